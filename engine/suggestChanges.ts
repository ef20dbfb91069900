import type { BallSpec, MatchupContext, Suggestion } from './types';
import { DEFAULT_BALL_DIAMETER_IN } from './constants';
import { checkFit, checkMatchup } from './internal/matchupChecks';
import { reactionUnchecked } from './ballReaction';
import { DEMAND_SCALE } from './conditionDemand';
import { FIT_SCALE, type StrengthFit } from './strengthFit';

/** The surfaces suggestChanges chooses among, rough to smooth (common pro-shop steps). */
export const SURFACE_STEPS: readonly { surfaceGrit: number; polished: boolean }[] = [
  { surfaceGrit: 500, polished: false },
  { surfaceGrit: 1000, polished: false },
  { surfaceGrit: 2000, polished: false },
  { surfaceGrit: 3000, polished: false },
  { surfaceGrit: 4000, polished: false },
  { surfaceGrit: 4000, polished: true },
];

/** Pin-to-PAP distances suggestChanges chooses among for the next drilling, inches (common layouts). */
export const LAYOUT_STEPS: readonly number[] = [3.375, 4, 4.5, 5, 5.5, 6];

/** The caution every surface suggestion carries (governing-body rules and pro-shop safety, common practice). */
export const SURFACE_CAUTION =
  'Change a surface between sessions only: no abrasives, polish or cleaners other than a dry towel during USBC competition (check your league or tournament rules); sand wet with eye and dust protection, or have the pro shop do it.';

/** Inches rounded to the nearest 1/8, in words: 3.375 → "3 3/8". */
function eighths(x: number): string {
  const n = Math.round(x * 8);
  const whole = Math.floor(n / 8);
  const rest = n % 8;
  if (rest === 0) return `${whole}`;
  const [num, den] = rest % 4 === 0 ? [rest / 4, 2] : rest % 2 === 0 ? [rest / 2, 4] : [rest, 8];
  return whole > 0 ? `${whole} ${num}/${den}` : `${num}/${den}`;
}

const round1 = (x: number) => Math.round(x * 10) / 10;

/**
 * What to change for a ball on a matchup, by the amount the gap between its reaction and the condition's demand
 * calls for (strengthFit): too much ball → a smoother surface, a weaker layout, more speed, a move deeper;
 * too little → the reverse. Nothing is suggested for a ball that already suits (within ±FIT_SCALE.tolerance).
 *
 * Definitions:
 * - surface (not plastic): of SURFACE_STEPS in the gap's direction, the finish that brings the gap closest to 0
 *   (a resurface also restores the reaction lost to wear), offered only when it closes at least a point of the
 *   gap; it carries SURFACE_CAUTION (surface changes between sessions only). Common practice: a lower grit reads
 *   earlier, a higher grit or polish goes longer.
 * - layout (next drilling, not plastic): of LAYOUT_STEPS, the pin-to-PAP distance whose flare closes the gap best
 *   (45°, 3 3/8 in, flares most; farther from it flares less — rigid-body mechanics, sin 2θ), when it closes at
 *   least 1.5 points; drilling is a pro-shop technician's work.
 * - release: more than twice the tolerance off: about 1 mph more speed (too strong) or less (too weak), each mph
 *   worth DEMAND_SCALE.perMph points (common practice).
 * - line: too strong → move deeper (feet 2 boards, target 1 board toward the middle: 2-and-1); too weak → the
 *   reverse (common practice). `change.feetBoards`/`targetBoards` count boards away from the hand-side gutter.
 * - plastic: the corner-spare use instead.
 *
 * @param ball the ball (already validated).
 * @param ctx the matchup (matchupContext).
 * @param fit the ball's strengthFit on that matchup.
 * @returns the suggestions, surface first, then layout, release, line.
 * @example
 * suggestChanges(strongSolid2000, houseCtx, fit)[0]; // => { kind: 'surface', text: 'Go smoother — 4000 grit …', change: { surfaceGrit: 4000, polished: false } }
 */
export function suggestChanges(ball: BallSpec, ctx: MatchupContext, fit: StrengthFit): Suggestion[] {
  checkMatchup('suggestChanges', ball, ctx);
  checkFit('suggestChanges', ball, fit);
  return suggestionsUnchecked(ball, ctx, fit);
}

