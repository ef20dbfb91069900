import { describe, expect, it } from 'vitest';
import { ballFeatures, flareShare, matchupContext, pinToPapInForAngle, suggestChanges, targetFlareShare } from '../../engine/index';
import type { BallSpec, OilPattern } from '../../engine/index';
import { houseShot, longHeavy, plasticBall, polishedPearl, roughAsymSolid, shortLight, typicalBowler } from './fixtures';

// Directions: TRADE.md 7.2 (sand lower for more read in oil; higher grit or polish for length and
// backend), 6.3 (45° pin for the most flare), 7.1 (rule of 31; 2-and-1 move), all common practice
// except 6.3 (derived).

const suggest = (ball: BallSpec, pattern: OilPattern, bowler = typicalBowler, games = 0) =>
  suggestChanges(ball, ballFeatures(ball), matchupContext(bowler, pattern, games));

describe('suggestChanges', () => {
  it('surface: a polished pearl on heavy oil is told to sand to a lower grit without polish', () => {
    const s = suggest(polishedPearl, longHeavy).find((x) => x.kind === 'surface');
    expect(s?.text).toMatch(/^Sand to \d+ grit/);
    expect(s?.change).toMatchObject({ polished: false });
    expect(Number(s?.change?.surfaceGrit)).toBeLessThan(2000);
  });

  it('surface: a 500 grit solid on a short light pattern is told to go to a higher grit or polish', () => {
    const s = suggest(roughAsymSolid, shortLight).find((x) => x.kind === 'surface');
    expect(s?.text).toMatch(/^Go to 4000 grit/);
  });

  it('layout: a 75° pin on heavy oil is told to move toward 45°, to a distance whose flare share is the layout rule’s target (±0.05)', () => {
    const ball = { ...polishedPearl, layout: { pinToPapIn: pinToPapInForAngle(75) } };
    const s = suggest(ball, longHeavy).find((x) => x.kind === 'layout');
    expect(s?.text).toMatch(/^Next drilling/);
    const suggested = Number(s?.change?.pinToPapIn);
    expect(suggested).toBeLessThan(ball.layout.pinToPapIn);
    expect(suggested).toBeGreaterThanOrEqual(pinToPapInForAngle(45) - 0.07); // rounded to 1/8 in
    const target = targetFlareShare(matchupContext(typicalBowler, longHeavy).oilDemand);
    expect(Math.abs(flareShare(suggested) - target)).toBeLessThan(0.05);
  });

  it('layout: a ball without a layout is asked for one', () => {
    const { layout: _omit, ...noLayout } = polishedPearl;
    expect(suggest(noLayout, houseShot).find((x) => x.kind === 'layout')?.text).toMatch(/^Enter this ball's layout/);
  });

  it('release: a strong solid on a short light pattern is told to add 1 mph (17 → 18 mph)', () => {
    expect(suggest(roughAsymSolid, shortLight).find((x) => x.kind === 'release')?.change).toEqual({ speedMph: 18 });
  });

  it('line: the rule-of-31 board (44 ft − 31 = 13) on the long pattern', () => {
    expect(suggest(roughAsymSolid, longHeavy)).toContainEqual(expect.objectContaining({ kind: 'line', change: { exitBoard: 13 } }));
  });

  it('line: a ball too strong for the lane gets a 2-and-1 move deeper — left for a right-hander, right for a left-hander', () => {
    const right = suggest(roughAsymSolid, shortLight).find((x) => x.kind === 'line' && x.change?.feetBoards === 2);
    const left = suggest(roughAsymSolid, shortLight, { ...typicalBowler, hand: 'left' }).find((x) => x.kind === 'line' && x.change?.feetBoards === 2);
    expect(right?.text).toMatch(/target 1 board left/);
    expect(left?.text).toMatch(/target 1 board right/);
  });

  it('plastic: only the corner-spare suggestion', () => {
    expect(suggest(plasticBall, houseShot)).toEqual([expect.objectContaining({ kind: 'line', change: { spareTargets: [7, 10] } })]);
  });
});
