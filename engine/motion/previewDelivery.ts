import type { BallInertia } from './ballInertia';
import type { FrictionField } from './frictionField';
import { bilinear } from './bilinear';
import { MOTION_CALIBRATION as K } from './motionCalibration';
import { PHYSICAL_CONSTANTS as C } from './physicalConstants';

/** What a preview delivery reports (hand-relative boards), enough for the line search. */
export interface PreviewResult {
  entryBoard: number;
  entryAngleDeg: number;
  breakpointBoard: number;
  breakpointFt: number;
  reachedPins: boolean;
  gutter: boolean;
}

const invBw = 1 / C.boardWidthM;

/**
 * A fast preview of one delivery for the line search: the ball taken as isotropic (one radius of gyration, the
 * mean of its three), for which the slip direction never changes while it slides, so the whole skid follows from
 * the friction it has met, Φ(t) = ∫μ dt: v = v₀ − gΦ·û₀ until Φ reaches α|u₀|/((1+α)g), then a straight roll at
 * v* = (v₀ + αR ω₀ × ẑ)/(1+α) (the sliding sphere's closed form, exact for any friction field). Φ, the position
 * and the oil carried on the track ring are integrated with RK2 on a coarse step; the ring is refreshed with dry
 * cover at `flareInPerS` (the full model's flare rate for this ball). About fifty times cheaper than
 * integrateDelivery and within about a board of it on a house shot; the solver uses it to find the line and the
 * full model for every number it reports.
 * Source: the sliding sphere (textbook mechanics; the two-zone form after Frohlich, Am. J. Phys. 72, 2004).
 * Units: SI state in (releaseState's), boards/ft/degrees out. Edge cases: oil fields only (uniform and sampled
 * fields are for the closed-form tests and go to integrateDelivery); a ball that stalls reports reachedPins false.
 * Example: `previewDelivery(releaseState(ball, bowler, 20, 11), ballInertia(ball), field, 1, 2.5)`.
 */
