/**
 * Ball-motion model benchmarks (bench/run.ts): one delivery at the default accuracy beside the floor of a bare
 * RK4 loop of the same step count, with the position error against the closed form of the sliding sphere in the
 * bench names, and rankArsenal for 15 balls including the pocket solver and miss room.
 */
import type { Bench } from './run';
import { BENCH_BOWLER, BENCH_HOUSE_PATTERN, BENCH_STRONG_SOLID } from './lib/benchHouse';
import {
  ballInertia,
  conditionOilMap,
  coverFriction,
  integrateDelivery,
  MOTION_CALIBRATION,
  oilFrictionField,
  rankArsenal,
  releaseState,
  uniformFrictionField,
} from '../engine/index';
import type { ArsenalBall, BallSpec, BowlerProfile } from '../engine/index';

const pattern = BENCH_HOUSE_PATTERN;
const bowler = BENCH_BOWLER;
const strong = BENCH_STRONG_SOLID;

// One delivery: the oil map with the oil carried on the ball's track, the default step.
const inertia = ballInertia(strong);
const field = oilFrictionField(conditionOilMap(pattern, bowler, 0), coverFriction(strong));
const state0 = releaseState(strong, bowler, 15, 8);
const steps = integrateDelivery(state0, inertia, field, { hand: 1 }).steps;

// Position error at the default step against the closed form of the sliding sphere (isotropic ball, uniform μ,
// ψ = 0): skid y(t) = ½ μ g (s⊥/|u₀|) t² until ∫μ dt = α|u₀|/((1+α)g), then a straight line at v*.
function closedFormError(): { yPinsMm: number; xRollMm: number } {
  const iso: BallSpec = {
    weightLb: 16,
    diameterIn: 8.5,
    rg: 2.5,
    differential: 0,
    intermediateDifferential: 0,
    coverType: 'reactive-solid',
    surfaceGrit: 2000,
    polished: false,
  };
  const b: BowlerProfile = { hand: 'right', speedMph: 8 / 0.44704, revRpm: 300, axisRotationDeg: 45, axisTiltDeg: 15 };
  const I = ballInertia(iso),
    R = I.radiusM,
    mu = 0.2,
    g = 9.80665,
    L = 18.288;
  const s = releaseState(iso, b, 20, 20);
  const a = I.iLow / (I.massKg * R * R);
  const ux = s[2] - R * s[5],
    uy = s[3] + R * s[4],
    u = Math.hypot(ux, uy);
  const t = (a * u) / ((1 + a) * mu * g);
  const xr = s[2] * t - 0.5 * mu * g * (ux / u) * t * t,
    yr = s[3] * t - 0.5 * mu * g * (uy / u) * t * t;
  const vx = (s[2] + a * R * s[5]) / (1 + a),
    vy = (s[3] - a * R * s[4]) / (1 + a);
  const yPins = yr + (vy / vx) * (L - xr);
  const r = integrateDelivery(s, I, uniformFrictionField(mu));
  const bw = (41.5 / 39) * 0.0254;
  return { yPinsMm: Math.abs((r.entryBoard - 20) * bw - yPins) * 1000, xRollMm: Math.abs((r.rollStartFt as number) * 0.3048 - xr) * 1000 };
}
const err = closedFormError();

/** The floor: a bare RK4 loop over the same 11-value state and the same step count, trivial right-hand side. */
const fs = new Float64Array(11),
  ft = new Float64Array(11),
  f1 = new Float64Array(11),
  f2 = new Float64Array(11),
  f3 = new Float64Array(11),
  f4 = new Float64Array(11);
function bare(a: Float64Array, d: Float64Array): void {
  d[0] = a[2];
  d[1] = a[3];
  d[2] = -0.01 * a[2];
  d[3] = -0.01 * a[3];
  for (let i = 4; i < 11; i++) d[i] = -0.001 * a[i];
}
function rk4Floor(n: number): number {
  fs.fill(0);
  fs[2] = 8;
  fs[7] = 1;
  const h = MOTION_CALIBRATION.stepS;
  for (let k = 0; k < n; k++) {
    bare(fs, f1);
    for (let i = 0; i < 11; i++) ft[i] = fs[i] + 0.5 * h * f1[i];
    bare(ft, f2);
    for (let i = 0; i < 11; i++) ft[i] = fs[i] + 0.5 * h * f2[i];
    bare(ft, f3);
    for (let i = 0; i < 11; i++) ft[i] = fs[i] + h * f3[i];
    bare(ft, f4);
    for (let i = 0; i < 11; i++) fs[i] += (h / 6) * (f1[i] + 2 * (f2[i] + f3[i]) + f4[i]);
  }
  return fs[0];
}

