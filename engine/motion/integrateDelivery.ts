import type { BallInertia } from './ballInertia';
import type { FrictionField } from './frictionField';
import { assertNumber } from './assertNumber';
import { MOTION_CALIBRATION as K } from './motionCalibration';
import { PHYSICAL_CONSTANTS as C } from './physicalConstants';
import { motionSteps } from './motionSteps';
import { STATE } from './releaseState';

/** Options of one integration. */
export interface IntegrateOptions {
  /** 1 = right-hander, −1 = left-hander: only changes how boards and angles are reported (hand side). */
  hand?: 1 | -1;
  /** RK4 step near rolling, s (default MOTION_CALIBRATION.stepS, or withMotionSteps'). */
  stepS?: number;
  /** Longest RK4 step while the ball slides fast, s (default MOTION_CALIBRATION.maxStepS, or stepS when stepS is given; ≥ stepS). */
  maxStepS?: number;
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
  /** Where the ball starts to roll (slip gone); null when it still slides at the pins. */
  rollStartFt: number | null;
  /** Where the skid ends and the hook phase begins (see integrateDelivery). */
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
  /** Flare: the farthest the spin axis migrated over the cover from where it started (the spread of the track rings), inches of arc on the surface. */
  flareIn: number;
  steps: number;
  finalState: Float64Array;
}

/** Fixed-shape parameter block of the right-hand side (monomorphic for the JIT). */
class Kernel {
  m = 0;
  R = 0;
  g = C.g;
  eps2 = 0;
  i1 = 0;
  i2 = 0;
  i3 = 0;
  inv1 = 0;
  inv2 = 0;
  inv3 = 0;
  /** 0 uniform, 1 sampled μ grid, 2 oil film grid. */
  kind = 0;
  mu0 = 0;
  dMu = 0;
  hc = 1;
  carried = 0;
  rows = 0;
  cols = 0;
  invRowM = 0;
  grid: Float64Array = new Float64Array(0);
}

const invBw = 1 / C.boardWidthM;

/** Bilinear lookup in a pattern-board × foot grid at lane position (x, y) in metres. */
function bilinear(grid: Float64Array, rows: number, cols: number, invRowM: number, x: number, y: number): number {
  let jf = y * invBw + 20;
  if (jf < 0) jf = 0;
  else if (jf > cols - 1) jf = cols - 1;
  let rf = x * invRowM;
  if (rf < 0) rf = 0;
  else if (rf > rows - 1) rf = rows - 1;
  let j0 = Math.floor(jf),
    r0 = Math.floor(rf);
  if (j0 > cols - 2) j0 = cols - 2;
  if (r0 > rows - 2) r0 = rows - 2;
  const fj = jf - j0,
    fr = rf - r0;
  const a = r0 * cols + j0,
    b = a + cols;
  return (1 - fr) * ((1 - fj) * grid[a] + fj * grid[a + 1]) + fr * ((1 - fj) * grid[b] + fj * grid[b + 1]);
}

/**
 * Newton–Euler right-hand side: regularised Coulomb friction at the contact point F = −μ m g u/√(|u|²+ε²),
 * torque r_c × F, Euler's equations in the body frame, q̇ = ½(0, ω) ⊗ q with the rotation matrix built with
 * the 2/|q|² factor (exact for the non-unit quaternions of the RK4 stages). No allocation.
 */