export function previewDelivery(
  s0: Float64Array,
  inertia: BallInertia,
  field: FrictionField,
  hand: 1 | -1,
  flareInPerS: number,
): PreviewResult {
  const m = inertia.massKg,
    R = inertia.radiusM,
    g = C.g;
  const k2 = (inertia.iLow + inertia.iHigh + inertia.iInt) / (3 * m);
  const alpha = k2 / (R * R);
  let x = s0[0],
    y = s0[1];
  const vx0 = s0[2],
    vy0 = s0[3],
    wx0 = s0[4],
    wy0 = s0[5],
    wz0 = s0[6];
  const ux0 = vx0 - R * wy0,
    uy0 = vy0 + R * wx0;
  const u0 = Math.hypot(ux0, uy0);
  const ex = u0 > 0 ? ux0 / u0 : 0,
    ey = u0 > 0 ? uy0 / u0 : 0;
  const phiRoll = (alpha * u0) / ((1 + alpha) * g);
  const vxr = (vx0 + alpha * R * wy0) / (1 + alpha),
    vyr = (vy0 - alpha * R * wx0) / (1 + alpha);
  // angular momentum about the contact point (per unit mass), for |ω| along the way: ω = (L − R ẑ × v)/k²
  const lx = k2 * wx0 - R * vy0,
    ly = k2 * wy0 + R * vx0;
  const grid = field.filmUm,
    rows = field.rows,
    cols = field.cols,
    invRowM = 1 / (field.ftStep * C.footM);
  const mu0 = field.mu0,
    dMu = field.dMu,
    hc = field.filmScaleUm;
  const carried = field.carriedOil;
  const split = K.filmSplit,
    wB = K.carriedFilmWeight;
  const keepPerPass = Math.log(1 - K.exchangeFraction);
  const invTau = Number.isFinite(field.absorptionTimeS) ? 1 / field.absorptionTimeS : 0;
  const refresh = (flareInPerS * C.inchM) / (K.trackWidthIn * C.inchM);
  const stopM = C.headpinFt * C.footM,
    half = C.laneHalfWidthM;
  const h = 0.012;
  let phi = 0,
    ring = 0,
    t = 0;
  let bpY = hand * y,
    bpX = x,
    gutter = false;
  let vx = vx0,
    vy = vy0;
  const muAt = (px: number, py: number, b: number) => mu0 + (dMu * hc) / (bilinear(grid, rows, cols, invRowM, px, py) + wB * b + hc);
  while (t < K.maxTimeS) {
    if (phi >= phiRoll) {
      // rolling: a straight line to the pins
      const vxe = vxr,
        vye = vyr;
      if (vxe <= 0) break;
      const yEnd = y + (vye / vxe) * (stopM - x);
      if (hand * vye < 0 && hand * yEnd < bpY) {
        bpY = hand * yEnd;
        bpX = stopM;
      }
      if (!gutter && Math.abs(yEnd) > half) gutter = true;
      return {
        entryBoard: C.centreBoard + hand * yEnd * invBw,
        entryAngleDeg: (Math.atan2(hand * vye, vxe) * 180) / Math.PI,
        breakpointBoard: C.centreBoard + bpY * invBw,
        breakpointFt: bpX / C.footM,
        reachedPins: true,
        gutter,
      };
    }
    // RK2 (midpoint) on (x, y, Φ); the ring is updated once a step
    const mu1 = muAt(x, y, ring);
    const vxa = vx0 - g * phi * ex,
      vya = vy0 - g * phi * ey;
    const xm = x + 0.5 * h * vxa,
      ym = y + 0.5 * h * vya,
      phim = phi + 0.5 * h * mu1;
    const mu2 = muAt(xm, ym, ring);
    const vxm = vx0 - g * phim * ex,
      vym = vy0 - g * phim * ey;
    let dphi = h * mu2;
    let hStep = h;
    if (phi + dphi > phiRoll) {
      hStep = (h * (phiRoll - phi)) / dphi;
      dphi = phiRoll - phi;
    }
    const x1 = x + hStep * vxm,
      y1 = y + hStep * vym;
    phi += dphi;
    vx = vx0 - g * phi * ex;
    vy = vy0 - g * phi * ey;
    // breakpoint (hand-relative lateral minimum)
    if (hand * y1 < bpY) {
      bpY = hand * y1;
      bpX = x1;
    }
    if (!gutter && Math.abs(y1) > half && x1 <= stopM) gutter = true;
    if (x1 >= stopM) {
      const f = (stopM - x) / (x1 - x);
      const ye = y + f * (y1 - y);
      return {
        entryBoard: C.centreBoard + hand * ye * invBw,
        entryAngleDeg: (Math.atan2(hand * vy, vx) * 180) / Math.PI,
        breakpointBoard: C.centreBoard + bpY * invBw,
        breakpointFt: bpX / C.footM,
        reachedPins: true,
        gutter,
      };
    }
    if (carried) {
      const wx = (lx + R * vy) / k2,
        wy = (ly - R * vx) / k2;
      const wmag = Math.sqrt(wx * wx + wy * wy + wz0 * wz0);
      const hLane = bilinear(grid, rows, cols, invRowM, x1, y1);
      ring += (1 - Math.exp((keepPerPass * wmag * hStep) / (2 * Math.PI))) * (split * hLane - ring);
      ring *= Math.exp(-hStep * (refresh + invTau));
    }
    x = x1;
    y = y1;
    t += hStep;
    if (vx <= 0) break;
  }
  return {
    entryBoard: C.centreBoard + hand * y * invBw,
    entryAngleDeg: (Math.atan2(hand * vy, vx) * 180) / Math.PI,
    breakpointBoard: C.centreBoard + bpY * invBw,
    breakpointFt: bpX / C.footM,
    reachedPins: false,
    gutter,
  };
}
