import { standingSet } from './internal/pins';

/**
 * Pin positions on the deck: `x` is the lateral position in half pin-spacings (6 in) from the
 * headpin's line, negative toward the 7 pin; `row` is 0 (headpin) … 3 (back row).
 * Source: USBC lane specifications (pins 12 in apart centre to centre, in an equilateral triangle).
 */
const PIN_POSITION: Readonly<Record<number, { x: number; row: number }>> = {
  1: { x: 0, row: 0 },
  2: { x: -1, row: 1 },
  3: { x: 1, row: 1 },
  4: { x: -2, row: 2 },
  5: { x: 0, row: 2 },
  6: { x: 2, row: 2 },
  7: { x: -3, row: 3 },
  8: { x: -1, row: 3 },
  9: { x: 1, row: 3 },
  10: { x: 3, row: 3 },
};

/**
 * Tells whether the pins left standing after the first delivery of a frame form a split.
 *
 * Definition (the USBC and World Bowling wording of a split, from memory): the
 * headpin is down and either (a) at least one pin is down between two or more standing pins
 * (e.g. 7-9, 3-10), or (b) at least one pin is down immediately ahead of two or more standing pins
 * (e.g. 5-6).
 *
 * How Lanewright reads the two clauses on the pin triangle (see README.md):
 * - (a) "between": a down pin lies laterally strictly between two standing pins and in a row from
 *   the nearer one's to the farther one's. So 7-10, 2-7 and 5-7 are splits, while a pin directly
 *   behind another (2-8, 3-9) is not, since no pin position lies between them.
 * - (b) "immediately ahead": a down pin whose two rear neighbours both stand, when those two stand
 *   side by side as a pair on their own in their row. So every side-by-side leave (2-3, 4-5, 5-6,
 *   7-8, 8-9, 9-10) is a split, while a run of three or more standing pins in one row (7-8-9,
 *   4-5-6, the whole back row 7-8-9-10) is one connected group and not a split, as the rules' wording
 *   rules for 7-8-9-10.
 * With the headpin standing a leave is never a split (the USBC playing rules on splits, "washouts").
 *
 * @param standing numbers of the pins left standing, 1–10, in any order, no repeats.
 * @returns true for a split.
 * @throws TypeError if `standing` is not an array; RangeError for a pin number outside 1–10 or a
 *   pin listed twice.
 *
 * @example
 * isSplit([7, 10]);  // => true
 * isSplit([2, 8]);   // => false (the 8 is behind the 2)
 * isSplit([1, 2, 10]); // => false (headpin standing)
 */
export function isSplit(standing: number[]): boolean {
  const fn = 'isSplit';
  const up = standingSet(fn, standing);
  if (up.has(1) || up.size < 2) return false;

  const down = [1, 2, 3, 4, 5, 6, 7, 8, 9, 10].filter((p) => !up.has(p));
  const standingPins = [...up];

  // (a) a down pin between two standing pins.
  for (let i = 0; i < standingPins.length; i++) {
    for (let j = i + 1; j < standingPins.length; j++) {
      const a = PIN_POSITION[standingPins[i]];
      const b = PIN_POSITION[standingPins[j]];
      const xLo = Math.min(a.x, b.x);
      const xHi = Math.max(a.x, b.x);
      const rowLo = Math.min(a.row, b.row);
      const rowHi = Math.max(a.row, b.row);
      for (const d of down) {
        const q = PIN_POSITION[d];
        if (q.x > xLo && q.x < xHi && q.row >= rowLo && q.row <= rowHi) return true;
      }
    }
  }

  // (b) a down pin immediately ahead of a side-by-side pair standing on its own in its row.
  const at = (x: number, row: number): number | undefined => {
    for (const p of standingPins) {
      const q = PIN_POSITION[p];
      if (q.x === x && q.row === row) return p;
    }
    return undefined;
  };
  for (const d of down) {
    const q = PIN_POSITION[d];
    const left = at(q.x - 1, q.row + 1);
    const right = at(q.x + 1, q.row + 1);
    if (left === undefined || right === undefined) continue;
    const runContinues = at(q.x - 3, q.row + 1) !== undefined || at(q.x + 3, q.row + 1) !== undefined;
    if (!runContinues) return true;
  }
  return false;
}
