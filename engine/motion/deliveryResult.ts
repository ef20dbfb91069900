/** Options of one integration (integrateDelivery). */
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
