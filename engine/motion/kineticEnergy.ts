import type { BallInertia } from './ballInertia';
import { assertInertia, assertState } from './assertState';
import { bodyRotation } from './bodyRotation';

const rot = new Float64Array(9);

/**
 * Kinetic energy ½ m |v|² + ½ ω·I_w ω of a delivery state.
 *
 * Source: the energy balance of sliding friction (dKE/dt = F·u = −μN|u| ≤ 0: it never increases; constant while rolling).
 * Units: SI state in, J out. Edge cases: a state that is not 11 finite numbers, or a zero quaternion, throws (the
 * motion model's input checks). Example: a 7.257 kg ball at 8 m/s with no spin → 232.2 J.
 */
export function kineticEnergy(s: Float64Array, inertia: BallInertia): number {
  assertState('kineticEnergy', s);
  assertInertia('kineticEnergy', inertia);
  const wx = s[4],
    wy = s[5],
    wz = s[6];
  bodyRotation(s, rot);
  const w1 = rot[0] * wx + rot[3] * wy + rot[6] * wz;
  const w2 = rot[1] * wx + rot[4] * wy + rot[7] * wz;
  const w3 = rot[2] * wx + rot[5] * wy + rot[8] * wz;
  return (
    0.5 * inertia.massKg * (s[2] * s[2] + s[3] * s[3]) + 0.5 * (inertia.iLow * w1 * w1 + inertia.iHigh * w2 * w2 + inertia.iInt * w3 * w3)
  );
}
