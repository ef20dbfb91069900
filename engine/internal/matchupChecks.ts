import type { BallSpec, MatchupContext } from '../types';
import { validateBallSpec } from '../validateBallSpec';
import { validateBowlerProfile } from '../validateBowlerProfile';
import { finite, list, oneOf, record } from './checks';

/**
 * A list of factors (ballReaction's or conditionDemand's): records with a finite `points` each (at most a dozen).
 * The message is built only on a failure (this runs for every ball of a ranking).
 */
function factors(fn: string, name: string, value: unknown): void {
  const fs = list(fn, name, value);
  for (let i = 0; i < fs.length; i++) {
    const f = fs[i] as { points?: unknown } | null;
    if (f === null || typeof f !== 'object' || typeof f.points !== 'number' || !Number.isFinite(f.points))
      finite(fn, `${name}[${i}].points`, record(fn, `${name}[${i}]`, f).points);
  }
}

/**
 * The checks of the fit's building blocks (strengthFit, suggestChanges, fitLayer): a well-formed ball and a
 * matchup as matchupContext builds it (its bowler, and a demand with a finite total and its factors). Throws a
 * TypeError or RangeError whose message starts with `fn`.
 */
export function checkMatchup(fn: string, ball: unknown, ctx: unknown): asserts ctx is MatchupContext {
  validateBallSpec(ball, fn);
  const c = record(fn, 'ctx', ctx);
  validateBowlerProfile(c.bowler, fn);
  const demand = record(fn, 'ctx.demand', c.demand);
  finite(fn, 'ctx.demand.total', demand.total);
  factors(fn, 'ctx.demand.factors', demand.factors);
}

/** A strength fit as strengthFit returns it (its verdict, gap and the ball's reaction). */
export function checkFit(fn: string, ball: BallSpec, fit: unknown): void {
  const f = record(fn, 'fit', fit);
  oneOf(fn, 'fit.verdict', f.verdict, ['too-strong', 'suits', 'too-weak']);
  finite(fn, 'fit.gap', f.gap);
  if (ball.coverType === 'plastic') return;
  const reaction = record(fn, 'fit.reaction', f.reaction);
  finite(fn, 'fit.reaction.total', reaction.total);
  factors(fn, 'fit.reaction.factors', reaction.factors);
}