function rhs(s: Float64Array, d: Float64Array, k: Kernel): void {
  const x = s[0],
    y = s[1],
    vx = s[2],
    vy = s[3],
    wx = s[4],
    wy = s[5],
    wz = s[6];
  const qw = s[7],
    qx = s[8],
    qy = s[9],
    qz = s[10];
  const R = k.R;
  let mu: number;
  if (k.kind === 0) mu = k.mu0;
  else if (k.kind === 1) mu = bilinear(k.grid, k.rows, k.cols, k.invRowM, x, y);
  else {
    const h = bilinear(k.grid, k.rows, k.cols, k.invRowM, x, y) + k.carried;
    mu = k.mu0 + (k.dMu * k.hc) / (h + k.hc);
  }
  const ux = vx - R * wy,
    uy = vy + R * wx;
  const c = (-mu * k.g) / Math.sqrt(ux * ux + uy * uy + k.eps2);
  const ax = c * ux,
    ay = c * uy; // F/m
  const tx = R * k.m * ay,
    ty = -R * k.m * ax; // τ = r_c × F, τ_z = 0
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
  const w1 = q00 * wx + q10 * wy + q20 * wz,
    w2 = q01 * wx + q11 * wy + q21 * wz,
    w3 = q02 * wx + q12 * wy + q22 * wz;
  const t1 = q00 * tx + q10 * ty,
    t2 = q01 * tx + q11 * ty,
    t3 = q02 * tx + q12 * ty;
  const dw1 = (t1 + (k.i2 - k.i3) * w2 * w3) * k.inv1;
  const dw2 = (t2 + (k.i3 - k.i1) * w3 * w1) * k.inv2;
  const dw3 = (t3 + (k.i1 - k.i2) * w1 * w2) * k.inv3;
  d[0] = vx;
  d[1] = vy;
  d[2] = ax;
  d[3] = ay;
  d[4] = q00 * dw1 + q01 * dw2 + q02 * dw3;
  d[5] = q10 * dw1 + q11 * dw2 + q12 * dw3;
  d[6] = q20 * dw1 + q21 * dw2 + q22 * dw3;
  d[7] = -0.5 * (wx * qx + wy * qy + wz * qz);
  d[8] = 0.5 * (wx * qw + wy * qz - wz * qy);
  d[9] = 0.5 * (wy * qw + wz * qx - wx * qz);
  d[10] = 0.5 * (wz * qw + wx * qy - wy * qx);
}

// RK4 stage buffers (reused between calls; integrateDelivery is synchronous and must not be called again
// from inside its own onStep callback).
const rkTmp = new Float64Array(11),
  rk1 = new Float64Array(11),
  rk2 = new Float64Array(11),
  rk3 = new Float64Array(11),
  rk4 = new Float64Array(11);

/**
 * Integrates one delivery from the foul line to the pins with fixed-step RK4: full Newton–Euler state (x, y, v,
 * ω, q), smoothed Coulomb friction, one step h. Friction comes from `field`: uniform, a sampled μ grid, or an oil
 * map read through the cover's mixed-lubrication law, where the film also counts the oil the ball carries on its
 * track. The track ring (the circle of cover that touches the lane) exchanges oil with the lane on each pass
 * through contact (toward filmSplit·h, fraction exchangeFraction per pass), gives it up to the cover with the
 * cover's absorption time, and is refreshed with dry cover as the spin axis migrates through the core (flare):
 * a migration of one trackWidthIn replaces the ring. Flare is not imposed: it comes from Euler's equations.
 *
 * Reported quantities (our definitions): `rollStartFt` where the slip speed |u| first falls below
 * `rollSlipTolEps`·ε, extrapolated linearly to zero; `skidFt` where |u| has fallen by `skidSlipDrop` of its
 * release value (the ball has started to hook), or the breakpoint if that comes first; breakpoint = the
 * point farthest toward the hand-side gutter (where the lateral velocity changes sign, interpolated); entry
 * board/angle at the stop distance (60 ft), angle positive toward the pocket side (increasing boards);
 * `flareIn` the farthest the spin axis moved over the cover from its release position (the spread of the oil rings).
 *
 * Units: SI state in (see `STATE`), feet / boards / mph / degrees / seconds out. Edge cases: state must have 11
 * finite entries; step in [1e-5, 0.02] s; a ball that stalls or times out has `reachedPins` false and reports
 * its last position; the gutter (ball centre past the lane edge) truncates the path but integration continues
 * on a virtual lane so `entryBoard` stays continuous.
 * Example: `integrateDelivery(releaseState(ball, bowler, 20, 15), ballInertia(ball), uniformFrictionField(0.2))`.
 */