// Fifteen invented balls, strong to weak.
const mk = (id: string, o: Partial<BallSpec>): ArsenalBall => ({ ...strong, ...o, id });
const balls: ArsenalBall[] = [
  mk('b01', { surfaceGrit: 500 }),
  mk('b02', { surfaceGrit: 1000 }),
  mk('b03', {}),
  mk('b04', { surfaceGrit: 3000 }),
  mk('b05', { coverType: 'reactive-hybrid', rg: 2.52, differential: 0.046, intermediateDifferential: 0.008 }),
  mk('b06', {
    coverType: 'reactive-hybrid',
    rg: 2.52,
    differential: 0.046,
    intermediateDifferential: 0.008,
    surfaceGrit: 1500,
    polished: true,
  }),
  mk('b07', { coverType: 'reactive-pearl', rg: 2.55, differential: 0.045, intermediateDifferential: 0 }),
  mk('b08', { coverType: 'reactive-pearl', rg: 2.55, differential: 0.045, intermediateDifferential: 0, surfaceGrit: 1500, polished: true }),
  mk('b09', {
    coverType: 'reactive-pearl',
    rg: 2.6,
    differential: 0.025,
    intermediateDifferential: 0,
    surfaceGrit: 3000,
    polished: true,
    layout: { pinToPapIn: 5.5 },
  }),
  mk('b10', { rg: 2.54, differential: 0.048, intermediateDifferential: 0 }),
  mk('b11', { rg: 2.58, differential: 0.02, intermediateDifferential: 0, surfaceGrit: 3000 }),
  mk('b12', { coverType: 'urethane', rg: 2.6, differential: 0.02, intermediateDifferential: 0, surfaceGrit: 1000 }),
  mk('b13', { coverType: 'urethane', rg: 2.65, differential: 0.015, intermediateDifferential: 0 }),
  mk('b14', {
    coverType: 'reactive-hybrid',
    rg: 2.62,
    differential: 0.035,
    intermediateDifferential: 0,
    surfaceGrit: 4000,
    polished: true,
  }),
  mk('b15', {
    coverType: 'plastic',
    rg: 2.7,
    differential: 0.008,
    intermediateDifferential: 0,
    surfaceGrit: 4000,
    polished: true,
    layout: { pinToPapIn: 1 },
  }),
];

const fmt = (x: number): string => (x < 0.1 ? x.toFixed(3) : x.toFixed(2));

export const benches: Bench[] = [
  {
    name: `motion: one delivery, default accuracy (RK4 h = ${MOTION_CALIBRATION.stepS * 1000} ms, ${steps} steps, oil map + carried oil; error vs the closed form: y at pins ${fmt(err.yPinsMm)} mm, roll point ${fmt(err.xRollMm)} mm)`,
    target: '< 0.5 ms median',
    run: () => void integrateDelivery(state0, inertia, field, { hand: 1 }),
    iterations: 300,
  },
  { name: `motion: floor — bare RK4 loop, same ${steps} steps, trivial right-hand side`, run: () => void rk4Floor(steps), iterations: 300 },
  {
    name: 'motion: rankArsenal, 15 balls incl. pocket solver and miss room (fresh pattern)',
    target: '< 8 ms median',
    run: () => void rankArsenal({ balls, bowler, pattern, gamesBowled: 0 }),
    iterations: 15,
  },
  {
    name: 'motion: rankArsenal, 15 balls incl. miss room, after 3 games (transition)',
    target: '< 8 ms median',
    run: () => void rankArsenal({ balls, bowler, pattern, gamesBowled: 3 }),
    iterations: 15,
  },
];
