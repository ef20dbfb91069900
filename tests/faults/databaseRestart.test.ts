import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { call, ownCluster, sleep, startServer, until, userWithRole, type OwnCluster, type ServerProcess } from './harness';

/**
 * PostgreSQL stopped and started again while a bowler logs shots: while it is down every request answers
 * 503 in the error shape (health says db unreachable), afterwards everything works again on the same
 * server process, and the client's retries (same Idempotency-Key) leave every shot stored exactly once.
 */
let cluster: OwnCluster;
let server: ServerProcess;

beforeAll(async () => {
  cluster = await ownCluster('fault-db');
  server = await startServer({ DATABASE_URL: cluster.url, LOG_LEVEL: 'info' });
});
afterAll(async () => {
  await server?.kill();
  cluster?.remove();
});

/** Three perfect games: frames 1–9 one strike each, frame 10 three strikes (12 deliveries a game). */
function perfectGames(games: number) {
  const out: { gameNumber: number; frame: number; delivery: number }[] = [];
  for (let g = 1; g <= games; g++) {
    for (let frame = 1; frame <= 9; frame++) out.push({ gameNumber: g, frame, delivery: 1 });
    for (let d = 1; d <= 3; d++) out.push({ gameNumber: g, frame: 10, delivery: d });
  }
  return out;
}

describe('PostgreSQL stopped and restarted mid-run', () => {
  it('503 in the error shape while it is down, success afterwards, no shot lost or doubled', async () => {
    const bowler = await userWithRole(server, cluster, 'bowler', 'db-bowler');
    const ball = await call(server.base, 'POST', '/api/arsenal', {
      token: bowler.token,
      body: {
        name: 'Fault Tester',
        coverType: 'reactive-solid',
        coreType: 'asymmetric',
        rg: 2.5,
        differential: 0.05,
        intermediateDifferential: 0.015,
        weightLb: 15,
        surfaceGrit: 2000,
        polished: false,
      },
    });
    expect(ball.status).toBe(201);
    const session = await call(server.base, 'POST', '/api/sessions', {
      token: bowler.token,
      body: { date: new Date().toISOString().slice(0, 10), kind: 'practice' },
    });
    expect(session.status).toBe(201);
    const sessionId = session.body.item.id as number;

    const shots = perfectGames(3);
    const seen = new Map<number, number>();
    const bad: string[] = [];
    let acknowledged = 0;
    let down = false;
    const downAnswers: number[] = [];

    // The client: each shot is sent until the server accepts it (201, or 200 for a retry the server already stored).
    const client = (async () => {
      for (const [i, s] of shots.entries()) {
        for (let attempt = 0; ; attempt++) {
          const r = await call(server.base, 'POST', `/api/sessions/${sessionId}/shots`, {
            token: bowler.token,
            headers: { 'Idempotency-Key': `fault-${sessionId}-${i}` },
            body: { ...s, ballId: ball.body.item.id, standing: [] },
          });
          seen.set(r.status, (seen.get(r.status) ?? 0) + 1);
          if (down) downAnswers.push(r.status);
          if (r.status === 201 || r.status === 200) {
            acknowledged += 1;
            break;
          }
          if (r.status !== 503 || r.body?.error?.code !== 'service_unavailable')
            bad.push(`${r.status} ${JSON.stringify(r.body).slice(0, 200)}`);
          if (attempt > 400) throw new Error('a shot was never accepted');
          await sleep(50);
        }
      }
    })();

    // The fault: once a few shots are in, stop the cluster for a few seconds, then start it again.
    await until(
      async () => acknowledged,
      (n) => n >= 6,
      20000,
      20,
    );
    // Requests in flight at the moment PostgreSQL goes away (their connections are terminated under them).
    const burst = Promise.all(
      Array.from({ length: 24 }, (_, i) =>
        call(server.base, 'GET', i % 3 === 0 ? '/api/stats' : i % 3 === 1 ? `/api/sessions/${sessionId}` : '/api/arsenal', {
          token: bowler.token,
        }),
      ),
    );
    await sleep(5);
    cluster.stop();
    down = true;
    for (const r of await burst)
      if (r.status !== 200 && !(r.status === 503 && r.body?.error?.code === 'service_unavailable'))
        bad.push(`in flight: ${r.status} ${JSON.stringify(r.body).slice(0, 200)}`);
    const healthDown = await call(server.base, 'GET', '/api/health');
    const readDown = await call(server.base, 'GET', `/api/sessions/${sessionId}`, {
      token: bowler.token,
      headers: { 'X-Request-Id': 'fault-db-probe-0001' },
    });
    await sleep(3000);
    const ackWhileDown = acknowledged;
    await cluster.start();
    down = false;
    await client;

    expect(healthDown.status).toBe(503);
    expect(healthDown.body).toMatchObject({ status: 'degraded', db: 'unreachable' });
    expect(readDown.status).toBe(503);
    expect(readDown.body.error).toMatchObject({ code: 'service_unavailable', message: expect.any(String) });
    if (bad.length)
      console.log(
        server
          .output()
          .split('\n')
          .filter((l) => l.includes('"level":50'))
          .join('\n')
          .slice(0, 4000),
      );
    expect(bad).toEqual([]); // only 503s in the error shape while it was down, never a 500
    expect(downAnswers.filter((s) => s === 503).length).toBeGreaterThan(0);
    expect(acknowledged).toBe(shots.length);
    expect(ackWhileDown).toBeLessThan(shots.length);

    // After: the same process serves again, and every shot is stored exactly once.
    const health = await until(
      () => call(server.base, 'GET', '/api/health'),
      (r) => r.status === 200,
      10000,
    );
    expect(health.body).toMatchObject({ status: 'ok', db: 'ok' });
    const rows = await cluster.query<{ n: string; keys: string }>(
      'SELECT count(*) AS n, count(DISTINCT idempotency_key) AS keys FROM shots WHERE session_id = $1',
      [sessionId],
    );
    expect(Number(rows[0].n)).toBe(shots.length);
    expect(Number(rows[0].keys)).toBe(shots.length);
    const detail = await call(server.base, 'GET', `/api/sessions/${sessionId}`, { token: bowler.token });
    expect(detail.status).toBe(200);
    expect(detail.body.item.gameViews.map((g: { total: number; complete: boolean }) => [g.total, g.complete])).toEqual([
      [300, true],
      [300, true],
      [300, true],
    ]);
    // The request id is on every log line of the request: the warning about the database and the access line.
    const probe = server
      .output()
      .split('\n')
      .filter((l) => l.includes('fault-db-probe-0001'));
    expect(probe.some((l) => l.includes('database unavailable'))).toBe(true);
    expect(probe.some((l) => l.includes('"msg":"request"') && l.includes('"status":503'))).toBe(true);
    expect(readDown.headers?.get('x-request-id')).toBe('fault-db-probe-0001');
    console.log(`[fault db] answers during the run: ${JSON.stringify(Object.fromEntries(seen))}`);
  });
});
