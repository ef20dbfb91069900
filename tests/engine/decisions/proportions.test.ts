import { describe, expect, it } from 'vitest';
import { probabilityBetter, shotsPerArm, twoProportionTest } from '../../../engine/index';

/** P(X > Y) for X ~ Beta(a1, b1), Y ~ Beta(a2, b2) by the midpoint rule on ∫ f_X(x) F_Y(x) dx — an independent check. */
function integrated(a1: number, b1: number, a2: number, b2: number, steps = 20000): number {
  const lnB = (a: number, b: number) => lgamma(a) + lgamma(b) - lgamma(a + b);
  const pdf = (x: number, a: number, b: number) => Math.exp((a - 1) * Math.log(x) + (b - 1) * Math.log(1 - x) - lnB(a, b));
  let cdfY = 0,
    total = 0;
  const h = 1 / steps;
  for (let i = 0; i < steps; i++) {
    const x = (i + 0.5) * h;
    cdfY += pdf(x, a2, b2) * h;
    total += pdf(x, a1, b1) * (cdfY - pdf(x, a2, b2) * h * 0.5) * h;
  }
  return total;
}
/** Lanczos log-gamma (Numerical Recipes, 3rd ed., §6.1), written out here so the check does not share the code under test. */
function lgamma(z: number): number {
  const g = [
    57.1562356658629235, -59.5979603554754912, 14.1360979747417471, -0.491913816097620199, 0.339946499848118887e-4, 0.465236289270485756e-4,
    -0.983744753048795646e-4, 0.158088703224912494e-3, -0.210264441724104883e-3, 0.217439618115212643e-3, -0.16431810653676389e-3,
    0.844182239838527433e-4, -0.261908384015814087e-4, 0.368991826595316234e-5,
  ];
  const x = z;
  let y = z;
  const tmp = x + 5.2421875;
  const t = (x + 0.5) * Math.log(tmp) - tmp;
  let ser = 0.999999999999997092;
  for (const c of g) ser += c / ++y;
  return t + Math.log((2.5066282746310005 * ser) / x);
}

describe('probabilityBetter: P(one true rate > another) with Beta(1, 1) priors (J. D. Cook, "Exact calculation of beta inequalities", 2005)', () => {
  it('2 of 2 against 0 of 2: Beta(3, 1) against Beta(1, 3) gives 1 − 3·B(3, 4) = 0.95 (worked by hand)', () => {
    expect(probabilityBetter({ hits: 2, n: 2 }, { hits: 0, n: 2 })).toBeCloseTo(0.95, 10);
  });

  it('1 of 1 against no shots: Beta(2, 1) against Beta(1, 1) gives ∫ 2x·x dx = 2/3 (worked by hand)', () => {
    expect(probabilityBetter({ hits: 1, n: 1 }, { hits: 0, n: 0 })).toBeCloseTo(2 / 3, 10);
  });

  it('equal counts give one half, and the two orders add up to one', () => {
    expect(probabilityBetter({ hits: 7, n: 20 }, { hits: 7, n: 20 })).toBeCloseTo(0.5, 10);
    const ab = probabilityBetter({ hits: 30, n: 50 }, { hits: 20, n: 50 });
    const ba = probabilityBetter({ hits: 20, n: 50 }, { hits: 30, n: 50 });
    expect(ab + ba).toBeCloseTo(1, 9);
  });

  it('agrees with a numerical integration of the two posteriors at league-sized counts', () => {
    for (const [a, b] of [
      [
        [30, 50],
        [20, 50],
      ],
      [
        [12, 40],
        [18, 45],
      ],
      [
        [55, 100],
        [45, 100],
      ],
    ] as const) {
      const exact = probabilityBetter({ hits: a[0], n: a[1] }, { hits: b[0], n: b[1] });
      const numeric = integrated(1 + a[0], 1 + a[1] - a[0], 1 + b[0], 1 + b[1] - b[0]);
      expect(Math.abs(exact - numeric)).toBeLessThan(2e-4);
    }
  });

  it('refuses impossible counts', () => {
    expect(() => probabilityBetter({ hits: 3, n: 2 }, { hits: 0, n: 2 })).toThrow(RangeError);
    expect(() => probabilityBetter({ hits: 1.5, n: 2 }, { hits: 0, n: 2 })).toThrow(RangeError);
  });
});

describe('twoProportionTest: the pooled large-sample z test for two proportions (any introductory statistics text)', () => {
  it('45 of 100 against 30 of 100: p̄ 0.375, SE √(0.375·0.625·0.02) = 0.06847, z = 2.191, two-sided p = 0.0285 (worked by hand)', () => {
    const r = twoProportionTest({ hits: 45, n: 100 }, { hits: 30, n: 100 });
    expect(r.z).toBeCloseTo(2.1909, 3);
    expect(r.p).toBeCloseTo(0.0285, 3);
  });

  it('no shots in an arm, or a pooled rate of 0 or 1, says nothing (z 0, p 1)', () => {
    expect(twoProportionTest({ hits: 0, n: 0 }, { hits: 3, n: 5 })).toEqual({ z: 0, p: 1 });
    expect(twoProportionTest({ hits: 5, n: 5 }, { hits: 6, n: 6 })).toEqual({ z: 0, p: 1 });
  });
});

describe('shotsPerArm: the sample size for comparing two proportions (J. L. Fleiss, Statistical Methods for Rates and Proportions), α 0.05 two-sided, power 0.8', () => {
  it('0.6 against 0.4: (1.95996·√(2·0.5·0.5) + 0.84162·√(0.24 + 0.24))² / 0.04 = 96.9 → 97 per arm (worked by hand)', () => {
    expect(shotsPerArm(0.6, 0.4)).toBe(97);
  });

  it('0.40 against 0.25: (1.95996·√(2·0.325·0.675) + 0.84162·√(0.24 + 0.1875))² / 0.0225 = 151.9 → 152 per arm (worked by hand)', () => {
    expect(shotsPerArm(0.4, 0.25)).toBe(152);
  });

  it('a smaller difference needs more shots; more power needs more shots', () => {
    expect(shotsPerArm(0.35, 0.3)).toBeGreaterThan(shotsPerArm(0.4, 0.3));
    expect(shotsPerArm(0.4, 0.3, 0.05, 0.9)).toBeGreaterThan(shotsPerArm(0.4, 0.3));
  });

  it('two equal rates cannot be told apart: refused', () => {
    expect(() => shotsPerArm(0.3, 0.3)).toThrow(RangeError);
  });
});
