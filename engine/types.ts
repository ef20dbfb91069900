/**
 * Public types of the Lanewright engine. Units: feet from the foul line, boards (1–39),
 * inches, lb, mph, rpm, degrees, mL and µL.
 */

/** Cover stock families, weakest-reading to strongest-reading in oil. */
export type CoverType = 'plastic' | 'urethane' | 'reactive-pearl' | 'reactive-hybrid' | 'reactive-solid';

/** The ball layout relative to the bowler's positive axis point (PAP). */
export interface BallLayout {
  /** Pin-to-PAP distance measured along the ball's surface, inches. */
  pinToPapIn: number;
  /** Drilling angle (pin to PAP to CG/mass-bias line), degrees. */
  drillingAngleDeg?: number;
  /** VAL angle (for asymmetric cores: PAP–pin line to pin–PSA line), degrees. */
  valAngleDeg?: number;
}

/** A bowling ball as the engine sees it. */
export interface BallSpec {
  weightLb: number;
  /** Default 8.5 in. */
  diameterIn?: number;
  /** Radius of gyration about the low-RG (pin) axis, inches. */
  rg: number;
  /** Differential RG, inches. */
  differential: number;
  /** Intermediate differential, inches; 0 = symmetric core. */
  intermediateDifferential: number;
  coverType: CoverType;
  /** Grit of the last abrasive pad: 360 … 500, 1000, 2000, 3000, 4000 … */
  surfaceGrit: number;
  /** Polish or compound over that grit. */
  polished: boolean;
  hardnessD?: number;
  layout?: BallLayout;
  /** Games bowled since the last resurface (the cover dulls and soaks up oil with use); default 0. */
  gamesSinceResurface?: number;
  /** Year the ball model was approved (or released) — the hardness limit depends on it; unknown: today's limit. */
  approvalYear?: number;
}

/**
 * The lane surface a condition is bowled on: its material and how much friction it has. Wood soaks up
 * conditioner and breaks down faster; a high-friction surface grips the ball harder once the oil is gone.
 * Default: synthetic, medium friction.
 */
export interface LaneSurface {
  kind: 'wood' | 'synthetic';
  friction: 'low' | 'medium' | 'high';
}

/** How a bowler releases the ball. */
export interface BowlerProfile {
  hand: 'right' | 'left';
  speedMph: number;
  revRpm: number;
  /** 0 = end-over-end forward roll, 90 = pure side spin. */
  axisRotationDeg: number;
  /** 0 = horizontal axis. */
  axisTiltDeg: number;
  papRightIn?: number;
  papUpIn?: number;
}

/** Oil a lane machine lays in one kind of crossing. */
export interface Sweep {
  direction: 'forward' | 'reverse';
  /** Inclusive, either order, pattern board numbers (from the right-hand gutter). */
  fromBoard: number;
  toBoard: number;
  /** Oil is spread evenly between these distances, feet. */
  startFt: number;
  endFt: number;
  crossings: number;
  /** Each crossing puts this much on every covered board, µL. */
  microlitersPerBoard: number;
}

/** Boards are counted from the right-hand gutter; a left-hander's board b is 40 − b. */
export interface OilPattern {
  name: string;
  sweeps: Sweep[];
}

// ---------------------------------------------------------------------------------------------
// Result types of the public functions (added with the first engine layer).

/** Result of scoreGame: running total after each of the ten frames, and the game's total. */
export interface GameScore {
  frames: number[];
  total: number;
}

/** Result of scorePartialGame: a game in progress. */
export interface PartialGameScore {
  /** Running total after each of the 10 frames; null from the first frame not yet scorable. */
  frames: (number | null)[];
  /** The last known running total (0 before any frame is scored). */
  total: number;
  complete: boolean;
  /** The frame waiting for the next delivery, 1–10, or null when the game is over. */
  nextFrame: number | null;
  /** Pins standing for the next delivery: 10 on a fresh rack, 0 when the game is over. */
  pinsStanding: number;
}

/** One broken limit found by checkLegality. */
export interface LegalityViolation {
  /** The BallSpec field, e.g. 'weightLb'. */
  field: string;
  /** The limit in words, e.g. '≤ 16 lb'. */
  limit: string;
  /** Where the limit comes from. */
  source: string;
}

/** A limit checkLegality could not check, and why. */
export interface LegalityGap {
  field: string;
  reason: string;
}

