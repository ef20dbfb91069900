import { wrap, type Remote } from 'comlink';
import type { PairAdvice, RankArsenalInput, RankedBallWithPrediction } from '@engine/index';
import { ballToArsenalBall, type Ball } from '@shared/balls';
import type { EngineWorker } from '@/workers/engine.worker';

let remote: Remote<EngineWorker> | null = null;

/** The one engine worker of the page, started on first use (Vite bundles it as its own module chunk). */
function engineWorker(): Remote<EngineWorker> {
  remote ??= wrap<EngineWorker>(new Worker(new URL('../workers/engine.worker.ts', import.meta.url), { type: 'module' }));
  return remote;
}

/** rankArsenal in the engine worker; the input is copied as plain data first (reactive proxies cannot cross to a worker). */
export async function rankInWorker(input: RankArsenalInput): Promise<RankedBallWithPrediction[]> {
  return engineWorker().rankArsenal(JSON.parse(JSON.stringify(input)) as RankArsenalInput);
}

/** pairAdvice in the engine worker (plain data across, as rankInWorker). */
export async function pairAdviceInWorker(
  input: Omit<RankArsenalInput, 'gamesBowled'> & { gamesBowled: number; ballInUse: string },
): Promise<PairAdvice> {
  return engineWorker().pairAdvice(JSON.parse(JSON.stringify(input)) as typeof input);
}

/**
 * One ball ranked in the engine worker on the given condition, as the server's matchup ranks it (a ball's numbers
 * never depend on the other balls ranked with it): the what-if and the coach's side by side both ask this way.
 */
export async function rankOneInWorker(ball: Ball, on: Omit<RankArsenalInput, 'balls'>): Promise<RankedBallWithPrediction | null> {
  const [ranked] = await rankInWorker({ balls: [ballToArsenalBall(ball)], ...on });
  return ranked ?? null;
}

/**
 * Keeps only the newest of overlapping runs: `const run = latestOnly()`, then `const r = await run(() => work())` is
 * `{ value, stale }`, `stale` when a newer run started meanwhile (its answer is then dropped by the caller).
 */
export function latestOnly() {
  let calls = 0;
  return async <T>(work: () => Promise<T>): Promise<{ value: T; stale: boolean }> => {
    const call = ++calls;
    const value = await work();
    return { value, stale: call !== calls };
  };
}