export function integrateDelivery(
  state0: Float64Array,
  inertia: BallInertia,
  field: FrictionField,
  options: IntegrateOptions = {},
): DeliveryResult {
  const fn = 'integrateDelivery';
  if (!(state0 instanceof Float64Array) || state0.length !== STATE.length)
    throw new TypeError(`${fn}: state must be a Float64Array of length ${STATE.length}`);
  for (let i = 0; i < STATE.length; i++)
    if (!Number.isFinite(state0[i])) throw new TypeError(`${fn}: state[${i}] is not finite: ${state0[i]}`);
  const eps = assertNumber(fn, 'slipEpsMs', options.slipEpsMs ?? K.slipEpsMs, 1e-6, 1);
  const defaults = motionSteps();
  let h = assertNumber(fn, 'stepS', options.stepS ?? defaults.stepS, 1e-5, 0.02);
  {
    // keep λh ≤ 2 (explicit RK4 is stable for λh ≲ 2.8), λ = μ_max g (1 + R²/k_min²)/ε
    const kMin2 = Math.min(inertia.iLow, inertia.iHigh, inertia.iInt) / inertia.massKg;
    const lambda = (field.muMax * C.g * (1 + (inertia.radiusM * inertia.radiusM) / kMin2)) / eps;
    if (lambda * h > 2) h = 2 / lambda;
  }
  // a caller that fixes stepS without maxStepS gets a fixed step (accuracy studies, closed-form checks)
  const hMax = Math.max(
    h,
    assertNumber(fn, 'maxStepS', options.maxStepS ?? (options.stepS !== undefined ? h : defaults.maxStepS), 1e-5, 0.05),
  );
  // While the slip speed u is large the friction direction barely turns in a step: the local stiffness is
  // μg(1+R²/k²)/u rather than /ε, so the step can grow with u (up to hMax) at the same stability margin.
  const kMin2s = Math.min(inertia.iLow, inertia.iHigh, inertia.iInt) / inertia.massKg;
  const slipStep = K.slipStepFactor / (field.muMax * C.g * (1 + (inertia.radiusM * inertia.radiusM) / kMin2s));
  const maxT = assertNumber(fn, 'maxTimeS', options.maxTimeS ?? K.maxTimeS, h, 60);
  const stopFt = assertNumber(fn, 'stopFt', options.stopFt ?? C.headpinFt, 0.1, 200);
  const hand = options.hand ?? 1;
  const onStep = options.onStep;

  const k = new Kernel();
  k.m = inertia.massKg;
  k.R = inertia.radiusM;
  k.eps2 = eps * eps;
  k.i1 = inertia.iLow;
  k.i2 = inertia.iHigh;
  k.i3 = inertia.iInt;
  k.inv1 = 1 / k.i1;
  k.inv2 = 1 / k.i2;
  k.inv3 = 1 / k.i3;
  k.kind = field.kind === 'uniform' ? 0 : field.kind === 'sampled' ? 1 : 2;
  k.mu0 = field.mu0;
  k.dMu = field.dMu;
  k.hc = field.filmScaleUm;
  k.rows = field.rows;
  k.cols = field.cols;
  k.grid = field.kind === 'oil' ? field.filmUm : field.grid;
  k.invRowM = 1 / (field.ftStep * C.footM);

  // oil carried on the track ring
  const carried = field.kind === 'oil' && field.carriedOil;
  const split = K.filmSplit,
    wB = K.carriedFilmWeight;
  const keepPerPass = Math.log(1 - K.exchangeFraction); // ln of the share kept per pass through contact
  const invAbsorbS = Number.isFinite(field.absorptionTimeS) ? 1 / field.absorptionTimeS : 0;
  const invTrack = 1 / (K.trackWidthIn * C.inchM);
  let ring = 0; // carried film on the track, µm
  // the ring's rates at the start of the step (exchange per s, loss to flare and absorption per s, lane film):
  // the step's friction reads the ring at mid-step, and the update uses the mean of the start and end rates
  // (second order in h, like the rest of the step)
  let exRate = 0,
    lossRate = invAbsorbS,
    laneFilm = 0;

  const s = Float64Array.from(state0);
  const tmp = rkTmp,
    k1 = rk1,
    k2 = rk2,
    k3 = rk3,
    k4 = rk4;
  {
    const qn = 1 / Math.hypot(s[7], s[8], s[9], s[10]);
    s[7] *= qn;
    s[8] *= qn;
    s[9] *= qn;
    s[10] *= qn;
  }

  if (carried) {
    laneFilm = bilinear(k.grid, k.rows, k.cols, k.invRowM, s[0], s[1]);
    exRate = (-keepPerPass * Math.sqrt(s[4] * s[4] + s[5] * s[5] + s[6] * s[6])) / (2 * Math.PI);
  }
  const ftM = C.footM,
    stopM = stopFt * ftM,
    half = C.laneHalfWidthM,
    R = inertia.radiusM;
  const maxSamples = Math.floor(stopFt) + 2;
  const sampleFt = new Float64Array(maxSamples),
    sampleBoard = new Float64Array(maxSamples),
    sampleSpeed = new Float64Array(maxSamples);
  const toBoard = (y: number): number => C.centreBoard + hand * y * invBw;
  const mph = 1 / C.mphMs;
  let ns = 0;
  sampleFt[0] = s[0] / ftM;
  sampleBoard[0] = toBoard(s[1]);
  sampleSpeed[0] = Math.hypot(s[2], s[3]) * mph;
  ns = 1;
  let nextFoot = Math.floor(s[0] / ftM) + 1;

  const slip = (): number => {
    const ax = s[2] - R * s[5],
      ay = s[3] + R * s[4];
    return Math.sqrt(ax * ax + ay * ay);
  };
  const u0 = slip();
  const tol = K.rollSlipTolEps * eps;
  let rollStartFt: number | null = u0 <= tol ? s[0] / ftM : null;
  const skidU = (1 - K.skidSlipDrop) * u0;
  let skidFt = u0 <= tol ? s[0] / ftM : NaN;
  let uPrev = u0;

  // spin axis in body axes (for flare): ω_b = Qᵀω (written out in the loop; here for the release)
  let pbx = 0,
    pby = 0,
    pbz = 0,
    flareCos = 1;
  {
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
    const nb = Math.sqrt(b1 * b1 + b2 * b2 + b3 * b3);
    if (nb > 0) {
      pbx = b1 / nb;
      pby = b2 / nb;
      pbz = b3 / nb;
    }
  }
  const a0x = pbx,
    a0y = pby,
    a0z = pbz; // the spin axis in the body at release: the first track ring's pole

  let bpY = hand * s[1],
    bpX = s[0];
  let gutter = Math.abs(s[1]) > half,
    gutterFt: number | null = gutter ? s[0] / ftM : null;
  let reached = false,
    entryBoard = NaN,
    entryAngle = NaN,
    tPins = NaN,
    vPins = NaN;
  let t = 0,
    steps = 0;
  const hMin = h;

  while (t < maxT) {
    h = uPrev * slipStep;
    if (h < hMin) h = hMin;
    else if (h > hMax) h = hMax;
    const h2 = h / 2,
      h6 = h / 6;
    if (carried) {
      const tgt = split * laneFilm;
      k.carried = wB * (tgt + (ring - tgt) * Math.exp(-exRate * h2)) * Math.exp(-lossRate * h2);
    } else k.carried = 0;
    const x0 = s[0],
      y0 = s[1],
      vx0 = s[2],
      vy0 = s[3];
    rhs(s, k1, k);
    for (let i = 0; i < 11; i++) tmp[i] = s[i] + h2 * k1[i];
    rhs(tmp, k2, k);
    for (let i = 0; i < 11; i++) tmp[i] = s[i] + h2 * k2[i];
    rhs(tmp, k3, k);
    for (let i = 0; i < 11; i++) tmp[i] = s[i] + h * k3[i];
    rhs(tmp, k4, k);
    for (let i = 0; i < 11; i++) s[i] += h6 * (k1[i] + 2 * (k2[i] + k3[i]) + k4[i]);
    const qn = 1 / Math.sqrt(s[7] * s[7] + s[8] * s[8] + s[9] * s[9] + s[10] * s[10]);
    s[7] *= qn;
    s[8] *= qn;
    s[9] *= qn;
    s[10] *= qn;
    t += h;
    steps++;
    if (onStep !== undefined) onStep(t, s);

    // flare: how far the spin axis moved through the body this step (chord ≈ arc)
    {
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
      const wmag = Math.sqrt(b1 * b1 + b2 * b2 + b3 * b3);
      if (wmag > 0) {
        const inv = 1 / wmag;
        const nx = b1 * inv,
          ny = b2 * inv,
          nz = b3 * inv;
        const ex = nx - pbx,
          ey = ny - pby,
          ez = nz - pbz;
        const dAxis = Math.sqrt(ex * ex + ey * ey + ez * ez);
        const c0 = nx * a0x + ny * a0y + nz * a0z;
        if (c0 < flareCos) flareCos = c0;
        pbx = nx;
        pby = ny;
        pbz = nz;
        if (carried) {
          // the track ring: passes through contact (one per revolution), fresh cover from flare, absorption
          const hLane = bilinear(k.grid, k.rows, k.cols, k.invRowM, s[0], s[1]);
          const ex1 = (-keepPerPass * wmag) / (2 * Math.PI);
          const tgt = split * 0.5 * (laneFilm + hLane);
          ring = tgt + (ring - tgt) * Math.exp(-0.5 * (exRate + ex1) * h);
          const fresh = R * dAxis * invTrack;
          const loss1 = (fresh < 1 ? -Math.log(1 - fresh) / h : Infinity) + invAbsorbS;
          ring *= Math.exp(-0.5 * (lossRate + loss1) * h);
          exRate = ex1;
          lossRate = loss1;
          laneFilm = hLane;
        }
      }
    }

    const x1 = s[0],
      y1 = s[1];
    const dx = x1 - x0;
    // slip events
    const su = s[2] - R * s[5],
      sv = s[3] + R * s[4];
    const u1 = Math.sqrt(su * su + sv * sv);
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
      const vh0 = hand * vy0,
        vh1 = hand * s[3];
      if (vh0 < 0 && vh1 >= 0) {
        const tau = (vh0 / (vh0 - vh1)) * h;
        const yb = hand * y0 + 0.5 * vh0 * tau;
        if (yb < bpY) {
          bpY = yb;
          bpX = x0 + vx0 * tau;
        }
      }
      if (yh1 < bpY) {
        bpY = yh1;
        bpX = x1;
      }
    }
    // gutter
    if (!gutter && Math.abs(y1) > half && x1 <= stopM) {
      gutter = true;
      const f = (half - Math.abs(y0)) / (Math.abs(y1) - Math.abs(y0));
      const xg = x0 + f * dx;
      gutterFt = xg / ftM;
      if (ns < maxSamples) {
        sampleFt[ns] = gutterFt;
        sampleBoard[ns] = toBoard(y0 + f * (y1 - y0));
        sampleSpeed[ns] = Math.hypot(vx0 + f * (s[2] - vx0), vy0 + f * (s[3] - vy0)) * mph;
        ns++;
      }
    }
    // per-foot samples
    while (!gutter && nextFoot <= stopFt && x1 >= nextFoot * ftM && dx > 0) {
      const f = (nextFoot * ftM - x0) / dx;
      sampleFt[ns] = nextFoot;
      sampleBoard[ns] = toBoard(y0 + f * (y1 - y0));
      sampleSpeed[ns] = Math.hypot(vx0 + f * (s[2] - vx0), vy0 + f * (s[3] - vy0)) * mph;
      ns++;
      nextFoot++;
    }
    if (x1 >= stopM) {
      const f = (stopM - x0) / dx;
      const vxe = vx0 + f * (s[2] - vx0),
        vye = vy0 + f * (s[3] - vy0);
      entryBoard = toBoard(y0 + f * (y1 - y0));
      entryAngle = (Math.atan2(hand * vye, vxe) * 180) / Math.PI;
      tPins = t - h + f * h;
      vPins = Math.hypot(vxe, vye) * mph;
      reached = true;
      if (!gutter && ns < maxSamples && sampleFt[ns - 1] < stopFt - 1e-9) {
        sampleFt[ns] = stopFt;
        sampleBoard[ns] = entryBoard;
        sampleSpeed[ns] = vPins;
        ns++;
      }
      break;
    }
    if (s[2] <= 0) break; // stalled or rolling back
  }
  if (!reached) {
    entryBoard = toBoard(s[1]);
    entryAngle = (Math.atan2(hand * s[3], s[2]) * 180) / Math.PI;
    tPins = t;
    vPins = Math.hypot(s[2], s[3]) * mph;
  }
  const breakpointFt = bpX / ftM;
  if (Number.isNaN(skidFt)) skidFt = (reached ? stopM : s[0]) / ftM;
  // the skid ends where the ball starts to hook: never after its breakpoint (when it has one past the release)
  if (breakpointFt > 0.5 && skidFt > breakpointFt) skidFt = breakpointFt;
  return {
    sampleFt,
    sampleBoard,
    sampleSpeedMph: sampleSpeed,
    sampleCount: ns,
    rollStartFt,
    skidFt,
    breakpointFt,
    breakpointBoard: C.centreBoard + bpY * invBw,
    entryBoard,
    entryAngleDeg: entryAngle,
    timeToPinsS: tPins,
    speedAtPinsMph: vPins,
    reachedPins: reached,
    gutter,
    gutterFt,
    flareIn: (Math.acos(Math.max(-1, Math.min(1, flareCos))) * R) / C.inchM,
    steps,
    finalState: s,
  };
}
