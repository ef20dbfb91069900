import type { ArsenalBall, RankArsenalInput, RuleResult, Suggestion } from './types';
import { surfaceWords } from './ballReaction';
import { checkLegality } from './checkLegality';
import { combineLayers } from './combineLayers';
import { matchupContext } from './matchupContext';
import { SCORING_LAYERS } from './scoringLayers';
import { FIT_SCALE, fitUnchecked } from './strengthFit';
import { finite, list, oneOf, record, show } from './internal/checks';
import { validateBallSpec } from './validateBallSpec';
import { conditionOilMap } from './motion/conditionOilMap';
import { MOTION_LAYER_WEIGHT, motionLayer, type RankedBallWithPrediction } from './motion/motionLayer';
import { prepareShot } from './motion/prepareShot';
import type { LaneOilMap } from './motion/laneOilMap';
import type { ShotPrediction } from './motion/shotPrediction';
import type { PocketLineHint } from './motion/solvePocketLine';

/** How a caller may steer one ranking's work (none of it changes what a ball's entry means). */
export interface RankArsenalOptions {
  /**
   * Where each ball's line search settled on a nearby condition (the same ball and release, a little more or less
   * play on the lane), by ball id: the search starts there instead of scanning the lane (solvePocketLine's warm start).
   */
  hints?: ReadonlyMap<string, PocketLineHint>;
  /** Told where each ball's line search settled, to warm-start a later ranking. */
  onSettled?: (ballId: string, settled: PocketLineHint) => void;
  /** Asked before each ball; true stops the ranking with an Error named 'AbortError' (the caller went away). */
  aborted?: () => boolean;
}

/** Order of the standings in a ranking: strike balls, then spare balls, then balls outside the limits. */
const STANDING_ORDER = { strike: 0, spare: 1, illegal: 2 } as const;

/** One ranked ball as far as its place in the ranking goes. */
export interface RankedPlace {
  standing?: keyof typeof STANDING_ORDER;
  score: number;
  id: string;
}

/** Checks one side of compareRanked: a standing rankArsenal gives, a finite score and a string id. */
function placeOf(fn: string, name: string, value: unknown): void {
  const q = value as Partial<RankedPlace> | null;
  // the well-formed case without building a message (this runs for every comparison of a sort)
  if (
    q !== null &&
    typeof q === 'object' &&
    (q.standing === undefined || q.standing === 'strike' || q.standing === 'spare' || q.standing === 'illegal') &&
    typeof q.score === 'number' &&
    Number.isFinite(q.score) &&
    typeof q.id === 'string'
  )
    return;
  const p = record(fn, name, value);
  if (p.standing !== undefined) oneOf(fn, `${name}.standing`, p.standing, ['strike', 'spare', 'illegal']);
  finite(fn, `${name}.score`, p.score);
  if (typeof p.id !== 'string') throw new TypeError(`${fn}: ${name}.id must be a string, got ${show(p.id)}`);
}

/**
 * rankArsenal's order, for anyone who re-orders a ranking after changing one ball's score (the what-if): standing
 * (strike, spare, outside the limits), then score (highest first), then id.
 */
export function compareRanked(a: RankedPlace, b: RankedPlace): number {
  placeOf('compareRanked', 'a', a);
  placeOf('compareRanked', 'b', b);
  const sa = STANDING_ORDER[a.standing ?? 'strike'],
    sb = STANDING_ORDER[b.standing ?? 'strike'];
  return sa - sb || b.score - a.score || (a.id < b.id ? -1 : a.id > b.id ? 1 : 0);
}

