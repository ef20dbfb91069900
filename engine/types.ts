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
  /** Where the rule comes from: a TRADE.md entry, a standard, or "common practice". */
  source: string;
}

export type SuggestionKind = 'surface' | 'layout' | 'release' | 'line';

/** Something to change, and which way. `change` holds the new values, e.g. { surfaceGrit: 3000 }. */
export interface Suggestion {
  kind: SuggestionKind;
  text: string;
  change?: Record<string, unknown>;
}

/** A ball of an arsenal: its spec plus the caller's identifier. */
export type ArsenalBall = BallSpec & { id: string };

/** Input of rankArsenal. */
export interface RankArsenalInput {
  balls: ArsenalBall[];
  bowler: BowlerProfile;
  pattern: OilPattern;
  /** Games already bowled on the pattern (pattern breakdown); default 0. */
  gamesBowled?: number;
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
}

/**
 * What the rules layer knows about a matchup before looking at any ball: the pattern's numbers,
 * how much ball the pattern and the bowler call for, and how far the pattern has broken down.
 * All demands are 0 (least ball) … 1 (most ball).
 */
export interface MatchupContext {
  bowler: BowlerProfile;
  pattern: OilPattern;
  analysis: PatternAnalysis;
  gamesBowled: number;
  /** From the pattern's volume: 0 at 15 mL or less, 1 at 30 mL or more. */
  volumeDemand: number;
  /** From the pattern's length: 0 at 33 ft or less, 1 at 48 ft or more. */
  lengthDemand: number;
  /** Combined pattern demand: 0.55 × volumeDemand + 0.45 × lengthDemand. */
  oilDemand: number;
  /** From the bowler's speed and rev rate: 0 = needs little ball (high revs, low speed), 1 = needs a lot. */
  bowlerNeed: number;
  /** 0 on a fresh pattern, rising toward 1 as games are bowled: g / (g + 6). */
  breakdown: number;
  /** The ball strength the matchup calls for (0–1), from oilDemand, bowlerNeed and breakdown. */
  targetStrength: number;
}

/** A ball's properties on the rules layer's 0–1 scales. */
export interface BallFeatures {
  /** COVER_READ of the cover type (see ballFeatures). */
  coverRead: number;
  /** COVER_SURFACE_RESPONSE of the cover type. */
  surfaceResponse: number;
  /** surfaceSmoothness of grit and polish: 0 rough … 1 polished 4000. */
  smoothness: number;
  /** 1 at the lowest legal RG (2.46 in, earliest roll) … 0 at the highest (2.80 in). */
  rgLowness: number;
  /** Differential as a share of the legal maximum 0.060 in, 0–1. */
  differentialShare: number;
  /** Intermediate differential ÷ FULL_ASYMMETRY_IN, 0–1 (0 = symmetric core). */
  asymmetry: number;
  /** flareShare of the layout, or null when the ball has no layout. */
  layoutShare: number | null;
  /** Flare potential: differentialShare × (layoutShare, or 1 without a layout). */
  flare: number;
}

/**
 * One rule of thumb of the rules layer: a small pure function of a ball (with its features) and the
 * matchup, returning its contribution, or null when it does not apply to this ball.
 */
export type MatchupRule = (ball: BallSpec, features: BallFeatures, ctx: MatchupContext) => RuleResult | null;
