import { describe, expect, it } from 'vitest';
import { compareTrial, shotsPerArm, TRIAL_RULES } from '../../../engine/index';
import type { HitKind, ShotRecord } from '../../../engine/index';

/** A seeded generator of frames 1–9 (each a first ball; a spare ball after a non-strike), games of nine frames. */
function armShots(
  sessionId: string,
  ballId: string,
  outcomes: { strike: boolean; leave?: number[]; hit?: HitKind; breakpoint?: number }[],
): ShotRecord[] {
  const shots: ShotRecord[] = [];
  outcomes.forEach((o, i) => {
    const gameNumber = Math.floor(i / 9) + 1,
      frame = (i % 9) + 1;
    const base = {
      sessionId,
      gameNumber,
      date: '2026-11-20',
      ballId,
      surfaceKey: '2000 grit',
      frame,
      hit: o.hit ?? 'pocket',
      breakpointBoard: o.breakpoint ?? null,
    };
    if (o.strike) shots.push({ ...base, delivery: 1, standing: [] });
    else {
      shots.push({ ...base, delivery: 1, standing: o.leave ?? [10] });
      shots.push({ ...base, delivery: 2, standing: [], hit: null, breakpointBoard: null });
    }
  });
  return shots;
}
/** `strikes` strikes among `n` first balls, spread evenly; the others leave `leave`. */
function outcomes(n: number, strikes: number, leave: number[] = [10]) {
  return Array.from({ length: n }, (_, i) => ({ strike: Math.floor(((i + 1) * strikes) / n) > Math.floor((i * strikes) / n), leave }));
}

describe('compareTrial: an equipment trial’s per-arm figures and its verdict', () => {
  it('at small samples the verdict is “not enough shots yet”, even when one arm leads', () => {
    const r = compareTrial({
      hand: 'right',
      arms: [
        { id: 'a', label: 'Layout A', shots: armShots('s1', 'b1', outcomes(6, 5)) },
        { id: 'b', label: 'Layout B', shots: armShots('s2', 'b2', outcomes(6, 1)) },
      ],
    });
    expect(r.verdict.kind).toBe('not-enough');
    expect(r.verdict.text).toMatch(/^Not enough shots yet/);
    expect(r.verdict.moreShotsPerArm).toBeGreaterThanOrEqual(TRIAL_RULES.minFirstBalls - 6);
    expect(r.arms.map((a) => a.strike.n)).toEqual([6, 6]);
  });

  it('a large seeded difference (60 of 100 against 25 of 100 strikes) gives a clear verdict for the stronger arm', () => {
    const r = compareTrial({
      hand: 'right',
      arms: [
        { id: 'a', label: 'Layout A', shots: armShots('s1', 'b1', outcomes(100, 25)) },
        { id: 'b', label: 'Layout B', shots: armShots('s2', 'b2', outcomes(100, 60)) },
      ],
    });
    expect(r.verdict.kind).toBe('clear');
    expect(r.verdict.leaderId).toBe('b');
    expect(r.verdict.probability).toBeGreaterThan(0.999);
    expect(r.verdict.test!.p).toBeLessThan(0.001);
    expect(r.verdict.text).toContain('Layout B strikes more often than Layout A');
    const b = r.arms.find((a) => a.id === 'b')!;
    expect(b.strike).toMatchObject({ hits: 60, n: 100, pct: 60 });
    expect(b.strike.low!).toBeLessThan(60);
    expect(b.strike.high!).toBeGreaterThan(60);
  });

  it('a close race (30 of 60 against 27 of 60) is not settled, and the shots still needed follow the power calculation', () => {
    const r = compareTrial({
      hand: 'right',
      arms: [
        { id: 'a', label: 'A', shots: armShots('s1', 'b1', outcomes(60, 30)) },
        { id: 'b', label: 'B', shots: armShots('s2', 'b2', outcomes(60, 27)) },
      ],
    });
    expect(r.verdict.kind).toBe('not-enough');
    expect(r.verdict.leaderId).toBe('a');
    expect(r.verdict.probability!).toBeGreaterThan(0.5);
    expect(r.verdict.probability!).toBeLessThan(TRIAL_RULES.clearProbability);
    expect(r.verdict.moreShotsPerArm).toBe(shotsPerArm(0.5, 0.45) - 60);
  });

  it('carry counts strikes among pocket hits; the pocket-side corner pin is the 10 for a right-hander and the 7 for a left-hander (mirrored)', () => {
    const right = compareTrial({
      hand: 'right',
      arms: [
        { id: 'a', label: 'A', shots: armShots('s1', 'b1', outcomes(20, 10, [10])) },
        { id: 'b', label: 'B', shots: armShots('s2', 'b2', outcomes(20, 10, [7])) },
      ],
    });
    expect(right.arms[0].pocketCorner).toMatchObject({ pin: 10, hits: 10, n: 20 });
    expect(right.arms[0].farCorner).toMatchObject({ pin: 7, hits: 0 });
    expect(right.arms[1].farCorner).toMatchObject({ pin: 7, hits: 10 });
    expect(right.arms[0].carry).toMatchObject({ hits: 10, n: 20 });
    const left = compareTrial({
      hand: 'left',
      arms: [
        { id: 'a', label: 'A', shots: armShots('s1', 'b1', outcomes(20, 10, [7])) },
        { id: 'b', label: 'B', shots: armShots('s2', 'b2', outcomes(20, 10, [10])) },
      ],
    });
    expect(left.arms[0].pocketCorner).toMatchObject({ pin: 7, hits: 10 });
    expect(left.arms[1].farCorner).toMatchObject({ pin: 10, hits: 10 });
  });

  it('breakpoint spread and observed-minus-predicted breakpoint, with a 95 % interval', () => {
    const boards = [6, 7, 8, 9, 10, 6, 7, 8, 9, 10];
    const shots = armShots(
      's1',
      'b1',
      boards.map((b) => ({ strike: true, breakpoint: b })),
    );
    const r = compareTrial({
      hand: 'right',
      arms: [
        { id: 'a', label: 'A', shots, predictedBreakpointBoard: 7 },
        { id: 'b', label: 'B', shots: armShots('s2', 'b2', outcomes(10, 5)) },
      ],
    });
    const a = r.arms[0];
    // mean 8, sample sd √(20/9) = 1.4907 (by hand), half-width 1.96·1.4907/√10 = 0.924
    expect(a.breakpoint.mean).toBeCloseTo(8, 10);
    expect(a.breakpoint.sd).toBeCloseTo(1.4907, 4);
    expect(a.predictedVsObserved!.mean).toBeCloseTo(1, 10);
    expect(a.predictedVsObserved!.low).toBeCloseTo(1 - 0.924, 3);
    expect(r.arms[1].predictedVsObserved).toBeNull();
  });

  it('refuses a trial with one arm or repeated arm ids', () => {
    expect(() => compareTrial({ hand: 'right', arms: [{ id: 'a', label: 'A', shots: [] }] })).toThrow(RangeError);
    expect(() =>
      compareTrial({
        hand: 'right',
        arms: [
          { id: 'a', label: 'A', shots: [] },
          { id: 'a', label: 'B', shots: [] },
        ],
      }),
    ).toThrow(RangeError);
  });
});
