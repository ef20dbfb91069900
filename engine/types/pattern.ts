/**
 * Public engine types: oil patterns, the lane surface, and what analyzePattern and oilGrid report.
 * Units: feet from the foul line, boards (1–39), inches, lb, mph, rpm, degrees, mL and µL.
 */

/**
 * The lane surface a condition is bowled on: its material and how much friction it has. Wood soaks up
 * conditioner and breaks down faster; a high-friction surface grips the ball harder once the oil is gone.
 * Default: synthetic, medium friction.
 */
export interface LaneSurface {
  kind: 'wood' | 'synthetic';
  friction: 'low' | 'medium' | 'high';
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
