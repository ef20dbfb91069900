import { mean, sampleStandardDeviation } from 'simple-statistics';
import { shotStats } from '../shotlog/shotStats';
import type { Rate, ShotRecord } from '../shotlog/types';
import { wilsonInterval } from '../shotlog/wilsonInterval';
import { probabilityBetter, shotsPerArm, twoProportionTest } from './proportions';

/**
 * The trial's thresholds (Lanewright's choices, stated on the screen):
 * - `minFirstBalls`: below this many first balls at a full rack in any arm no verdict is given;
 * - `clearProbability`: the posterior probability that the leading arm strikes more often than the next one needed
 *   for a verdict (0.95, the usual one-sided 5 % level);
 * - `alpha`/`power`: the standard power calculation for "how many more shots" (two-sided 5 %, 80 % power);
 * - `smallestDifference`: with no difference seen yet, the shots needed are for a 10-point difference in strike rate.
 */
export const TRIAL_RULES = Object.freeze({ minFirstBalls: 10, clearProbability: 0.95, alpha: 0.05, power: 0.8, smallestDifference: 0.1 });

/** One arm of a trial: a ball, a surface or a layout, and the shots logged with it. */
export interface TrialArmInput {
  id: string;
  label: string;
  shots: ShotRecord[];
  /** The breakpoint board (hand-side) the ball-motion model predicts for this arm on the trial's condition. */
  predictedBreakpointBoard?: number | null;
}

/** A mean with its normal-approximation 95 % interval (null with fewer than two values). */
export interface MeanWithInterval {
  n: number;
  mean: number | null;
  sd: number | null;
  low: number | null;
  high: number | null;
}

export interface TrialArmResult {
  id: string;
  label: string;
  shots: number;
  strike: Rate;
  pocket: Rate;
  /** Strikes among pocket hits. */
  carry: Rate;
  /** Single corner-pin leaves after a first ball at a full rack: the pocket-side corner (the 10 pin for a right-hander, the 7 for a left-hander) and the far one. */
  pocketCorner: Rate & { pin: number };
  farCorner: Rate & { pin: number };
  /** Spread of the logged breakpoint boards (sample standard deviation). */
  breakpoint: MeanWithInterval;
  /** Observed minus predicted breakpoint board (positive: the ball went farther out than the model said). */
  predictedVsObserved: (MeanWithInterval & { predictedBoard: number }) | null;
}

export interface TrialVerdict {
  kind: 'clear' | 'not-enough';
  /** The arm that strikes more often (clear) or leads so far (not-enough, null when tied or no shots). */
  leaderId: string | null;
  /** The arm it is compared with. */
  runnerUpId: string | null;
  /** P(leader's true strike rate > runner-up's), Beta(1, 1) priors. */
  probability: number | null;
  /** The pooled two-proportion test on strike rates. */
  test: { z: number; p: number } | null;
  /** More first balls needed in each arm to settle it (power calculation), null for a clear verdict. */
  moreShotsPerArm: number | null;
  text: string;
}

export interface TrialComparison {
  arms: TrialArmResult[];
  verdict: TrialVerdict;
}

function rate(hits: number, n: number): Rate {
  if (n === 0) return { hits, n, pct: null, low: null, high: null };
  const w = wilsonInterval(hits, n);
  const r = (x: number) => Math.round(x * 1000) / 10;
  return { hits, n, pct: r(hits / n), low: r(w.low), high: r(w.high) };
}

function meanWithInterval(values: number[]): MeanWithInterval {
  if (values.length === 0) return { n: 0, mean: null, sd: null, low: null, high: null };
  const m = mean(values);
  if (values.length < 2) return { n: 1, mean: m, sd: null, low: null, high: null };
  const sd = sampleStandardDeviation(values);
  const half = (1.96 * sd) / Math.sqrt(values.length);
  return { n: values.length, mean: m, sd, low: m - half, high: m + half };
}

/** Single-pin corner leaves among first balls at a full rack that were not strikes (shotStats' leaves). */
function cornerLeaves(stats: ReturnType<typeof shotStats>, pin: number): Rate & { pin: number } {
  const hits = stats.leaves.filter((l) => l.pins.length === 1 && l.pins[0] === pin).reduce((s, l) => s + l.count, 0);
  return { ...rate(hits, stats.strike.n), pin };
}

function armResult(arm: TrialArmInput, hand: 'right' | 'left'): TrialArmResult {
  const stats = shotStats(arm.shots);
  const boards = arm.shots.filter((s) => s.breakpointBoard != null && s.delivery === 1).map((s) => s.breakpointBoard as number);
  const bp = meanWithInterval(boards);
  const predicted = arm.predictedBreakpointBoard;
  const pvo = predicted == null || bp.n === 0 ? null : { ...meanWithInterval(boards.map((b) => b - predicted)), predictedBoard: predicted };
  return {
    id: arm.id,
    label: arm.label,
    shots: arm.shots.length,
    strike: stats.strike,
    pocket: stats.pocket,
    carry: stats.carry,
    pocketCorner: cornerLeaves(stats, hand === 'right' ? 10 : 7),
    farCorner: cornerLeaves(stats, hand === 'right' ? 7 : 10),
    breakpoint: bp,
    predictedVsObserved: pvo,
  };
}

