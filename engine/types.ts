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
