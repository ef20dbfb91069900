import type { BallFeatures, BallSpec, MatchupContext, Suggestion } from './types';
import { DEFAULT_BALL_DIAMETER_IN } from './constants';
import { strengthOf } from './ballStrength';
import { pinToPapInForAngle } from './pinToPapInForAngle';
import { ruleOf31 } from './ruleOf31';
import { surfaceSmoothness } from './surfaceSmoothness';
import { targetFlareShare } from './rules/layoutFlare';

/** The surfaces suggestChanges chooses among, rough to smooth (common pro-shop steps, TRADE.md 7.2). */
export const SURFACE_STEPS: readonly { surfaceGrit: number; polished: boolean }[] = [
  { surfaceGrit: 500, polished: false },
  { surfaceGrit: 1000, polished: false },
  { surfaceGrit: 2000, polished: false },
  { surfaceGrit: 3000, polished: false },
  { surfaceGrit: 4000, polished: false },
  { surfaceGrit: 4000, polished: true },
];

/** Inches rounded to the nearest 1/8, in words: 3.375 → "3 3/8". */
function eighths(x: number): string {
  const n = Math.round(x * 8);
  const whole = Math.floor(n / 8);
  const rest = n % 8;
  if (rest === 0) return `${whole}`;
  const [num, den] = rest % 4 === 0 ? [rest / 4, 2] : rest % 2 === 0 ? [rest / 2, 4] : [rest, 8];
  return whole > 0 ? `${whole} ${num}/${den}` : `${num}/${den}`;
}

/**
 * What to change for a ball on a matchup, and which way — the suggestions of the rules layer.
 *
 * Definitions (each common practice unless noted):
 * - surface (not plastic): when the ball's surfaceSmoothness is more than 0.15 from the surface
 *   rule's target (1 − oilDemand), the nearest SURFACE_STEPS finish: sand to a lower grit for more
 *   read in oil, or a higher grit or polish for more length and a sharper backend (TRADE.md 7.2).
 * - layout (not plastic): when the layout's flare share is more than 0.12 from the layout rule's
 *   target, the pin-to-PAP distance that gives it — 45° (3 3/8 in) for the most flare, a longer
 *   distance for less (TRADE.md 6.3, derived); without a layout, the distance that would suit.
 * - release (not plastic): when the ball is more than 0.2 stronger or weaker than the matchup's
 *   targetStrength, 1 mph more speed (the ball goes farther before it reads) or 1 mph less.
 * - line: the rule of 31 exit board (TRADE.md 7.1); when the ball is more than 0.1 stronger or
 *   weaker than called for, a 2-and-1 move (feet 2 boards, target 1 board) deeper or outward
 *   (TRADE.md 7.1). `change.feetBoards`/`targetBoards` count boards away from the gutter on the
 *   bowler's hand side. A plastic ball gets the corner-spare suggestion instead.
 *
 * @param ball the ball (already validated).
 * @param f its features (ballFeatures).
 * @param ctx the matchup (matchupContext).
 * @returns the suggestions, surface first, then layout, release, line.
 * @example
 * suggestChanges(ball500Grit, f, lightHouseContext)[0]; // => { kind: 'surface', text: 'Go to 4000 grit …', change: { surfaceGrit: 4000, polished: false } }
 */
