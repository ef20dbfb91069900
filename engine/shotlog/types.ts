/**
 * Public types of the shot log: logged deliveries, the frame sheet built from them,
 * shot statistics, suggested moves and the calibration of the ball-motion model.
 *
 * Units: boards are counted from the gutter on the bowler's hand side (1–39, the way a bowler
 * counts them; a left-hander's board b is pattern board 40 − b), feet from the foul line,
 * percentages 0–100 in `Rate`, proportions 0–1 from `wilsonInterval`.
 */
import type { BallSpec } from '../types/ball';
import type { LaneSurface } from '../types/pattern';

/**
 * One logged delivery: which frame and delivery it was and the pins standing AFTER it.
 * frame 1–10; delivery 1–2 (1–3 in frame 10); standing = pin numbers 1–10 still standing after this
 * delivery. On a foul (the USBC playing rules on fouls) the pins that fell are re-spotted: `standing` is what the bowler
 * saw (it must still be a subset of the pins standing before), but no pin is credited.
 */
export interface LoggedDelivery {
  frame: number;
  delivery: number;
  standing: number[];
  foul?: boolean;
}

/** One delivery on the frame sheet. */
export interface DeliveryView {
  frame: number;
  delivery: number;
  /** Pins standing before this delivery, ascending. */
  pinsBefore: number[];
  /** Pins standing after this delivery, ascending; on a foul the re-spotted rack (= pinsBefore). */
  standing: number[];
  /** Pins credited (0 on a foul). */
  pins: number;
  foul: boolean;
  /** 'X' strike, '/' spare, '-' no pins, 'F' foul, else '1'…'9'. */
  symbol: string;
  /** isSplit on the first delivery of a rack (never on a foul: the rack is re-spotted). */
  split: boolean;
  /** 1: the first ball at a full rack (a strike chance); 2: the second ball at a rack (a spare chance). */
  rackBall: 1 | 2;
}

/** One frame on the frame sheet. */
export interface FrameView {
  frame: number;
  /** Its deliveries so far (empty for a frame not yet started). */
  deliveries: DeliveryView[];
  /** Running total after this frame (scorePartialGame), null until its bonus deliveries are in. */
  runningTotal: number | null;
  /** Whether the frame has all its own deliveries (not counting bonus deliveries in later frames). */
  complete: boolean;
}

/** A game's frame sheet: always 10 frames. */
export interface GameView {
  frames: FrameView[];
  /** Pins credited by each delivery in order (a foul is 0): the input of scoreGame/scorePartialGame. */
  rolls: number[];
  /** scoreGame total for a complete game, else the last known running total (scorePartialGame). */
  total: number;
  complete: boolean;
  /** The next delivery expected and the pins standing for it; null when the game is complete. */
  next: { frame: number; delivery: number; pinsBefore: number[] } | null;
}

/** checkDelivery's answer: the delivery as it would appear on the sheet, or why it cannot be. */
export type DeliveryCheck =
  { ok: true; view: DeliveryView } | { ok: false; field: 'frame' | 'delivery' | 'standing' | 'foul'; reason: string };

/**
 * Where a first ball met the pins (right-hander's view mirrored for left-handers): 'pocket' the
 * 1-3 (1-2 for a left-hander); 'high' too much headpin; 'light' too little headpin; 'brooklyn'
 * crossed over to the other side of the headpin; 'miss' no hit worth the name (gutter, chop).
 */
export type HitKind = 'pocket' | 'high' | 'light' | 'brooklyn' | 'miss';

/** A logged delivery with where, when and with what it was thrown. */
export interface ShotRecord extends LoggedDelivery {
  sessionId: string;
  gameNumber: number;
  /** YYYY-MM-DD. */
  date: string;
  ballId: string;
  /** The ball's surface at the time, e.g. "2000 grit" or "polished". */
  surfaceKey: string;
  /** Hand-side boards. */
  feetBoard?: number | null;
  targetBoard?: number | null;
  breakpointBoard?: number | null;
  hit?: HitKind | null;
}

/**
 * A success rate with its Wilson 95 % score interval, all in percent (0–100); pct/low/high are null
 * when n is 0.
 */
export interface Rate {
  hits: number;
  n: number;
  pct: number | null;
  low: number | null;
  high: number | null;
}

/** One leave (pins standing after a first ball on a full rack) and how often it came up. */
export interface LeaveCount {
  pins: number[];
  /** leaveName, e.g. '4-7-10'. */
  name: string;
  count: number;
  /** count ÷ all leaves counted (the shares sum to 1). */
  share: number;
  /** Whether the leave is a split (isSplit). */
  split: boolean;
}

