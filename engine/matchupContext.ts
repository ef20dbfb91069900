import type { BowlerProfile, LaneSurface, MatchupContext, OilPattern } from './types';
import { analyzePattern } from './analyzePattern';
import { conditionDemand } from './conditionDemand';
import { finite } from './internal/checks';
import { laneSurfaceOf } from './motion/laneSurfaceOf';
import { validateBowlerProfile } from './validateBowlerProfile';
import { validatePattern } from './validatePattern';

/**
 * What the matchup knows before looking at any ball: the pattern's numbers (analyzePattern), the lane surface,
 * the games bowled, and how much ball the condition asks of this bowler (conditionDemand).
 *
 * Source: see analyzePattern and conditionDemand. Units: as those. Edge cases: `lane` defaults to a synthetic
 * lane of medium friction; games must be 0 or more.
 *
 * @param bowler the bowler.
 * @param pattern the pattern.
 * @param gamesBowled games already bowled on the pattern, 0 or more; default 0.
 * @param fn the public function to name in error messages; default 'matchupContext'.
 * @param lane the lane surface; default synthetic, medium friction.
 * @throws TypeError/RangeError for a malformed bowler, pattern or lane, or a negative games count.
 * @example
 * matchupContext(bowler, pattern, 3).demand.total; // => the demand after three games
 */
export function matchupContext(
  bowler: BowlerProfile,
  pattern: OilPattern,
  gamesBowled = 0,
  fn = 'matchupContext',
  lane?: LaneSurface,
): MatchupContext {
  validateBowlerProfile(bowler, fn);
  validatePattern(pattern, fn);
  const g = finite(fn, 'gamesBowled', gamesBowled);
  if (g < 0) throw new RangeError(`${fn}: gamesBowled must be 0 or more, got ${g}`);
  const surface = laneSurfaceOf(fn, lane);
  const analysis = analyzePattern(pattern);
  return {
    bowler,
    pattern,
    analysis,
    gamesBowled: g,
    lane: surface,
    demand: conditionDemand({ analysis, bowler, lane: surface, gamesBowled: g }),
  };
}
