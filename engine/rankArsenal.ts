import type { ArsenalBall, RankArsenalInput, RankedBall } from './types';
import { combineLayers } from './combineLayers';
import { matchupContext } from './matchupContext';
import { SCORING_LAYERS } from './scoringLayers';
import { list, record } from './internal/checks';
import { validateBallSpec } from './validateBallSpec';

/**
 * Ranks a bowler's arsenal for a pattern, best first, with the reasons and what to change.
 *
 * Definition: the matchup is built once (matchupContext); each ball is scored by every layer of
 * SCORING_LAYERS and the layers are combined (combineLayers, a weighted mean). Today the only
 * layer is the rules layer (rulesLayer, weight 1); the ball-motion model joins as a second entry
 * of SCORING_LAYERS (scoringLayers.ts). Order: strike balls
 * by score (highest first), then plastic balls (a spare ball is never first for strikes, whatever
 * its score), ties by id.
 * Source: the rules of thumb in engine/rules/ (README.md table), each naming its source.
 *
 * @param input `balls` (each a BallSpec with a unique non-empty `id`), `bowler`, `pattern`,
 *   `gamesBowled` (games already bowled on the pattern, default 0).
 * @returns one RankedBall per ball: `id`, `score` 0–100, `reasons` (rule, effect, text, source),
 *   `suggestions` (surface, layout, release, line) and `layers` (each layer's own score and
 *   weight). An empty arsenal gives [].
 * @throws TypeError/RangeError for malformed input or duplicate ids, naming 'rankArsenal'.
 * @example
 * rankArsenal({ balls, bowler, pattern })[0].id; // => the best ball's id
 */
export function rankArsenal(input: RankArsenalInput): RankedBall[] {
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

  const ranked = (balls as ArsenalBall[]).map((ball) => {
    const layers = scorers.map(({ layer, score }) => ({ name: layer.name, weight: layer.weight, result: score(ball) }));
    const { score, reasons, suggestions } = combineLayers(layers);
    const entry: RankedBall = {
      id: ball.id,
      score,
      reasons,
      suggestions,
      layers: layers.map((l) => ({ name: l.name, weight: l.weight, score: l.result.score })),
    };
    return { ball, entry };
  });
  ranked.sort((a, b) => {
    const pa = a.ball.coverType === 'plastic' ? 1 : 0;
    const pb = b.ball.coverType === 'plastic' ? 1 : 0;
    return pa - pb || b.entry.score - a.entry.score || (a.ball.id < b.ball.id ? -1 : a.ball.id > b.ball.id ? 1 : 0);
  });
  return ranked.map((r) => r.entry);
}
