import { describe, expect, it, vi } from 'vitest';

// This file's server gets one engine thread and a queue of one (set before the configuration is read).
vi.hoisted(() => {
  process.env.ENGINE_WORKERS = '1';
  process.env.ENGINE_QUEUE = '1';
});

const { api, createUser, errorOf } = await import('../../helpers/api');
const { createBall, createPattern } = await import('../../helpers/fixtures');
const { engineQueueLimit, engineThreads, rankInWorker } = await import('../../../server/lib/enginePool');
const { AppError } = await import('../../../server/lib/AppError');
const { longHeavy, polishedPearl, roughAsymSolid, typicalBowler, urethaneBall } = await import('../../engine/fixtures');

/** A ranking that keeps the one thread busy for a while: many balls through the motion model. */
const heavyInput = (games: number) => ({ balls: Array.from({ length: 60 }, (_, i) => ({ ...[roughAsymSolid, polishedPearl, urethaneBall][i % 3], id: `b${i}` })), bowler: typicalBowler, pattern: longHeavy, gamesBowled: games });

/** Finding 9: a full ranking queue answers 503 with Retry-After at once instead of letting requests hang. */
describe('the ranking queue is bounded', () => {
  it('with 1 thread and 1 waiting, a third task is refused at once as engine_busy (503, Retry-After)', async () => {
    expect([engineThreads, engineQueueLimit]).toEqual([1, 1]);
    const running = rankInWorker(heavyInput(0.1));
    const waiting = rankInWorker(heavyInput(0.2));
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

  it('over HTTP: while the thread and the queue are taken, a matchup gets 503 with Retry-After in the error shape; afterwards 200', async () => {
    const { user, auth } = await createUser();
    await createBall(user.id);
    const pattern = await createPattern(user.id);
    const hold = [rankInWorker(heavyInput(1.1)), rankInWorker(heavyInput(1.2))];
    const res = await api.post('/api/matchups').set(auth).send({ patternId: pattern.id });
    expect(res.status).toBe(503);
    expect(errorOf(res.body).code).toBe('engine_busy');
    expect(Number(res.headers['retry-after'])).toBeGreaterThanOrEqual(1);
    await Promise.allSettled(hold);
    expect((await api.post('/api/matchups').set(auth).send({ patternId: pattern.id })).status).toBe(200);
  }, 60000);
});
