/**
 * Lane geometry and unit constants of the Lanewright engine.
 *
 * Source: Lanewright's conventions (engine/README.md) and the USBC lane specifications (lane and pin-deck
 * dimensions, USBC lane text as reproduced on secondary pages). Every value is in the engine's
 * units: feet from the foul line, boards, inches.
 */

/** Number of boards across the lane. Source: USBC lane specifications (39 boards). */
export const BOARD_COUNT = 39;

/**
 * Nominal lane width, inches. Source: USBC lane specifications (41–42 in, nominal 41.5 in).
 */
export const LANE_WIDTH_IN = 41.5;

/**
 * Width of one board, inches: 41.5 in ÷ 39 boards = 1.0641 in.
 * Source: arithmetic on the nominal lane width.
 *
 * @example
 * 6 / BOARD_WIDTH_IN; // => 5.64 boards between adjacent pin columns
 */
export const BOARD_WIDTH_IN = LANE_WIDTH_IN / BOARD_COUNT;

/** Foul line to the centre of the headpin spot, feet. Source: USBC lane specifications (60 ft ± 1/2 in). */
export const HEADPIN_FT = 60;

/**
 * Distance of the targeting arrows from the foul line, feet. Source: Lanewright's conventions (engine/README.md)
 * ("arrows at 15 ft"; sources disagree, 12–17 ft).
 */
export const ARROWS_FT = 15;

/** Boards the seven arrows sit on. Source: USBC lane specifications. */
export const ARROW_BOARDS: readonly number[] = [5, 10, 15, 20, 25, 30, 35];

/**
 * The pocket: board of the ball's centre at the headpin for the bowler's hand.
 * Source: USBC pin-carry research, reported second-hand.
 */
export const POCKET_BOARD = 17.5;

/** Best entry angle into the pocket, degrees. Source: USBC pin-carry research, reported second-hand (about 6°). */
export const IDEAL_ENTRY_ANGLE_DEG = 6;

/** Nominal ball diameter used when a ball has none, inches. Source: Lanewright's conventions (8.5 in). */
export const DEFAULT_BALL_DIAMETER_IN = 8.5;

/** Microlitres in one millilitre. Source: the definition of the units (mL = µL / 1000). */
export const MICROLITERS_PER_ML = 1000;
