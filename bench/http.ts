/**
 * HTTP benchmarks (the second half of `npm run bench`): the real server on a throwaway PostgreSQL,
 * loaded with autocannon on loopback, each beside a bare-Express floor measured in the same run;
 * plus the client's initial JavaScript size. Figures are appended to bench/results.json under "http".
 *
 *  - POST /api/matchups for a 15-ball arsenal at 10 concurrent connections: p95 latency, repeated input (≤ 300 ms)
 *    and cold, every input new (≤ 150 ms); the size of the answer (≤ 40 kB)
 *  - GET /api/arsenal: requests per second against bare Express answering the same body (≥ 0.5 ×), and for a
 *    bowler with 1 000 balls (≥ 0.3 ×); the load average is written beside the figures
 *  - the server's peak RSS over these loads (the statistics page under load is bench/stats.ts, on the production build)
 *  - the built client's initial JS (entry chunk + modulepreloads), kB gzip (target ≤ 350)
 */
import type { ChildProcess } from 'node:child_process';
import fs from 'node:fs';
import nodeHttp from 'node:http';
import path from 'node:path';
import zlib from 'node:zlib';
import { bin, migrateAndSeed, root, run, signIn as signInAt, startServer, stopAll, throwawayCluster } from './lib/benchServer';
import { aThousandBalls, arsenalOfFifteen } from './lib/httpData';
import { bareFloor, clientInitialJsGzipKb, load } from './lib/httpLoad';
import { reportHttp } from './lib/httpReport';
import { productionEnv } from './lib/productionEnv';
import { freePort } from '../scripts/lib/pg.mjs';

async function main(): Promise<void> {
  const { dir, adminUrl } = await throwawayCluster('lanewright-bench-');
  let server: ChildProcess | null = null;
  try {
    const env = productionEnv(adminUrl);
    migrateAndSeed(env);
    const distDir = path.join(root, 'dist', 'bench-client');
    run(bin('vite'), ['build', '--logLevel', 'error', '--outDir', distDir], env);
    const jsKb = clientInitialJsGzipKb(distDir);

    const port = await freePort();
    // ENGINE_QUEUE 16: all 10 connections' rankings wait their turn (the default, 8 per thread, refuses the tenth with
    // a fast 503 that would flatter the latency); the server's own log stays quiet below errors.
    // Started as `node --import tsx` so server.pid is the server itself (its peak memory is read from /proc).
    const started = await startServer({
      env: { ...env, CLIENT_DIST: distDir, RATE_LIMIT_AUTH: '100000', ENGINE_QUEUE: '16', LOG_LEVEL: 'error' },
      port,
      tries: 100,
      ownPid: true,
    });
    server = started.server;
    const { base } = started;
    const signIn = (email: string) => signInAt(base, email);
    const auth = await signIn('dana@copperline.example');
    await arsenalOfFifteen(base, auth);
    const patterns = (await (await fetch(`${base}/api/patterns`, { headers: auth })).json()) as { items: { id: number; name: string }[] };
    const heavy = patterns.items.find((p) => /Long/.test(p.name)) ?? patterns.items[0];
    // A second bowler with 1 000 balls (copies of his own, written straight to the database).
    const big = await signIn('lee@copperline.example');
    await aThousandBalls(adminUrl);

    // The lists first, so no queued ranking from the matchup runs competes with them; each beside bare Express
    // answering the very body the route answers, measured just before it.
    const listBody = await (await fetch(`${base}/api/arsenal`, { headers: auth })).json();
    const bigBody = (await (await fetch(`${base}/api/arsenal`, { headers: big })).json()) as { total: number };
    const floor = await bareFloor(listBody);
    const list = await load({ url: `${base}/api/arsenal`, headers: auth, connections: 10, duration: 10 });
    const floorBig = await bareFloor(bigBody);
    const listBig = await load({ url: `${base}/api/arsenal`, headers: big, connections: 10, duration: 10 });

    await load({
      url: `${base}/api/matchups`,
      method: 'POST',
      headers: auth,
      body: JSON.stringify({ patternId: heavy.id }),
      connections: 2,
      duration: 2,
    }); // warm the workers
    const matchups = await load({
      url: `${base}/api/matchups`,
      method: 'POST',
      headers: auth,
      body: JSON.stringify({ patternId: heavy.id }),
      connections: 10,
      duration: 10,
    });
    // Cold: every request a different input (games bowled in steps of 0.001), so the ranking cache never answers.
    let n = 0;
    const cold = await load({
      url: `${base}/api/matchups`,
      connections: 10,
      duration: 10,
      requests: [
        {
          method: 'POST',
          headers: auth,
          setupRequest: (req) => ({ ...req, body: JSON.stringify({ patternId: heavy.id, gamesBowled: ((n++ % 29000) + 1) / 1000 }) }),
        },
      ],
    });
    // The answer's size: its JSON, and the bytes on the wire for a client that accepts gzip (every browser).
    const wire = await new Promise<Buffer>((resolve, reject) => {
      const req = nodeHttp.request(`${base}/api/matchups`, { method: 'POST', headers: { ...auth, 'accept-encoding': 'gzip' } }, (res) => {
        const chunks: Buffer[] = [];
        res.on('data', (c: Buffer) => chunks.push(c));
        res.on('end', () => resolve(Buffer.concat(chunks)));
      });
      req.on('error', reject);
      req.end(JSON.stringify({ patternId: heavy.id, gamesBowled: 29.5 }));
    });
    const answerKb = wire.length / 1024;
    const answerJsonKb = zlib.gunzipSync(wire).length / 1024;
    const peakRssMb = () => {
      const m = /VmHWM:\s+(\d+) kB/.exec(fs.readFileSync(`/proc/${server!.pid}/status`, 'utf8'));
      return m ? Number(m[1]) / 1024 : NaN;
    };
    const rssMb = peakRssMb();

    reportHttp({
      matchups,
      cold,
      answerKb,
      answerJsonKb,
      floor,
      floorBig,
      list,
      listBig,
      listBalls: (listBody as { total: number }).total,
      bigBalls: bigBody.total,
      rssMb,
      jsKb,
    });
  } finally {
    await stopAll(server, dir, 500);
  }
}

await main();
