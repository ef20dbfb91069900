import { beforeAll, describe, expect, it, vi } from 'vitest';

// This file's server gets one engine thread, a queue of one and a 300 ms queueing deadline (set before the configuration is read).
vi.hoisted(() => {
  process.env.ENGINE_WORKERS = '1';
  process.env.ENGINE_QUEUE = '1';
  process.env.ENGINE_QUEUE_WAIT_MS = '300';
});

const { api, createUser, errorOf } = await import('../../helpers/api');
const { createBall, createPattern } = await import('../../helpers/fixtures');
const { engineLoad, engineQueueLimit, engineQueueWaitMs, engineThreadIds, engineThreads, rankInWorker, warmEnginePool } =
  await import('../../../server/lib/enginePool');
const { AppError } = await import('../../../server/lib/AppError');
const { longHeavy, polishedPearl, roughAsymSolid, typicalBowler, urethaneBall } = await import('../../engine/fixtures');

/** A ranking that keeps the one thread busy for a while: many balls through the motion model. */
const heavyInput = (games: number, count = 60) => ({
  balls: Array.from({ length: count }, (_, i) => ({ ...[roughAsymSolid, polishedPearl, urethaneBall][i % 3], id: `b${i}` })),
  bowler: typicalBowler,
  pattern: longHeavy,
  gamesBowled: games,
});

/** Finding 9: a full ranking queue answers 503 with Retry-After at once instead of letting requests hang. */
/** A task whose outcome (done or refused) is only waited for. */
const settled = (p: Promise<unknown>) =>
  p.then(
    () => 'ran',
    (e: unknown) => (e instanceof AppError ? e.code : String(e)),
  );

/**
 * Balls in a ranking that holds the one thread for a second or more on this machine (3 s by a cold estimate), far past the 300 ms
 * deadline: sized from a timed ranking, since the motion model's speed changes with the engine and the machine.
 */
let blockingCount = 150;
beforeAll(async () => {
  warmEnginePool(); // as the server does at start
  await rankInWorker(heavyInput(0.05, 30)); // the thread's first run compiles the engine
  const started = Date.now();
  await rankInWorker(heavyInput(0.06, 60));
  const msPerBall = Math.max(0.2, (Date.now() - started) / 60);
  blockingCount = Math.min(6000, Math.max(150, Math.ceil(3000 / msPerBall)));
}, 60000);

describe('the ranking queue is bounded', () => {
  it('with 1 thread and 1 waiting, a third task is refused at once as engine_busy (503, Retry-After)', async () => {
    expect([engineThreads, engineQueueLimit]).toEqual([1, 1]);
    const running = settled(rankInWorker(heavyInput(0.1)));
    const waiting = settled(rankInWorker(heavyInput(0.2)));
    const started = Date.now();
    const refused = await rankInWorker(heavyInput(0.3)).then(
      () => null,
      (e: unknown) => e,
    );
    expect(Date.now() - started).toBeLessThan(100);
    expect(refused).toBeInstanceOf(AppError);
    expect(refused).toMatchObject({ status: 503, code: 'engine_busy' });
    expect((refused as InstanceType<typeof AppError>).retryAfterS).toBeGreaterThanOrEqual(1);
    await Promise.allSettled([running, waiting]);
    expect((await rankInWorker(heavyInput(0.4))).length).toBeGreaterThan(0);
  }, 60000);

  it('a task that waits longer than ENGINE_QUEUE_WAIT_MS for a thread is refused (503) at the deadline, not left to hang', async () => {
    expect(engineQueueWaitMs).toBe(300);
    const longest = heavyInput(2, blockingCount); // a second or more, well past the 300 ms deadline
    const running = settled(rankInWorker(longest));
    const started = Date.now();
    const waited = await rankInWorker(heavyInput(2.5)).then(
      () => 'ran',
      (e: unknown) => (e instanceof AppError ? e.code : String(e)),
    );
    const ms = Date.now() - started;
    expect(waited).toBe('engine_busy');
    expect(ms).toBeGreaterThanOrEqual(250);
    expect(ms).toBeLessThan(1500);
    await running;
  }, 60000);

  it('a ranking whose client went away stops between balls, and the same thread ranks the next one', async () => {
    const threads = engineThreadIds();
    expect(threads).toHaveLength(1);
    const gone = new AbortController();
    const started = Date.now();
    const running = rankInWorker(heavyInput(3, blockingCount), gone.signal).then(
      () => 'ran',
      (e: unknown) => (e instanceof Error ? e.message : String(e)),
    );
    expect(engineLoad().threads).toBe(1); // it has the thread: only the check between balls can stop it now
    gone.abort();
    expect(await running).toMatch(/stopped before ball .*went away/);
    expect(Date.now() - started).toBeLessThan(1500); // the whole ranking holds the thread for seconds
    expect((await rankInWorker(heavyInput(3.5, 6))).length).toBe(6);
    expect(engineThreadIds()).toEqual(threads);
  }, 60000);

  it('over HTTP: while the thread and the queue are taken, a matchup gets 503 with Retry-After in the error shape; afterwards 200', async () => {
    const { user, auth } = await createUser();
    await createBall(user.id);
    const pattern = await createPattern(user.id);
    const hold = [settled(rankInWorker(heavyInput(1.1, blockingCount))), settled(rankInWorker(heavyInput(1.2)))];
    const res = await api.post('/api/matchups').set(auth).send({ patternId: pattern.id });
    expect(res.status).toBe(503);
    expect(errorOf(res.body).code).toBe('engine_busy');
    expect(Number(res.headers['retry-after'])).toBeGreaterThanOrEqual(1);
    await Promise.allSettled(hold);
    expect((await api.post('/api/matchups').set(auth).send({ patternId: pattern.id })).status).toBe(200);
  }, 60000);
});
