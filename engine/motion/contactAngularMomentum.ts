import type { BallInertia } from './ballInertia';
import { assertInertia, assertState } from './assertState';
import { bodyRotation } from './bodyRotation';

const rot = new Float64Array(9);

/**
 * Angular momentum about the contact point, L_P = I_w ω + m R ẑ × v, of a delivery state.
 *
 * Source: rigid-body mechanics: the angular momentum about the contact point (exact invariant for any μ field and any inertia tensor with no pivot
 * friction, rolling resistance or CoM offset). I_w = Q diag(I_L, I_H, I_I) Qᵀ.
 * Units: state in SI (see `STATE`), kg·m²/s out, lane axes. Edge cases: q need not be unit (the
 * 2/|q|² form is used); a state that is not 11 finite numbers, or a zero quaternion, throws (the motion model's
 * input checks). Example: a ball rolling forward at 8 m/s with no side spin has L_P = (0, (I + mR²)·v/R, 0).
 */
export function contactAngularMomentum(s: Float64Array, inertia: BallInertia): [number, number, number] {
  assertState('contactAngularMomentum', s);
  assertInertia('contactAngularMomentum', inertia);
  const wx = s[4],
    wy = s[5],
    wz = s[6];
  bodyRotation(s, rot);
  const w1 = (rot[0] * wx + rot[3] * wy + rot[6] * wz) * inertia.iLow;
  const w2 = (rot[1] * wx + rot[4] * wy + rot[7] * wz) * inertia.iHigh;
  const w3 = (rot[2] * wx + rot[5] * wy + rot[8] * wz) * inertia.iInt;
  const mR = inertia.massKg * inertia.radiusM;
  return [
    rot[0] * w1 + rot[1] * w2 + rot[2] * w3 - mR * s[3],
    rot[3] * w1 + rot[4] * w2 + rot[5] * w3 + mR * s[2],
    rot[6] * w1 + rot[7] * w2 + rot[8] * w3,
  ];
}
