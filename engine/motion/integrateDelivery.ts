import type { BallInertia } from './ballInertia';
import type { DeliveryResult, IntegrateOptions } from './deliveryResult';
import { assertNumber } from './assertNumber';
import { assertInertia, assertState } from './assertState';
import { assertField, type FrictionField } from './frictionField';
import { DeliveryRecorder } from './deliveryRecorder';
import { MOTION_CALIBRATION as K } from './motionCalibration';
import { motionSteps } from './motionSteps';
import { NewtonEulerKernel, rk4Step } from './newtonEuler';
import { PHYSICAL_CONSTANTS as C } from './physicalConstants';
import { SpinAxisTrack } from './spinAxisTrack';

export type { DeliveryResult, IntegrateOptions } from './deliveryResult';

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
  assertState(fn, state0);
  assertInertia(fn, inertia);
  assertField(fn, field);
  if (options === null || typeof options !== 'object') throw new TypeError(`${fn}: options must be an object, got ${String(options)}`);
  const eps = assertNumber(fn, 'slipEpsMs', options.slipEpsMs ?? K.slipEpsMs, 1e-6, 1);
  const defaults = motionSteps();
  let h = assertNumber(fn, 'stepS', options.stepS ?? defaults.stepS, 1e-5, 0.02);
  // keep λh ≤ 2 (explicit RK4 is stable for λh ≲ 2.8), λ = μ_max g (1 + R²/k_min²)/ε
  const kMin2 = Math.min(inertia.iLow, inertia.iHigh, inertia.iInt) / inertia.massKg;
  const stiffness = field.muMax * C.g * (1 + (inertia.radiusM * inertia.radiusM) / kMin2);
  const lambda = stiffness / eps;
  if (lambda * h > 2) h = 2 / lambda;
  // a caller that fixes stepS without maxStepS gets a fixed step (accuracy studies, closed-form checks)
  const hMax = Math.max(
    h,
    assertNumber(fn, 'maxStepS', options.maxStepS ?? (options.stepS !== undefined ? h : defaults.maxStepS), 1e-5, 0.05),
  );
  // While the slip speed u is large the friction direction barely turns in a step: the local stiffness is
  // μg(1+R²/k²)/u rather than /ε, so the step can grow with u (up to hMax) at the same stability margin.
  const slipStep = K.slipStepFactor / stiffness;
  const maxT = assertNumber(fn, 'maxTimeS', options.maxTimeS ?? K.maxTimeS, h, 60);
  const stopFt = assertNumber(fn, 'stopFt', options.stopFt ?? C.headpinFt, 0.1, 200);
  const hand = options.hand ?? 1;
  if (hand !== 1 && hand !== -1) throw new TypeError(`${fn}: hand must be 1 or -1, got ${String(hand)}`);
  const onStep = options.onStep;
  if (onStep !== undefined && typeof onStep !== 'function') throw new TypeError(`${fn}: onStep must be a function`);

  const k = new NewtonEulerKernel(inertia, field, eps);
  const s = Float64Array.from(state0);
  const qn = 1 / Math.hypot(s[7], s[8], s[9], s[10]);
  s[7] *= qn;
  s[8] *= qn;
  s[9] *= qn;
  s[10] *= qn;
  const axis = new SpinAxisTrack(s, k, field);
  const rec = new DeliveryRecorder(s, hand, stopFt, inertia.radiusM, K.rollSlipTolEps * eps);
  let t = 0,
    steps = 0;
  const hMin = h;
  while (t < maxT) {
    h = rec.uPrev * slipStep; // NaN when a rolling ball (u 0) meets a frictionless field (slipStep ∞): take hMin
    if (!(h >= hMin)) h = hMin;
    else if (h > hMax) h = hMax;
    axis.beforeStep(k, h);
    const x0 = s[0],
      y0 = s[1],
      vx0 = s[2],
      vy0 = s[3];
    rk4Step(s, h, k);
    t += h;
    steps++;
    if (onStep !== undefined) onStep(t, s);
    axis.afterStep(s, k, h);
    if (rec.afterStep(s, x0, y0, vx0, vy0, t, h)) break;
  }
  return rec.result(s, t, steps, axis.flareIn(inertia.radiusM));
}
