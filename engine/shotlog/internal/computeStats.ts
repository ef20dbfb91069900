import { mean, sampleStandardDeviation } from 'simple-statistics';
import { leaveName } from '../../leaveName';
import type { LeaveCount, Rate, ShotStats } from '../types';
import { wilsonInterval } from '../wilsonInterval';
import type { AnalyzedShots } from './analyzeShots';

/** A Rate in percent with its Wilson 95 % interval (null values when n is 0). */
export function rate(hits: number, n: number): Rate {
  if (n === 0) return { hits, n, pct: null, low: null, high: null };
  const w = wilsonInterval(hits, n);
  return { hits, n, pct: (100 * hits) / n, low: 100 * w.low, high: 100 * w.high };
}

/** The statistics of the entries whose indexes are in `include` (definitions: shotStats). */
export function computeStats(a: AnalyzedShots, include: Set<number>): ShotStats {
  let strikes = 0,
    strikeN = 0,
    spares = 0,
    spareN = 0,
    single = 0,
    singleN = 0,
    multi = 0,
    multiN = 0;
  let splitMade = 0,
    splitN = 0,
    pocket = 0,
    pocketN = 0,
    carried = 0;
  const firstBallPins: number[] = [];
  const leaves = new Map<string, LeaveCount>();
  let leaveTotal = 0;
  const games = new Set<string>();
  for (const i of include) {
    const e = a.entries[i];
    games.add(e.game);
    const v = e.view;
    if (!v) continue;
    if (v.rackBall === 1) {
      strikeN++;
      const strike = v.symbol === 'X';
      if (strike) strikes++;
      firstBallPins.push(v.pins);
      const hit = e.shot.hit;
      if (hit !== undefined && hit !== null) {
        pocketN++;
        if (hit === 'pocket') {
          pocket++;
          if (strike) carried++;
        }
      }
      if (!v.foul && !strike) {
        const name = leaveName(v.standing);
        const c = leaves.get(name);
        if (c) c.count++;
        else leaves.set(name, { pins: v.standing.slice(), name, count: 1, share: 0, split: v.split });
        leaveTotal++;
      }
    } else {
      spareN++;
      const made = v.symbol === '/';
      if (made) spares++;
      if (v.pinsBefore.length === 1) {
        singleN++;
        if (made) single++;
      } else {
        multiN++;
        if (made) multi++;
      }
      if (e.rackFirst?.split) {
        splitN++;
        if (made) splitMade++;
      }
    }
  }
  const totals = a.games.filter((g) => g.total !== null && g.entries.every((i) => include.has(i))).map((g) => g.total as number);
  const leaveList = [...leaves.values()]
    .map((l) => ({ ...l, share: l.count / leaveTotal }))
    .sort((x, y) => y.count - x.count || (x.name < y.name ? -1 : x.name > y.name ? 1 : 0));
  return {
    shots: include.size,
    games: games.size,
    average: totals.length > 0 ? mean(totals) : null,
    completeGames: totals.length,
    strike: rate(strikes, strikeN),
    spare: rate(spares, spareN),
    singlePinSpare: rate(single, singleN),
    multiPinSpare: rate(multi, multiN),
    splitConversion: rate(splitMade, splitN),
    pocket: rate(pocket, pocketN),
    carry: rate(carried, pocket),
    firstBallAverage: {
      mean: firstBallPins.length > 0 ? mean(firstBallPins) : null,
      sd: firstBallPins.length > 1 ? sampleStandardDeviation(firstBallPins) : null,
      n: firstBallPins.length,
    },
    leaves: leaveList,
  };
}
