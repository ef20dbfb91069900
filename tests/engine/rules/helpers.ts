// Helpers for the rule tests (not a test file): run one rule on a ball and a matchup.
import { ballFeatures, matchupContext } from '../../../engine/index';
import type { BallSpec, BowlerProfile, MatchupRule, OilPattern, RuleResult } from '../../../engine/index';
import { typicalBowler } from '../fixtures';

export function run(rule: MatchupRule, ball: BallSpec, pattern: OilPattern, bowler: BowlerProfile = typicalBowler, games = 0): RuleResult | null {
  return rule(ball, ballFeatures(ball), matchupContext(bowler, pattern, games));
}

export function effect(rule: MatchupRule, ball: BallSpec, pattern: OilPattern, bowler: BowlerProfile = typicalBowler, games = 0): number {
  const r = run(rule, ball, pattern, bowler, games);
  if (!r) throw new Error('rule did not apply');
  return r.effect;
}
