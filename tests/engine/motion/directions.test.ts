import { describe, expect, it } from 'vitest';
import { simulateShot } from '../../../engine/index';
import type { BallSpec, BowlerProfile, OilPattern } from '../../../engine/types';
import { flatPattern, housePattern, strokerBowler, strongBall } from './fixtures';

// Directions are the trade's rules of thumb (TRADE.md §7.2 "How ball properties change motion", common
// practice, C) and PHYSICS.md §5.1–§5.4; each is checked on two invented patterns on a fixed line that
// puts the reference ball near the pocket (so no variant falls in the gutter).
const lanes: [string, (scale?: number) => OilPattern, number, number][] = [
  ['flat 42 ft', (k = 1) => flatPattern(50 * k), 15, 10],
  ['house 40 ft', (k = 1) => housePattern(k), 13, 6.2],
];

function shot(lane: (typeof lanes)[number], o: { ball?: Partial<BallSpec>; bowler?: Partial<BowlerProfile>; oil?: number; games?: number } = {}) {
  const [, pattern, laydownBoard, targetBoard] = lane;
  const p = simulateShot({ ball: strongBall(o.ball), bowler: strokerBowler(o.bowler), pattern: pattern(o.oil), laydownBoard, targetBoard, gamesBowled: o.games ?? 0 });
  expect(p.gutter).toBe(false);
  return { ...p, hook: p.entryBoard - p.breakpoint.board };
}

function increasing(values: number[]): void {
  for (let i = 1; i < values.length; i++) expect(values[i]).toBeGreaterThan(values[i - 1]);
}

describe.each(lanes)('directions on the %s pattern', (...lane) => {
  it('ft, RG 2.46 → 2.60 → 2.70 in: the skid ends and rolling starts later (lower RG hooks earlier, TRADE.md §7.2)', () => {
    const r = [2.46, 2.6, 2.7].map((rg) => shot(lane, { ball: { rg } }));
    increasing(r.map((p) => p.skidFt));
    increasing(r.map((p) => p.rollStartFt as number));
  });

  it('boards, differential 0.010 → 0.030 → 0.058 in at a strong 3.4 in pin-to-PAP: more hook (breakpoint to entry), and 0.058 hooks more at 3.4 in than pin-on-axis (0.3 in) (TRADE.md §7.2, §6.3)', () => {
    const r = [0.01, 0.03, 0.058].map((differential) => shot(lane, { ball: { differential, intermediateDifferential: 0 } }));
    increasing(r.map((p) => p.hook));
    const weak = shot(lane, { ball: { differential: 0.058, intermediateDifferential: 0, layout: { pinToPapIn: 0.3 } } });
    expect(r[2].hook).toBeGreaterThan(weak.hook);
  });

  it('ft, surface 500 → 2000 → 4000 grit → 4000 polished: the skid ends later (rougher reads earlier, TRADE.md §7.2; PHYSICS.md §5.2)', () => {
    const r = [{ surfaceGrit: 500 }, { surfaceGrit: 2000 }, { surfaceGrit: 4000 }, { surfaceGrit: 4000, polished: true }].map((b) => shot(lane, { ball: b }));
    increasing(r.map((p) => p.skidFt));
  });

  it('ft, the same ball as reactive pearl instead of solid: longer skid and later breakpoint (TRADE.md §7.2 cover order)', () => {
    const solid = shot(lane);
    const pearl = shot(lane, { ball: { coverType: 'reactive-pearl' } });
    expect(pearl.skidFt).toBeGreaterThan(solid.skidFt);
    expect(pearl.breakpoint.ft).toBeGreaterThan(solid.breakpoint.ft);
  });

  it('ft, oil volume ×1 → ×1.5 → ×2: the breakpoint moves later (more oil, later hook; TRADE.md §4.3, C)', () => {
    increasing([1, 1.5, 2].map((oil) => shot(lane, { oil }).breakpoint.ft));
  });

  it('ft, release speed 16 → 17.5 → 19 mph: later breakpoint and later end of skid (more speed goes longer, C)', () => {
    const r = [16, 17.5, 19].map((speedMph) => shot(lane, { bowler: { speedMph } }));
    increasing(r.map((p) => p.breakpoint.ft));
    increasing(r.map((p) => p.skidFt));
  });

  it('boards, rev rate 250 → 320 → 400 rpm: more hook and a higher entry board (more revs hook more, C)', () => {
    const r = [250, 320, 400].map((revRpm) => shot(lane, { bowler: { revRpm } }));
    increasing(r.map((p) => p.hook));
    increasing(r.map((p) => p.entryBoard));
  });

  it('ft, games bowled 0 → 2 → 4 → 6: the breakpoint moves earlier as the track dries (PHYSICS.md §5.4; TRADE.md §5.2 "break patterns down")', () => {
    const r = [0, 2, 4, 6].map((games) => shot(lane, { games }).breakpoint.ft);
    for (let i = 1; i < r.length; i++) expect(r[i]).toBeLessThan(r[i - 1]);
  });
});
