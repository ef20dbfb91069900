import { integerInRange, list } from './checks';

/** Checks a list of standing pins (integers 1–10, no repeats) and returns them as a set. */
export function standingSet(fn: string, standing: unknown): Set<number> {
  const pins = list(fn, 'standing', standing).map((p, i) => integerInRange(fn, `standing[${i}]`, p, 1, 10));
  const up = new Set<number>();
  for (const p of pins) {
    if (up.has(p)) throw new RangeError(`${fn}: pin ${p} is listed twice`);
    up.add(p);
  }
  return up;
}
