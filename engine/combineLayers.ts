import type { LayerResult, Suggestion } from './types';
import { clamp, finite, list, record, show } from './internal/checks';

/** One scoring layer's result for a ball and its weight in the combined score. */
export interface WeightedLayer {
  /** e.g. 'rules' or 'motion'. */
  name: string;
  /** Weight of this layer's score, > 0. */
  weight: number;
  result: LayerResult;
}

/** Whether every entry of a list is an object (a hole is not). */
function allObjects(xs: unknown[]): boolean {
  for (let i = 0; i < xs.length; i++) if (xs[i] === null || typeof xs[i] !== 'object') return false;
  return true;
}

/** One layer's shape: a name, and a result with a finite score and lists of reasons and suggestions. */
function checkLayer(fn: string, i: number, layer: unknown): WeightedLayer {
  const l = record(fn, `layer ${i + 1}`, layer) as unknown as WeightedLayer;
  if (typeof l.name !== 'string') throw new TypeError(`${fn}: layer ${i + 1} needs a string name, got ${show(l.name)}`);
  const r = l.result as Partial<LayerResult> | null;
  const ok =
    r !== null &&
    typeof r === 'object' &&
    typeof r.score === 'number' &&
    Number.isFinite(r.score) &&
    Array.isArray(r.reasons) &&
    Array.isArray(r.suggestions) &&
    allObjects(r.suggestions);
  if (!ok) {
    const result = record(fn, `result of layer ${l.name}`, l.result);
    finite(fn, `score of layer ${l.name}`, result.score);
    list(fn, `reasons of layer ${l.name}`, result.reasons);
    list(fn, `suggestions of layer ${l.name}`, result.suggestions).forEach((s) => record(fn, `a suggestion of layer ${l.name}`, s));
  }
  return l;
}

/**
 * Combines the scoring layers of one ball into its final score, reasons and suggestions.
 *
 * Definition: score = Σ weight × score ÷ Σ weight, clamped to 0–100 and rounded to 0.1; reasons
 * are concatenated in layer order; suggestions are concatenated with exact repeats (same kind and
 * text) removed. With a single layer the result is that layer's.
 * Source: Lanewright's choice (Lanewright's design: the ranking combines the matchup model and the
 * ball-motion model).
 *
 * @param layers at least one layer.
 * @throws RangeError for no layers or a weight ≤ 0.
 * @example
 * combineLayers([{ name: 'rules', weight: 1, result }]).score === result.score; // => true
 */
export function combineLayers(layers: WeightedLayer[]): LayerResult {
  const fn = 'combineLayers';
  if (!Array.isArray(layers) || layers.length === 0) throw new RangeError(`${fn}: at least one layer is needed`);
  let wSum = 0;
  let sSum = 0;
  for (let i = 0; i < layers.length; i++) {
    const l = checkLayer(fn, i, layers[i]);
    const w = finite(fn, `weight of layer ${l.name}`, l.weight);
    if (w <= 0) throw new RangeError(`${fn}: weight of layer ${l.name} must be greater than 0, got ${w}`);
    wSum += w;
    sSum += w * l.result.score;
  }
  const seen = new Set<string>();
  const suggestions: Suggestion[] = [];
  for (const l of layers) {
    for (const s of l.result.suggestions) {
      const key = `${s.kind}\u0000${s.text}`;
      if (!seen.has(key)) {
        seen.add(key);
        suggestions.push(s);
      }
    }
  }
  return {
    score: Math.round(clamp(sSum / wSum, 0, 100) * 10) / 10,
    reasons: layers.flatMap((l) => l.result.reasons),
    suggestions,
  };
}
