import type { BallInertia } from './ballInertia';

/**
 * Kinetic energy ½ m |v|² + ½ ω·I_w ω of a delivery state.
 *
 * Source: the energy balance of sliding friction (dKE/dt = F·u = −μN|u| ≤ 0: it never increases; constant while rolling).
 * Units: SI state in, J out. Edge cases: none. Example: a 7.257 kg ball at 8 m/s with no spin → 232.2 J.
 */
export function kineticEnergy(s: Float64Array, inertia: BallInertia): number {
  const wx = s[4],
    wy = s[5],
    wz = s[6],
    qw = s[7],
    qx = s[8],
    qy = s[9],
    qz = s[10];
  const sc = 2 / (qw * qw + qx * qx + qy * qy + qz * qz);
  const w1 = (1 - sc * (qy * qy + qz * qz)) * wx + sc * (qx * qy + qw * qz) * wy + sc * (qx * qz - qw * qy) * wz;
  const w2 = sc * (qx * qy - qw * qz) * wx + (1 - sc * (qx * qx + qz * qz)) * wy + sc * (qy * qz + qw * qx) * wz;
  const w3 = sc * (qx * qz + qw * qy) * wx + sc * (qy * qz - qw * qx) * wy + (1 - sc * (qx * qx + qy * qy)) * wz;
  return (
    0.5 * inertia.massKg * (s[2] * s[2] + s[3] * s[3]) + 0.5 * (inertia.iLow * w1 * w1 + inertia.iHigh * w2 * w2 + inertia.iInt * w3 * w3)
  );
}
