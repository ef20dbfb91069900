import type { BallSpec, CoverType } from './types';
import { DEFAULT_BALL_DIAMETER_IN } from './constants';
import { flareShare } from './flareShare';
import { validateBallSpec } from './validateBallSpec';

/** One part of a ball's total reaction: points above (+) or below (−) the benchmark ball, with its reason. */
export interface ReactionFactor {
  /** Stable key: 'cover', 'surface', 'wear', 'rg', 'flare', 'asymmetry', 'drilling-angle'. */
  key: string;
  /** Points of reaction this part adds (+) or takes away (−) against the benchmark ball. */
  points: number;
  /** What the part is, in a bowler's words ("reactive solid cover", "2000 grit"). */
  label: string;
  /** Where the direction comes from. */
  source: string;
}

/** A ball's total reaction on the matchup scale and its parts. */
export interface BallReaction {
  /** REACTION_SCALE.benchmark + Σ factor points. */
  total: number;
  factors: ReactionFactor[];
}

/**
 * The matchup scale's weights (Lanewright's, each checked against the ball-motion model in the direction the
 * trade teaches; tests/engine/ballReaction.test.ts). Unit: 5 points ≈ one surface step (2000 → 4000 grit on a
 * reactive cover) ≈ one board of launch in the ball-motion model ≈ 3–4 ft of breakpoint.
 * - `benchmark` 50: a reactive hybrid at 3000 grit, RG 2.52 in, differential 0.045 in, symmetric, pin 4 1/2 in
 *   from the PAP, drilling angle 45°, freshly resurfaced.
 * - `cover`: points against the hybrid (common practice: in oil solid > hybrid > pearl; urethane reads early but
 *   hooks little; plastic barely hooks).
 * - `surfacePerDoubling`: points per halving of the grit number below 3000 (and minus per doubling above);
 *   `polish`: points a polish or compound takes off; both × the cover's `surfaceResponse` (reactive 1,
 *   urethane 0.7, plastic 0.2). Common practice: a lower grit reads earlier; polish adds length.
 * - `wearMax`, `wearHalfGames`: the reaction a cover loses with games since its last resurface (it soaks up oil
 *   and its track burnishes; common practice: resurface every 60–100 games).
 * - `rgPerInch`: points per inch of RG below 2.52 (common practice: a lower RG revs up and reads earlier).
 * - `flarePerFullDifferential`: points for the flare potential differential × |sin 2θ| (θ the pin-to-PAP angle)
 *   against the benchmark's, per 0.060 in (the USBC maximum differential); the sin 2θ law is rigid-body
 *   mechanics (the migration torque ½ ΔI ω sin 2θ is largest at 45°).
 * - `asymmetryPerFull`, `asymmetryFullIn`: an asymmetric core (intermediate differential) responds quicker
 *   (common practice), up to 3 points at 0.020 in and more.
 * - `drillingAnglePer30Deg`: a smaller drilling angle reads earlier and smoother, a larger one saves energy for
 *   a later, sharper turn (common practice for layouts given by drilling angle, pin-to-PAP and VAL angle), ±2 points at most.
 */
export const REACTION_SCALE = Object.freeze({
  benchmark: 50,
  cover: Object.freeze({ plastic: -35, urethane: -8, 'reactive-pearl': -3, 'reactive-hybrid': 0, 'reactive-solid': 3 }) as Readonly<
    Record<CoverType, number>
  >,
  surfaceResponse: Object.freeze({
    plastic: 0.2,
    urethane: 0.7,
    'reactive-pearl': 1,
    'reactive-hybrid': 1,
    'reactive-solid': 1,
  }) as Readonly<Record<CoverType, number>>,
  surfaceReferenceGrit: 3000,
  surfacePerDoubling: 5.5,
  polish: 5,
  wearMax: 4,
  wearHalfGames: 40,
  rgReferenceIn: 2.52,
  rgPerInch: 12,
  flareReference: 0.045 * Math.abs(Math.sin(2 * (4.5 / (DEFAULT_BALL_DIAMETER_IN / 2)))),
  flarePerFullDifferential: 10,
  asymmetryPerFull: 2,
  asymmetryFullIn: 0.02,
  asymmetryMax: 3,
  drillingAnglePer30Deg: 1.5,
  drillingAngleMax: 2,
});

const COVER_WORDS: Readonly<Record<CoverType, string>> = {
  plastic: 'plastic cover',
  urethane: 'urethane cover',
  'reactive-pearl': 'reactive pearl cover',
  'reactive-hybrid': 'reactive hybrid cover',
  'reactive-solid': 'reactive solid cover',
};

const round1 = (x: number) => Math.round(x * 10) / 10;

/** "2000 grit", "4000 grit polished". */
export function surfaceWords(grit: number, polished: boolean): string {
  return polished ? `${grit} grit polished` : `${grit} grit`;
}