export function suggestChanges(ball: BallSpec, f: BallFeatures, ctx: MatchupContext): Suggestion[] {
  const out: Suggestion[] = [];
  const hand = ctx.bowler.hand;
  const deeper = hand === 'right' ? 'left' : 'right';
  const outward = hand === 'right' ? 'right' : 'left';

  if (ball.coverType === 'plastic') {
    out.push({
      kind: 'line',
      text: 'Use this ball for corner spares: throw it straight at the 7 and 10 pins, cross-lane.',
      change: { spareTargets: [7, 10] },
    });
    return out;
  }

  // Surface.
  const surfaceTarget = 1 - ctx.oilDemand;
  if (Math.abs(f.smoothness - surfaceTarget) > 0.15) {
    let best = SURFACE_STEPS[0];
    let bestGap = Infinity;
    for (const step of SURFACE_STEPS) {
      const gap = Math.abs(surfaceSmoothness(step.surfaceGrit, step.polished) - surfaceTarget);
      if (gap < bestGap) {
        best = step;
        bestGap = gap;
      }
    }
    const newSmoothness = surfaceSmoothness(best.surfaceGrit, best.polished);
    if (Math.abs(newSmoothness - f.smoothness) > 0.05) {
      const finish = best.polished ? `${best.surfaceGrit} grit and polish` : `${best.surfaceGrit} grit`;
      out.push(
        newSmoothness < f.smoothness
          ? {
              kind: 'surface',
              text: `Sand to ${finish} for an earlier, stronger read in this oil.`,
              change: { ...best },
            }
          : {
              kind: 'surface',
              text: `Go to ${finish} for more length and a sharper backend on this pattern.`,
              change: { ...best },
            },
      );
    }
  }

  // Layout.
  const diameter = ball.diameterIn ?? DEFAULT_BALL_DIAMETER_IN;
  const flareTarget = targetFlareShare(ctx.oilDemand);
  // The pin-to-PAP angle giving flareTarget: 45° for the most flare, else the angle above 45°.
  const angle = flareTarget >= 0.97 ? 45 : 90 - (Math.asin(flareTarget) * 90) / Math.PI;
  const distance = Math.round(pinToPapInForAngle(angle, diameter) * 8) / 8;
  const pct = Math.round((flareTarget >= 0.97 ? 1 : flareTarget) * 100);
  if (!ball.layout) {
    out.push({
      kind: 'layout',
      text: `Enter this ball's layout to have it scored; for this pattern a pin about ${eighths(distance)} in from your PAP (${pct}% of the core's flare) suits.`,
      change: { pinToPapIn: distance },
    });
  } else if (f.layoutShare !== null && Math.abs(f.layoutShare - flareTarget) > 0.12) {
    out.push({
      kind: 'layout',
      text:
        f.layoutShare < flareTarget
          ? `Next drilling: a pin about ${eighths(distance)} in from your PAP gives ${pct}% of the core's flare, for more hook in this oil.`
          : `Next drilling: a pin about ${eighths(distance)} in from your PAP gives ${pct}% of the core's flare, for more control on this pattern.`,
      change: { pinToPapIn: distance },
    });
  }

  // Release.
  const delta = strengthOf(f) - ctx.targetStrength;
  const speed = ctx.bowler.speedMph;
  if (delta > 0.2) {
    out.push({
      kind: 'release',
      text: `Try about 1 mph more speed (${speed + 1} mph) so this ball gets farther down the lane before it reads.`,
      change: { speedMph: speed + 1 },
    });
  } else if (delta < -0.2 && speed > 1) {
    out.push({
      kind: 'release',
      text: `Try about 1 mph less speed (${speed - 1} mph) to give this ball more time to read the oil.`,
      change: { speedMph: speed - 1 },
    });
  }

  // Line.
  const L = ctx.analysis.lengthFt;
  if (L > 0) {
    const exit = ruleOf31(Math.min(L, 60));
    out.push({
      kind: 'line',
      text: `Start with the ball leaving the oil near board ${exit} (rule of 31: ${L} ft − 31).`,
      change: { exitBoard: exit },
    });
  }
  if (delta > 0.1) {
    out.push({
      kind: 'line',
      text: `If it hooks early, move your feet 2 boards and your target 1 board ${deeper} (2-and-1) to play deeper in the oil.`,
      change: { feetBoards: 2, targetBoards: 1 },
    });
  } else if (delta < -0.1) {
    out.push({
      kind: 'line',
      text: `If it goes long past the breakpoint, move your feet 2 boards and your target 1 board ${outward} (2-and-1) toward the drier outside.`,
      change: { feetBoards: -2, targetBoards: -1 },
    });
  }
  return out;
}
