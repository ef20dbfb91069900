import type { MatchupContext } from '../types';
import { clamp } from './checks';

/**
 * Points a rule gives for how close a ball's value x is to the matchup's target t, both 0–1:
 * maxPoints × (1 − slope × |x − t|), kept within ±maxPoints. With the default slope, a miss of 0.4
 * gives 0 and a miss of 0.8 or more gives −maxPoints.
 */
export function fitEffect(x: number, t: number, maxPoints: number, slope = 2.5): number {
  return maxPoints * clamp(1 - slope * Math.abs(x - t), -1, 1);
}

/** Rounds a rule's effect to 0.1 point so reasons read cleanly and results are stable. */
export function points(x: number): number {
  return Math.round(x * 10) / 10;
}

/** "45 ft, 28.0 mL" — the pattern in a few words. */
export function patternWords(ctx: MatchupContext): string {
  return `${ctx.analysis.lengthFt} ft, ${ctx.analysis.volumeMl.toFixed(1)} mL`;
}

/** A word for a demand: 'little', 'some', 'a lot of'. */
export function demandWords(d: number): string {
  return d < 0.35 ? 'little' : d < 0.65 ? 'a medium amount of' : 'a lot of';
}
