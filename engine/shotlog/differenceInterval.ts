import { integerInRange, record } from '../internal/checks';
import { wilsonInterval } from './wilsonInterval';

/**
 * The difference of two independent proportions, after − before, with its 95 % interval by the hybrid
 * score method ("method 10": built from each proportion's Wilson score interval), which keeps good
 * coverage for the small samples of a shot log where the simple p̂₁ − p̂₂ ± z·SE interval does not.
 *
 * Definition: with p₁ = hits1/n1, p₂ = hits2/n2 and their Wilson limits (l₁, u₁), (l₂, u₂):
 * low = (p₁ − p₂) − √((p₁ − l₁)² + (u₂ − p₂)²), high = (p₁ − p₂) + √((u₁ − p₁)² + (p₂ − l₂)²).
 * Source: R. G. Newcombe, "Interval estimation for the difference between independent proportions:
 * comparison of eleven methods", Statistics in Medicine 17 (1998) 873–890.
 *
 * Units: proportions 0–1.
 * @param after `{ hits, n }` of the later sample (n ≥ 1).
 * @param before `{ hits, n }` of the earlier sample (n ≥ 1).
 * @returns `{ diff, low, high }` with −1 ≤ low ≤ diff ≤ high ≤ 1.
 * @throws TypeError for a missing sample or a non-number; RangeError for n < 1 or hits outside 0…n (as wilsonInterval),
 *   naming differenceInterval.
 * @example
 * differenceInterval({ hits: 56, n: 70 }, { hits: 48, n: 80 }); // => { diff: 0.2, low: 0.0524…, high: 0.3339… }
 */
export function differenceInterval(
  after: { hits: number; n: number },
  before: { hits: number; n: number },
): { diff: number; low: number; high: number } {
  const fn = 'differenceInterval';
  const a = record(fn, 'after', after);
  const b = record(fn, 'before', before);
  const n1 = integerInRange(fn, 'after.n', a.n, 1, Number.MAX_SAFE_INTEGER);
  const h1 = integerInRange(fn, 'after.hits', a.hits, 0, n1);
  const n2 = integerInRange(fn, 'before.n', b.n, 1, Number.MAX_SAFE_INTEGER);
  const h2 = integerInRange(fn, 'before.hits', b.hits, 0, n2);
  const p1 = h1 / n1;
  const p2 = h2 / n2;
  const w1 = wilsonInterval(h1, n1);
  const w2 = wilsonInterval(h2, n2);
  const diff = p1 - p2;
  return {
    diff,
    low: Math.max(-1, diff - Math.hypot(p1 - w1.low, w2.high - p2)),
    high: Math.min(1, diff + Math.hypot(w1.high - p1, p2 - w2.low)),
  };
}
