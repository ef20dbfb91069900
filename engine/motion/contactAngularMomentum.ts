import type { BallInertia } from './ballInertia';

/**
 * Angular momentum about the contact point, L_P = I_w ω + m R ẑ × v, of a delivery state.
 *
 * Source: rigid-body mechanics: the angular momentum about the contact point (exact invariant for any μ field and any inertia tensor with no pivot
 * friction, rolling resistance or CoM offset). I_w = Q diag(I_L, I_H, I_I) Qᵀ.
 * Units: state in SI (see `STATE`), kg·m²/s out, lane axes. Edge cases: q need not be unit (the
 * 2/|q|² form is used). Example: a ball rolling forward at 8 m/s with no side spin has
 * L_P = (0, (I + mR²)·v/R, 0).
 */
export function contactAngularMomentum(s: Float64Array, inertia: BallInertia): [number, number, number] {
  const wx = s[4],
    wy = s[5],
    wz = s[6],
    qw = s[7],
    qx = s[8],
    qy = s[9],
    qz = s[10];
  const sc = 2 / (qw * qw + qx * qx + qy * qy + qz * qz);
  const q00 = 1 - sc * (qy * qy + qz * qz),
    q01 = sc * (qx * qy - qw * qz),
    q02 = sc * (qx * qz + qw * qy);
  const q10 = sc * (qx * qy + qw * qz),
    q11 = 1 - sc * (qx * qx + qz * qz),
    q12 = sc * (qy * qz - qw * qx);
  const q20 = sc * (qx * qz - qw * qy),
    q21 = sc * (qy * qz + qw * qx),
    q22 = 1 - sc * (qx * qx + qy * qy);
  const w1 = (q00 * wx + q10 * wy + q20 * wz) * inertia.iLow;
  const w2 = (q01 * wx + q11 * wy + q21 * wz) * inertia.iHigh;
  const w3 = (q02 * wx + q12 * wy + q22 * wz) * inertia.iInt;
  const mR = inertia.massKg * inertia.radiusM;
  return [q00 * w1 + q01 * w2 + q02 * w3 - mR * s[3], q10 * w1 + q11 * w2 + q12 * w3 + mR * s[2], q20 * w1 + q21 * w2 + q22 * w3];
}
