/**
 * Physical constants and lane geometry used by the ball-motion model, in SI units.
 *
 * Source: rigid-body mechanics (frames, lane, ball, g) and Lanewright's conventions (engine/README.md)
 * (boards 1–39 from the hand-side gutter, width 41.5/39 in, headpin at 60 ft, arrows at 15 ft,
 * pocket board 17.5). Unit conversions are exact definitions (international inch, foot, pound, mph).
 *
 * Edge cases: none (constants). Example: `PHYSICAL_CONSTANTS.boardWidthM` → 0.0270281 m.
 */
export const PHYSICAL_CONSTANTS = Object.freeze({
  /** Standard gravity, m/s² (exact, CGPM 1901). */
  g: 9.80665,
  /** Metres per inch (exact). */
  inchM: 0.0254,
  /** Metres per foot (exact). */
  footM: 0.3048,
  /** Kilograms per pound (exact). */
  poundKg: 0.45359237,
  /** Metres per second per mile per hour (exact). */
  mphMs: 0.44704,
  /** Board width, m: 41.5 in / 39 boards (Lanewright's conventions). */
  boardWidthM: (41.5 / 39) * 0.0254,
  /** Half the lane width (centre board to the lane edge), m: 20.75 in. */
  laneHalfWidthM: 20.75 * 0.0254,
  /** Centre board (in line with the headpin). */
  centreBoard: 20,
  /** Foul line to headpin, ft (USBC lane specifications). */
  headpinFt: 60,
  /** Foul line to the arrows, ft (Lanewright's conventions). */
  arrowsFt: 15,
  /** The pocket at the headpin for the bowler's hand, board (USBC pin-carry research, reported second-hand). */
  pocketBoard: 17.5,
  /** Default ball diameter, in (engine/types.ts BallSpec.diameterIn). */
  defaultDiameterIn: 8.5,
  /**
   * Oil film thickness of 1 µL spread on one board over one foot, µm:
   * 1e-9 m³ / (board width × 0.3048 m) = 0.12139 µm (1 mL per board-foot ≈ 121 µm).
   */
  filmUmPerMicroliterBoardFt: (1e-9 / ((41.5 / 39) * 0.0254 * 0.3048)) * 1e6,
});
