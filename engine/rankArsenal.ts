import type { ArsenalBall, RankArsenalInput } from './types';
import { combineLayers } from './combineLayers';
import { matchupContext } from './matchupContext';
import { SCORING_LAYERS } from './scoringLayers';
import { list, record } from './internal/checks';
import { validateBallSpec } from './validateBallSpec';
// ── ball-motion layer (issue 4, engine/motion) ──────────────────────────────────────────────
import { conditionOilMap } from './motion/conditionOilMap';
import { MOTION_LAYER_WEIGHT, motionLayer, type RankedBallWithPrediction } from './motion/motionLayer';
// ── end ball-motion layer imports ───────────────────────────────────────────────────────────

/**
 * Ranks a bowler's arsenal for a pattern, best first, with the reasons and what to change.
 *
 * Definition: the matchup is built once (matchupContext); each ball is scored by every layer of
 * SCORING_LAYERS, then by the ball-motion layer (motionLayer: the pocket line the model finds, its
 * predicted entry angle — about 6° best, TRADE.md §2.2 — pocket reachability and miss room, on the oil
 * map after `gamesBowled`, conditionOilMap; weight MOTION_LAYER_WEIGHT), and the layers are combined
 * (combineLayers, a weighted mean). Each ranked ball carries the model's `prediction` and `missRoom`. Order: strike balls
 * by score (highest first), then plastic balls (a spare ball is never first for strikes, whatever
 * its score), ties by id.
 * Source: the rules of thumb in engine/rules/ (README.md table), each naming its source.
 *
 * @param input `balls` (each a BallSpec with a unique non-empty `id`), `bowler`, `pattern`,
 *   `gamesBowled` (games already bowled on the pattern, default 0), `calibration` (fitCalibration's
 *   answer, optional: when `calibration.enough`, every ball whose own fit is `enough` is simulated with
 *   its fitted frictionScale, and its entry carries that `frictionScale` and a 'motion-calibration' reason).
 * @returns one RankedBall per ball: `id`, `score` 0–100, `reasons` (rule, effect, text, source —
 *   the rules layer's, then the motion layer's 'motion-…' reasons), `suggestions` (surface, layout,
 *   release, line), `layers` (each layer's own score and weight), `prediction` (ShotPrediction on the
 *   pocket line) and `missRoom` (boards of target error that still reach the pocket). An empty arsenal gives [].
 * @throws TypeError/RangeError for malformed input or duplicate ids, naming 'rankArsenal'.
 * @example
 * rankArsenal({ balls, bowler, pattern })[0].id; // => the best ball's id
 */
export function rankArsenal(input: RankArsenalInput): RankedBallWithPrediction[] {
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
  const ctx = matchupContext(input.bowler, input.pattern, input.gamesBowled ?? 0, fn);
  const scales = calibrationScales(fn, inp.calibration);

  const scorers = SCORING_LAYERS.map((layer) => ({ layer, score: layer.prepare(ctx) }));
  // ── ball-motion layer (issue 4): one oil map per ranking (after ctx.gamesBowled), one pocket line,
  // prediction and miss room per ball; its score joins the rules layer's (engine/motion/motionLayer.ts).
  const motionMap = conditionOilMap(ctx.pattern, ctx.bowler, ctx.gamesBowled);

  const ranked = (balls as ArsenalBall[]).map((ball) => {
    const layers = scorers.map(({ layer, score }) => ({ name: layer.name, weight: layer.weight, result: score(ball) }));
    const scale = scales.get(ball.id);
    const verdict = motionLayer(ball, ctx.bowler, ctx.pattern, motionMap, ctx.gamesBowled, scale ?? 1);
    layers.push({ name: 'motion', weight: MOTION_LAYER_WEIGHT, result: verdict.result });
    const { score, reasons, suggestions } = combineLayers(layers);
    if (scale !== undefined) {
      const pct = Math.round((scale - 1) * 100);
      reasons.push({
        rule: 'motion-calibration',
        effect: 0,
        text: `The ball-motion model is calibrated to your logged shots with this ball: friction ×${scale.toFixed(2)} (${pct === 0 ? 'as modelled' : `${Math.abs(pct)} % ${pct > 0 ? 'more' : 'less'} than modelled`}).`,
        source: 'fitCalibration (engine/shotlog) on the bowler\'s logged breakpoints and pocket results',
      });
    }
    const entry: RankedBallWithPrediction = {
      id: ball.id,
      score,
      reasons,
      suggestions,
      layers: layers.map((l) => ({ name: l.name, weight: l.weight, score: l.result.score })),
      prediction: verdict.prediction,
      missRoom: verdict.missRoom,
      ...(scale !== undefined ? { frictionScale: scale } : {}),
    };
    return { ball, entry };
  });
  // ── end ball-motion layer ──
  ranked.sort((a, b) => {
    const pa = a.ball.coverType === 'plastic' ? 1 : 0;
    const pb = b.ball.coverType === 'plastic' ? 1 : 0;
    return pa - pb || b.entry.score - a.entry.score || (a.ball.id < b.ball.id ? -1 : a.ball.id > b.ball.id ? 1 : 0);
  });
  return ranked.map((r) => r.entry);
}

/**
 * The friction multipliers a calibration applies, by ball id: only when `calibration.enough`, and only
 * for balls whose own fit is `enough` (n ≥ minShots). Checks the calibration's shape (TypeError/RangeError
 * naming `fn`). Internal to rankArsenal.
 */
function calibrationScales(fn: string, calibration: unknown): Map<string, number> {
  const out = new Map<string, number>();
  if (calibration === undefined || calibration === null) return out;
  const c = record(fn, 'calibration', calibration);
  if (typeof c.enough !== 'boolean') throw new TypeError(`${fn}: calibration.enough must be true or false, got ${String(c.enough)}`);
  const perBall = list(fn, 'calibration.perBall', c.perBall);
  if (!c.enough) return out;
  perBall.forEach((p, i) => {
    const b = record(fn, `calibration.perBall[${i}]`, p);
    if (typeof b.ballId !== 'string') throw new TypeError(`${fn}: calibration.perBall[${i}].ballId must be a string, got ${String(b.ballId)}`);
    const scale = b.frictionScale;
    if (typeof scale !== 'number' || !Number.isFinite(scale)) throw new TypeError(`${fn}: calibration.perBall[${i}].frictionScale must be a finite number, got ${String(scale)}`);
    if (scale < 0.1 || scale > 10) throw new RangeError(`${fn}: calibration.perBall[${i}].frictionScale must be in [0.1, 10], got ${scale}`);
    const enough = b.enough === undefined ? (typeof b.n === 'number' && typeof c.minShots === 'number' && b.n >= c.minShots) : b.enough === true;
    if (enough) out.set(b.ballId, scale);
  });
  return out;
}
