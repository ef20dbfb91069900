/**
 * The rotation matrix Q (body → lane axes, row-major into `out[0..8]`) of the orientation quaternion s[7..10] of a
 * delivery state, built with the 2/|q|² factor so it is exact for the non-unit quaternions of the RK4 stages.
 *
 * Source: the quaternion rotation matrix (rigid-body mechanics). Units: none. Edge cases: q must not be zero;
 * internal to the motion model, unchecked (the invariants use it; newtonEulerRhs writes the same matrix out in locals). Example: q = (1, 0, 0, 0) → the identity.
 */
export function bodyRotation(s: Float64Array, out: Float64Array): void {
  const qw = s[7],
    qx = s[8],
    qy = s[9],
    qz = s[10];
  const sc = 2 / (qw * qw + qx * qx + qy * qy + qz * qz);
  out[0] = 1 - sc * (qy * qy + qz * qz);
  out[1] = sc * (qx * qy - qw * qz);
  out[2] = sc * (qx * qz + qw * qy);
  out[3] = sc * (qx * qy + qw * qz);
  out[4] = 1 - sc * (qx * qx + qz * qz);
  out[5] = sc * (qy * qz - qw * qx);
  out[6] = sc * (qx * qz - qw * qy);
  out[7] = sc * (qy * qz + qw * qx);
  out[8] = 1 - sc * (qx * qx + qy * qy);
}

/**
 * The angular velocity of a delivery state in body axes, b = Qᵀω, for a unit quaternion (the 2·q form: the state
 * after its step's normalisation), written into `out[0..2]`; returns |b|.
 *
 * Source: rigid-body mechanics. Units: rad/s. Edge cases: q must be of unit length; internal, unchecked (hot path).
 * Example: q = (1, 0, 0, 0), ω = (0, 3, 4) → out = (0, 3, 4), returns 5.
 */
export function bodySpin(s: Float64Array, out: Float64Array): number {
  const qw = s[7],
    qx = s[8],
    qy = s[9],
    qz = s[10],
    wx = s[4],
    wy = s[5],
    wz = s[6];
  const b1 = (1 - 2 * (qy * qy + qz * qz)) * wx + 2 * (qx * qy + qw * qz) * wy + 2 * (qx * qz - qw * qy) * wz;
  const b2 = 2 * (qx * qy - qw * qz) * wx + (1 - 2 * (qx * qx + qz * qz)) * wy + 2 * (qy * qz + qw * qx) * wz;
  const b3 = 2 * (qx * qz + qw * qy) * wx + 2 * (qy * qz - qw * qx) * wy + (1 - 2 * (qx * qx + qy * qy)) * wz;
  out[0] = b1;
  out[1] = b2;
  out[2] = b3;
  return Math.sqrt(b1 * b1 + b2 * b2 + b3 * b3);
}