/**
 * Ranks a bowler's arsenal for a condition, best first, with the reasons and what to change.
 *
 * Definition: the matchup is built once (matchupContext: the pattern's numbers, the lane surface, the games
 * bowled and what the condition asks of this bowler); each ball gets the matchup model's fit (fitLayer:
 * its reaction against the demand, and the changes that close the gap) and the ball-motion model's verdict
 * (motionLayer: the line that reaches the pocket, its entry angle, miss room, skid, breakpoint and roll, on the
 * oil map after `gamesBowled`), combined by combineLayers (weights FIT_LAYER_WEIGHT and MOTION_LAYER_WEIGHT).
 * Standing: a ball outside the governing body's limits (checkLegality) is 'illegal' — listed apart, after every
 * other ball, with its broken limits, never ranked for strikes; plastic is a 'spare' ball, listed after the strike
 * balls; every other ball is a 'strike' ball. Order: standing, then score (highest first), then id.
 * A strike ball that is too strong or too weak also gets a 'ball' suggestion naming the strike ball of the
 * arsenal that fits the condition best, when that one is at least FIT_SCALE.tolerance closer.
 * Source: strengthFit, suggestChanges and motionLayer name theirs; the legality limits are the USBC equipment
 * specifications.
 *
 * @param input `balls` (each a BallSpec with a unique non-empty `id` and an optional `label` for texts),
 *   `bowler`, `pattern`, `gamesBowled` (default 0), `lane` (default synthetic, medium friction), `calibration`
 *   (fitCalibration's answer, optional: when `calibration.enough`, every ball whose own fit is `enough` is
 *   simulated with its fitted frictionScale, and its entry carries that `frictionScale` and a
 *   'motion-calibration' reason).
 * @returns one RankedBall per ball: `id`, `score` 0–100, `standing`, `fit` (strength, demand, gap, verdict),
 *   `reasons` (the fit's parts, then the motion model's), `suggestions`, `layers`, `prediction` (on the pocket
 *   line), `missRoom`, and `legality` for an illegal ball. An empty arsenal gives [].
 * @param options `hints` warm-start each ball's line search from where it settled on a nearby condition, `onSettled`
 *   hears where each settled, `aborted` is asked between balls (RankArsenalOptions).
 * @throws TypeError/RangeError for malformed input or duplicate ids, naming 'rankArsenal'; an Error named
 *   'AbortError' when `aborted()` answers true.
 * @example
 * rankArsenal({ balls, bowler, pattern })[0].id; // => the best ball's id
 */