/** suggestChanges without the input checks, for callers that have made them (fitLayer). */
export function suggestionsUnchecked(ball: BallSpec, ctx: MatchupContext, fit: StrengthFit): Suggestion[] {
  const out: Suggestion[] = [];
  if (ball.coverType === 'plastic') {
    out.push({
      kind: 'line',
      text: 'Use this ball for corner spares: throw it straight at the 7 and 10 pins, cross-lane.',
      change: { spareTargets: [7, 10] },
    });
    return out;
  }
  if (fit.verdict === 'suits') return out;
  const gap = fit.gap;
  const strong = gap > 0;
  const current = fit.reaction;
  const pointsOf = (key: string, r = current) => r.factors.find((f) => f.key === key)?.points ?? 0;

  // Surface: the finish in the gap's direction that brings the gap nearest 0 (a resurface also ends the wear).
  const here = pointsOf('surface') + pointsOf('wear');
  let best: { step: (typeof SURFACE_STEPS)[number]; newGap: number } | null = null;
  for (const step of SURFACE_STEPS) {
    if (step.surfaceGrit === ball.surfaceGrit && step.polished === ball.polished) continue;
    const r = reactionUnchecked({ ...ball, ...step, gamesSinceResurface: 0 });
    const delta = pointsOf('surface', r) - here;
    if (strong ? delta >= 0 : delta <= 0) continue;
    const newGap = round1(gap + delta);
    if (best === null || Math.abs(newGap) < Math.abs(best.newGap)) best = { step, newGap };
  }
  if (best !== null && Math.abs(best.newGap) <= Math.abs(gap) - 1) {
    const finish = best.step.polished ? `${best.step.surfaceGrit} grit and polish` : `${best.step.surfaceGrit} grit`;
    const change = Math.abs(round1(best.newGap - gap));
    out.push({
      kind: 'surface',
      text: strong
        ? `Go smoother — ${finish}: about ${change} points less reaction (gap ${gap} → ${best.newGap}), for more length and a later turn on this condition. ${SURFACE_CAUTION}`
        : `Sand it rougher — ${finish}: about ${change} points more reaction (gap ${gap} → ${best.newGap}), for an earlier, stronger read in this oil. ${SURFACE_CAUTION}`,
      change: { ...best.step },
    });
  }

  // Layout for the next drilling: the pin-to-PAP distance whose flare closes the gap best.
  const diameter = ball.diameterIn ?? DEFAULT_BALL_DIAMETER_IN;
  if (ball.layout) {
    const flareHere = pointsOf('flare');
    let lay: { pin: number; newGap: number } | null = null;
    for (const pin of LAYOUT_STEPS) {
      if (pin > (Math.PI * diameter) / 2) continue;
      const r = reactionUnchecked({ ...ball, layout: { ...ball.layout, pinToPapIn: pin } });
      const delta = pointsOf('flare', r) - flareHere;
      if (strong ? delta >= 0 : delta <= 0) continue;
      const newGap = round1(gap + delta);
      if (lay === null || Math.abs(newGap) < Math.abs(lay.newGap)) lay = { pin, newGap };
    }
    if (lay !== null && Math.abs(lay.newGap) <= Math.abs(gap) - 1.5) {
      out.push({
        kind: 'layout',
        text: `Next drilling: a pin about ${eighths(lay.pin)} in from your PAP ${strong ? 'flares less, for a smoother, more controllable reaction' : 'flares more, for more hook in this oil'} (gap ${gap} → ${lay.newGap}). Drilling is work for a qualified pro-shop technician.`,
        change: { pinToPapIn: lay.pin },
      });
    }
  } else {
    out.push({
      kind: 'layout',
      text: `Enter this ball's layout (pin-to-PAP distance) so its flare is counted; without it the benchmark's flare is assumed.`,
      change: {},
    });
  }

  // Release: a clear gap also calls for a speed change.
  const speed = ctx.bowler.speedMph;
  if (Math.abs(gap) > 2 * FIT_SCALE.tolerance) {
    const mph = strong ? speed + 1 : speed - 1;
    if (mph > 1) {
      out.push({
        kind: 'release',
        text: strong
          ? `Or about 1 mph more speed (${mph} mph): worth about ${DEMAND_SCALE.perMph} points, the ball gets farther down the lane before it reads.`
          : `Or about 1 mph less speed (${mph} mph): worth about ${DEMAND_SCALE.perMph} points, the ball has more time to read the oil.`,
        change: { speedMph: mph },
      });
    }
  }

  // Line: move with the ball's strength.
  const deeper = ctx.bowler.hand === 'right' ? 'left' : 'right';
  const outward = ctx.bowler.hand === 'right' ? 'right' : 'left';
  out.push(
    strong
      ? {
          kind: 'line',
          text: `Until then, move deeper: feet 2 boards and target 1 board ${deeper} (2-and-1), to give this ball more oil before it reads.`,
          change: { feetBoards: 2, targetBoards: 1 },
        }
      : {
          kind: 'line',
          text: `Until then, move toward the friction: feet 2 boards and target 1 board ${outward} (2-and-1), so this ball finds the drier outside.`,
          change: { feetBoards: -2, targetBoards: -1 },
        },
  );
  return out;
}