/**
 * A ball's total reaction on the matchup scale — how early and how much it hooks in oil — split into the parts
 * that make it (cover, surface, wear since the last resurface, RG, flare from differential and layout,
 * asymmetry, drilling angle). The condition's demand (conditionDemand) is on the same scale, so the gap between
 * them says how much too strong or too weak a ball is, and which parts make it so.
 *
 * Definition: REACTION_SCALE.benchmark + Σ parts (see REACTION_SCALE for each part and its source); parts are
 * rounded to 0.1 point and listed largest first.
 * Units: points (5 ≈ one surface step). Edge cases: a ball without a layout uses the benchmark's flare share;
 * no drilling angle → no drilling-angle part; grit is taken as it is (a 360 grit reads more than a 500).
 *
 * @param ball the ball.
 * @returns `{ total, factors }`.
 * @throws TypeError/RangeError for a malformed ball (validateBallSpec), naming 'ballReaction'.
 * @example
 * ballReaction({ ...solid, surfaceGrit: 2000 }).total - ballReaction({ ...solid, surfaceGrit: 4000 }).total; // => 5.5
 */
export function ballReaction(ball: BallSpec): BallReaction {
  validateBallSpec(ball, 'ballReaction');
  return reactionUnchecked(ball);
}

/** ballReaction for a ball already validated. */
export function reactionUnchecked(ball: BallSpec): BallReaction {
  const W = REACTION_SCALE;
  const response = W.surfaceResponse[ball.coverType];
  const factors: ReactionFactor[] = [];
  const add = (key: string, points: number, label: string, source: string) => factors.push({ key, points: round1(points), label, source });

  add(
    'cover',
    W.cover[ball.coverType],
    COVER_WORDS[ball.coverType],
    'common practice (cover types: plastic, urethane, pearl, hybrid, solid)',
  );
  const surface = (W.surfacePerDoubling * Math.log2(W.surfaceReferenceGrit / ball.surfaceGrit) - (ball.polished ? W.polish : 0)) * response;
  add(
    'surface',
    surface,
    surfaceWords(ball.surfaceGrit, ball.polished),
    'common practice (a lower grit reads oil earlier; polish adds length)',
  );
  const games = ball.gamesSinceResurface ?? 0;
  if (games > 0) {
    add(
      'wear',
      (-W.wearMax * games * response) / (games + W.wearHalfGames),
      `${games} games since the last resurface`,
      'common practice (a cover soaks up oil and dulls with use; resurface every 60–100 games)',
    );
  }
  add(
    'rg',
    -W.rgPerInch * (ball.rg - W.rgReferenceIn),
    `RG ${ball.rg.toFixed(3)} in`,
    'common practice (a lower RG revs up and reads earlier)',
  );
  const diameter = ball.diameterIn ?? DEFAULT_BALL_DIAMETER_IN;
  const share = ball.layout ? flareShare(ball.layout.pinToPapIn, diameter) : W.flareReference / 0.045;
  const flare = ball.differential * share;
  const flareLabel = ball.layout
    ? `differential ${ball.differential.toFixed(3)} in with the pin ${ball.layout.pinToPapIn} in from the PAP (${Math.round(share * 100)} % of its flare)`
    : `differential ${ball.differential.toFixed(3)} in (no layout entered)`;
  add(
    'flare',
    (W.flarePerFullDifferential * (flare - W.flareReference)) / 0.06,
    flareLabel,
    'rigid-body mechanics (flare ∝ differential × sin 2θ, largest 45° from the PAP) and the USBC 0.060 in differential limit',
  );
  if (ball.intermediateDifferential > 0) {
    add(
      'asymmetry',
      Math.min(W.asymmetryMax, (W.asymmetryPerFull * ball.intermediateDifferential) / W.asymmetryFullIn),
      `asymmetric core (intermediate differential ${ball.intermediateDifferential.toFixed(3)} in)`,
      'common practice (an asymmetric core responds quicker to friction)',
    );
  }
  const da = ball.layout?.drillingAngleDeg;
  if (da !== undefined) {
    const p = Math.max(-W.drillingAngleMax, Math.min(W.drillingAngleMax, (W.drillingAnglePer30Deg * (45 - da)) / 30));
    if (Math.abs(p) >= 0.05)
      add(
        'drilling-angle',
        p,
        `drilling angle ${da}°`,
        'common practice (layouts by drilling angle, pin-to-PAP and VAL angle: a smaller drilling angle reads earlier and smoother)',
      );
  }
  factors.sort((a, b) => Math.abs(b.points) - Math.abs(a.points) || a.key.localeCompare(b.key));
  const total = round1(W.benchmark + factors.reduce((s, f) => s + f.points, 0));
  return { total, factors };
}
