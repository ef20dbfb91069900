/**
 * Public engine types: the matchup — rankArsenal's input and result, reasons, suggestions, the condition's demand.
 * Units: feet from the foul line, boards (1–39), inches, lb, mph, rpm, degrees, mL and µL.
 */

import type { Calibration } from '../shotlog/types';
import type { ArsenalBall, LegalityResult } from './ball';
import type { BowlerProfile } from './bowler';
import type { LaneSurface, OilPattern, PatternAnalysis } from './pattern';

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
  calibration?: Calibration;
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
  demand: ConditionDemand;
}

/** One part of a condition's demand: points above (+) or below (−) the reference condition, with its reason. */
export interface DemandFactor {
  /** Stable key: 'volume', 'length', 'ratio', 'lane-surface', 'transition', 'speed', 'rev-rate', 'axis-rotation', 'axis-tilt'. */
  key: string;
  points: number;
  /** The condition or release value in words ("27.6 mL of oil", "375 rpm"). */
  label: string;
  source: string;
}

/** How much ball a condition asks of this bowler, on the matchup scale (ballReaction's), and its parts. */
export interface ConditionDemand {
  total: number;
  factors: DemandFactor[];
}
