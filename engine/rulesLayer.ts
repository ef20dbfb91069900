import type { BallSpec, LayerResult, MatchupContext, RuleResult } from './types';
import { featuresUnchecked } from './ballFeatures';
import { MATCHUP_RULES } from './matchupRules';
import { suggestChanges } from './suggestChanges';
import { clamp } from './internal/checks';

/** The score a ball starts from before the rules add or take points. */
export const RULES_BASE_SCORE = 50;

/**
 * The rules layer for one ball on an already built matchup: every rule of MATCHUP_RULES, summed.
 *
 * Definition: score = clamp(50 + Σ effect, 0, 100), rounded to 0.1; reasons are the rules that
 * apply, largest |effect| first; suggestions from suggestChanges.
 * Source: each rule names its own (see README.md rule table).
 *
 * @param ball a ball already validated (validateBallSpec).
 * @param ctx the matchup (matchupContext).
 * @returns `{ score, reasons, suggestions }`.
 * @example
 * rulesLayer(ball, matchupContext(bowler, pattern)).score; // => 0–100
 */
export function rulesLayer(ball: BallSpec, ctx: MatchupContext): LayerResult {
  const f = featuresUnchecked(ball);
  const reasons: RuleResult[] = [];
  for (const rule of MATCHUP_RULES) {
    const r = rule(ball, f, ctx);
    if (r) reasons.push(r);
  }
  reasons.sort((a, b) => Math.abs(b.effect) - Math.abs(a.effect) || a.rule.localeCompare(b.rule));
  const sum = reasons.reduce((s, r) => s + r.effect, 0);
  const score = Math.round(clamp(RULES_BASE_SCORE + sum, 0, 100) * 10) / 10;
  return { score, reasons, suggestions: suggestChanges(ball, f, ctx) };
}
