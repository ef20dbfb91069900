// Worker-thread entry for heavy engine calls (see enginePool.ts).
import { createHash } from 'node:crypto';
import { LRUCache } from 'lru-cache';
import { fitCalibration, gameCounts, movesOfRecentShots, rankArsenal, shotStatsOfCounts } from '../../engine/index';
import type { GameCountsRow, PocketLineHint } from '../../engine/index';
import type { Calibration, Move, ShotCounts, ShotRecord } from '../../engine/shotlog/types';
import type { RankArsenalInput, RankedBall } from '../../engine/types';

/**
 * Where each ball's line search settled, by ball and condition (the ball's spec, the release, the pattern, the lane
 * surface, its calibration and games bowled in 0.05-game steps): the next ranking of that ball on that condition
 * starts its search there (rankArsenal's hints). bench/accuracy.ts shows that hints from under 0.05 games away leave
 * the order, the advice and the line's figures as a cold search gives them; on the same input they are identical.
 */
const settledLines = new LRUCache<string, PocketLineHint>({ max: 20_000 });
export const HINT_GAMES_STEP = 0.05;

const hash = (v: unknown) => createHash('sha1').update(JSON.stringify(v)).digest('base64url');

/** A ranking task: the input, and a flag the request thread raises when its client went away (checked between balls). */
export interface RankTask {
  input: RankArsenalInput;
  abort?: Int32Array;
}

export function rank(task: RankTask): RankedBall[] {
  const { input, abort } = task;
  const { balls, calibration, gamesBowled, ...condition } = input;
  const conditionKey = hash({ ...condition, games: Math.floor((gamesBowled ?? 0) / HINT_GAMES_STEP) });
  const scales = new Map((calibration?.enough ? calibration.perBall : []).map((p) => [p.ballId, p.frictionScale]));
  const keys = new Map<string, string>();
  const hints = new Map<string, PocketLineHint>();
  for (const b of Array.isArray(balls) ? balls : []) {
    const id = b.id;
    const key = `${conditionKey}:${hash({ spec: { ...b, id: undefined, label: undefined }, scale: scales.get(id) ?? 1 })}`;
    keys.set(id, key);
    const h = settledLines.get(key);
    if (h) hints.set(id, h);
  }
  return rankArsenal(input, {
    hints,
    onSettled: (id, settled) => {
      const key = keys.get(id);
      if (key) settledLines.set(key, settled);
    },
    aborted: abort ? () => Atomics.load(abort, 0) === 1 : undefined,
  });
}

/** The counts of the statistics page's groups (summed from the kept game counts) and the latest shots for the moves. */
export interface StatsTask {
  overall: ShotCounts;
  byBall: { key: string; counts: ShotCounts }[];
  bySurface: { key: string; counts: ShotCounts }[];
  /** Without tallies: the trend shows each session's games, average, strike and spare rates only. */
  bySession: { key: string; counts: ShotCounts }[];
  /** The filtered shots of the latest sessions (`complete`: every filtered shot). */
  recent: ShotRecord[];
  complete: boolean;
  hand: 'right' | 'left';
}

/** The statistics of each group, and the moves when the latest shots suffice for them (else null: read every shot). */
export function stats(task: StatsTask) {
  const of = (gs: { key: string; counts: ShotCounts }[]) => gs.map((g) => ({ key: g.key, stats: shotStatsOfCounts(g.counts) }));
  return {
    overall: shotStatsOfCounts(task.overall),
    byBall: of(task.byBall),
    bySurface: of(task.bySurface),
    // only what the trend shows (a season has hundreds of sessions: their full statistics would be copied back for nothing)
    bySession: task.bySession.map((g) => {
      const st = shotStatsOfCounts(g.counts);
      return { key: g.key, games: st.games, average: st.average, strikePct: st.strike.pct, sparePct: st.spare.pct };
    }),
    moves: movesOfRecentShots({ shots: task.recent, hand: task.hand, complete: task.complete }),
  };
}
export type StatsParts = ReturnType<typeof stats>;

/** The kept counts of games whose shots changed (engine gameCounts). */
export function countGames(records: ShotRecord[]): GameCountsRow[] {
  return gameCounts(records);
}

/** The moves of the latest shots when they suffice (or are every filtered shot: `complete`), else null. */
export function moves(task: { shots: ShotRecord[]; hand: 'right' | 'left'; complete: boolean }): Move[] | null {
  return movesOfRecentShots(task);
}

export function calibrate(input: Parameters<typeof fitCalibration>[0]): Calibration {
  return fitCalibration(input);
}
