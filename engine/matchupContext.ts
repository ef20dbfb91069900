import type { BowlerProfile, MatchupContext, OilPattern } from './types';
import { analyzePattern } from './analyzePattern';
import { clamp, finite } from './internal/checks';
import { validateBowlerProfile } from './validateBowlerProfile';
import { validatePattern } from './validatePattern';

/**
 * The scales of matchupContext: where each demand is 0 and 1, and the bowler's reference release.
 * Sources: volume and length ends bracket the TRADE.md conventions classes (light < 20 mL, heavy
 * > 25 mL; short < 37 ft, long ≥ 43 ft, section 4.3); the reference release (17 mph, 350 rpm) is
 * in the middle of TRADE.md 7.3's typical ranges; `breakdownGames` is Lanewright's choice (half the
 * effect after 6 games, about two league sessions on a pair — common practice direction, value
 * from memory).
 */
export const DEMAND_SCALE = {
  volumeMl: [15, 30],
  lengthFt: [33, 48],
  volumeWeight: 0.55,
  referenceSpeedMph: 17,
  speedSpanMph: 4,
  referenceRevRpm: 350,
  revSpanRpm: 150,
  breakdownGames: 6,
  bowlerWeight: 0.3,
  breakdownWeight: 0.3,
} as const;

/**
 * What the rules layer knows about a matchup before looking at any ball.
 *
 * Definitions (all 0–1):
 * - volumeDemand = (volumeMl − 15) ÷ 15, lengthDemand = (lengthFt − 33) ÷ 15, clamped;
 *   oilDemand = 0.55 × volumeDemand + 0.45 × lengthDemand. More oil and a longer pattern call for
 *   more ball (common practice, TRADE.md 4.3 and 7.2).
 * - bowlerNeed = 0.5 + 0.25 × ((speed − 17) ÷ 4 − (revs − 350) ÷ 150), clamped: a high-speed,
 *   low-rev bowler needs more ball than a high-rev, low-speed one (common practice).
 * - breakdown = g ÷ (g + 6) for g games bowled: as oil is pushed and soaked out of the track the
 *   lane hooks more, so less ball is needed (common practice direction).
 * - targetStrength = oilDemand + 0.3 × (bowlerNeed − 0.5) − 0.3 × breakdown, clamped.
 *
 * @param bowler the bowler.
 * @param pattern the pattern.
 * @param gamesBowled games already bowled on the pattern, 0 or more; default 0.
 * @param fn the public function to name in error messages; default 'matchupContext'.
 * @throws TypeError/RangeError for a malformed bowler or pattern or a negative games count.
 * @example
 * matchupContext(bowler, pattern, 3).breakdown; // => 0.333
 */
export function matchupContext(
  bowler: BowlerProfile,
  pattern: OilPattern,
  gamesBowled = 0,
  fn = 'matchupContext',
): MatchupContext {
  validateBowlerProfile(bowler, fn);
  validatePattern(pattern, fn);
  const g = finite(fn, 'gamesBowled', gamesBowled);
  if (g < 0) throw new RangeError(`${fn}: gamesBowled must be 0 or more, got ${g}`);
  const S = DEMAND_SCALE;
  const analysis = analyzePattern(pattern);
  const volumeDemand = clamp((analysis.volumeMl - S.volumeMl[0]) / (S.volumeMl[1] - S.volumeMl[0]), 0, 1);
  const lengthDemand = clamp((analysis.lengthFt - S.lengthFt[0]) / (S.lengthFt[1] - S.lengthFt[0]), 0, 1);
  const oilDemand = S.volumeWeight * volumeDemand + (1 - S.volumeWeight) * lengthDemand;
  const speedTerm = (bowler.speedMph - S.referenceSpeedMph) / S.speedSpanMph;
  const revTerm = (bowler.revRpm - S.referenceRevRpm) / S.revSpanRpm;
  const bowlerNeed = clamp(0.5 + 0.25 * (speedTerm - revTerm), 0, 1);
  const breakdown = g / (g + S.breakdownGames);
  const targetStrength = clamp(
    oilDemand + S.bowlerWeight * (bowlerNeed - 0.5) - S.breakdownWeight * breakdown,
    0,
    1,
  );
  return {
    bowler,
    pattern,
    analysis,
    gamesBowled: g,
    volumeDemand,
    lengthDemand,
    oilDemand,
    bowlerNeed,
    breakdown,
    targetStrength,
  };
}
