import crypto from 'node:crypto';
import fs from 'node:fs';
import { createRequire } from 'node:module';
import { cpus, tmpdir } from 'node:os';
import path from 'node:path';
import { fileURLToPath } from 'node:url';
import { Piscina } from 'piscina';
import type { fitCalibration, GameCountsRow } from '../../engine/index';
import type { Calibration, Move, ShotRecord } from '../../engine/shotlog/types';
import type { RankArsenalInput, RankedBall } from '../../engine/types';
import { config } from '../config/index';
import { AppError } from './AppError';
import { logger } from './logger';
import { rankingSeconds } from './metrics';
import type { RankTask, StatsParts, StatsTask } from './engineWorker';

const here = path.dirname(fileURLToPath(import.meta.url));

/**
 * Heavy engine work (ranking with the ball-motion model) runs in worker threads so a request never holds the
 * event loop. The pool stays warm and bounded:
 *  - the worker (engineWorker.ts and the engine) is plain JavaScript when a thread starts: the production build
 *    ships it as dist/server/engineWorker.js; in development it is compiled once per process with esbuild;
 *  - every thread starts with the pool and none retires when idle (minThreads = maxThreads, no idle
 *    timeout): after a quiet minute the first requests do not wait for cold threads;
 *  - a task is handed to piscina only when a thread is free; at most ENGINE_QUEUE tasks wait for one, and
 *    none waits longer than ENGINE_QUEUE_WAIT_MS: past either, the request is answered 503 with Retry-After
 *    instead of waiting past any client's patience (load shedding with a bounded queue and a queueing
 *    deadline, common practice).
 */
let pool: Piscina | null = null;
let compiled: string | null = null;

/** Default: one thread per core but one, left to the event loop and the database (on 2 cores: 1 thread), at most 8. */
export const engineThreads = Math.max(1, Math.min(config.ENGINE_WORKERS || cpus().length - 1, 8));
export const engineQueueLimit = config.ENGINE_QUEUE || 8 * engineThreads;
export const engineQueueWaitMs = config.ENGINE_QUEUE_WAIT_MS;
/** Seconds a refused client is told to wait. */
const RETRY_AFTER_S = 2;

const busyError = () => new AppError(503, 'engine_busy', 'The ranking engine is busy; try again in a moment', undefined, RETRY_AFTER_S);

/** Free threads and the line of tasks waiting for one (each with its deadline). */
let active = 0;
const line: { go: () => void; fail: (err: unknown) => void }[] = [];

function release(): void {
  const next = line.shift();
  if (next) next.go();
  else active -= 1;
}

/** Waits for a free thread (resolves with its release), or refuses: line full, waited too long, or the client went away. */
function acquire(signal?: AbortSignal): Promise<() => void> {
  if (active < engineThreads) {
    active += 1;
    return Promise.resolve(release);
  }
  if (line.length >= engineQueueLimit) return Promise.reject(busyError());
  return new Promise((resolve, reject) => {
    const entry = {
      go: () => {
        clearTimeout(timer);
        signal?.removeEventListener('abort', onAbort);
        resolve(release);
      },
      fail: (err: unknown) => {
        clearTimeout(timer);
        signal?.removeEventListener('abort', onAbort);
        const i = line.indexOf(entry);
        if (i >= 0) line.splice(i, 1);
        reject(err);
      },
    };
    const timer = setTimeout(() => entry.fail(busyError()), engineQueueWaitMs);
    const onAbort = () => entry.fail(signal!.reason ?? new Error('aborted'));
    signal?.addEventListener('abort', onAbort, { once: true });
    line.push(entry);
  });
}

async function runTask<T>(name: string, input: unknown, signal?: AbortSignal): Promise<T> {
  const done = await acquire(signal);
  const started = Date.now();
  try {
    return (await getPool().run(input, { name })) as T;
  } finally {
    done();
    if (name === 'rank') rankingSeconds.observe((Date.now() - started) / 1000);
  }
}

/** The production build's ranking thread, beside the bundle (or one folder up from a shared chunk). */
function builtWorker(): string | null {
  for (const dir of [here, path.dirname(here)]) {
    const f = path.join(dir, 'engineWorker.js');
    if (fs.existsSync(f)) return f;
  }
  return null;
}

