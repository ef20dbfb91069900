import { describe, expect, it } from 'vitest';
import { matchupContext, REACTION_SCALE, strengthFit, suggestChanges, SURFACE_CAUTION } from '../../engine/index';
import type { BallSpec, OilPattern } from '../../engine/index';
import { houseShot, longHeavy, plasticBall, polishedPearl, roughAsymSolid, shortLight, typicalBowler } from './fixtures';

// suggestChanges: the moves that close the gap between a ball's reaction and the condition's demand, by the amount
// needed (common practice: too much ball → smoother surface, weaker layout, more speed, move deeper; too little →
// the reverse; surface work between sessions only — USBC allows only a dry towel during competition).

const sug = (ball: BallSpec, pattern: OilPattern, bowler = typicalBowler) => {
  const ctx = matchupContext(bowler, pattern);
  const fit = strengthFit(ball, ctx);
  return { fit, list: suggestChanges(ball, ctx, fit) };
};
const smooth = (g: number, p: boolean) => Math.log2(g) + (p ? 1 : 0);

describe('suggestChanges', () => {
  it('surface: a 500-grit solid that is too strong for a short, light pattern is told to go smoother, to the finish that brings the gap nearest 0', () => {
    const { fit, list } = sug(roughAsymSolid, shortLight);
    expect(fit.verdict).toBe('too-strong');
    const s = list.find((x) => x.kind === 'surface');
    expect(s).toBeDefined();
    const c = s!.change as { surfaceGrit: number; polished: boolean };
    expect(smooth(c.surfaceGrit, c.polished)).toBeGreaterThan(smooth(500, false));
    expect(s!.text).toMatch(/^Go smoother/);
    expect(s!.text).toContain(SURFACE_CAUTION);
    // the gap after the change is the smallest any pro-shop finish gives (by the amount needed, not a fixed step)
    const after = (b: BallSpec) => strengthFit(b, matchupContext(typicalBowler, shortLight)).gap;
    const chosen = Math.abs(after({ ...roughAsymSolid, ...c }));
    for (const [g, p] of [
      [1000, false],
      [2000, false],
      [3000, false],
      [4000, false],
      [4000, true],
    ] as const) {
      expect(chosen).toBeLessThanOrEqual(Math.abs(after({ ...roughAsymSolid, surfaceGrit: g, polished: p })) + 1e-9);
    }
  });

  it('surface: a polished pearl that is too weak for long heavy oil is told to sand rougher, without polish', () => {
    const { fit, list } = sug(polishedPearl, longHeavy);
    expect(fit.verdict).toBe('too-weak');
    const s = list.find((x) => x.kind === 'surface');
    expect(s?.text).toMatch(/^Sand it rougher/);
    expect(s?.change).toMatchObject({ polished: false });
  });

  it('nothing but the model line is left for a ball that suits: no surface, layout, release or 2-and-1 move', () => {
    // find a finish of the solid that suits the house shot
    const ball = [500, 1000, 1500, 2000, 3000, 4000]
      .map((surfaceGrit) => ({ ...roughAsymSolid, surfaceGrit }))
      .find((b) => sug(b, houseShot).fit.verdict === 'suits');
    expect(ball).toBeDefined();
    expect(sug(ball!, houseShot).list).toEqual([]);
  });

  it('layout: a ball without a layout is asked for one; a too-strong ball with a strong layout is offered a weaker pin position for its next drilling, with the pro-shop caution', () => {
    const { layout: _omit, ...noLayout } = roughAsymSolid;
    expect(sug(noLayout as BallSpec, shortLight).list.find((x) => x.kind === 'layout')?.text).toMatch(/Enter this ball's layout/);
    const l = sug(roughAsymSolid, shortLight).list.find((x) => x.kind === 'layout');
    expect(l).toBeDefined();
    expect((l!.change as { pinToPapIn: number }).pinToPapIn).toBeGreaterThan(roughAsymSolid.layout!.pinToPapIn);
    expect(l!.text).toMatch(/pro-shop technician/);
  });

  it('release: a clear gap also offers about 1 mph — more for too much ball, less for too little', () => {
    expect(sug(roughAsymSolid, shortLight).list.find((x) => x.kind === 'release')?.change).toEqual({ speedMph: 18 });
    expect(sug(polishedPearl, longHeavy).list.find((x) => x.kind === 'release')?.change).toEqual({ speedMph: 16 });
  });

  it('line: too much ball moves deeper (2-and-1 left for a right-hander, right for a left-hander), too little toward the friction', () => {
    const right = sug(roughAsymSolid, shortLight).list.find((x) => x.kind === 'line');
    expect(right?.text).toMatch(/board left/);
    expect(right?.change).toEqual({ feetBoards: 2, targetBoards: 1 });
    const mirrored: OilPattern = {
      name: 'm',
      sweeps: shortLight.sweeps.map((s) => ({ ...s, fromBoard: 40 - s.toBoard, toBoard: 40 - s.fromBoard })),
    };
    expect(sug(roughAsymSolid, mirrored, { ...typicalBowler, hand: 'left' }).list.find((x) => x.kind === 'line')?.text).toMatch(
      /board right/,
    );
    expect(sug(polishedPearl, longHeavy).list.find((x) => x.kind === 'line')?.change).toEqual({ feetBoards: -2, targetBoards: -1 });
  });

  it('a resurface also ends the wear: a worn ball that is a little weak is told to resurface to the same grit', () => {
    // the same ball, worn by 80 games: the wear part is about −REACTION_SCALE.wearMax × 2/3
    const worn: BallSpec = { ...polishedPearl, polished: false, surfaceGrit: 2000, gamesSinceResurface: 80 };
    const ctx = matchupContext(typicalBowler, houseShot);
    const f = strengthFit(worn, ctx);
    const wear = f.reaction.factors.find((x) => x.key === 'wear')?.points ?? 0;
    expect(wear).toBeCloseTo((-REACTION_SCALE.wearMax * 80) / 120, 1);
  });

  it('plastic: only the corner-spare suggestion', () => {
    expect(sug(plasticBall, houseShot).list).toEqual([
      {
        kind: 'line',
        text: 'Use this ball for corner spares: throw it straight at the 7 and 10 pins, cross-lane.',
        change: { spareTargets: [7, 10] },
      },
    ]);
  });
});
