// Worker-thread entry for heavy engine calls (see enginePool.ts).
import { createHash } from 'node:crypto';
import { LRUCache } from 'lru-cache';
import { fitCalibration, rankArsenal, shotStats, statsBy, suggestMoves } from '../../engine/index';
import type { PocketLineHint } from '../../engine/index';
import type { Calibration, ShotRecord } from '../../engine/shotlog/types';
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

/** A season's shots and the bowler's hand: the statistics GET /api/stats shows. */
export interface StatsTask {
  records: ShotRecord[];
  hand: 'right' | 'left';
}

export function stats({ records, hand }: StatsTask) {
  return {
    overall: shotStats(records),
    byBall: statsBy(records, 'ballId'),
    bySurface: statsBy(records, ['ballId', 'surfaceKey']),
    bySession: statsBy(records, 'sessionId'),
    moves: suggestMoves({ shots: records, hand }),
  };
}
export type StatsParts = ReturnType<typeof stats>;

export function calibrate(input: Parameters<typeof fitCalibration>[0]): Calibration {
  return fitCalibration(input);
}