export function rankArsenal(input: RankArsenalInput, options: RankArsenalOptions = {}): RankedBallWithPrediction[] {
  const fn = 'rankArsenal';
  const inp = record(fn, 'input', input);
  const balls = list(fn, 'balls', inp.balls);
  const ids = new Set<string>();
  balls.forEach((b, i) => {
    validateBallSpec(b, fn);
    const id = (b as { id?: unknown }).id;
    if (typeof id !== 'string' || id === '') throw new TypeError(`${fn}: ball ${i + 1} needs a non-empty string id`);
    if (ids.has(id)) throw new RangeError(`${fn}: ball id ${JSON.stringify(id)} is used twice`);
    ids.add(id);
  });
  const ctx = matchupContext(input.bowler, input.pattern, input.gamesBowled ?? 0, fn, input.lane);
  // Options are optional help: anything that is not what they describe is ignored.
  const opt = (options !== null && typeof options === 'object' ? options : {}) as Partial<Record<keyof RankArsenalOptions, unknown>>;
  const hints = opt.hints instanceof Map ? (opt.hints as ReadonlyMap<string, PocketLineHint>) : undefined;
  const onSettled = typeof opt.onSettled === 'function' ? (opt.onSettled as NonNullable<RankArsenalOptions['onSettled']>) : undefined;
  const aborted = typeof opt.aborted === 'function' ? (opt.aborted as NonNullable<RankArsenalOptions['aborted']>) : undefined;
  const scales = calibrationScales(fn, inp.calibration);

  const scorers = SCORING_LAYERS.map((layer) => ({ layer, score: layer.prepare(ctx) }));
  // One oil map per ranking (after ctx.gamesBowled). Each ball's line is searched on its own, so a ball's numbers
  // never depend on the other balls ranked with it (the what-if and the side-by-side show the same numbers).
  const motionMap = conditionOilMap(ctx.pattern, ctx.bowler, ctx.gamesBowled, ctx.lane);

  const arsenal = balls as ArsenalBall[];
  const ranked = arsenal.map((ball) => {
    if (aborted?.()) {
      const err = new Error(`${fn}: stopped before ball ${JSON.stringify(ball.id)}: the caller went away`);
      err.name = 'AbortError';
      throw err;
    }
    const legality = checkLegality(ball);
    const standing: 'strike' | 'spare' | 'illegal' = !legality.legal ? 'illegal' : ball.coverType === 'plastic' ? 'spare' : 'strike';
    const layers = scorers.map(({ layer, score }) => ({ name: layer.name, weight: layer.weight, result: score(ball) }));
    const scale = scales.get(ball.id);
    const hint = hints?.get(ball.id);
    const verdict = motionLayer(ball, ctx.bowler, ctx.pattern, motionMap, ctx.gamesBowled, scale?.frictionScale ?? 1, {
      lane: ctx.lane,
      ...(hint ? { hint } : {}),
    });
    if (verdict.settled) onSettled?.(ball.id, verdict.settled);
    layers.push({ name: 'motion', weight: MOTION_LAYER_WEIGHT, result: verdict.result });
    const { score, reasons, suggestions } = combineLayers(layers);
    if (verdict.pocketReached)
      addSameLineFigures(suggestions, ball, ctx.bowler, ctx.pattern, motionMap, scale?.frictionScale ?? 1, ctx.lane, verdict.prediction);
    if (scale !== undefined) reasons.push(calibrationReason(scale, ball));
    if (standing === 'illegal') {
      const broken = legality.violations.map((v) => `${v.field} ${v.limit}`).join(', ');
      reasons.unshift({
        rule: 'legality',
        effect: 0,
        text: `Outside the USBC limits (${broken}): listed apart and not ranked for strikes.`,
        source: 'USBC equipment specifications',
      });
    }
    const fit = fitUnchecked(ball, ctx); // the ball and the matchup were checked above
    const entry: RankedBallWithPrediction = {
      id: ball.id,
      score,
      standing,
      fit: { strength: fit.strength, demand: fit.demand, gap: fit.gap, verdict: fit.verdict },
      reasons,
      suggestions,
      layers: layers.map((l) => ({ name: l.name, weight: l.weight, score: l.result.score })),
      prediction: verdict.prediction,
      missRoom: verdict.missRoom,
      ...(scale !== undefined ? { frictionScale: scale.frictionScale } : {}),
      ...(standing === 'illegal' ? { legality } : {}),
    };
    return { ball, entry };
  });

  // A better-fitting strike ball from the same arsenal, for a ball that is too strong or too weak.
  const strikes = ranked.filter((r) => r.entry.standing === 'strike');
  for (const r of strikes) {
    const gap = r.entry.fit?.gap ?? 0;
    if (Math.abs(gap) <= FIT_SCALE.tolerance) continue;
    let best: (typeof strikes)[number] | null = null;
    for (const o of strikes) {
      if (o === r) continue;
      const g = Math.abs(o.entry.fit?.gap ?? Infinity);
      if (g <= Math.abs(gap) - FIT_SCALE.tolerance && (best === null || g < Math.abs(best.entry.fit?.gap ?? Infinity))) best = o;
    }
    if (best !== null) {
      const name = best.ball.label ?? `ball ${best.ball.id}`;
      const s: Suggestion = {
        kind: 'ball',
        text: `Or change balls: ${name} fits this condition better (${gap > 0 ? 'weaker' : 'stronger'}: gap ${best.entry.fit?.gap} against ${gap}).`,
        change: { ballId: best.ball.id },
      };
      const lineAt = r.entry.suggestions.findIndex((x) => x.kind === 'line');
      r.entry.suggestions.splice(lineAt < 0 ? r.entry.suggestions.length : lineAt, 0, s);
    }
  }

  ranked.sort((a, b) => compareRanked({ ...a.entry, id: a.ball.id }, { ...b.entry, id: b.ball.id }));
  return ranked.map((r) => r.entry);
}

/**
 * Adds to each surface and layout suggestion what the model predicts on the ball's current line with the change
 * made (the figures predictChange gives as `sameLine`): the breakpoint's shift and the entry board's, so the
 * advice says how much, not only which way. Internal to rankArsenal.
 */
