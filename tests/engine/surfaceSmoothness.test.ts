import { describe, expect, it } from 'vitest';
import { surfaceSmoothness } from '../../engine/index';

// Definition (engine/surfaceSmoothness.ts): 0.85 × ln(grit/360) ÷ ln(4000/360) + 0.15 if polished,
// clamped; direction from TRADE.md 7.2 (common practice). Values derived by hand.

describe('surfaceSmoothness', () => {
  it('scale: 360 grit is 0, 4000 grit is 0.85, 4000 grit polished is 1 (±1e-12)', () => {
    expect(surfaceSmoothness(360, false)).toBe(0);
    expect(Math.abs(surfaceSmoothness(4000, false) - 0.85)).toBeLessThan(1e-12);
    expect(Math.abs(surfaceSmoothness(4000, true) - 1)).toBeLessThan(1e-12);
  });

  it('scale: 500 grit is 0.85 × ln(500/360) ÷ ln(4000/360) = 0.1159 (±1e-4)', () => {
    // ln(1.3889) = 0.32850; ln(11.111) = 2.40795; 0.85 × 0.13643 = 0.11596.
    expect(surfaceSmoothness(500, false)).toBeCloseTo(0.11596, 4);
  });

  it('scale rises with grit: 500 < 1000 < 2000 < 3000 < 4000 < 4000 polished', () => {
    const s = [500, 1000, 2000, 3000, 4000].map((g) => surfaceSmoothness(g, false));
    s.push(surfaceSmoothness(4000, true));
    for (let i = 1; i < s.length; i++) expect(s[i]).toBeGreaterThan(s[i - 1]);
  });

  it('scale: grit outside 360–4000 is clamped (180 → 0, 8000 → 0.85)', () => {
    expect(surfaceSmoothness(180, false)).toBe(0);
    expect(Math.abs(surfaceSmoothness(8000, false) - 0.85)).toBeLessThan(1e-12);
  });

  it('throws RangeError for grit 0 and TypeError for a polish flag that is not a boolean', () => {
    expect(() => surfaceSmoothness(0, false)).toThrow(/surfaceSmoothness: grit must be greater than 0, got 0/);
    expect(() => surfaceSmoothness(1000, 'yes' as unknown as boolean)).toThrow(TypeError);
  });
});
