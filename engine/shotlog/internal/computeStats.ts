import { isSplit } from '../../isSplit';
import { leaveName } from '../../leaveName';
import type { LeaveCount, Rate, ShotCounts, ShotStats } from '../types';
import { wilsonInterval } from '../wilsonInterval';
import type { AnalyzedShots } from './analyzeShots';
import { zeroCounts } from './countKeys';

/** A Rate in percent with its Wilson 95 % interval (null values when n is 0). */
export function rate(hits: number, n: number): Rate {
  if (n === 0) return { hits, n, pct: null, low: null, high: null };
  const w = wilsonInterval(hits, n);
  return { hits, n, pct: (100 * hits) / n, low: 100 * w.low, high: 100 * w.high };
}

/** The counts of the entries whose indexes are in `include` (definitions: shotStats; tallies: ShotCounts). */
export function countsOf(a: AnalyzedShots, include: Set<number>): ShotCounts {
  const c: ShotCounts = { ...zeroCounts(), shots: include.size };
  const tally = (key: string) => {
    c.tallies[key] = (c.tallies[key] ?? 0) + 1;
  };
  const games = new Set<string>();
  for (const i of include) {
    const e = a.entries[i];
    games.add(e.game);
    const v = e.view;
    if (!v) continue;
    if (v.rackBall === 1) {
      c.strikeN++;
      const strike = v.symbol === 'X';
      if (strike) c.strikes++;
      tally(`fb:${v.pins}`);
      const hit = e.shot.hit;
      if (hit !== undefined && hit !== null) {
        c.pocketN++;
        if (hit === 'pocket') {
          c.pocket++;
          if (strike) c.carried++;
        }
      }
      if (!v.foul && !strike) tally(`leave:${[...v.standing].sort((x, y) => x - y).join(',')}`);
    } else {
      c.spareN++;
      const made = v.symbol === '/';
      if (made) c.spares++;
      if (v.pinsBefore.length === 1) {
        c.singleN++;
        if (made) c.singleMade++;
      } else {
        c.multiN++;
        if (made) c.multiMade++;
      }
      if (e.rackFirst?.split) {
        c.splitN++;
        if (made) c.splitMade++;
      }
    }
  }
  c.games = games.size;
  for (const g of a.games) {
    if (g.total !== null && g.entries.every((i) => include.has(i))) {
      c.totalSum += g.total;
      c.completeGames++;
    }
  }
  return c;
}

/**
 * ShotStats from counts (definitions: shotStats). The first-ball mean is Σ k·n_k ÷ n and its sample standard deviation
 * √(Σ n_k (k − mean)² ÷ (n − 1)), summed over k = 0…10 pins, so every figure depends on the counts alone (not on the
 * order the shots were counted in). Leaves are named by leaveName and marked by isSplit.
 */
export function statsFromCounts(c: ShotCounts): ShotStats {
  const firstBall = new Array<number>(11).fill(0);
  const leaves: Omit<LeaveCount, 'share'>[] = [];
  for (const [key, count] of Object.entries(c.tallies)) {
    if (!count) continue;
    if (key.startsWith('fb:')) firstBall[Number(key.slice(3))] += count;
    else if (key.startsWith('leave:')) {
      const pins = key
        .slice(6)
        .split(',')
        .map(Number)
        .sort((x, y) => x - y);
      leaves.push({ pins, name: leaveName(pins), count, split: isSplit(pins) });
    }
  }
  let n = 0;
  let sum = 0;
  firstBall.forEach((count, pins) => {
    n += count;
    sum += count * pins;
  });
  const fbMean = n > 0 ? sum / n : null;
  let squares = 0;
  if (fbMean !== null) firstBall.forEach((count, pins) => (squares += count * (pins - fbMean) * (pins - fbMean)));
  const leaveTotal = leaves.reduce((t, l) => t + l.count, 0);
  const leaveList: LeaveCount[] = leaves
    .map((l) => ({ pins: l.pins, name: l.name, count: l.count, share: l.count / leaveTotal, split: l.split }))
    .sort((x, y) => y.count - x.count || (x.name < y.name ? -1 : x.name > y.name ? 1 : 0));
  return {
    shots: c.shots,
    games: c.games,
    average: c.completeGames > 0 ? c.totalSum / c.completeGames : null,
    completeGames: c.completeGames,
    strike: rate(c.strikes, c.strikeN),
    spare: rate(c.spares, c.spareN),
    singlePinSpare: rate(c.singleMade, c.singleN),
    multiPinSpare: rate(c.multiMade, c.multiN),
    splitConversion: rate(c.splitMade, c.splitN),
    pocket: rate(c.pocket, c.pocketN),
    carry: rate(c.carried, c.pocket),
    firstBallAverage: { mean: fbMean, sd: n > 1 ? Math.sqrt(squares / (n - 1)) : null, n },
    leaves: leaveList,
  };
}

/** The statistics of the entries whose indexes are in `include` (definitions: shotStats): statsFromCounts of their counts. */
export function computeStats(a: AnalyzedShots, include: Set<number>): ShotStats {
  return statsFromCounts(countsOf(a, include));
}
