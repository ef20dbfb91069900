import type { BallInertia } from './ballInertia';
import type { FrictionField } from './frictionField';
import { assertNumber } from './assertNumber';
import { MOTION_CALIBRATION as K } from './motionCalibration';
import { PHYSICAL_CONSTANTS as C } from './physicalConstants';
import { STATE } from './releaseState';

/** Options of one integration. */
export interface IntegrateOptions {
  /** 1 = right-hander, −1 = left-hander: only changes how boards and angles are reported (hand side). */
  hand?: 1 | -1;
  /** RK4 step, s (default MOTION_CALIBRATION.stepS). */
  stepS?: number;
  /** Regularisation speed ε, m/s (default MOTION_CALIBRATION.slipEpsMs). */
  slipEpsMs?: number;
  /** Stop after this time, s. */
  maxTimeS?: number;
  /** Stop at this distance, ft (default: the headpin, 60 ft). */
  stopFt?: number;
  /** Called after every step with the time and the state (read it, do not keep it). For tests. */
  onStep?: (tS: number, state: Float64Array) => void;
}

/** What one integration reports, hand-relative (boards from the bowler's hand-side gutter). */
export interface DeliveryResult {
  /** Samples at every whole foot from 0 to the pins, or to the gutter (the last sample is the gutter point). */
  sampleFt: Float64Array;
  sampleBoard: Float64Array;
  sampleSpeedMph: Float64Array;
  sampleCount: number;
  rollStartFt: number | null;
  skidFt: number;
  breakpointFt: number;
  breakpointBoard: number;
  /** At the stop distance (the headpin): as if the lane went on past a gutter, so solvers see a continuous value. */
  entryBoard: number;
  entryAngleDeg: number;
  timeToPinsS: number;
  speedAtPinsMph: number;
  reachedPins: boolean;
  gutter: boolean;
  gutterFt: number | null;
  steps: number;
  finalState: Float64Array;
}

/** Fixed-shape parameter block of the right-hand side (monomorphic for the JIT). */
class Kernel {
  m = 0; R = 0; g = C.g; eps2 = 0;
  i1 = 0; i2 = 0; i3 = 0; inv1 = 0; inv2 = 0; inv3 = 0;
  uniform = true; mu0 = 0; dMu = 0; eb = 1;
  rows = 0; cols = 0; invRowM = 0; grid: Float64Array = new Float64Array(0);
}

const invBw = 1 / C.boardWidthM;

/**
 * The 4 cube-map cells (6·n² cells) around body direction (x, y, z) and their bilinear weights, written
 * to splatCell / splatW (weights clamped at the face's edge rows; need not be unit).
 */
function splat(x: number, y: number, z: number, n: number): void {
  const ax = Math.abs(x), ay = Math.abs(y), az = Math.abs(z);
  let face: number, a: number, b: number;
  if (ax >= ay && ax >= az) { face = x > 0 ? 0 : 1; a = y / ax; b = z / ax; }
  else if (ay >= az) { face = y > 0 ? 2 : 3; a = x / ay; b = z / ay; }
  else { face = z > 0 ? 4 : 5; a = x / az; b = y / az; }
  let u = (a + 1) * 0.5 * n - 0.5, v = (b + 1) * 0.5 * n - 0.5;
  if (u < 0) u = 0; else if (u > n - 1) u = n - 1;
  if (v < 0) v = 0; else if (v > n - 1) v = n - 1;
  let i0 = Math.floor(u), j0 = Math.floor(v);
  if (i0 > n - 2) i0 = n - 2;
  if (j0 > n - 2) j0 = n - 2;
  const fu = u - i0, fv = v - j0, base = face * n * n + i0 * n + j0;
  splatCell[0] = base; splatW[0] = (1 - fu) * (1 - fv);
  splatCell[1] = base + n; splatW[1] = fu * (1 - fv);
  splatCell[2] = base + 1; splatW[2] = (1 - fu) * fv;
  splatCell[3] = base + n + 1; splatW[3] = fu * fv;
}

/** Bilinear lookup in a pattern-board × foot grid at lane position (x, y) in metres. */
function bilinear(grid: Float64Array, rows: number, cols: number, invRowM: number, x: number, y: number): number {
  let jf = y * invBw + 20;
  if (jf < 0) jf = 0; else if (jf > cols - 1) jf = cols - 1;
  let rf = x * invRowM;
  if (rf < 0) rf = 0; else if (rf > rows - 1) rf = rows - 1;
  let j0 = Math.floor(jf), r0 = Math.floor(rf);
  if (j0 > cols - 2) j0 = cols - 2;
  if (r0 > rows - 2) r0 = rows - 2;
  const fj = jf - j0, fr = rf - r0;
  const a = r0 * cols + j0, b = a + cols;
  return (1 - fr) * ((1 - fj) * grid[a] + fj * grid[a + 1]) + fr * ((1 - fj) * grid[b] + fj * grid[b + 1]);
}