/** The statistics of a set of logged shots (definitions in shotStats). */
export interface ShotStats {
  shots: number;
  games: number;
  /** Mean score of the complete games; null when none is complete. */
  average: number | null;
  /** Number of complete games behind `average`. */
  completeGames: number;
  strike: Rate;
  spare: Rate;
  singlePinSpare: Rate;
  multiPinSpare: Rate;
  splitConversion: Rate;
  pocket: Rate;
  /** Strikes among pocket hits. */
  carry: Rate;
  firstBallAverage: { mean: number | null; sd: number | null; n: number };
  /** Most frequent first. */
  leaves: LeaveCount[];
}

/** A side-to-side move, as the bowler faces the pins. */
export interface BoardMove {
  direction: 'left' | 'right';
  boards: number;
}

/** A suggested adjustment, with the evidence that triggered it and its source. */
export interface Move {
  kind: 'two-and-one' | 'ball-change' | 'spare-system';
  title: string;
  detail: string;
  feet?: BoardMove;
  target?: BoardMove;
  evidence: string;
  source: string;
}

/** spareAdjustment's answer. */
export interface SpareAdjustment {
  keyPin: number;
  /** Hand-side board to stand on for the spare. */
  feetBoard: number;
  /** Hand-side target board at the arrows (the strike target, 3-6-9). */
  targetBoard: number;
  feet: BoardMove;
  detail: string;
  source: string;
}

/** One logged shot as the calibration reads it: the ball as it was, the line, what was seen. */
export interface CalibrationObservation {
  ball: BallSpec & { id: string };
  /** Hand-side board at the foul line. */
  laydownBoard: number;
  /** Hand-side board at the arrows. */
  targetBoard: number;
  /** Hand-side board where the ball was farthest toward the gutter. */
  breakpointBoard?: number | null;
  hit?: HitKind | null;
  /** Games bowled on the pattern before this shot (default 0). */
  gamesBowled?: number;
  /** The lane surface this shot was thrown on (default: fitCalibration's `lane`). */
  lane?: LaneSurface;
}

/** The friction scale fitted for one ball, with its 95 % interval. */
export interface BallCalibration {
  ballId: string;
  frictionScale: number;
  low: number;
  high: number;
  /** Usable observations of this ball. */
  n: number;
  /** n ≥ minShots: rankArsenal applies this ball's scale. */
  enough: boolean;
  /** RMS of this ball's residuals at frictionScale 1 and at the fitted scale, boards. */
  rmsBoardsBefore: number | null;
  rmsBoardsAfter: number | null;
  /** The surfaces this ball's shots were thrown with ("2000 grit", "4000 grit polished"), oldest first. */
  surfaces: string[];
  /**
   * True when the best fit would have left the ball with no line to the pocket although the bowler logged pocket
   * hits with it: the scale was moved toward 1 until a line reaches the pocket again.
   */
  keptReachable: boolean;
}

/** fitCalibration's answer. */
export interface Calibration {
  /** Usable observations over all balls. */
  shots: number;
  /** At least one ball has minShots usable observations. */
  enough: boolean;
  minShots: number;
  perBall: BallCalibration[];
  /** RMS residual over all usable observations at frictionScale 1 and at the fitted scales, boards. */
  rmsBoardsBefore: number | null;
  rmsBoardsAfter: number | null;
  note: string;
}

/** A change of a rate, after − before, in percentage points with its 95 % interval (nulls when a side has no shots). */
export interface RateChange {
  diff: number | null;
  low: number | null;
  high: number | null;
}

/** One side of a move: the first balls read and their strike and pocket rates. */
export interface FollowUpSide {
  firstBalls: number;
  strike: Rate;
  pocket: Rate;
}

/** moveFollowUp's answer for one move (definitions there). */
export interface MoveFollowUp {
  /** The first ball after the move. */
  at: { sessionId: string; gameNumber: number; frame: number; date: string };
  /** What changed, e.g. "feet 2 left, target 1 left". */
  title: string;
  feet?: BoardMove;
  target?: BoardMove;
  ball?: { from: string; to: string };
  surface?: { from: string; to: string };
  before: FollowUpSide;
  after: FollowUpSide;
  pocketChange: RateChange;
  strikeChange: RateChange;
  /** The rate the verdict reads: pocket when both sides have enough recorded hits, else strike. */
  judgedBy: 'pocket' | 'strike';
  verdict: 'better' | 'worse' | 'unclear' | 'too-soon';
  summary: string;
}
