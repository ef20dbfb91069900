import { integerInRange, record } from '../internal/checks';

/** How a league gives handicap: a percentage of the difference between a basis score and the bowler's average. */
export interface HandicapRule {
  /** The basis score, e.g. 220 (a whole number of pins, 100–300). */
  basis: number;
  /** The percentage of the difference, e.g. 90 (1–100). */
  percentage: number;
  /** The most handicap a game may carry, if the league caps it. */
  maxPerGame?: number | null;
}

/**
 * Handicap per game: the league's percentage of the difference between its basis score and the average,
 * fractions dropped, never below 0 and at most the league's cap (a percentage of a basis is the usual method:
 * USBC league rules on handicap — from memory; 90 % of 220 and 80 % of 210 are common choices).
 * @example
 * handicapFor(185, { basis: 220, percentage: 90 }); // => 31 (0.9 × 35 = 31.5)
 */
export function handicapFor(average: number, rule: HandicapRule): number {
  const fn = 'handicapFor';
  const avg = integerInRange(fn, 'average', average, 0, 300);
  const r = record(fn, 'rule', rule);
  const basis = integerInRange(fn, 'rule.basis', r.basis, 100, 300);
  const pct = integerInRange(fn, 'rule.percentage', r.percentage, 1, 100);
  const cap = r.maxPerGame === undefined || r.maxPerGame === null ? null : integerInRange(fn, 'rule.maxPerGame', r.maxPerGame, 0, 300);
  // integer arithmetic: pct × (basis − avg) / 100, truncated, so 31.5 never becomes 31.499…
  const h = Math.max(0, Math.floor((pct * (basis - avg)) / 100));
  return cap === null ? h : Math.min(cap, h);
}