/**
 * Newton–Euler right-hand side (PHYSICS.md §1.2–§1.5): regularised Coulomb friction at the contact
 * point F = −μ m g u/√(|u|²+ε²) (§1.8), torque r_c × F (§1.3), Euler's equations in the body frame
 * (§1.4), q̇ = ½(0, ω) ⊗ q with Q built from the 2/|q|² form (§1.5 pitfall). No allocation.
 */
function rhs(s: Float64Array, d: Float64Array, k: Kernel): void {
  const x = s[0], y = s[1], vx = s[2], vy = s[3], wx = s[4], wy = s[5], wz = s[6];
  const qw = s[7], qx = s[8], qy = s[9], qz = s[10];
  const R = k.R;
  const mu = k.uniform ? k.mu0 : k.mu0 + k.dMu * k.eb * bilinear(k.grid, k.rows, k.cols, k.invRowM, x, y);
  const ux = vx - R * wy, uy = vy + R * wx;
  const c = -mu * k.g / Math.sqrt(ux * ux + uy * uy + k.eps2);
  const ax = c * ux, ay = c * uy; // F/m
  const tx = R * k.m * ay, ty = -R * k.m * ax; // τ = r_c × F, τ_z = 0
  const sc = 2 / (qw * qw + qx * qx + qy * qy + qz * qz);
  const q00 = 1 - sc * (qy * qy + qz * qz), q01 = sc * (qx * qy - qw * qz), q02 = sc * (qx * qz + qw * qy);
  const q10 = sc * (qx * qy + qw * qz), q11 = 1 - sc * (qx * qx + qz * qz), q12 = sc * (qy * qz - qw * qx);
  const q20 = sc * (qx * qz - qw * qy), q21 = sc * (qy * qz + qw * qx), q22 = 1 - sc * (qx * qx + qy * qy);
  const w1 = q00 * wx + q10 * wy + q20 * wz, w2 = q01 * wx + q11 * wy + q21 * wz, w3 = q02 * wx + q12 * wy + q22 * wz;
  const t1 = q00 * tx + q10 * ty, t2 = q01 * tx + q11 * ty, t3 = q02 * tx + q12 * ty;
  const dw1 = (t1 + (k.i2 - k.i3) * w2 * w3) * k.inv1;
  const dw2 = (t2 + (k.i3 - k.i1) * w3 * w1) * k.inv2;
  const dw3 = (t3 + (k.i1 - k.i2) * w1 * w2) * k.inv3;
  d[0] = vx; d[1] = vy; d[2] = ax; d[3] = ay;
  d[4] = q00 * dw1 + q01 * dw2 + q02 * dw3;
  d[5] = q10 * dw1 + q11 * dw2 + q12 * dw3;
  d[6] = q20 * dw1 + q21 * dw2 + q22 * dw3;
  d[7] = -0.5 * (wx * qx + wy * qy + wz * qz);
  d[8] = 0.5 * (wx * qw + wy * qz - wz * qy);
  d[9] = 0.5 * (wy * qw + wz * qx - wx * qz);
  d[10] = 0.5 * (wz * qw + wx * qy - wy * qx);
}

// Scratch for the oil carried on the ball (reused between calls; integrateDelivery is synchronous and
// must not be called again from inside its own onStep callback).
let cellOil = new Float64Array(0);
const splatCell = new Int32Array(4);
const rkTmp = new Float64Array(11), rk1 = new Float64Array(11), rk2 = new Float64Array(11), rk3 = new Float64Array(11), rk4 = new Float64Array(11);
const splatW = new Float64Array(4);

