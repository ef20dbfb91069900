import { describe, expect, it } from 'vitest';
import { combineLayers } from '../../engine/index';
import type { LayerResult } from '../../engine/index';

// Definition (engine/combineLayers.ts, Lanewright's choice): weighted mean of the layer scores;
// reasons concatenated; repeated suggestions dropped. Expected values derived by hand.

const layer = (score: number, text: string): LayerResult => ({
  score,
  reasons: [{ rule: `r-${score}`, effect: score - 50, text: `${text}.`, source: 'test' }],
  suggestions: [{ kind: 'line', text }],
});

describe('combineLayers', () => {
  it('points: one layer passes through unchanged', () => {
    const l = layer(72.5, 'a');
    expect(combineLayers([{ name: 'rules', weight: 1, result: l }])).toEqual(l);
  });

  it('points: weights 1 and 3 on scores 60 and 80 give (60 + 240) ÷ 4 = 75', () => {
    const c = combineLayers([
      { name: 'rules', weight: 1, result: layer(60, 'a') },
      { name: 'motion', weight: 3, result: layer(80, 'b') },
    ]);
    expect(c.score).toBe(75);
    expect(c.reasons.map((r) => r.rule)).toEqual(['r-60', 'r-80']);
  });

  it('drops a suggestion repeated by a second layer', () => {
    const c = combineLayers([
      { name: 'rules', weight: 1, result: layer(60, 'same') },
      { name: 'motion', weight: 1, result: layer(70, 'same') },
    ]);
    expect(c.suggestions).toHaveLength(1);
  });

  it('throws RangeError for no layers or a weight of 0', () => {
    expect(() => combineLayers([])).toThrow(/combineLayers: at least one layer is needed/);
    expect(() => combineLayers([{ name: 'rules', weight: 0, result: layer(1, 'a') }])).toThrow(
      /combineLayers: weight of layer rules must be greater than 0, got 0/,
    );
  });
});
