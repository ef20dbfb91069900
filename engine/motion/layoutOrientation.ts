/**
 * The ball's initial orientation quaternion from its layout relative to the bowler's axis.
 *
 * Definition (the release model of engine/motion/README.md and the USBC axis marking rule): the pin (low-RG axis ê₁) lies at the angle
 * `pinAngleRad` (pin-to-PAP distance ÷ radius, Lanewright's conventions) from the positive axis point
 * `pap`, on the great circle from the PAP toward the top of the ball at release (our convention; real
 * layouts put the pin above the grip). The PSA (high-RG axis ê₂) is turned from the pin→PAP direction
 * at the pin by the VAL angle (turning sense mirrored with `hand`); ê₃ = ê₁ × ê₂. For a symmetric core
 * ê₂/ê₃ are interchangeable, so the VAL angle has no effect. Returns q = (w, x, y, z), body→world.
 *
 * Units: `pap` unit vector in lane axes (x down the lane, y to the bowler's left, z up); radians.
 * Edge cases: a pin on the PAP (angle 0) or a vertical axis uses fixed fallback directions; `pap`
 * must be non-zero. Mirror rule: hand −1 with a mirrored PAP gives the mirrored
 * tensor. Example: `layoutOrientation([0, 1, 0], Math.PI / 2, 0, 1)` puts the pin on the x–z plane.
 */
export function layoutOrientation(
  pap: readonly [number, number, number],
  pinAngleRad: number,
  valAngleRad: number,
  hand: 1 | -1,
): [number, number, number, number] {
  const n = Math.hypot(pap[0], pap[1], pap[2]);
  if (!(n > 0) || !Number.isFinite(n))
    throw new RangeError(`layoutOrientation: pap must be a non-zero finite vector, got ${pap.join(',')}`);
  const dx = pap[0] / n,
    dy = pap[1] / n,
    dz = pap[2] / n;
  // toward the top of the ball, perpendicular to the PAP
  let tx = -dz * dx,
    ty = -dz * dy,
    tz = 1 - dz * dz;
  let tn = Math.hypot(tx, ty, tz);
  if (tn < 1e-9) {
    tx = 1 - dx * dx;
    ty = -dx * dy;
    tz = -dx * dz;
    tn = Math.hypot(tx, ty, tz);
  }
  tx /= tn;
  ty /= tn;
  tz /= tn;
  const cb = Math.cos(pinAngleRad),
    sb = Math.sin(pinAngleRad);
  const px = cb * dx + sb * tx,
    py = cb * dy + sb * ty,
    pz = cb * dz + sb * tz; // ê₁
  // unit tangent at the pin pointing toward the PAP: −(d/dβ of p) = sb·d − cb·t
  const ux = sb * dx - cb * tx,
    uy = sb * dy - cb * ty,
    uz = sb * dz - cb * tz;
  // p × u
  const wx = py * uz - pz * uy,
    wy = pz * ux - px * uz,
    wz = px * uy - py * ux;
  const cv = Math.cos(valAngleRad),
    sv = hand * Math.sin(valAngleRad);
  let e2x = cv * ux + sv * wx,
    e2y = cv * uy + sv * wy,
    e2z = cv * uz + sv * wz; // ê₂
  const e2n = Math.hypot(e2x, e2y, e2z);
  e2x /= e2n;
  e2y /= e2n;
  e2z /= e2n;
  const e3x = py * e2z - pz * e2y,
    e3y = pz * e2x - px * e2z,
    e3z = px * e2y - py * e2x; // ê₃ = ê₁ × ê₂
  return quatFromColumns(px, py, pz, e2x, e2y, e2z, e3x, e3y, e3z);
}

/** Quaternion of the rotation matrix with columns a, b, c (Shepperd's method). */
function quatFromColumns(
  m00: number,
  m10: number,
  m20: number,
  m01: number,
  m11: number,
  m21: number,
  m02: number,
  m12: number,
  m22: number,
): [number, number, number, number] {
  const tr = m00 + m11 + m22;
  let w: number, x: number, y: number, z: number;
  if (tr > 0) {
    const s = Math.sqrt(tr + 1) * 2;
    w = s / 4;
    x = (m21 - m12) / s;
    y = (m02 - m20) / s;
    z = (m10 - m01) / s;
  } else if (m00 > m11 && m00 > m22) {
    const s = Math.sqrt(1 + m00 - m11 - m22) * 2;
    w = (m21 - m12) / s;
    x = s / 4;
    y = (m01 + m10) / s;
    z = (m02 + m20) / s;
  } else if (m11 > m22) {
    const s = Math.sqrt(1 + m11 - m00 - m22) * 2;
    w = (m02 - m20) / s;
    x = (m01 + m10) / s;
    y = s / 4;
    z = (m12 + m21) / s;
  } else {
    const s = Math.sqrt(1 + m22 - m00 - m11) * 2;
    w = (m10 - m01) / s;
    x = (m02 + m20) / s;
    y = (m12 + m21) / s;
    z = s / 4;
  }
  const n = Math.hypot(w, x, y, z);
  return [w / n, x / n, y / n, z / n];
}
