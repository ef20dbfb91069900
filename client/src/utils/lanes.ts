/** Lane numbers as people write them: "1–12, 15, 20–24". */

/** Sorted, de-duplicated lane numbers → "1–12, 15, 20–24". */
export function formatLaneRanges(lanes: readonly number[]): string {
  const sorted = [...new Set(lanes)].sort((a, b) => a - b);
  const parts: string[] = [];
  let i = 0;
  while (i < sorted.length) {
    let j = i;
    while (j + 1 < sorted.length && sorted[j + 1] === sorted[j] + 1) j += 1;
    parts.push(i === j ? `${sorted[i]}` : `${sorted[i]}–${sorted[j]}`);
    i = j + 1;
  }
  return parts.join(', ');
}

/** "Lanes 1–12" / "Lane 7". */
export function lanesLabel(lanes: readonly number[]): string {
  return `${lanes.length === 1 ? 'Lane' : 'Lanes'} ${formatLaneRanges(lanes)}`;
}

export interface ParsedLanes {
  lanes: number[];
  /** Why the text could not be read, or ''. */
  error: string;
}

/**
 * Reads "1-12, 15 20–24" (commas or spaces between parts; -, – or "to" in a range) into lane numbers 1…max.
 */
export function parseLaneRanges(text: string, max: number): ParsedLanes {
  const out = new Set<number>();
  const parts = text
    .replace(/\s*(?:–|—|-|to)\s*/gi, '-')
    .split(/[\s,;]+/)
    .filter(Boolean);
  for (const part of parts) {
    const m = /^(\d+)(?:-(\d+))?$/.exec(part);
    if (!m) return { lanes: [], error: `“${part}” is not a lane or a range like 1–12` };
    const a = Number(m[1]);
    const b = m[2] === undefined ? a : Number(m[2]);
    const lo = Math.min(a, b);
    const hi = Math.max(a, b);
    if (lo < 1 || hi > max) return { lanes: [], error: `Lanes go from 1 to ${max}` };
    for (let n = lo; n <= hi; n += 1) out.add(n);
  }
  return { lanes: [...out].sort((x, y) => x - y), error: '' };
}

/** "1 Dec 2026" for a YYYY-MM-DD date (read as a calendar day, not shifted by time zone). */
export function formatDay(iso: string): string {
  const [y, m, d] = iso.split('-').map(Number);
  return new Intl.DateTimeFormat(undefined, { day: 'numeric', month: 'short', year: 'numeric', timeZone: 'UTC' }).format(
    new Date(Date.UTC(y, m - 1, d)),
  );
}

/** "from 1 Dec 2026 to 7 Dec 2026" / "from 1 Dec 2026 until further notice". */
export function formatValidity(validFrom: string, validTo: string | null | undefined): string {
  return validTo ? `${formatDay(validFrom)} to ${formatDay(validTo)}` : `from ${formatDay(validFrom)}, until further notice`;
}
