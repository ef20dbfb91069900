/**
 * Public engine types: the ball, its layout, and the governing body's limits it is checked against.
 * Units: feet from the foul line, boards (1–39), inches, lb, mph, rpm, degrees, mL and µL.
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

/** A ball in an arsenal: its specs, a unique id, and an optional name for texts that point at it ("Or change balls: …"). */
export type ArsenalBall = BallSpec & { id: string; label?: string };

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