/**
 * Integrates one delivery from the foul line to the pins with fixed-step RK4 (PHYSICS.md §4.1
 * Option A): full Newton–Euler state (x, y, v, ω, q), smoothed Coulomb friction, one step h.
 * Friction comes from `field` (uniform, a sampled μ function, or an oil map with the oil the ball
 * carries on its track, PHYSICS.md §5.3: the cover is a cube map of cells; as cover rolls through
 * contact the cells under it relax toward φh, db = (φh − b)·w ds/ℓ (bilinear weight w, ℓ such that one
 * cell width exchanges κ), and absorb oil with time constant τ; friction sees h + w_b·b). Flare is not imposed: it comes from Euler's equations (§1.10).
 *
 * Reported quantities (our definitions, PHYSICS.md §1.8, §4.1 "Reporting"): `rollStartFt` where the
 * slip speed |u| first falls below `rollSlipTolEps`·ε, extrapolated linearly to zero; `skidFt` where |u|
 * first falls to `skidSlipFraction` of its release value (the end of the skid, start of the hook
 * phase); breakpoint = the point farthest toward the hand-side gutter (where the lateral velocity
 * changes sign, interpolated); entry board/angle at the stop distance (60 ft), angle positive toward
 * the pocket side (increasing boards).
 *
 * Units: SI state in (see `STATE`), feet / boards / mph / degrees / seconds out. Edge cases: state
 * must have 11 finite entries; step in [1e-5, 0.02] s; a ball that stalls or times out has
 * `reachedPins` false and reports its last position; the gutter (ball centre past the lane edge)
 * truncates the path but integration continues on a virtual lane so `entryBoard` stays continuous.
 * Example: `integrateDelivery(releaseState(ball, bowler, 20, 15), ballInertia(ball), uniformFrictionField(0.2))`.
 */