/**
 * An equipment trial: two or more arms (balls, surfaces or layouts) compared on the shots logged with each, and a
 * verdict with its evidence.
 *
 * Definition: per arm, shotStats' strike, pocket and carry rates with Wilson 95 % intervals, the single corner-pin
 * leaves (mirrored for a left-hander), the breakpoint spread and the observed-minus-predicted breakpoint. The
 * verdict compares strike rates (strikes ÷ first balls at a full rack): the leader is the arm with the highest
 * posterior mean (Beta(1 + strikes, 1 + non-strikes)); "clear" when every arm has at least
 * TRIAL_RULES.minFirstBalls first balls and P(leader > runner-up) ≥ TRIAL_RULES.clearProbability (probabilityBetter:
 * Cook 2005), else "not enough shots yet" with the shots per arm a power calculation asks for at the observed rates
 * (shotsPerArm: Fleiss) less those already logged. The pooled two-proportion z test is given as a second opinion.
 *
 * @param input.arms at least two arms with distinct ids.
 * @param input.hand the bowler's hand (corner pins are mirrored for a left-hander).
 */
export function compareTrial(input: { arms: TrialArmInput[]; hand: 'right' | 'left' }): TrialComparison {
  const fn = 'compareTrial';
  if (!Array.isArray(input?.arms) || input.arms.length < 2) throw new RangeError(`${fn}: a trial needs at least two arms`);
  if (new Set(input.arms.map((a) => a.id)).size !== input.arms.length) throw new RangeError(`${fn}: arm ids must be distinct`);
  if (input.hand !== 'right' && input.hand !== 'left') throw new TypeError(`${fn}: hand must be 'right' or 'left'`);
  const arms = input.arms.map((a) => armResult(a, input.hand));
  return { arms, verdict: verdict(arms) };
}

function verdict(arms: TrialArmResult[]): TrialVerdict {
  const R = TRIAL_RULES;
  const counts = arms.map((a) => ({
    id: a.id,
    label: a.label,
    hits: a.strike.hits,
    n: a.strike.n,
    post: (1 + a.strike.hits) / (2 + a.strike.n),
  }));
  const sorted = [...counts].sort((x, y) => y.post - x.post);
  const [lead, next] = sorted;
  const probability = probabilityBetter(lead, next);
  const test = twoProportionTest(lead, next);
  const fewest = counts.reduce((m, c) => (c.n < m.n ? c : m));
  const p1 = lead.n > 0 ? lead.hits / lead.n : 0,
    p2 = next.n > 0 ? next.hits / next.n : 0;
  const needed =
    p1 !== p2 ? shotsPerArm(p1, p2, R.alpha, R.power) : shotsPerArm(Math.min(0.95, p2 + R.smallestDifference), p2, R.alpha, R.power);
  const more = Math.max(0, needed - fewest.n);
  const pctP = probability >= 0.995 ? 'over 99 %' : probability <= 0.005 ? 'under 1 %' : `${Math.round(probability * 100)} %`;
  if (fewest.n < R.minFirstBalls) {
    return {
      kind: 'not-enough',
      leaderId: lead.n > 0 && lead.post !== next.post ? lead.id : null,
      runnerUpId: next.id,
      probability,
      test,
      moreShotsPerArm: Math.max(more, R.minFirstBalls - fewest.n),
      text: `Not enough shots yet: ${fewest.label} has ${fewest.n} first ball${fewest.n === 1 ? '' : 's'} at a full rack; a verdict needs at least ${R.minFirstBalls} in every arm.`,
    };
  }
  if (probability >= R.clearProbability) {
    return {
      kind: 'clear',
      leaderId: lead.id,
      runnerUpId: next.id,
      probability,
      test,
      moreShotsPerArm: null,
      text: `${lead.label} strikes more often than ${next.label}: ${lead.hits} of ${lead.n} against ${next.hits} of ${next.n}, a probability of ${pctP} that it is truly better.`,
    };
  }
  const tied = lead.post === next.post;
  return {
    kind: 'not-enough',
    leaderId: tied ? null : lead.id,
    runnerUpId: next.id,
    probability,
    test,
    moreShotsPerArm: more,
    text: tied
      ? `Not enough shots yet: no difference so far; telling a ${Math.round(R.smallestDifference * 100)}-point difference apart needs about ${needed} first balls in each arm.`
      : `Not enough shots yet: ${lead.label} leads (a probability of ${pctP} that it is better); at these rates about ${needed} first balls in each arm would settle it, ${more} more.`,
  };
}
