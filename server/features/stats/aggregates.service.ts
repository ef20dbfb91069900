import { gameCounts, type GameCountsRow } from '../../../engine/index';
import type { ShotRecord } from '../../../engine/shotlog/types';
import { countGamesInWorker } from '../../lib/enginePool';
import { sequelize } from '../../models/index';
import { toShotRecord } from '../sessions/sessions.repository';
import { aggregatesRepository } from './aggregates.repository';

/** Games counted per step of a refresh (about 4 000 shots). */
export const GAMES_PER_STEP = 200;

type Count = (records: ShotRecord[]) => Promise<GameCountsRow[]> | GameCountsRow[];

/**
 * Counts again the bowler's games whose shots changed since they were counted (marked by the triggers of migration
 * 20261230-0016, whoever wrote the shots), so `shot_aggregates` is current for a statistics read. Usually nothing
 * changed: one indexed read on the primary. The counting runs on the stats thread (countGamesInWorker); `count` runs it
 * here instead (the seeders). Answers whether anything was counted (the read that follows then goes to the primary).
 */
export async function refreshShotAggregates(userId: number, count: Count = countGamesInWorker): Promise<boolean> {
  if (!(await aggregatesRepository.hasChanges(userId))) return false;
  return sequelize.transaction(async (transaction) => {
    const games = await aggregatesRepository.claimChangedGames(userId, transaction);
    if (games.length === 0) return false;
    // A few hundred games at a time, so a season counted for the first time never holds all its shots at once.
    for (let i = 0; i < games.length; i += GAMES_PER_STEP) {
      const step = games.slice(i, i + GAMES_PER_STEP);
      const rows = await aggregatesRepository.gameShots(step, transaction);
      const counted = rows.length ? await count(rows.map((r) => toShotRecord(r, r.date!))) : [];
      await aggregatesRepository.replaceGames(userId, step, counted, transaction);
    }
    return true;
  });
}

/** Counts every marked game of every bowler on this thread (the seeders, after logging the demo shots). */
export async function refreshAllShotAggregates(): Promise<number> {
  const bowlers = await aggregatesRepository.changedBowlers();
  for (const id of bowlers) await refreshShotAggregates(id, gameCounts);
  return bowlers.length;
}
