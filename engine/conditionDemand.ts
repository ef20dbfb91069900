import { finite, inRange, record, show } from './internal/checks';
import { laneSurfaceOf } from './motion/laneSurfaceOf';
import { validateBowlerProfile } from './validateBowlerProfile';
import type { BowlerProfile, ConditionDemand, DemandFactor, LaneSurface, PatternAnalysis } from './types';

export type { ConditionDemand, DemandFactor };

/**
 * The demand side of the matchup scale (points; 5 ≈ one surface step ≈ one board of launch in the ball-motion
 * model). Each weight was read off the ball-motion model (the launch a benchmark ball needs to reach the pocket
 * as one input changes) and agrees in direction with the trade (tests/engine/conditionDemand.test.ts):
 * - `reference` 64 at a 40 ft, 21 mL, 4:1 pattern on a medium-friction synthetic lane, fresh, for a bowler at
 *   17 mph, 350 rpm, 45° of axis rotation and 15° of tilt (anchored so that a strong asymmetric solid at 4000
 *   grit fits a fresh house shot for a 16.5 mph, 375 rpm bowler and its 2000-grit finish fits the same
 *   pattern with about 6 mL more oil — common practice);
 * - `perMl` 1.0: more oil asks for more ball (common practice);
 * - `perFt` 1.5: a longer pattern asks for more ball (common practice: length is the pattern variable ball
 *   choice is keyed to first — short patterns call for weaker, cleaner balls, long ones for stronger, rougher
 *   ones; a 5 ft step is worth about one and a half surface steps. The ball-motion model alone moves its
 *   breakpoint about 2 points' worth per 5 ft at the same volume; the rest is the longer dry backend a short
 *   pattern leaves, where a strong ball hooks early and rolls out);
 * - `perRatioDoubling` 2, within `ratioCap` (−4 … +3): a high ratio leaves friction outside that brings the ball back and
 *   asks for less ball; a flat (sport) pattern asks for a ball that reads the oil itself (common practice; the
 *   USBC sport limit is 3:1);
 * - `laneFriction`: a grippy lane surface asks for less ball, a slick one more (common practice);
 * - `perGame` 0.85 (× `woodFactor` 1.3 on wood), at most `transitionMax`: as the track dries the lane asks for
 *   less ball (common practice: transition);
 * - `perMph` 6, `perRpm` −0.13, `perRotationDeg` −0.5, `perTiltDeg` 0.25: more speed and tilt ask for more ball;
 *   more revs and axis rotation make the ball hook more and ask for less (common practice).
 */
export const DEMAND_SCALE = Object.freeze({
  reference: 64,
  referenceMl: 21,
  perMl: 1.0,
  referenceFt: 40,
  perFt: 1.5,
  referenceRatio: 4,
  perRatioDoubling: 2,
  ratioCap: Object.freeze({ low: -4, high: 3 }),
  laneFriction: Object.freeze({ low: 6, medium: 0, high: -6 }),
  perGame: 0.85,
  woodFactor: 1.3,
  transitionMax: 15,
  referenceMph: 17,
  perMph: 6,
  referenceRpm: 350,
  perRpm: -0.13,
  referenceRotationDeg: 45,
  perRotationDeg: -0.5,
  referenceTiltDeg: 15,
  perTiltDeg: 0.25,
});

const round1 = (x: number) => Math.round(x * 10) / 10;

/**
 * How much ball a condition asks of this bowler, on the matchup scale, split into its parts: the pattern's
 * volume, length and ratio, the lane surface, the games already bowled, and the bowler's speed, rev rate, axis
 * rotation and tilt. A ball whose reaction (ballReaction) equals the demand fits.
 *
 * Definition: DEMAND_SCALE.reference + Σ parts (DEMAND_SCALE names each weight and its source); parts within
 * 0.05 point of zero are left out; parts are rounded to 0.1 point and listed largest first.
 * Units: points. Edge cases: a pattern with no outside oil (ratio Infinity) counts at the low cap; a dry lane
 * (no oil) counts its missing volume and length like any other.
 *
 * @param input `analysis` (analyzePattern), `bowler`, `lane` (default synthetic, medium friction), `gamesBowled` (≥ 0).
 * @returns `{ total, factors }`.
 * @example
 * conditionDemand({ analysis: analyzePattern(heavy), bowler, gamesBowled: 0 }).total; // => about 70
 */