/** Result of checkLegality. `legal` is true when no checked limit is broken. */
export interface LegalityResult {
  legal: boolean;
  violations: LegalityViolation[];
  /** Limits that were not checked (no value given, no limit known, or a lighter ball). */
  unchecked: LegalityGap[];
}

export type LengthClass = 'short' | 'medium' | 'long';
export type VolumeClass = 'light' | 'medium' | 'heavy';
export type RatioClass = 'sport' | 'challenge' | 'recreation';

/** Result of analyzePattern. Lengths in ft, volumes in mL. */
export interface PatternAnalysis {
  lengthFt: number;
  volumeMl: number;
  forwardMl: number;
  reverseMl: number;
  ratio: number;
  lengthClass: LengthClass;
  volumeClass: VolumeClass;
  ratioClass: RatioClass;
}

/** Sampling options of oilGrid. */
export interface OilGridOptions {
  /** Step between sampled boards, boards; default 1. */
  boardStep?: number;
  /** Step between sampled distances, ft; default 1. */
  ftStep?: number;
  /** Last sampled distance, ft; default 60 (the headpin). */
  maxFt?: number;
}

/** Oil sampled on a grid: values[i][j] is the oil on boards[i] at ft[j], µL per board per foot. */
export interface OilGrid {
  boards: number[];
  ft: number[];
  values: number[][];
}

/** One rule of thumb's contribution to a ball's score. */
export interface RuleResult {
  /** Stable identifier of the rule, e.g. 'cover-vs-oil'. */
  rule: string;
  /** Points added to (or taken from) the ball's score. */
  effect: number;
  /** One sentence a bowler understands. */
  text: string;
  /** Where the rule comes from: a publication, a standard, or "common practice". */
  source: string;
}

export type SuggestionKind = 'surface' | 'layout' | 'release' | 'line' | 'ball';

/** Something to change, and which way. `change` holds the new values, e.g. { surfaceGrit: 3000 }. */
export interface Suggestion {
  kind: SuggestionKind;
  text: string;
  change?: Record<string, unknown>;
}

/** A ball of an arsenal: its spec plus the caller's identifier. */
/** A ball in an arsenal: its specs, a unique id, and an optional name for texts that point at it ("Or change balls: …"). */
export type ArsenalBall = BallSpec & { id: string; label?: string };

/** Input of rankArsenal. */
export interface RankArsenalInput {
  balls: ArsenalBall[];
  bowler: BowlerProfile;
  pattern: OilPattern;
  /** Games already bowled on the pattern (pattern breakdown); default 0. */
  gamesBowled?: number;
  /** The lane surface the condition names; default synthetic, medium friction. */
  lane?: LaneSurface;
  /**
   * The bowler's calibration (fitCalibration, issue 7): when `enough`, each ball with its own
   * `enough` fit is simulated with its fitted `frictionScale` in the ball-motion layer.
   */
  calibration?: import('./shotlog/types').Calibration;
}

/** One layer's opinion of a ball: a 0–100 score with its reasons and suggestions. */
export interface LayerResult {
  score: number;
  reasons: RuleResult[];
  suggestions: Suggestion[];
}

/** A ranked ball in the result of rankArsenal. */
export interface RankedBall {
  id: string;
  /** 0–100, higher is a better match. */
  score: number;
  reasons: RuleResult[];
  suggestions: Suggestion[];
  /** Each scoring layer's own score and weight (rankArsenal fills it; see SCORING_LAYERS). */
  layers?: { name: string; weight: number; score: number }[];
  /**
   * 'strike' (ranked for strikes), 'spare' (plastic: a spare ball, listed after the strike balls) or 'illegal'
   * (outside the governing body's limits: listed apart, after every other ball, with `legality`).
   */
  standing?: 'strike' | 'spare' | 'illegal';
  /** The ball's reaction against the condition's demand (strengthFit). */
  fit?: { strength: number; demand: number; gap: number; verdict: 'too-strong' | 'suits' | 'too-weak' };
  /** The broken limits of an illegal ball. */
  legality?: LegalityResult;
}

/**
 * What the matchup knows before looking at any ball: the pattern's numbers, the lane surface, the games
 * bowled, the bowler, and what the condition asks of this bowler on the matchup scale (conditionDemand).
 */
export interface MatchupContext {
  bowler: BowlerProfile;
  pattern: OilPattern;
  analysis: PatternAnalysis;
  gamesBowled: number;
  lane: LaneSurface;
  demand: import('./conditionDemand').ConditionDemand;
}
