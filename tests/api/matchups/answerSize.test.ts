import http from 'node:http';
import type { AddressInfo } from 'node:net';
import zlib from 'node:zlib';
import { describe, expect, it } from 'vitest';
import { simulateShot } from '../../../engine/index';
import { ballToSpec } from '../../../shared/balls';
import { DEFAULT_PROFILE } from '../../../shared/profile';
import { PATH_TOLERANCE_BOARDS } from '../../../server/features/matchups/matchups.service';
import { api, app, createUser } from '../../helpers/api';
import { createBall, createPattern, LONG_HEAVY, POLISHED_PEARL, STRONG_SOLID, URETHANE } from '../../helpers/fixtures';

interface Point {
  ft: number;
  board: number;
  speedMph: number;
}

/** Distance from p to the segment a–b in the (board, ft) plane. */
function toSegment(p: Point, a: Point, b: Point): number {
  const dx = b.board - a.board,
    dy = b.ft - a.ft;
  const t = dx === 0 && dy === 0 ? 0 : Math.max(0, Math.min(1, ((p.board - a.board) * dx + (p.ft - a.ft) * dy) / (dx * dx + dy * dy)));
  return Math.hypot(p.board - (a.board + t * dx), p.ft - (a.ft + t * dy));
}

describe('POST /api/matchups — the answer as sent', () => {
  it('sends each path at the lane view’s resolution: every engine sample within the tolerance of the line drawn, both ends kept', async () => {
    const me = await createUser();
    const ball = await createBall(me.user.id, STRONG_SOLID);
    const pattern = await createPattern(me.user.id, LONG_HEAVY);
    const res = await api.post('/api/matchups').set(me.auth).send({ patternId: pattern.id });
    expect(res.status).toBe(200);
    const sent = res.body.rankings[0].prediction as { path: Point[]; laydownBoard: number; targetBoard: number; entryBoard: number };
    // the engine's own path on the same line (the release and the ball as the server gave them)
    const full = simulateShot({
      ball: ballToSpec(ball),
      bowler: res.body.bowler ?? DEFAULT_PROFILE,
      pattern: { name: 'p', sweeps: res.body.pattern.sweeps },
      lane: res.body.lane,
      laydownBoard: sent.laydownBoard,
      targetBoard: sent.targetBoard,
    }).path;
    expect(sent.path.length).toBeLessThan(full.length / 2);
    expect(sent.path[0].ft).toBe(0);
    expect(sent.path[sent.path.length - 1].ft).toBeCloseTo(full[full.length - 1].ft, 1);
    for (const p of full) {
      let near = Infinity;
      for (let i = 1; i < sent.path.length; i++) near = Math.min(near, toSegment(p, sent.path[i - 1], sent.path[i]));
      expect(near).toBeLessThanOrEqual(PATH_TOLERANCE_BOARDS + 0.02); // plus the rounding to a hundredth of a board
    }
    expect(Math.abs(sent.entryBoard - 17.5)).toBeLessThanOrEqual(0.05); // figures are the engine's, unrounded
  });

  it('gzips the answer for a client that accepts it: 15 balls in under 40 kB on the wire', async () => {
    const me = await createUser();
    const specs = [STRONG_SOLID, POLISHED_PEARL, URETHANE];
    for (let i = 0; i < 15; i++) await createBall(me.user.id, specs[i % 3], { surfaceGrit: [500, 1000, 2000, 3000, 4000][i % 5] });
    const pattern = await createPattern(me.user.id, LONG_HEAVY);
    // Over a real socket, counting the bytes as they arrive (still compressed).
    const server = app.listen(0, '127.0.0.1');
    await new Promise((r) => server.once('listening', r));
    const { port } = server.address() as AddressInfo;
    const body = JSON.stringify({ patternId: pattern.id });
    const got = await new Promise<{ status: number; encoding: string | undefined; wire: Buffer }>((resolve, reject) => {
      const req = http.request(
        {
          host: '127.0.0.1',
          port,
          method: 'POST',
          path: '/api/matchups',
          headers: { ...me.auth, 'content-type': 'application/json', 'accept-encoding': 'gzip' },
        },
        (res) => {
          const chunks: Buffer[] = [];
          res.on('data', (c: Buffer) => chunks.push(c));
          res.on('end', () =>
            resolve({ status: res.statusCode ?? 0, encoding: res.headers['content-encoding'], wire: Buffer.concat(chunks) }),
          );
        },
      );
      req.on('error', reject);
      req.end(body);
    }).finally(() => server.close());
    expect(got.status).toBe(200);
    expect(got.encoding).toBe('gzip');
    expect(got.wire.length).toBeLessThanOrEqual(40 * 1024);
    const answer = JSON.parse(zlib.gunzipSync(got.wire).toString('utf8')) as { rankings: unknown[] };
    expect(answer.rankings).toHaveLength(15);
  });
});
