import { describe, expect, it } from 'vitest';
import { importErrorLines, patternFileName } from '../../client/src/utils/patternFiles';

/** The pattern editor's file helpers: the export name and an import's refusal in the sweeps table's words. */
describe('pattern files', () => {
  it('names an export after the pattern, as a slug, with the format', () => {
    expect(patternFileName('  Tideline Trial 40 ', 'json')).toBe('tideline-trial-40.lanewright.json');
    expect(patternFileName('Ünïcode / only!!', 'csv')).toBe('n-code-only.lanewright.csv');
    expect(patternFileName('***', 'csv')).toBe('pattern.lanewright.csv');
  });

  it('lists a refused import line by line, in order, naming each field as the sweeps table does', () => {
    const lines = importErrorLines({
      'lines.7.endFt': 'At most 70',
      'lines.3': 'Not a sweep',
      'lines.3.microlitersPerBoard': 'Must be a number',
      'lines.12.somethingNew': 'Unknown',
    });
    expect(lines).toHaveLength(4);
    expect(lines.map((l) => l.line)).toEqual([3, 3, 7, 12]);
    expect(lines).toContainEqual({ line: 3, text: 'oil per board (µL): Must be a number' });
    expect(lines).toContainEqual({ line: 3, text: 'Not a sweep' });
    expect(lines).toContainEqual({ line: 7, text: 'end (ft): At most 70' });
    expect(lines).toContainEqual({ line: 12, text: 'somethingNew: Unknown' });
  });
});
