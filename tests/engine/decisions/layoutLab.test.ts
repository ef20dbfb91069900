import { describe, expect, it } from 'vitest';
import { layoutLab } from '../../../engine/index';
import type { BallSpec, BowlerProfile } from '../../../engine/index';
import { houseShot } from '../fixtures';

// An invented asymmetric solid (no real product).
const ball = (differential: number): BallSpec => ({
  weightLb: 15,
  rg: 2.5,
  differential,
  intermediateDifferential: 0.015,
  coverType: 'reactive-solid',
  surfaceGrit: 2000,
  polished: false,
});
const bowler: BowlerProfile = { hand: 'right', speedMph: 17, revRpm: 350, axisRotationDeg: 45, axisTiltDeg: 15 };
const run = (differential: number, pinToPapIn: number, who: BowlerProfile = bowler, valAngleDeg = 50) =>
  layoutLab({
    ball: ball(differential),
    bowler: who,
    pattern: houseShot,
    layouts: [{ id: 'x', label: 'x', layout: { pinToPapIn, valAngleDeg } }],
  })[0];
const dist = (p: { x: number; y: number }, q: { x: number; y: number } = { x: 0, y: 0 }) => Math.hypot(p.x - q.x, p.y - q.y);

describe('layoutLab: the layout drawing and its flare rings', () => {
  it('the map keeps distances from the PAP true: the pin is drawn its pin-to-PAP distance from the PAP', () => {
    const e = run(0.05, 4.375);
    expect(dist(e.pap)).toBe(0);
    expect(dist(e.pin)).toBeCloseTo(4.375, 9);
    // the spin axis starts at the PAP and ends the model's flare (inches of arc) away from it
    expect(dist(e.axes[0])).toBeCloseTo(0, 9);
    expect(dist(e.axes.at(-1)!)).toBeCloseTo(e.flareIn, 6);
    expect(e.rings.length).toBe(e.axes.length);
    expect(e.rings.every((r) => r.length > 20)).toBe(true);
  });

  it('flare rings spread wider with a larger differential (rigid-body mechanics: the drive ½·ΔI·ω·sin 2θ grows with ΔI; common practice: higher differential, more flare)', () => {
    const spread = [0.02, 0.035, 0.05].map((d) => run(d, 4).flareIn);
    expect(spread[1]).toBeGreaterThan(spread[0] * 1.2);
    expect(spread[2]).toBeGreaterThan(spread[1] * 1.1);
  });

  it('flare peaks at a middle pin-to-PAP distance: small with the pin near the PAP, largest between 3 and 5 in (drive largest at θ = 45°, 3.34 in on an 8.5 in ball, rigid-body mechanics; common practice: about 3 3/8 to 5 in for most flare, from memory)', () => {
    const dists = [0.75, 1.5, 2.5, 3, 3.5, 4, 4.5, 5, 5.5, 6.25];
    const flare = dists.map((d) => run(0.05, d).flareIn);
    const best = dists[flare.indexOf(Math.max(...flare))];
    expect(best).toBeGreaterThanOrEqual(3);
    expect(best).toBeLessThanOrEqual(5);
    expect(flare[0]).toBeLessThan(0.5 * Math.max(...flare));
    expect(flare.at(-1)!).toBeLessThan(Math.max(...flare));
  });

  it('a left-hander’s drawing is the mirror image: the mass bias moves to the other side of the pin–PAP line', () => {
    const r = run(0.05, 4, bowler, 60),
      l = run(0.05, 4, { ...bowler, hand: 'left' }, 60);
    expect(r.massBias).not.toBeNull();
    expect(Math.sign(r.massBias!.x)).toBe(-Math.sign(l.massBias!.x));
    expect(r.massBias!.y).toBeCloseTo(l.massBias!.y, 6);
  });

  it('two layouts side by side, each with its own predicted path on the condition', () => {
    const [a, b] = layoutLab({
      ball: ball(0.05),
      bowler,
      pattern: houseShot,
      layouts: [
        { id: 'early', label: 'Pin near the PAP', layout: { pinToPapIn: 2 } },
        { id: 'strong', label: 'Pin at 4 1/2', layout: { pinToPapIn: 4.5 } },
      ],
    });
    expect([a.id, b.id]).toEqual(['early', 'strong']);
    expect(a.prediction.path.length).toBeGreaterThan(50);
    expect(b.flareIn).toBeGreaterThan(a.flareIn);
  });
});
