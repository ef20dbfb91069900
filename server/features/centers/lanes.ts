/** "1–12, 15, 17–18" from [1..12, 15, 17, 18]. */
export function laneRanges(lanes: number[]): string {
  const sorted = [...new Set(lanes)].sort((a, b) => a - b);
  const parts: string[] = [];
  for (let i = 0; i < sorted.length;) {
    let j = i;
    while (j + 1 < sorted.length && sorted[j + 1] === sorted[j] + 1) j++;
    parts.push(i === j ? `${sorted[i]}` : `${sorted[i]}–${sorted[j]}`);
    i = j + 1;
  }
  return parts.join(', ');
}

/** True when two date ranges (YYYY-MM-DD, open end = null) share a day. */
export function datesOverlap(a: { validFrom: string; validTo: string | null }, b: { validFrom: string; validTo: string | null }): boolean {
  return (a.validTo === null || b.validFrom <= a.validTo) && (b.validTo === null || a.validFrom <= b.validTo);
}