function addSameLineFigures(
  suggestions: Suggestion[],
  ball: ArsenalBall,
  bowler: RankArsenalInput['bowler'],
  pattern: RankArsenalInput['pattern'],
  map: LaneOilMap,
  frictionScale: number,
  lane: RankArsenalInput['lane'],
  before: ShotPrediction,
): void {
  for (const s of suggestions) {
    if ((s.kind !== 'surface' && s.kind !== 'layout') || !s.change || Object.keys(s.change).length === 0) continue;
    const changed =
      s.kind === 'layout'
        ? { ...ball, layout: { ...(ball.layout ?? { pinToPapIn: 4 }), ...(s.change as { pinToPapIn: number }) } }
        : { ...ball, ...(s.change as object), gamesSinceResurface: 0 };
    const r = prepareShot({ ball: changed, bowler, pattern, frictionScale, lane }, map).run(before.laydownBoard, before.targetBoard);
    const dBp = Math.round((r.breakpointFt - before.breakpoint.ft) * 10) / 10 || 0;
    const dEntry = Math.round((r.entryBoard - before.entryBoard) * 10) / 10 || 0;
    const bp = Math.abs(dBp) < 0.1 ? 'about where it is' : `${Math.abs(dBp).toFixed(1)} ft ${dBp > 0 ? 'later' : 'earlier'}`;
    const entry =
      Math.abs(dEntry) < 0.1
        ? 'the same board'
        : `${Math.abs(dEntry).toFixed(1)} boards ${dEntry > 0 ? 'higher (more hook)' : 'lighter (less hook)'}`;
    s.text = `${s.text} On your present line the model puts the breakpoint ${bp} and the ball ${entry} at the headpin.`;
    s.change = { ...s.change, sameLine: { breakpointShiftFt: dBp, entryBoardShift: dEntry } };
  }
}

/** A calibration applied to one ball: its scale and the surfaces its shots were thrown with. */
interface AppliedScale {
  frictionScale: number;
  surfaces: string[];
}

/** The 'motion-calibration' reason: the scale, and the shift to today's surface when the shots were thrown with another. */
function calibrationReason(scale: AppliedScale, ball: ArsenalBall): RuleResult {
  const pct = Math.round((scale.frictionScale - 1) * 100);
  const today = surfaceWords(ball.surfaceGrit, ball.polished);
  const other = scale.surfaces.length > 0 && !scale.surfaces.includes(today);
  const shift = other
    ? ` Fitted on shots thrown at ${scale.surfaces.join(' and ')}; carried to today's ${today}, where the model's own surface change applies on top of it.`
    : '';
  return {
    rule: 'motion-calibration',
    effect: 0,
    text: `The ball-motion model is calibrated to your logged shots with this ball: friction ×${scale.frictionScale.toFixed(2)} (${pct === 0 ? 'as modelled' : `${Math.abs(pct)} % ${pct > 0 ? 'more' : 'less'} than modelled`}).${shift}`,
    source: "least-squares fit of the ball-motion model to the bowler's logged breakpoints and pocket results (fitCalibration)",
  };
}

/**
 * The friction multipliers a calibration applies, by ball id: only when `calibration.enough`, and only for balls
 * whose own fit is `enough` (n ≥ minShots), with the surfaces their shots were thrown with. Checks the
 * calibration's shape (TypeError/RangeError naming `fn`). Internal to rankArsenal.
 */
function calibrationScales(fn: string, calibration: unknown): Map<string, AppliedScale> {
  const out = new Map<string, AppliedScale>();
  if (calibration === undefined || calibration === null) return out;
  const c = record(fn, 'calibration', calibration);
  if (typeof c.enough !== 'boolean') throw new TypeError(`${fn}: calibration.enough must be true or false, got ${String(c.enough)}`);
  const perBall = list(fn, 'calibration.perBall', c.perBall);
  if (!c.enough) return out;
  perBall.forEach((p, i) => {
    const b = record(fn, `calibration.perBall[${i}]`, p);
    if (typeof b.ballId !== 'string')
      throw new TypeError(`${fn}: calibration.perBall[${i}].ballId must be a string, got ${String(b.ballId)}`);
    const scale = b.frictionScale;
    if (typeof scale !== 'number' || !Number.isFinite(scale))
      throw new TypeError(`${fn}: calibration.perBall[${i}].frictionScale must be a finite number, got ${String(scale)}`);
    if (scale < 0.1 || scale > 10)
      throw new RangeError(`${fn}: calibration.perBall[${i}].frictionScale must be in [0.1, 10], got ${scale}`);
    const enough =
      b.enough === undefined ? typeof b.n === 'number' && typeof c.minShots === 'number' && b.n >= c.minShots : b.enough === true;
    const surfaces = Array.isArray(b.surfaces) ? (b.surfaces as unknown[]).filter((x): x is string => typeof x === 'string') : [];
    if (enough) out.set(b.ballId, { frictionScale: scale, surfaces });
  });
  return out;
}
