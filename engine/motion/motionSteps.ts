import { assertNumber } from './assertNumber';
import { MOTION_CALIBRATION as K } from './motionCalibration';

/** The integrator's step settings: the step near rolling and the longest step while the ball slides fast, s. */
export interface MotionSteps {
  stepS: number;
  maxStepS: number;
}

let override: MotionSteps | null = null;

/** The step settings deliveries use when their caller names none: MOTION_CALIBRATION's, or withMotionSteps' inside its call. */
export function motionSteps(): MotionSteps {
  return override ?? { stepS: K.stepS, maxStepS: K.maxStepS };
}

/**
 * Runs `fn` with every delivery integrated at other step settings (the engine is synchronous, so the setting
 * holds exactly for the call), then restores the previous ones. For accuracy studies: the same ranking at a
 * fine fixed step is the reference the production steps are measured against (bench/accuracy.ts).
 * Units: s. Edge cases: steps outside [1e-5, 0.05] s are refused by integrateDelivery (RangeError naming it).
 * Example: `withMotionSteps({ stepS: 0.001, maxStepS: 0.001 }, () => rankArsenal(input))`.
 */
export function withMotionSteps<T>(steps: MotionSteps, fn: () => T): T {
  if (steps === null || typeof steps !== 'object') throw new TypeError(`withMotionSteps: steps must be an object, got ${String(steps)}`);
  assertNumber('withMotionSteps', 'stepS', steps.stepS, 1e-5, 0.02);
  assertNumber('withMotionSteps', 'maxStepS', steps.maxStepS, steps.stepS, 0.05);
  if (typeof fn !== 'function') throw new TypeError(`withMotionSteps: fn must be a function, got ${String(fn)}`);
  const previous = override;
  override = { stepS: steps.stepS, maxStepS: steps.maxStepS };
  try {
    return fn();
  } finally {
    override = previous;
  }
}