export function conditionDemand(input: {
  analysis: PatternAnalysis;
  bowler: BowlerProfile;
  lane?: LaneSurface;
  gamesBowled?: number;
}): ConditionDemand {
  const fn = 'conditionDemand';
  const W = DEMAND_SCALE;
  record(fn, 'input', input);
  const { analysis: a, bowler: b } = input;
  const an = record(fn, 'analysis', a);
  finite(fn, 'analysis.volumeMl', an.volumeMl);
  finite(fn, 'analysis.lengthFt', an.lengthFt);
  if (typeof an.ratio !== 'number' || Number.isNaN(an.ratio))
    throw new TypeError(`${fn}: analysis.ratio must be a number, got ${show(an.ratio)}`);
  validateBowlerProfile(b, fn);
  const lane = laneSurfaceOf(fn, input.lane);
  const games = input.gamesBowled === undefined ? 0 : inRange(fn, 'gamesBowled', input.gamesBowled, 0);
  const factors: DemandFactor[] = [];
  const add = (key: string, points: number, label: string, source: string) => {
    if (Math.abs(points) >= 0.05) factors.push({ key, points: round1(points), label, source });
  };
  add(
    'volume',
    W.perMl * (a.volumeMl - W.referenceMl),
    `${a.volumeMl.toFixed(1)} mL of oil`,
    'common practice (more oil asks for more ball)',
  );
  add(
    'length',
    W.perFt * (a.lengthFt - W.referenceFt),
    `a ${a.lengthFt} ft pattern`,
    'common practice (a longer pattern asks for more ball)',
  );
  const ratioPts = Number.isFinite(a.ratio)
    ? Math.max(W.ratioCap.low, Math.min(W.ratioCap.high, -W.perRatioDoubling * Math.log2(Math.max(a.ratio, 1e-6) / W.referenceRatio)))
    : W.ratioCap.low;
  const ratioWords = Number.isFinite(a.ratio) ? `a ${a.ratio.toFixed(1)}:1 ratio` : 'no oil outside';
  add('ratio', ratioPts, ratioWords, 'common practice (friction outside brings the ball back; the USBC sport limit is 3:1)');
  add(
    'lane-surface',
    W.laneFriction[lane.friction],
    `a ${lane.friction}-friction ${lane.kind} lane`,
    'common practice (a grippy lane surface asks for less ball)',
  );
  if (games > 0) {
    const t = -Math.min(W.transitionMax, W.perGame * games * (lane.kind === 'wood' ? W.woodFactor : 1));
    add(
      'transition',
      t,
      `${games} ${games === 1 ? 'game' : 'games'} already bowled${lane.kind === 'wood' ? ' on wood' : ''}`,
      'common practice (the track dries and the lane hooks earlier as games are bowled)',
    );
  }
  add(
    'speed',
    W.perMph * (b.speedMph - W.referenceMph),
    `${b.speedMph} mph`,
    'common practice (more speed takes the ball farther before it reads)',
  );
  add('rev-rate', W.perRpm * (b.revRpm - W.referenceRpm), `${b.revRpm} rpm`, 'common practice (more revs hook more)');
  add(
    'axis-rotation',
    W.perRotationDeg * (b.axisRotationDeg - W.referenceRotationDeg),
    `${b.axisRotationDeg}° of axis rotation`,
    'common practice (more side roll hooks more at the back)',
  );
  add(
    'axis-tilt',
    W.perTiltDeg * (b.axisTiltDeg - W.referenceTiltDeg),
    `${b.axisTiltDeg}° of axis tilt`,
    'common practice (more tilt gives more length and less hook)',
  );
  factors.sort((x, y) => Math.abs(y.points) - Math.abs(x.points) || x.key.localeCompare(y.key));
  const total = round1(W.reference + factors.reduce((s, f) => s + f.points, 0));
  return { total, factors };
}
