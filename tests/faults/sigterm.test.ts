import http from 'node:http';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { call, ownCluster, sleep, startServer, userWithRole, type OwnCluster, type ServerProcess } from './harness';

/**
 * SIGTERM while requests are in flight: the server stops accepting new connections at once, lets the
 * requests it has finish (a request whose body is still arriving, and rankings running in the worker
 * threads), then closes the pool and exits with code 0.
 */
let cluster: OwnCluster;
let server: ServerProcess;

beforeAll(async () => {
  cluster = await ownCluster('fault-sigterm');
  server = await startServer({ DATABASE_URL: cluster.url });
});
afterAll(async () => {
  await server?.kill();
  cluster?.remove();
});

/**
 * A PUT whose body is sent in two halves; resolves with the answer. It asks `Expect: 100-continue` (RFC 9110
 * §10.1.1), so `headersSent` resolves only once the server has parsed the request's headers and answered
 * "100 Continue": from then on the connection carries a request in progress, however busy the machine is.
 */
function slowPut(base: string, path: string, token: string, body: unknown) {
  const payload = Buffer.from(JSON.stringify(body));
  const url = new URL(path, base);
  let sendRest: () => void = () => undefined;
  let markSent: () => void = () => undefined;
  const headersSent = new Promise<void>((r) => (markSent = r));
  const answer = new Promise<{ status: number; body: string }>((resolve, reject) => {
    const req = http.request(
      {
        host: url.hostname,
        port: url.port,
        path: url.pathname,
        method: 'PUT',
        headers: {
          'content-type': 'application/json',
          'content-length': payload.length,
          authorization: `Bearer ${token}`,
          expect: '100-continue',
        },
      },
      (res) => {
        let text = '';
        res.on('data', (d: Buffer) => (text += d.toString()));
        res.on('end', () => resolve({ status: res.statusCode ?? 0, body: text }));
      },
    );
    req.on('error', reject);
    req.on('continue', () => req.write(payload.subarray(0, 10), () => markSent()));
    req.flushHeaders();
    sendRest = () => req.end(payload.subarray(10));
  });
  return { answer, headersSent, sendRest: () => sendRest() };
}

/** Opens fresh connections to `base` until one is refused (returns 'ECONNREFUSED') or `ms` pass (returns the last outcome). */
async function refusedWithin(base: string, ms: number): Promise<string> {
  const deadline = Date.now() + ms;
  let outcome = '';
  while (Date.now() < deadline) {
    outcome = await new Promise<string>((resolve) => {
      const req = http.get(`${base}/api/health`, { agent: false }, (res) => {
        res.resume();
        resolve(`answered ${res.statusCode}`);
      });
      req.setTimeout(2000, () => req.destroy(new Error('no answer within 2 s')));
      req.on('error', (e: NodeJS.ErrnoException) => resolve(e.code ?? e.message));
    });
    if (outcome === 'ECONNREFUSED') return outcome;
    await sleep(50);
  }
  return outcome;
}

describe('SIGTERM during requests', () => {
  it('in-flight requests finish, new connections are refused, then the process exits 0', async () => {
    const coach = await userWithRole(server, cluster, 'coach', 'term-coach');
    const bowler = await userWithRole(server, cluster, 'bowler', 'term-bowler');
    const pattern = await call(server.base, 'POST', '/api/patterns', {
      token: coach.token,
      body: {
        name: 'Shutdown Long 45',
        visibility: 'published', // the bowler ranks on it: a draft is the coach's own
        sweeps: [{ direction: 'forward', fromBoard: 2, toBoard: 38, startFt: 0, endFt: 45, crossings: 4, microlitersPerBoard: 70 }],
      },
    });
    expect(pattern.status).toBe(201);
    for (const [i, cover] of ['reactive-solid', 'reactive-pearl', 'reactive-hybrid', 'urethane'].entries()) {
      const b = await call(server.base, 'POST', '/api/arsenal', {
        token: bowler.token,
        body: {
          name: `Term ${i}`,
          coverType: cover,
          coreType: 'asymmetric',
          rg: 2.5,
          differential: 0.05,
          intermediateDifferential: 0.015,
          weightLb: 15,
          surfaceGrit: 2000,
          polished: false,
        },
      });
      expect(b.status).toBe(201);
    }

    // In flight when the signal arrives: a request half sent, and cold rankings (each input new).
    const slow = slowPut(server.base, '/api/profile', bowler.token, { speedMph: 18.5, revRpm: 410 });
    const rankings = Array.from({ length: 6 }, (_, i) =>
      call(server.base, 'POST', '/api/matchups', {
        token: bowler.token,
        body: { patternId: pattern.body.item.id, gamesBowled: 1 + i / 7 },
      }),
    );
    // The signal only once the server has the request's headers (its 100 Continue): a connection that has not started a request yet is idle, and closing idle connections is the point of a graceful stop.
    await slow.headersSent;
    await sleep(400);
    const signalled = Date.now();
    server.child.kill('SIGTERM');

    // No new connections once it is stopping: fresh TCP connections (not from a keep-alive pool) until one is
    // refused. One accepted before the process got to the signal may still be answered, or closed as idle.
    const late = await refusedWithin(server.base, 5000);
    expect(late).toBe('ECONNREFUSED');

    slow.sendRest();
    const put = await slow.answer.catch((e: Error) => {
      throw new Error(`the half-sent request failed (${e.message}); server log:\n${server.output().slice(-3000)}`);
    });
    expect(put.status).toBe(200);
    expect(JSON.parse(put.body)).toMatchObject({ saved: true, profile: { speedMph: 18.5, revRpm: 410 } });
    const ranked = await Promise.all(rankings);
    expect(ranked.map((r) => r.status)).toEqual([200, 200, 200, 200, 200, 200]);
    for (const r of ranked) expect(r.body.rankings.length).toBe(4);

    const exit = await server.exited;
    expect(exit).toEqual({ code: 0, signal: null });
    expect(Date.now() - signalled).toBeLessThan(10000); // well before the 10 s forced close
    const rows = await cluster.query<{ speed_mph: number; rev_rpm: number }>(
      'SELECT speed_mph, rev_rpm FROM bowler_profiles WHERE user_id = $1',
      [bowler.id],
    );
    expect(rows.map((r) => [Number(r.speed_mph), Number(r.rev_rpm)])).toEqual([[18.5, 410]]);
    expect(server.output()).not.toMatch(/"level":(50|60)/); // no error logged on the way out
  });
});
