import { describe, expect, it } from 'vitest';
import { arsenalCoverage } from '../../../engine/index';
import type { ArsenalBall, BowlerProfile } from '../../../engine/index';
import { houseShot, shortLight } from '../fixtures';

// Invented balls (no real products). A bag built for light and house conditions, with two near-twins; the center's
// league pair runs the house shot with half as much oil again (a heavier lane group).
const bowler: BowlerProfile = { hand: 'right', speedMph: 17, revRpm: 350, axisRotationDeg: 45, axisTiltDeg: 15 };
const solid: ArsenalBall = {
  id: 'solid',
  label: 'Cinder Hawk',
  weightLb: 15,
  rg: 2.48,
  differential: 0.054,
  intermediateDifferential: 0.018,
  coverType: 'reactive-solid',
  surfaceGrit: 2000,
  polished: false,
  layout: { pinToPapIn: 4.5 },
};
const pearl2000: ArsenalBall = {
  id: 'pearl-2000',
  label: 'Dune Sparrow',
  weightLb: 15,
  rg: 2.54,
  differential: 0.045,
  intermediateDifferential: 0.008,
  coverType: 'reactive-pearl',
  surfaceGrit: 2000,
  polished: false,
  layout: { pinToPapIn: 4.5 },
};
const heavyHouse = {
  ...houseShot,
  name: 'Heavier house',
  sweeps: houseShot.sweeps.map((s) => ({ ...s, microlitersPerBoard: s.microlitersPerBoard * 1.5 })),
};
const pearl: ArsenalBall = {
  id: 'pearl',
  label: 'Glass Heron',
  weightLb: 15,
  rg: 2.54,
  differential: 0.045,
  intermediateDifferential: 0.008,
  coverType: 'reactive-pearl',
  surfaceGrit: 4000,
  polished: true,
  layout: { pinToPapIn: 4.5 },
};
const urethane: ArsenalBall = {
  id: 'urethane',
  label: 'Slate Wren',
  weightLb: 15,
  rg: 2.62,
  differential: 0.022,
  intermediateDifferential: 0,
  coverType: 'urethane',
  surfaceGrit: 2000,
  polished: false,
  layout: { pinToPapIn: 4.5 },
};
const twinA: ArsenalBall = {
  id: 'twin-a',
  label: 'Amber Finch',
  weightLb: 15,
  rg: 2.53,
  differential: 0.04,
  intermediateDifferential: 0,
  coverType: 'reactive-hybrid',
  surfaceGrit: 3000,
  polished: false,
  layout: { pinToPapIn: 4.5 },
};
const twinB: ArsenalBall = { ...twinA, id: 'twin-b', label: 'Amber Finch II', rg: 2.54, differential: 0.039 };
const plastic: ArsenalBall = {
  id: 'plastic',
  label: 'Spare Pebble',
  weightLb: 14,
  rg: 2.68,
  differential: 0.008,
  intermediateDifferential: 0,
  coverType: 'plastic',
  surfaceGrit: 4000,
  polished: true,
};
const catalogue = [
  {
    id: 'cat-solid',
    label: 'Iron Kestrel',
    spec: {
      weightLb: 15,
      rg: 2.46,
      differential: 0.056,
      intermediateDifferential: 0.02,
      coverType: 'reactive-solid' as const,
      surfaceGrit: 2000,
      polished: false,
    },
  },
  {
    id: 'cat-pearl',
    label: 'Mist Plover',
    spec: {
      weightLb: 15,
      rg: 2.55,
      differential: 0.04,
      intermediateDifferential: 0,
      coverType: 'reactive-pearl' as const,
      surfaceGrit: 4000,
      polished: true,
    },
  },
];
const conditions = [
  { id: 'league-heavy', label: 'Harrow Lanes 1–12, league', pattern: heavyHouse },
  { id: 'open-house', label: 'Harrow Lanes 13–24, open play', pattern: houseShot },
  { id: 'short', label: 'Fenwick Hall, short', pattern: shortLight },
];

describe('arsenalCoverage: conditions no ball suits, balls that do the same job (common practice: a bag covers heavy to light oil without doubling up)', () => {
  const bag = [solid, pearl2000, pearl, urethane, twinA, twinB, plastic];
  const r = arsenalCoverage({ bowler, balls: bag, conditions, catalogue });

  it('finds the planted gap: no ball for the heavy league pair, more ball needed, with a strong catalogue model suggested', () => {
    const heavy = r.gaps.find((g) => g.conditionId === 'league-heavy' && g.gamesBowled === 0);
    expect(heavy).toBeDefined();
    expect(heavy!.need).toBe('more');
    expect(heavy!.nearest!.gap).toBeLessThan(0);
    expect(heavy!.suggestions.map((s) => s.id)).toContain('cat-solid');
    expect(heavy!.suggestions.map((s) => s.id)).not.toContain('cat-pearl');
    expect(heavy!.kind).toMatch(/more ball.*solid reactive.*asymmetric/);
    // a strong solid needs a rough finish there: the suggestion carries it
    expect(heavy!.suggestions[0].surfaceGrit).toBeLessThanOrEqual(1000);
  });

  it('the light and house conditions are covered, and plastic never counts as covering one', () => {
    for (const id of ['open-house', 'short']) {
      const fresh = r.cells.find((c) => c.conditionId === id && c.gamesBowled === 0)!;
      expect(fresh.covering.length).toBeGreaterThan(0);
      expect(fresh.covering.every((id) => Math.abs(fresh.gaps.find((g) => g.ballId === id)!.gap) <= 2.5)).toBe(true);
      expect(fresh.covering).not.toContain('plastic');
    }
    expect(r.cells).toHaveLength(conditions.length * 2);
  });

  it('the near-twins are reported as doing the same job; balls of different cover families are not', () => {
    expect(r.duplicates.map((d) => [d.a, d.b])).toEqual([['twin-a', 'twin-b']]);
    expect(r.duplicates[0].text).toContain('Amber Finch and Amber Finch II');
  });

  it('adding the suggested ball closes the gap', () => {
    const heavy = r.gaps.find((g) => g.conditionId === 'league-heavy' && g.gamesBowled === 0)!;
    const pick = heavy.suggestions[0];
    const bought: ArsenalBall = {
      ...catalogue.find((c) => c.id === pick.id)!.spec,
      surfaceGrit: pick.surfaceGrit,
      polished: pick.polished,
      id: 'new',
      label: pick.label,
    };
    const filled = arsenalCoverage({ bowler, balls: [...bag, bought], conditions, catalogue });
    expect(filled.gaps.find((g) => g.conditionId === 'league-heavy' && g.gamesBowled === 0)).toBeUndefined();
  });
});
