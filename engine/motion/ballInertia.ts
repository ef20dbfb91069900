import type { BallSpec } from '../types';
import { assertNumber } from './assertNumber';
import { PHYSICAL_CONSTANTS as C } from './physicalConstants';

/** Mass, radius and principal moments of a ball (SI). */
export interface BallInertia {
  /** kg */
  massKg: number;
  /** m */
  radiusM: number;
  /** Principal moments about ê₁ (pin, low RG), ê₂ (PSA, high RG), ê₃ (intermediate), kg·m². */
  iLow: number;
  iHigh: number;
  iInt: number;
}

/**
 * Principal moments of inertia of a ball from its RG, differential and intermediate differential.
 *
 * Definition (the USBC marking rule: the pin marks the low-RG axis): k_L = rg about the pin axis ê₁,
 * k_H = k_L + differential about the PSA ê₂, k_I = k_H − intermediateDifferential about ê₃;
 * I = m k² (RG = √(I/m), rigid-body mechanics). Mass from `weightLb`, radius from `diameterIn` (default 8.5 in).
 * No mass-centre offset (a mass-centre offset is not modelled).
 *
 * Units: lb and in in; kg, m, kg·m² out. Edge cases: throws RangeError for weight outside
 * (0, 40] lb, diameter outside [6, 12] in, RG outside [1 in, R], differential outside [0, 0.5] in,
 * intermediate differential outside [0, differential]; TypeError for non-numbers. Illegal balls (over
 * 16 lb, RG outside 2.46–2.80 in, a uniform sphere rg² = 0.4 R²) are modelled all the same: legality
 * is the rules layer's business.
 *
 * Example: `ballInertia({ weightLb: 16, rg: 2.5, differential: 0, … }).iLow` → 0.029258 kg·m²
 * (reference value: I_L = 0.02926 kg m² at k_L = 2.50 in).
 */
export function ballInertia(ball: BallSpec): BallInertia {
  const fn = 'ballInertia';
  if (ball === null || typeof ball !== 'object') throw new TypeError(`${fn}: ball must be an object, got ${String(ball)}`);
  const weightLb = assertNumber(fn, 'weightLb', ball.weightLb, 1e-9, 40);
  const diameterIn = assertNumber(fn, 'diameterIn', ball.diameterIn ?? C.defaultDiameterIn, 6, 12);
  const rg = assertNumber(fn, 'rg', ball.rg, 1, diameterIn / 2);
  const diff = assertNumber(fn, 'differential', ball.differential, 0, 0.5);
  const idiff = assertNumber(fn, 'intermediateDifferential', ball.intermediateDifferential, 0, diff);
  const m = weightLb * C.poundKg;
  const kL = rg * C.inchM;
  const kH = (rg + diff) * C.inchM;
  const kI = (rg + diff - idiff) * C.inchM;
  return { massKg: m, radiusM: (diameterIn / 2) * C.inchM, iLow: m * kL * kL, iHigh: m * kH * kH, iInt: m * kI * kI };
}
