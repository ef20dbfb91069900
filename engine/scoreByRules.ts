import type { BallSpec, BowlerProfile, LayerResult, OilPattern } from './types';
import { matchupContext } from './matchupContext';
import { rulesLayer } from './rulesLayer';
import { validateBallSpec } from './validateBallSpec';

/**
 * Scores one ball for a bowler on a pattern with the documented rules of thumb alone (the rules
 * layer of rankArsenal).
 *
 * Definition: rulesLayer(ball, matchupContext(bowler, pattern, gamesBowled)): score 0–100 from 50
 * plus each rule's effect, the reasons (each with its source) and the suggestions.
 * Source: see each rule in engine/rules/ and README.md.
 *
 * @param ball the ball.
 * @param bowler the bowler.
 * @param pattern the pattern.
 * @param gamesBowled games already bowled on the pattern; default 0. More games favour weaker,
 *   cleaner balls (patternBreakdown).
 * @throws TypeError/RangeError for malformed input, naming 'scoreByRules'.
 * @example
 * scoreByRules(ball, bowler, pattern, 0); // => { score: 0–100, reasons: [{ rule, effect, text, source }, …], suggestions: […] }
 */
export function scoreByRules(ball: BallSpec, bowler: BowlerProfile, pattern: OilPattern, gamesBowled = 0): LayerResult {
  validateBallSpec(ball, 'scoreByRules');
  return rulesLayer(ball, matchupContext(bowler, pattern, gamesBowled, 'scoreByRules'));
}
