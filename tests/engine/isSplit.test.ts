import { describe, expect, it } from 'vitest';
import { isSplit } from '../../engine/index';

// Check values: the split definition and examples recorded in the USBC playing rules on splits —
// USBC / World Bowling wording (status M for the exact text), the encyclopedia's side-by-side list
// (S), the washouts page (S), the named splits list (S) and the back-row ruling (D/S).

describe('isSplit: the definition’s own examples', () => {
  it('7-9 is a split (clause a: the 8 is down between them)', () => {
    // the USBC playing rules on splits official definition, example "7-9".
    expect(isSplit([7, 9])).toBe(true);
  });

  it('3-10 is a split (clause a: the 6 is down between them)', () => {
    // the USBC playing rules on splits official definition, example "3-10".
    expect(isSplit([3, 10])).toBe(true);
  });

  it('5-6 is a split (clause b: the 3 is down immediately ahead of them)', () => {
    // the USBC playing rules on splits official definition, example "5-6".
    expect(isSplit([5, 6])).toBe(true);
  });
});

describe('isSplit: side-by-side leaves are splits (clause b)', () => {
  // the USBC playing rules on splits "Where they differ": 2-3, 4-5, 5-6, 7-8, 8-9, 9-10 count as splits under the
  // official wording and are listed as splits on the encyclopedia page (S/M).
  it.each([[[2, 3]], [[4, 5]], [[5, 6]], [[7, 8]], [[8, 9]], [[9, 10]]])('%j is a split', (leave) => {
    expect(isSplit(leave)).toBe(true);
  });
});

describe('isSplit: named splits', () => {
  // the USBC playing rules on splits "Common split names" (S): 7-10; 4-6-7-10 big four; 2-7 / 3-10 baby split; 5-7;
  // 5-10; 5-7-10; 4-6-7-8-10 / 4-6-7-9-10.
  it.each([[[7, 10]], [[4, 6, 7, 10]], [[2, 7]], [[3, 10]], [[5, 7]], [[5, 10]], [[5, 7, 10]], [[4, 6, 7, 8, 10]], [[4, 6, 7, 9, 10]]])(
    '%j is a split',
    (leave) => {
      expect(isSplit(leave)).toBe(true);
    },
  );

  it('a split does not depend on the order the pins are listed in (10, 7)', () => {
    // the USBC playing rules on splits: the 7-10 is a split; the leave is a set of pins.
    expect(isSplit([10, 7])).toBe(true);
  });
});

describe('isSplit: leaves that are not splits', () => {
  it.each([[[1, 2, 10]], [[1, 2, 4, 10]], [[1, 3, 7]], [[1, 3, 6, 7]]])('washout %j is not a split (headpin standing)', (leave) => {
    // the USBC playing rules on splits "Not splits (headpin standing)", champbowltour page (S).
    expect(isSplit(leave)).toBe(false);
  });

  it('the whole back row 7-8-9-10 is not a split (7 and 10 joined through 8 and 9)', () => {
    // the USBC playing rules on splits "Not a split (connected leave)" (D / S, university course page).
    expect(isSplit([7, 8, 9, 10])).toBe(false);
  });

  it('a single pin left standing is not a split (the definition needs two or more standing pins)', () => {
    // the USBC playing rules on splits definition: "between two or more standing pins" / "ahead of two or more".
    expect(isSplit([10])).toBe(false);
    expect(isSplit([7])).toBe(false);
  });

  it('a strike (no pins standing) is not a split', () => {
    // the USBC playing rules on splits definition: a split needs standing pins.
    expect(isSplit([])).toBe(false);
  });

  it('the 10 pin with a pin ahead of it (6-10) is not a split: they touch and nothing is down between', () => {
    // Derived from the the USBC playing rules on splits definition: no pin lies between the 6 and the 10, and no pin
    // is down ahead of two standing pins.
    expect(isSplit([6, 10])).toBe(false);
  });

  it('2-8 is not a split: the 8 stands directly behind the 2 with no pin position between them', () => {
    // Derived from the the USBC playing rules on splits wording of clause (a) (Lanewright's reading, README.md):
    // the 4 and 5 flank the line from 2 to 8 but are not between the two pins.
    expect(isSplit([2, 8])).toBe(false);
  });
});

describe('isSplit: invalid input', () => {
  it('throws TypeError for a value that is not an array', () => {
    expect(() => isSplit('7-10' as unknown as number[])).toThrow(TypeError);
  });

  it('throws RangeError naming the function for a pin number 11', () => {
    expect(() => isSplit([7, 11])).toThrow(/isSplit: standing\[1\] must be an integer from 1 to 10, got 11/);
  });

  it('throws RangeError for a pin listed twice', () => {
    expect(() => isSplit([7, 7])).toThrow(/isSplit: pin 7 is listed twice/);
  });
});
