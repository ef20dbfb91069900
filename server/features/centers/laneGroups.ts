/**
 * What is on each lane of a center at an instant, in the center's own time zone, and what comes next.
 *
 * A publication names its lanes, its first and last local day (the last may be open) and optionally the days of the
 * week it is in force on (league nights). On a given local day a lane carries, of the publications that cover it
 * and apply that day, the one that ranks highest: a scheduled publication (with an end date or recurring days)
 * before an open-ended one, then the newest. So a later open-ended house shot does not silently replace a weekend
 * sport shot published before it, and a publication for some lanes leaves the other lanes' condition alone.
 * Lanes with the same current publication and the same next change form one lane group.
 */

/** The fields of a publication the schedule needs. */
export interface Scheduled {
  id: number;
  lanes: number[];
  validFrom: string;
  validTo: string | null;
  weekdays: number[] | null;
  publishedAt: Date;
}

export interface LaneGroupOf<P extends Scheduled> {
  key: string;
  lanes: number[];
  from: number;
  to: number;
  current: P | null;
  currentUntil: string | null;
  next: { publication: P; from: string } | null;
}

const dayFormats = new Map<string, Intl.DateTimeFormat>();

/** True for a time zone name this runtime knows (IANA, e.g. "America/Denver"). */
export function isTimeZone(tz: string): boolean {
  try {
    new Intl.DateTimeFormat('en-CA', { timeZone: tz });
    return true;
  } catch {
    return false;
  }
}

/** The local calendar day (YYYY-MM-DD) of an instant in a time zone (UTC when the name is unknown). */
export function localDay(at: Date, timeZone: string): string {
  const tz = isTimeZone(timeZone) ? timeZone : 'UTC';
  let f = dayFormats.get(tz);
  if (!f) {
    f = new Intl.DateTimeFormat('en-CA', { timeZone: tz, year: 'numeric', month: '2-digit', day: '2-digit' });
    dayFormats.set(tz, f);
  }
  const parts = Object.fromEntries(f.formatToParts(at).map((p) => [p.type, p.value]));
  return `${parts.year}-${parts.month}-${parts.day}`;
}

/** A day plus n days (calendar arithmetic on YYYY-MM-DD). */
export function addDays(day: string, n: number): string {
  const d = new Date(`${day}T00:00:00Z`);
  d.setUTCDate(d.getUTCDate() + n);
  return d.toISOString().slice(0, 10);
}

/** ISO 8601 day of the week of a calendar day: 1 Monday … 7 Sunday. */
export function isoWeekday(day: string): number {
  const w = new Date(`${day}T00:00:00Z`).getUTCDay();
  return w === 0 ? 7 : w;
}

/** True when the publication is in force on that local day (ignoring lanes). */
export function appliesOn(p: Scheduled, day: string): boolean {
  if (day < p.validFrom || (p.validTo !== null && day > p.validTo)) return false;
  return !p.weekdays || p.weekdays.length === 0 || p.weekdays.includes(isoWeekday(day));
}

/** A scheduled publication (an end date or recurring days) outranks an open-ended one. */
export function isScheduled(p: Scheduled): boolean {
  return p.validTo !== null || (p.weekdays !== null && p.weekdays.length > 0 && p.weekdays.length < 7);
}

/** Positive when a ranks above b on a day both apply. */
export function compareRank(a: Scheduled, b: Scheduled): number {
  return Number(isScheduled(a)) - Number(isScheduled(b)) || a.publishedAt.getTime() - b.publishedAt.getTime() || a.id - b.id;
}

/** The publication on one lane on one local day, or null. */
export function onLane<P extends Scheduled>(pubs: readonly P[], lane: number, day: string): P | null {
  let best: P | null = null;
  for (const p of pubs) if (p.lanes.includes(lane) && appliesOn(p, day) && (!best || compareRank(p, best) > 0)) best = p;
  return best;
}

/** The days after `today` on which what is on a lane can change, in order. */
function changeDays(pubs: readonly Scheduled[], today: string): string[] {
  const days = new Set<string>();
  for (let i = 1; i <= 7; i++) days.add(addDays(today, i));
  for (const p of pubs) {
    if (p.validFrom > today) {
      days.add(p.validFrom);
      if (p.weekdays?.length) for (let i = 1; i < 7; i++) days.add(addDays(p.validFrom, i));
    }
    if (p.validTo !== null && p.validTo >= today) days.add(addDays(p.validTo, 1));
  }
  return [...days].filter((d) => d > today).sort();
}

/**
 * Every lane group of a center on its local day `today`: lanes 1…laneCount with what is on them and what follows.
 * Lanes with nothing now and nothing scheduled are left out.
 */
export function laneGroups<P extends Scheduled>(pubs: readonly P[], laneCount: number, today: string): LaneGroupOf<P>[] {
  const live = pubs.filter((p) => p.validTo === null || p.validTo >= today);
  const days = changeDays(live, today);
  const groups = new Map<string, LaneGroupOf<P>>();
  for (let lane = 1; lane <= laneCount; lane++) {
    const current = onLane(live, lane, today);
    let currentUntil: string | null = null;
    let next: LaneGroupOf<P>['next'] = null;
    for (const day of days) {
      const p = onLane(live, lane, day);
      if (p?.id === current?.id) continue;
      if (currentUntil === null && current) currentUntil = addDays(day, -1);
      if (p) {
        next = { publication: p, from: day };
        break;
      }
    }
    if (!current && !next) continue;
    const sig = `${current?.id ?? '-'}|${currentUntil ?? '-'}|${next?.publication.id ?? '-'}|${next?.from ?? '-'}`;
    const g = groups.get(sig);
    if (g) g.lanes.push(lane);
    else groups.set(sig, { key: '', lanes: [lane], from: lane, to: lane, current, currentUntil, next });
  }
  return [...groups.values()]
    .map((g) => {
      const from = g.lanes[0];
      const to = g.lanes.at(-1)!;
      return { ...g, from, to, key: `lanes-${from}-${to}` };
    })
    .sort((a, b) => a.from - b.from);
}

/**
 * The later publication that replaced `c` entirely, or null: later publications ranking at least as high, in force
 * at least as long and on at least its days, that together cover all its lanes (the newest of them is named).
 * A publication for some lanes only leaves the others' publication standing.
 */
export function replacedBy(c: Scheduled, later: readonly Scheduled[]): number | null {
  const covering = later.filter(
    (l) =>
      l.id !== c.id &&
      l.publishedAt > c.publishedAt &&
      Number(isScheduled(l)) >= Number(isScheduled(c)) &&
      l.lanes.some((n) => c.lanes.includes(n)) &&
      l.validFrom <= (c.validTo ?? l.validFrom) &&
      (l.validTo === null || (c.validTo !== null && l.validTo >= c.validTo)) &&
      (!l.weekdays?.length || (!!c.weekdays?.length && c.weekdays.every((d) => l.weekdays!.includes(d)))),
  );
  const lanes = new Set(covering.flatMap((l) => l.lanes));
  if (!c.lanes.every((n) => lanes.has(n))) return null;
  const newest = covering.filter((l) => l.lanes.some((n) => c.lanes.includes(n))).sort((a, b) => compareRank(b, a))[0];
  return newest ? newest.id : null;
}
