import type { BallSpec, BowlerProfile, LaneSurface, OilPattern } from '../types';

/** Input of `simulateShot` (issue 4 public API). */
export interface SimulateShotInput {
  ball: BallSpec;
  bowler: BowlerProfile;
  pattern: OilPattern;
  /** Hand-side board at the foul line; chosen by the pocket solver when omitted. */
  laydownBoard?: number;
  /** Hand-side board at the arrows (15 ft); chosen by the pocket solver when omitted. */
  targetBoard?: number;
  /** Games already bowled on the pattern (evolves the oil map, transitionOilMap); default 0. */
  gamesBowled?: number;
  /** The lane surface (wood or synthetic, and its friction); default synthetic, medium friction. */
  lane?: LaneSurface;
  /** One uniform friction coefficient everywhere: for tests and calibration (no oil map). */
  frictionOverride?: number;
  /**
   * Calibration multiplier of the friction coefficients (μ_oil and μ_dry of the cover, or
   * `frictionOverride`), default 1; in [0.1, 10]. Fitted per ball from logged shots by fitCalibration.
   */
  frictionScale?: number;
}

/** What the ball-motion model predicts for one delivery (issue 4 public API). Boards from the hand-side gutter. */
export interface ShotPrediction {
  /** At least one sample per foot, from the foul line to the pins or to the gutter. */
  path: { ft: number; board: number; speedMph: number }[];
  /** Where sliding ends (null: still sliding at the pins). */
  rollStartFt: number | null;
  /** Where the skid ends and the hook phase begins (before the breakpoint): the slip speed has fallen by a fifth of its release value. */
  skidFt: number;
  /** The farthest board toward the hand-side gutter. */
  breakpoint: { ft: number; board: number };
  /** At the headpin (60 ft). */
  entryBoard: number;
  /** At the headpin; positive = toward the pocket side (increasing boards). */
  entryAngleDeg: number;
  timeToPinsS: number;
  speedAtPinsMph: number;
  gutter: boolean;
  /** Flare: the farthest the spin axis migrated over the cover from its release position (the spread of the oil rings), inches of arc on the surface. */
  flareIn: number;
  /** The line used (chosen by the solver when not given). */
  laydownBoard: number;
  targetBoard: number;
}
