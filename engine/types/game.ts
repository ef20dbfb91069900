/**
 * Public engine types: scores of a game.
 * Units: feet from the foul line, boards (1–39), inches, lb, mph, rpm, degrees, mL and µL.
 */

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
