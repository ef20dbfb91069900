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
 *   `gamesBowled` (games already bowled on the pattern, default 0).
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

  const scorers = SCORING_LAYERS.map((layer) => ({ layer, score: layer.prepare(ctx) }));
  // ── ball-motion layer (issue 4): one oil map per ranking (after ctx.gamesBowled), one pocket line,
  // prediction and miss room per ball; its score joins the rules layer's (engine/motion/motionLayer.ts).
  const motionMap = conditionOilMap(ctx.pattern, ctx.bowler, ctx.gamesBowled);

  const ranked = (balls as ArsenalBall[]).map((ball) => {
    const layers = scorers.map(({ layer, score }) => ({ name: layer.name, weight: layer.weight, result: score(ball) }));
    const verdict = motionLayer(ball, ctx.bowler, ctx.pattern, motionMap);
    layers.push({ name: 'motion', weight: MOTION_LAYER_WEIGHT, result: verdict.result });
    const { score, reasons, suggestions } = combineLayers(layers);
    const entry: RankedBallWithPrediction = {
      id: ball.id,
      score,
      reasons,
      suggestions,
      layers: layers.map((l) => ({ name: l.name, weight: l.weight, score: l.result.score })),
      prediction: verdict.prediction,
      missRoom: verdict.missRoom,
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
