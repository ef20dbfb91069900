import normalCdf from '@stdlib/stats-base-dists-normal-cdf';
import normalQuantile from '@stdlib/stats-base-dists-normal-quantile';
import betaln from '@stdlib/math-base-special-betaln';
import { integerInRange, inRange } from '../internal/checks';

/** A count of successes in a number of trials. */
export interface Count {
  hits: number;
  n: number;
}

const lnBeta = (a: number, b: number) => betaln(a, b);

function count(fn: string, name: string, c: Count): Count {
  const n = integerInRange(fn, `${name}.n`, c?.n, 0, Number.MAX_SAFE_INTEGER);
  const hits = integerInRange(fn, `${name}.hits`, c?.hits, 0, n);
  return { hits, n };
}

/**
 * The probability that arm A's true rate is above arm B's, each with a uniform Beta(1, 1) prior updated by its
 * count (posterior Beta(1 + hits, 1 + misses)).
 *
 * Definition: with X ~ Beta(αA, βA) and Y ~ Beta(αB, βB) and αA a whole number,
 * P(X > Y) = Σ_{i=0}^{αA−1} B(αB + i, βA + βB) / ((βA + i)·B(1 + i, βA)·B(αB, βB)), summed in logs.
 * Source: J. D. Cook, "Exact calculation of beta inequalities", UT M. D. Anderson Cancer Center, Department of
 * Biostatistics technical report (2005); ln B from the stdlib-js math library.
 *
 * @returns a probability 0–1; 0.5 for two equal counts.
 * @example
 * probabilityBetter({ hits: 2, n: 2 }, { hits: 0, n: 2 }); // => 0.95 (Beta(3, 1) against Beta(1, 3))
 */
export function probabilityBetter(a: Count, b: Count): number {
  const fn = 'probabilityBetter';
  const A = count(fn, 'a', a),
    B = count(fn, 'b', b);
  const aA = 1 + A.hits,
    bA = 1 + A.n - A.hits,
    aB = 1 + B.hits,
    bB = 1 + B.n - B.hits;
  let total = 0;
  for (let i = 0; i < aA; i++) {
    total += Math.exp(lnBeta(aB + i, bA + bB) - Math.log(bA + i) - lnBeta(1 + i, bA) - lnBeta(aB, bB));
  }
  return Math.min(1, Math.max(0, total));
}

/**
 * The pooled two-proportion z test: is the difference between two observed rates larger than chance?
 *
 * Definition: p̄ = (hA + hB)/(nA + nB), z = (p̂A − p̂B)/√(p̄(1 − p̄)(1/nA + 1/nB)), two-sided p = 2(1 − Φ(|z|)).
 * Source: the large-sample test for two proportions of any introductory statistics text (e.g. D. S. Moore,
 * G. P. McCabe, Introduction to the Practice of Statistics, the chapter on comparing two proportions).
 *
 * @returns z and the two-sided p value; z 0 and p 1 when either arm has no trials or the pooled rate is 0 or 1.
 */
export function twoProportionTest(a: Count, b: Count): { z: number; p: number } {
  const fn = 'twoProportionTest';
  const A = count(fn, 'a', a),
    B = count(fn, 'b', b);
  if (A.n === 0 || B.n === 0) return { z: 0, p: 1 };
  const pooled = (A.hits + B.hits) / (A.n + B.n);
  const se = Math.sqrt(pooled * (1 - pooled) * (1 / A.n + 1 / B.n));
  if (!(se > 0)) return { z: 0, p: 1 };
  const z = (A.hits / A.n - B.hits / B.n) / se;
  return { z, p: Math.min(1, 2 * (1 - normalCdf(Math.abs(z), 0, 1))) };
}

/**
 * Shots needed in each arm to tell two true rates apart with a two-sided test at level `alpha` and the given
 * power.
 *
 * Definition: n = (z_{1−α/2}·√(2p̄q̄) + z_{1−β}·√(p₁q₁ + p₂q₂))² / (p₁ − p₂)², p̄ = (p₁ + p₂)/2, rounded up
 * (without continuity correction). Source: J. L. Fleiss, Statistical Methods for Rates and Proportions
 * (Wiley), the sample size for comparing two proportions; the normal quantiles from stdlib-js.
 *
 * @param p1 one rate, 0–1. @param p2 the other, 0–1 and not equal to p1.
 * @returns shots per arm (a whole number ≥ 1).
 * @example
 * shotsPerArm(0.6, 0.4); // => 97 (α 0.05 two-sided, power 0.8)
 */
export function shotsPerArm(p1: number, p2: number, alpha = 0.05, power = 0.8): number {
  const fn = 'shotsPerArm';
  inRange(fn, 'p1', p1, 0, 1, '');
  inRange(fn, 'p2', p2, 0, 1, '');
  inRange(fn, 'alpha', alpha, 1e-6, 0.5, '');
  inRange(fn, 'power', power, 0.5, 1 - 1e-6, '');
  if (p1 === p2) throw new RangeError(`${fn}: the two rates must differ`);
  const za = normalQuantile(1 - alpha / 2, 0, 1),
    zb = normalQuantile(power, 0, 1);
  const pbar = (p1 + p2) / 2;
  const root = za * Math.sqrt(2 * pbar * (1 - pbar)) + zb * Math.sqrt(p1 * (1 - p1) + p2 * (1 - p2));
  return Math.max(1, Math.ceil((root * root) / ((p1 - p2) * (p1 - p2)) - 1e-9));
}
