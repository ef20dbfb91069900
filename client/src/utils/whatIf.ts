import type { ShotPrediction } from '@engine/index';
import type { Ball } from '@shared/balls';
import { unitFormatter, type UnitFormatter } from './units';

/** A version of a ball to try: a surface (grit and polish) and a pin-to-PAP distance (null: undrilled). */
export interface BallVariant {
  surfaceGrit: number;
  polished: boolean;
  pinToPapIn: number | null;
}

/** The ball as it is, as a variant. */
export function variantOf(ball: Ball): BallVariant {
  return { surfaceGrit: ball.surfaceGrit, polished: ball.polished, pinToPapIn: ball.layout?.pinToPapIn ?? null };
}

/**
 * The ball with a variant applied, as the what-if and the coach's side by side both give it to the engine: a new
 * surface is a fresh cover (no games since the resurface, as the pro shop hands it back — the engine sizes its
 * surface suggestions the same way); the same surface keeps the ball's wear. A new pin-to-PAP keeps the ball's
 * drilling and VAL angles.
 */
export function applyVariant(ball: Ball, v: BallVariant): Ball {
  const resurfaced = v.surfaceGrit !== ball.surfaceGrit || v.polished !== ball.polished;
  const layout =
    v.pinToPapIn === null
      ? null
      : {
          pinToPapIn: v.pinToPapIn,
          drillingAngleDeg: ball.layout?.drillingAngleDeg ?? null,
          valAngleDeg: ball.layout?.valAngleDeg ?? null,
        };
  return {
    ...ball,
    surfaceGrit: v.surfaceGrit,
    polished: v.polished,
    layout,
    gamesSinceResurface: resurfaced ? 0 : ball.gamesSinceResurface,
  };
}

const f1 = (v: number) => v.toFixed(1);

/**
 * How the breakpoint moves from one prediction to another, in one sentence both what-ifs print, distances in the
 * bowler's units: "Breakpoint 1.8 ft later and 0.7 boards deeper: board 8.1 at 41.0 ft → board 8.8 at 42.8 ft."
 * Boards count from the bowler's hand-side gutter, so more boards is deeper (toward the middle).
 */
export function breakpointChange(
  from: ShotPrediction,
  to: ShotPrediction,
  u: Pick<UnitFormatter, 'distance'> = unitFormatter('imperial'),
): string {
  const dFt = to.breakpoint.ft - from.breakpoint.ft;
  const dBoard = to.breakpoint.board - from.breakpoint.board;
  const ft = Math.abs(dFt) < 0.05 ? 'at the same distance' : `${u.distance(Math.abs(dFt))} ${dFt > 0 ? 'later' : 'earlier'}`;
  const boards = Math.abs(dBoard) < 0.05 ? 'on the same board' : `${f1(Math.abs(dBoard))} boards ${dBoard > 0 ? 'deeper' : 'farther out'}`;
  return `Breakpoint ${ft} and ${boards}: board ${f1(from.breakpoint.board)} at ${u.distance(from.breakpoint.ft)} → board ${f1(to.breakpoint.board)} at ${u.distance(to.breakpoint.ft)}.`;
}

/** The fit of a ranked ball in words: "too strong by 5.6", "suits", "too weak by 6.1". */
export function fitWords(fit: { gap: number; verdict: 'too-strong' | 'suits' | 'too-weak' }): string {
  if (fit.verdict === 'suits') return 'suits';
  return `${fit.verdict === 'too-strong' ? 'too strong' : 'too weak'} by ${f1(Math.abs(fit.gap))}`;
}

/** A rank as an English ordinal: 1st, 2nd, 3rd, 4th, 11th, 21st. */
export function ordinal(n: number): string {
  return `${n}${n % 10 === 1 && n % 100 !== 11 ? 'st' : n % 10 === 2 && n % 100 !== 12 ? 'nd' : n % 10 === 3 && n % 100 !== 13 ? 'rd' : 'th'}`;
}

/** The grits both what-ifs offer for a surface. */
export const WHAT_IF_GRITS: readonly number[] = [360, 500, 800, 1000, 1500, 2000, 3000, 4000, 5000];

/** The grits to offer for a variant: the usual steps, with the ball's own grit sorted in when it is not one of them. */
export function gritChoices(current: number | null | undefined): readonly number[] {
  return current && !WHAT_IF_GRITS.includes(current) ? [...WHAT_IF_GRITS, current].sort((m, n) => m - n) : WHAT_IF_GRITS;
}
