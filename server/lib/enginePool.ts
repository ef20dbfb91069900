import { cpus } from 'node:os';
import path from 'node:path';
import { fileURLToPath } from 'node:url';
import { Piscina } from 'piscina';
import type { fitCalibration } from '../../engine/index';
import type { Calibration } from '../../engine/shotlog/types';
import type { RankArsenalInput, RankedBall } from '../../engine/types';
import { config } from '../config/index';
import { logger } from './logger';

const here = path.dirname(fileURLToPath(import.meta.url));
const workerFile = path.join(here, 'engineWorker.mjs');

/**
 * Heavy engine work (ranking with the ball-motion model) runs in worker threads so a request never
 * holds the event loop. engineWorker.mjs loads the TypeScript worker through tsx inside the thread.
 */
let pool: Piscina | null = null;

function getPool(): Piscina {
  if (pool) return pool;
  pool = new Piscina({
    filename: workerFile,
    minThreads: 1,
    maxThreads: Math.max(1, Math.min(config.ENGINE_WORKERS || cpus().length, 8)),
    idleTimeout: 60000,
  });
  pool.on('error', (err: unknown) => logger.error({ err }, 'engine worker failed'));
  return pool;
}

/** rankArsenal in a worker thread; an aborted signal (the client went away) drops the task if it has not started. */
export function rankInWorker(input: RankArsenalInput, signal?: AbortSignal): Promise<RankedBall[]> {
  return getPool().run(input, { name: 'rank', ...(signal ? { signal } : {}) }) as Promise<RankedBall[]>;
}

/** fitCalibration in a worker thread (about 25 ms of model deliveries per logged shot: too slow for the request thread). */
export function calibrateInWorker(input: Parameters<typeof fitCalibration>[0], signal?: AbortSignal): Promise<Calibration> {
  return getPool().run(input, { name: 'calibrate', ...(signal ? { signal } : {}) }) as Promise<Calibration>;
}

export async function closeEnginePool(): Promise<void> {
  if (pool) {
    const p = pool;
    pool = null;
    await p.destroy();
  }
}