export function integrateDelivery(state0: Float64Array, inertia: BallInertia, field: FrictionField, options: IntegrateOptions = {}): DeliveryResult {
  const fn = 'integrateDelivery';
  if (!(state0 instanceof Float64Array) || state0.length !== STATE.length) throw new TypeError(`${fn}: state must be a Float64Array of length ${STATE.length}`);
  for (let i = 0; i < STATE.length; i++) if (!Number.isFinite(state0[i])) throw new TypeError(`${fn}: state[${i}] is not finite: ${state0[i]}`);
  const eps = assertNumber(fn, 'slipEpsMs', options.slipEpsMs ?? K.slipEpsMs, 1e-6, 1);
  let h = assertNumber(fn, 'stepS', options.stepS ?? K.stepS, 1e-5, 0.02);
  {
    // keep λh ≤ 2 (PHYSICS.md §1.8: explicit RK4 is stable for λh ≲ 2.8), λ = μ_max g (1 + R²/k_min²)/ε
    let gMax = 0;
    for (let i = 0; i < field.grid.length; i++) if (field.grid[i] > gMax) gMax = field.grid[i];
    const muMax = field.uniform ? field.mu0 : field.mu0 + field.dMu * gMax;
    const kMin2 = Math.min(inertia.iLow, inertia.iHigh, inertia.iInt) / inertia.massKg;
    const lambda = (muMax * C.g * (1 + (inertia.radiusM * inertia.radiusM) / kMin2)) / eps;
    if (lambda * h > 2) h = 2 / lambda;
  }
  const maxT = assertNumber(fn, 'maxTimeS', options.maxTimeS ?? K.maxTimeS, h, 60);
  const stopFt = assertNumber(fn, 'stopFt', options.stopFt ?? C.headpinFt, 0.1, 200);
  const hand = options.hand ?? 1;
  const onStep = options.onStep;

  const k = new Kernel();
  k.m = inertia.massKg; k.R = inertia.radiusM; k.eps2 = eps * eps;
  k.i1 = inertia.iLow; k.i2 = inertia.iHigh; k.i3 = inertia.iInt;
  k.inv1 = 1 / k.i1; k.inv2 = 1 / k.i2; k.inv3 = 1 / k.i3;
  k.uniform = field.uniform; k.mu0 = field.mu0; k.dMu = field.dMu; k.eb = 1;
  k.rows = field.rows; k.cols = field.cols; k.grid = field.grid; k.invRowM = 1 / (field.ftStep * C.footM);

  // carried oil on the ball (cube map of cells)
  const carried = field.carriedOil && field.filmUm.length > 0;
  const n = K.ballCellsPerFaceEdge;
  const nCells = 6 * n * n;
  if (carried) {
    if (cellOil.length !== nCells) cellOil = new Float64Array(nCells);
    cellOil.fill(0);
  }
  const split = K.filmSplit, wB = K.carriedFilmWeight;
  // exchange length: rolling one cell width of cover through contact exchanges exchangeFraction
  const invEll = -Math.log(1 - K.exchangeFraction) / ((Math.PI / 2 / n) * inertia.radiusM);
  const invTau = Number.isFinite(field.absorptionTimeS) ? 1 / field.absorptionTimeS : 0;
  const absorbGrowth = Math.exp(h * invTau);
  let absorbScale = 1; // e^(t/τ) at the current step
  const invHc = 1 / field.filmScaleUm;
  let started = false, pcx = 0, pcy = 0, pcz = -1;
  const cellRad = Math.PI / 2 / n; // a cube-map cell's angular size at a face centre (π/2 per face / n)

  const s = Float64Array.from(state0);
  const tmp = rkTmp, k1 = rk1, k2 = rk2, k3 = rk3, k4 = rk4;
  { const qn = 1 / Math.hypot(s[7], s[8], s[9], s[10]); s[7] *= qn; s[8] *= qn; s[9] *= qn; s[10] *= qn; }

  const ftM = C.footM, stopM = stopFt * ftM, half = C.laneHalfWidthM, R = inertia.radiusM;
  const maxSamples = Math.floor(stopFt) + 2;
  const sampleFt = new Float64Array(maxSamples), sampleBoard = new Float64Array(maxSamples), sampleSpeed = new Float64Array(maxSamples);
  const toBoard = (y: number): number => C.centreBoard + hand * y * invBw;
  const mph = 1 / C.mphMs;
  let ns = 0;
  sampleFt[0] = s[0] / ftM; sampleBoard[0] = toBoard(s[1]); sampleSpeed[0] = Math.hypot(s[2], s[3]) * mph; ns = 1;
  let nextFoot = Math.floor(s[0] / ftM) + 1;

  const slip = (): number => { const ax = s[2] - R * s[5], ay = s[3] + R * s[4]; return Math.sqrt(ax * ax + ay * ay); };
  const u0 = slip();
  const tol = K.rollSlipTolEps * eps;
  let rollStartFt: number | null = u0 <= tol ? s[0] / ftM : null;
  const skidU = K.skidSlipFraction * u0;
  let skidFt = u0 <= tol ? s[0] / ftM : NaN;
  let uPrev = u0;

  let bpY = hand * s[1], bpX = s[0];
  let gutter = Math.abs(s[1]) > half, gutterFt: number | null = gutter ? s[0] / ftM : null;
  let reached = false, entryBoard = NaN, entryAngle = NaN, tPins = NaN, vPins = NaN;
  let t = 0, steps = 0;
  const h2 = h / 2, h6 = h / 6;

  while (t < maxT) {
    if (carried) {
      // Contact point in body axes: −Qᵀẑ = −(Q20, Q21, Q22). The contact's path over the ball since the
      // last step is walked in sub-steps of at most one cell; each sub-step exchanges oil with the 4
      // nearest cell centres in proportion to their bilinear weights and to the cover length rolled
      // through contact, so the result does not depend on the step or on where the cell edges fall.
      const qw = s[7], qx = s[8], qy = s[9], qz = s[10];
      const cx = -2 * (qx * qz - qw * qy), cy = -2 * (qy * qz + qw * qx), cz = -(1 - 2 * (qx * qx + qy * qy));
      if (started) {
        // angle rolled through contact ≈ chord |c − c_prev| (error θ³/24: 1e-4 relative at 0.13 rad per step)
        const ex = cx - pcx, ey = cy - pcy, ez = cz - pcz;
        const ang = Math.sqrt(ex * ex + ey * ey + ez * ez);
        const m = Math.max(1, Math.ceil(ang / cellRad));
        const x = (ang * R * invEll) / m; // exchange exponent of one sub-step at weight 1
        // cells hold b̃ = b·e^(t/τ), so absorption (db/dt = −b/τ) needs no per-cell work
        const hl = split * bilinear(field.filmUm, field.rows, field.cols, k.invRowM, s[0], s[1]) * absorbScale;
        for (let j = 1; j <= m; j++) {
          const f = (j - 0.5) / m; // sub-step midpoint (second order in the sub-step)
          splat(pcx + f * (cx - pcx), pcy + f * (cy - pcy), pcz + f * (cz - pcz), n);
          for (let i = 0; i < 4; i++) {
            const w = splatW[i];
            if (w <= 0) continue;
            const c = splatCell[i];
            const xw = x * w;
            cellOil[c] += (xw / (1 + 0.5 * xw)) * (hl - cellOil[c]); // (1 − e^−xw) to third order
          }
        }
      }
      splat(cx, cy, cz, n);
      let bRead = 0;
      for (let i = 0; i < 4; i++) bRead += splatW[i] * cellOil[splatCell[i]];
      k.eb = Math.exp(-wB * (bRead / absorbScale) * invHc);
      pcx = cx; pcy = cy; pcz = cz; started = true;
      absorbScale *= absorbGrowth;
    }
    const x0 = s[0], y0 = s[1], vx0 = s[2], vy0 = s[3];
    rhs(s, k1, k);
    for (let i = 0; i < 11; i++) tmp[i] = s[i] + h2 * k1[i];
    rhs(tmp, k2, k);
    for (let i = 0; i < 11; i++) tmp[i] = s[i] + h2 * k2[i];
    rhs(tmp, k3, k);
    for (let i = 0; i < 11; i++) tmp[i] = s[i] + h * k3[i];
    rhs(tmp, k4, k);
    for (let i = 0; i < 11; i++) s[i] += h6 * (k1[i] + 2 * (k2[i] + k3[i]) + k4[i]);
    const qn = 1 / Math.sqrt(s[7] * s[7] + s[8] * s[8] + s[9] * s[9] + s[10] * s[10]);
    s[7] *= qn; s[8] *= qn; s[9] *= qn; s[10] *= qn;
    t += h; steps++;
    if (onStep !== undefined) onStep(t, s);

    const x1 = s[0], y1 = s[1];
    const dx = x1 - x0;
    // slip events
    const u1 = slip();
    if (Number.isNaN(skidFt) && u1 <= skidU) {
      const f = uPrev > u1 ? (uPrev - skidU) / (uPrev - u1) : 1;
      skidFt = (x0 + f * dx) / ftM;
    }
    if (rollStartFt === null && u1 <= tol) {
      const rate = (uPrev - u1) / h;
      const tz = rate > 0 ? Math.min(u1 / rate, 0.02) : 0;
      rollStartFt = (x1 + s[2] * tz) / ftM;
    }
    uPrev = u1;
    // breakpoint (hand-relative lateral minimum)
    if (x1 <= stopM) {
      const yh1 = hand * y1;
      const vh0 = hand * vy0, vh1 = hand * s[3];
      if (vh0 < 0 && vh1 >= 0) {
        const tau = (vh0 / (vh0 - vh1)) * h;
        const yb = hand * y0 + 0.5 * vh0 * tau;
        if (yb < bpY) { bpY = yb; bpX = x0 + vx0 * tau; }
      }
      if (yh1 < bpY) { bpY = yh1; bpX = x1; }
    }
    // gutter
    if (!gutter && Math.abs(y1) > half && x1 <= stopM) {
      gutter = true;
      const f = (half - Math.abs(y0)) / (Math.abs(y1) - Math.abs(y0));
      const xg = x0 + f * dx;
      gutterFt = xg / ftM;
      if (ns < maxSamples) {
        sampleFt[ns] = gutterFt; sampleBoard[ns] = toBoard(y0 + f * (y1 - y0));
        sampleSpeed[ns] = Math.hypot(vx0 + f * (s[2] - vx0), vy0 + f * (s[3] - vy0)) * mph; ns++;
      }
    }
    // per-foot samples
    while (!gutter && nextFoot <= stopFt && x1 >= nextFoot * ftM && dx > 0) {
      const f = (nextFoot * ftM - x0) / dx;
      sampleFt[ns] = nextFoot; sampleBoard[ns] = toBoard(y0 + f * (y1 - y0));
      sampleSpeed[ns] = Math.hypot(vx0 + f * (s[2] - vx0), vy0 + f * (s[3] - vy0)) * mph; ns++;
      nextFoot++;
    }
    if (x1 >= stopM) {
      const f = (stopM - x0) / dx;
      const vxe = vx0 + f * (s[2] - vx0), vye = vy0 + f * (s[3] - vy0);
      entryBoard = toBoard(y0 + f * (y1 - y0));
      entryAngle = (Math.atan2(hand * vye, vxe) * 180) / Math.PI;
      tPins = t - h + f * h;
      vPins = Math.hypot(vxe, vye) * mph;
      reached = true;
      if (!gutter && ns < maxSamples && sampleFt[ns - 1] < stopFt - 1e-9) { sampleFt[ns] = stopFt; sampleBoard[ns] = entryBoard; sampleSpeed[ns] = vPins; ns++; }
      break;
    }
    if (s[2] <= 0) break; // stalled or rolling back
  }
  if (!reached) {
    entryBoard = toBoard(s[1]);
    entryAngle = (Math.atan2(hand * s[3], s[2]) * 180) / Math.PI;
    tPins = t; vPins = Math.hypot(s[2], s[3]) * mph;
  }
  if (Number.isNaN(skidFt)) skidFt = (reached ? stopM : s[0]) / ftM;
  return {
    sampleFt, sampleBoard, sampleSpeedMph: sampleSpeed, sampleCount: ns,
    rollStartFt, skidFt, breakpointFt: bpX / ftM, breakpointBoard: C.centreBoard + bpY * invBw,
    entryBoard, entryAngleDeg: entryAngle, timeToPinsS: tPins, speedAtPinsMph: vPins,
    reachedPins: reached, gutter, gutterFt, steps, finalState: s,
  };
}
