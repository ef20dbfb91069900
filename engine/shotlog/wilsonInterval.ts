import { finite, integerInRange } from '../internal/checks';

/** The conventional two-sided 95 % normal quantile used by wilsonInterval (z = 1.96). */
export const WILSON_Z_95 = 1.96;

/**
 * The Wilson score interval for a proportion: the range of true rates p for which the observed
 * hits/n lies within z standard errors √(p(1 − p)/n) of p.
 *
 * Definition: with p̂ = hits/n, centre = (p̂ + z²/2n)/(1 + z²/n) and half-width =
 * z/(1 + z²/n)·√(p̂(1 − p̂)/n + z²/4n²). Unlike p̂ ± z√(p̂(1 − p̂)/n) it never leaves [0, 1] and it is
 * not zero-width at 0 or n hits, which matters for the small samples of a shot log.
 * Source: E. B. Wilson, "Probable inference, the law of succession, and statistical inference",
 * Journal of the American Statistical Association 22 (1927) 209–212; the check values 0/10 →
 * [0, 0.2775] (closed form z²/(n + z²)) and 5/10 → [0.2366, 0.7634] are the ones tabulated in
 * comparisons of binomial intervals, e.g. R. G. Newcombe, Statistics in Medicine 17 (1998) 857–872
 * (from memory; both are re-derived by hand in the test).
 *
 * Units: proportions 0–1 (Rate in shotStats reports them in percent).
 * @param hits successes, an integer 0…n.
 * @param n trials, an integer ≥ 1.
 * @param z the normal quantile (default 1.96 for 95 %), > 0.
 * @returns `{ low, high }`, 0 ≤ low ≤ hits/n ≤ high ≤ 1; low is exactly 0 at 0 hits and high exactly 1 at n.
 * @throws TypeError for a non-number; RangeError for n < 1, hits outside 0…n, non-integers, z ≤ 0.
 * @example
 * wilsonInterval(5, 10); // => { low: 0.2366…, high: 0.7634… }
 */
export function wilsonInterval(hits: number, n: number, z: number = WILSON_Z_95): { low: number; high: number } {
  const fn = 'wilsonInterval';
  const trials = integerInRange(fn, 'n', n, 1, Number.MAX_SAFE_INTEGER);
  const h = integerInRange(fn, 'hits', hits, 0, trials);
  const zz = finite(fn, 'z', z);
  if (zz <= 0) throw new RangeError(`${fn}: z must be greater than 0, got ${zz}`);
  const p = h / trials;
  const z2 = zz * zz;
  const denom = 1 + z2 / trials;
  const centre = (p + z2 / (2 * trials)) / denom;
  const half = (zz / denom) * Math.sqrt((p * (1 - p)) / trials + z2 / (4 * trials * trials));
  return {
    low: h === 0 ? 0 : Math.max(0, centre - half),
    high: h === trials ? 1 : Math.min(1, centre + half),
  };
}
