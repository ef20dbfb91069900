import { buildSync } from 'esbuild';
import crypto from 'node:crypto';
import fs from 'node:fs';
import { cpus, tmpdir } from 'node:os';
import path from 'node:path';
import { fileURLToPath } from 'node:url';
import { Piscina } from 'piscina';
import type { fitCalibration } from '../../engine/index';
import type { Calibration } from '../../engine/shotlog/types';
import type { RankArsenalInput, RankedBall } from '../../engine/types';
import { config } from '../config/index';
import { AppError } from './AppError';
import { logger } from './logger';

const here = path.dirname(fileURLToPath(import.meta.url));

/**
 * Heavy engine work (ranking with the ball-motion model) runs in worker threads so a request never holds the
 * event loop. The pool stays warm and bounded:
 *  - the worker (engineWorker.ts and the engine) is compiled once per process with esbuild into one plain
 *    JavaScript file, so a thread starts without compiling TypeScript;
 *  - every thread starts with the pool and none retires when idle (minThreads = maxThreads, no idle
 *    timeout): after a quiet minute the first requests do not wait for cold threads;
 *  - at most ENGINE_QUEUE tasks wait for a thread; past that a request is answered at once with 503 and
 *    Retry-After instead of waiting past any client's patience (load shedding, common practice).
 */
let pool: Piscina | null = null;
let compiled: string | null = null;

export const engineThreads = Math.max(1, Math.min(config.ENGINE_WORKERS || cpus().length, 8));
export const engineQueueLimit = config.ENGINE_QUEUE || 8 * engineThreads;
/** Seconds a refused client is told to wait. */
const RETRY_AFTER_S = 2;

function compileWorker(): string {
  const out = path.join(tmpdir(), `lanewright-engine-worker-${process.pid}-${crypto.randomBytes(4).toString('hex')}.mjs`);
  buildSync({ entryPoints: [path.join(here, 'engineWorker.ts')], bundle: true, platform: 'node', format: 'esm', target: 'node20', outfile: out, logLevel: 'silent', legalComments: 'none' });
  return out;
}

function getPool(): Piscina {
  if (pool) return pool;
  const started = Date.now();
  compiled = compileWorker();
  const file = compiled;
  process.once('exit', () => fs.rmSync(file, { force: true }));
  pool = new Piscina({ filename: compiled, minThreads: engineThreads, maxThreads: engineThreads, idleTimeout: Infinity, maxQueue: engineQueueLimit });
  pool.on('error', (err: unknown) => logger.error({ err }, 'engine worker failed'));
  logger.debug({ threads: engineThreads, queue: engineQueueLimit, ms: Date.now() - started }, 'engine pool ready');
  return pool;
}

/** Starts the pool now (the server calls this at start, so the first ranking finds warm threads). */
export function warmEnginePool(): void {
  getPool();
}

function busy(err: unknown): never {
  if (err instanceof Error && /queue is at limit|no task queue available/i.test(err.message)) {
    throw new AppError(503, 'engine_busy', 'The ranking engine is busy; try again in a moment', undefined, RETRY_AFTER_S);
  }
  throw err;
}

/** rankArsenal in a worker thread; an aborted signal (the client went away) drops the task if it has not started. */
export function rankInWorker(input: RankArsenalInput, signal?: AbortSignal): Promise<RankedBall[]> {
  return (getPool().run(input, { name: 'rank', ...(signal ? { signal } : {}) }) as Promise<RankedBall[]>).catch(busy);
}

/** fitCalibration in a worker thread (about 25 ms of model deliveries per logged shot: too slow for the request thread). */
export function calibrateInWorker(input: Parameters<typeof fitCalibration>[0], signal?: AbortSignal): Promise<Calibration> {
  return (getPool().run(input, { name: 'calibrate', ...(signal ? { signal } : {}) }) as Promise<Calibration>).catch(busy);
}

/** Tasks waiting for a thread and threads in use (health and tests). */
export function engineLoad(): { queued: number; threads: number } {
  return { queued: pool?.queueSize ?? 0, threads: pool?.threads.length ?? 0 };
}

export async function closeEnginePool(): Promise<void> {
  if (pool) {
    const p = pool;
    pool = null;
    await p.destroy();
  }
  if (compiled) {
    fs.rmSync(compiled, { force: true });
    compiled = null;
  }
}
