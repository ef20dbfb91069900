import { describe, expect, it } from 'vitest';
import { analyzePattern } from '../../engine/index';
import { DEMO_PATTERNS } from '../../seeders/patterns';
import { usePatternDraft } from '../../client/src/composables/usePatternDraft';
import { patternNumberLines } from '../../client/src/utils/patternNumbers';
import { unitFormatter } from '../../client/src/utils/units';

/**
 * The pattern editor's numbers are the engine's: the editor's draft (the composable the editor view uses,
 * fed the sweeps as a person would see them typed in the table) must give exactly what `analyzePattern`
 * gives the server, for every demo pattern. Reference: analyzePattern itself (the server stores its summary).
 */
describe('pattern editor numbers (usePatternDraft) vs analyzePattern', () => {
  for (const demo of DEMO_PATTERNS) {
    it(`${demo.name}: the draft loaded from its sweeps has exactly analyzePattern's length, volume, split, ratio and classes`, () => {
      const draft = usePatternDraft();
      draft.load({ id: 1, version: 0, name: demo.name, description: demo.description, sweeps: demo.sweeps });
      const engine = analyzePattern({ name: demo.name, sweeps: demo.sweeps });

      expect(draft.invalidCount.value).toBe(0);
      expect(draft.validSweeps.value).toEqual(demo.sweeps);
      expect(draft.numbers.value).toEqual({ ...engine, ratio: Number.isFinite(engine.ratio) ? engine.ratio : null });
      // The classes the seed expects are the ones the editor shows.
      expect(draft.numbers.value.lengthClass).toBe(demo.expect.lengthClass);
      expect(draft.numbers.value.volumeClass).toBe(demo.expect.volumeClass);
      expect(draft.numbers.value.ratioClass).toBe(demo.expect.ratioClass);
    });

    it(`${demo.name}: the editor's displayed lines are analyzePattern's numbers, rounded for display only`, () => {
      const draft = usePatternDraft();
      draft.load({ id: 1, version: 0, name: demo.name, description: null, sweeps: demo.sweeps });
      const engine = analyzePattern({ name: demo.name, sweeps: demo.sweeps });
      const lines = Object.fromEntries(patternNumberLines(draft.numbers.value, unitFormatter('imperial')).map((l) => [l.key, l.value]));
      expect(lines.length).toBe(`${engine.lengthFt.toFixed(1)} ft`);
      expect(lines.volume).toBe(`${engine.volumeMl.toFixed(2)} mL`);
      expect(lines.forward).toBe(`${engine.forwardMl.toFixed(2)} mL`);
      expect(lines.reverse).toBe(`${engine.reverseMl.toFixed(2)} mL`);
      expect(lines.ratio).toBe(`${engine.ratio.toFixed(2)} : 1`);
    });
  }

  it('editing a cell: the numbers follow the typed value, and an invalid cell is left out with its message', () => {
    const draft = usePatternDraft();
    const demo = DEMO_PATTERNS[0];
    draft.load({ id: 1, version: 0, name: demo.name, description: null, sweeps: demo.sweeps });
    draft.rows.value[0].crossings = '3';
    const changed = demo.sweeps.map((s, i) => (i === 0 ? { ...s, crossings: 3 } : s));
    expect(draft.numbers.value.volumeMl).toBe(analyzePattern({ name: 'x', sweeps: changed }).volumeMl);
    expect(draft.dirty.value).toBe(true);

    draft.rows.value[0].toBoard = '41';
    expect(draft.rowErrors.value[0].toBoard).toBe('Board 1 to 39');
    expect(draft.invalidCount.value).toBe(1);
    expect(draft.numbers.value.volumeMl).toBe(analyzePattern({ name: 'x', sweeps: demo.sweeps.slice(1) }).volumeMl);
  });
});