function compileWorker(): string {
  // Development only: esbuild is a development dependency, loaded here on demand.
  const { buildSync } = createRequire(import.meta.url)('esbuild') as typeof import('esbuild');
  const out = path.join(tmpdir(), `lanewright-engine-worker-${process.pid}-${crypto.randomBytes(4).toString('hex')}.mjs`);
  buildSync({
    entryPoints: [path.join(here, 'engineWorker.ts')],
    bundle: true,
    platform: 'node',
    format: 'esm',
    target: 'node20',
    outfile: out,
    logLevel: 'silent',
    legalComments: 'none',
  });
  return out;
}

/** The worker's file: the build's, else (development) compiled once per process. */
function workerFile(): string {
  const built = builtWorker();
  if (built) return built;
  if (!compiled) {
    compiled = compileWorker();
    const file = compiled;
    process.once('exit', () => fs.rmSync(file, { force: true }));
  }
  return compiled;
}

function getPool(): Piscina {
  if (pool) return pool;
  const started = Date.now();
  const filename = workerFile();
  pool = new Piscina({ filename, minThreads: engineThreads, maxThreads: engineThreads, idleTimeout: Infinity });
  pool.on('error', (err: unknown) => logger.error({ err }, 'engine worker failed'));
  logger.debug({ threads: engineThreads, queue: engineQueueLimit, ms: Date.now() - started }, 'engine pool ready');
  return pool;
}

/** Starts the pool now (the server calls this at start, so the first ranking finds warm threads). */
export function warmEnginePool(): void {
  getPool();
}

/**
 * rankArsenal in a worker thread. An aborted signal (the client went away) drops the task while it waits, and once it
 * runs raises a flag the thread reads between balls: the ranking stops there and the thread takes the next task
 * (a thread is never terminated, so no ranking waits for a new one to start).
 */
export function rankInWorker(input: RankArsenalInput, signal?: AbortSignal): Promise<RankedBall[]> {
  const abort = new Int32Array(new SharedArrayBuffer(4));
  const raise = () => Atomics.store(abort, 0, 1);
  signal?.addEventListener('abort', raise, { once: true });
  const task: RankTask = { input, abort };
  return runTask<RankedBall[]>('rank', task, signal).finally(() => signal?.removeEventListener('abort', raise));
}

/** fitCalibration in a worker thread (about 25 ms of model deliveries per logged shot: too slow for the request thread). */
export function calibrateInWorker(input: Parameters<typeof fitCalibration>[0], signal?: AbortSignal): Promise<Calibration> {
  return runTask<Calibration>('calibrate', input, signal);
}

/**
 * Shot statistics run on a thread of their own, one task at a time, so they hold neither the event loop nor the ranking
 * threads: the statistics of summed counts and the moves of the latest shots (milliseconds), counting the games whose
 * shots changed (a season's first count: hundreds of milliseconds) and the moves of a longer run of latest shots.
 * Started on first use; it stays.
 */
let statsPool: Piscina | null = null;

function statsTask<T>(name: 'stats' | 'countGames' | 'moves', task: unknown): Promise<T> {
  statsPool ??= new Piscina({ filename: workerFile(), minThreads: 1, maxThreads: 1, idleTimeout: Infinity });
  return statsPool.run(task, { name }) as Promise<T>;
}

export const statsInWorker = (task: StatsTask): Promise<StatsParts> => statsTask('stats', task);
export const countGamesInWorker = (records: ShotRecord[]): Promise<GameCountsRow[]> => statsTask('countGames', records);
export const movesInWorker = (task: { shots: ShotRecord[]; hand: 'right' | 'left'; complete: boolean }): Promise<Move[] | null> =>
  statsTask('moves', task);

/** The ids of the pool's threads (tests: a thread is never replaced after an aborted ranking). */
export function engineThreadIds(): number[] {
  return (pool?.threads ?? []).map((t) => t.threadId);
}

/** Tasks waiting for a thread and threads in use (health and tests). */
export function engineLoad(): { queued: number; threads: number } {
  return { queued: line.length, threads: active };
}

export async function closeEnginePool(): Promise<void> {
  if (pool) {
    const p = pool;
    pool = null;
    await p.destroy();
  }
  if (statsPool) {
    const p = statsPool;
    statsPool = null;
    await p.destroy();
  }
  if (compiled) {
    fs.rmSync(compiled, { force: true });
    compiled = null;
  }
}
