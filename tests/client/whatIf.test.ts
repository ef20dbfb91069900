import { describe, expect, it } from 'vitest';
import { WHAT_IF_GRITS, gritChoices, ordinal } from '../../client/src/utils/whatIf';

describe('what-if helpers', () => {
  it('ordinal gives English rank suffixes, with the teens as “th”', () => {
    expect([1, 2, 3, 4, 11, 12, 13, 21, 22, 23, 101, 111].map(ordinal)).toEqual([
      '1st',
      '2nd',
      '3rd',
      '4th',
      '11th',
      '12th',
      '13th',
      '21st',
      '22nd',
      '23rd',
      '101st',
      '111th',
    ]);
  });

  it('gritChoices sorts a ball’s own grit into the usual steps, and adds nothing for a usual grit', () => {
    expect(gritChoices(2000)).toEqual(WHAT_IF_GRITS);
    expect(gritChoices(undefined)).toEqual(WHAT_IF_GRITS);
    const withOdd = gritChoices(1200);
    expect(withOdd).toHaveLength(WHAT_IF_GRITS.length + 1);
    expect(withOdd.indexOf(1200)).toBe(WHAT_IF_GRITS.indexOf(1000) + 1);
    expect([...withOdd].sort((a, b) => a - b)).toEqual(withOdd);
  });
});
