import type { BallSpec, MatchupContext, RuleResult } from './types';
import { checkMatchup } from './internal/matchupChecks';
import { reactionUnchecked, type BallReaction } from './ballReaction';

/** How a ball's reaction meets the condition's demand. */
export interface StrengthFit {
  /** The ball's reaction (ballReaction().total). */
  strength: number;
  /** What the condition asks of this bowler (conditionDemand().total). */
  demand: number;
  /** strength − demand: positive = too much ball, negative = too little. */
  gap: number;
  verdict: 'too-strong' | 'suits' | 'too-weak';
  /** 0–100: 100 within ±FIT_SCALE.tolerance, then falling by about FIT_SCALE.perPoint a point of gap beyond it, more slowly far off. */
  score: number;
  /** One reason per part of the ball and of the condition; the points lost to the gap are shared among the parts that make it. */
  reasons: RuleResult[];
  reaction: BallReaction;
}

/**
 * The fit's scale: within ±`tolerance` (2.5) points (about half a surface step) a ball suits the condition; beyond it
 * the 0–100 fit score is 100·exp(−perPoint·excess/100): about `perPoint` points lost per point of gap at first,
 * and never quite 0, so two balls far off still keep their order. Lanewright's choice: one surface step too much
 * or too little (5.5 points) costs about 12 points. Too much ball costs `tooStrongFactor` (1.3) times as much as
 * too little (common practice: a ball that hooks too much cannot be contained on the lane; one that hooks too
 * little can still be thrown straighter at the pocket).
 */
export const FIT_SCALE = Object.freeze({ tolerance: 2.5, perPoint: 5, tooStrongFactor: 1.3 });

const round1 = (x: number) => Math.round(x * 10) / 10 || 0;
const signed = (x: number) => `${x > 0 ? '+' : x < 0 ? '−' : '±'}${Math.abs(x).toFixed(1)}`;
const cap = (s: string) => s.charAt(0).toUpperCase() + s.slice(1);

/**
 * One model of the matchup: the ball's total reaction (ballReaction: cover, surface, wear, core, layout) against
 * what the condition asks of this bowler (the context's demand: volume, length, ratio, lane surface, games
 * bowled, speed, rev rate, axis rotation and tilt), on one scale. The gap says how much too strong (+) or too
 * weak (−) the ball is.
 *
 * Definition: gap = strength − demand; score = 100·exp(−FIT_SCALE.perPoint × excess / 100), excess =
 * max(0, |gap| − tolerance), × tooStrongFactor when the ball is too strong. The points lost (100 − score) are shared among the parts that push the gap's way — the ball's parts with
 * the gap's sign and the condition's parts against it — in proportion to their size; every other part shows its
 * points with effect 0. So the effects of the reasons add up to the points lost, nothing is counted twice, and
 * a reason's sign always agrees with its words.
 * Source: the parts' sources (ballReaction, conditionDemand); the matching of ball to condition is common
 * practice (a strong ball on a light, high-friction condition reads early and hooks too soon).
 *
 * @param ball a ball already validated.
 * @param ctx the matchup (matchupContext).
 * @returns strength, demand, gap, verdict, score, reasons and the reaction's parts.
 * @example
 * strengthFit(strongSolid2000, houseContext).verdict; // => 'too-strong'
 */
export function strengthFit(ball: BallSpec, ctx: MatchupContext): StrengthFit {
  checkMatchup('strengthFit', ball, ctx);
  return fitUnchecked(ball, ctx);
}

/** strengthFit without the input checks, for callers that have made them (fitLayer, rankArsenal). */
export function fitUnchecked(ball: BallSpec, ctx: MatchupContext): StrengthFit {
  const reaction = reactionUnchecked(ball);
  const demand = ctx.demand;
  const gap = round1(reaction.total - demand.total);
  const T = FIT_SCALE.tolerance;
  const verdict: StrengthFit['verdict'] = gap > T ? 'too-strong' : gap < -T ? 'too-weak' : 'suits';
  const excess = Math.max(0, Math.abs(gap) - T) * (gap > 0 ? FIT_SCALE.tooStrongFactor : 1);
  const lost = 100 * (1 - Math.exp((-FIT_SCALE.perPoint * excess) / 100));
  const score = round1(100 - lost);
  const dir = Math.sign(gap);
  // the parts that push the gap's way, and how much
  const push = (ballSide: boolean, pts: number) => (verdict === 'suits' ? 0 : Math.max(0, (ballSide ? 1 : -1) * dir * pts));
  const total =
    reaction.factors.reduce((s, f) => s + push(true, f.points), 0) + demand.factors.reduce((s, f) => s + push(false, f.points), 0);
  const shareOf = (ballSide: boolean, pts: number) => (total > 0 ? round1((-lost * push(ballSide, pts)) / total) : 0);
  const why = verdict === 'too-strong' ? 'too strong' : 'too weak';
  const reasons: RuleResult[] = [];
  for (const f of reaction.factors) {
    const effect = shareOf(true, f.points);
    let text = `${cap(f.label)}: ${signed(f.points)} reaction against a benchmark ball`;
    if (effect < 0) text += ` — part of why this ball is ${why} for this condition.`;
    else if (verdict !== 'suits' && f.points !== 0 && push(true, f.points) === 0)
      text += ` — this part already pulls toward the condition.`;
    else text += '.';
    reasons.push({ rule: `reaction-${f.key}`, effect, text, source: f.source });
  }
  for (const f of demand.factors) {
    const effect = shareOf(false, f.points);
    let text = `${cap(f.label)} asks for ${f.points > 0 ? 'more' : 'less'} ball (${signed(f.points)})`;
    if (effect < 0) text += ` — with this ball, part of why it is ${why}.`;
    else text += '.';
    reasons.push({ rule: `demand-${f.key}`, effect, text, source: f.source });
  }
  reasons.sort((a, b) => a.effect - b.effect || 0);
  return { strength: reaction.total, demand: demand.total, gap, verdict, score, reasons, reaction };
}
