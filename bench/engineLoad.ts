/**
 * Ranking load after idle (the last part of `npm run bench`; alone: `npm run bench:engine-load`): the real
 * server (NODE_ENV=production, default engine pool) on a throwaway PostgreSQL with the demo seed, on loopback.
 *
 *  1. Idle for BENCH_IDLE_S (default 90) seconds, then 100 distinct matchups at once.
 *  2. 50 concurrent clients for BENCH_DURATION (default 30) seconds, each sending distinct matchups one after
 *     another and, when refused, waiting the Retry-After it was given; meanwhile /api/health once every 100 ms.
 *
 * Every request has a 10 s client timeout. Targets: no request waits past 10 s (no timeouts), every refusal is a
 * 503 with Retry-After, nothing else outside 2xx, and /api/health p95 under 200 ms while the engine is loaded.
 * Distinct inputs (pattern × gamesBowled) keep the ranking cache from answering. Written to bench/results.json
 * under "engineLoad".
 */
import type { ChildProcess } from 'node:child_process';
import os from 'node:os';
import { migrateAndSeed, serverErrors, signIn, startServer, stopAll, throwawayCluster, writeResults } from './lib/benchServer';
import { productionEnv } from './lib/productionEnv';
import { freePort } from '../scripts/lib/pg.mjs';

const IDLE_S = Number(process.env.BENCH_IDLE_S ?? 90);
const DURATION_S = Number(process.env.BENCH_DURATION ?? 30);
const CONNECTIONS = Number(process.env.BENCH_CONNECTIONS ?? 50);
const BURST = 100;
const TIMEOUT_MS = 10_000;

interface Answer {
  status: number; // 0 = network error, -1 = client timeout
  ms: number;
  retryAfter: string | null;
}

async function send(url: string, init: RequestInit): Promise<Answer> {
  const t = performance.now();
  try {
    const res = await fetch(url, { ...init, signal: AbortSignal.timeout(TIMEOUT_MS) });
    await res.arrayBuffer();
    return { status: res.status, ms: performance.now() - t, retryAfter: res.headers.get('retry-after') };
  } catch (err) {
    return { status: (err as Error).name === 'TimeoutError' ? -1 : 0, ms: performance.now() - t, retryAfter: null };
  }
}

const pct = (xs: number[], p: number) => {
  if (xs.length === 0) return NaN;
  const s = [...xs].sort((a, b) => a - b);
  return s[Math.min(s.length - 1, Math.max(0, Math.ceil((p / 100) * s.length) - 1))];
};

function summary(answers: Answer[]) {
  const by = (f: (a: Answer) => boolean) => answers.filter(f).length;
  const ok = answers.filter((a) => a.status >= 200 && a.status < 300);
  return {
    requests: answers.length,
    ok: ok.length,
    refused503: by((a) => a.status === 503),
    refusedWithoutRetryAfter: by((a) => a.status === 503 && !a.retryAfter),
    other: by((a) => a.status !== 503 && (a.status < 200 || a.status >= 300)),
    timeouts: by((a) => a.status === -1),
    p50Ms: Math.round(
      pct(
        answers.map((a) => a.ms),
        50,
      ),
    ),
    p95Ms: Math.round(
      pct(
        answers.map((a) => a.ms),
        95,
      ),
    ),
    maxMs: Math.round(Math.max(...answers.map((a) => a.ms))),
    okP95Ms: Math.round(
      pct(
        ok.map((a) => a.ms),
        95,
      ),
    ),
  };
}

async function main(): Promise<void> {
  const { dir, adminUrl: url } = await throwawayCluster('lanewright-engine-load-');
  let server: ChildProcess | null = null;
  try {
    const port = await freePort();
    const env = productionEnv(url, `http://127.0.0.1:${port}`);
    migrateAndSeed(env);
    const started = await startServer({ env: { ...env, RATE_LIMIT_AUTH: '100000' }, port, tries: 150, collect: true });
    server = started.server;
    const { base, output } = started;
    const headers = await signIn(base, 'dana@copperline.example');
    const patterns = ((await (await fetch(`${base}/api/patterns`, { headers })).json()) as { items: { id: number }[] }).items.map(
      (p) => p.id,
    );
    let n = 0;
    /** A matchup no earlier request asked for (pattern × gamesBowled in steps of 0.01). */
    const nextBody = () => {
      n += 1;
      return JSON.stringify({ patternId: patterns[n % patterns.length], gamesBowled: Math.round(((n / 100) % 30) * 100) / 100 });
    };
    const matchup = () => send(`${base}/api/matchups`, { method: 'POST', headers, body: nextBody() });

    console.log(
      `\nEngine load (production server, ${os.cpus().length} cores): idle ${IDLE_S} s, then ${BURST} matchups at once; then ${CONNECTIONS} clients × ${DURATION_S} s`,
    );
    await new Promise((r) => setTimeout(r, IDLE_S * 1000));
    const burst = summary(await Promise.all(Array.from({ length: BURST }, matchup)));
    console.log(`after idle: ${JSON.stringify(burst)}`);

    const health: Answer[] = [];
    const sustained: Answer[] = [];
    const end = Date.now() + DURATION_S * 1000;
    const client = async () => {
      while (Date.now() < end) {
        const a = await matchup();
        sustained.push(a);
        if (a.status === 503) await new Promise((r) => setTimeout(r, Number(a.retryAfter ?? 1) * 1000));
      }
    };
    const poll = async () => {
      while (Date.now() < end) {
        health.push(await send(`${base}/api/health`, {}));
        await new Promise((r) => setTimeout(r, 100));
      }
    };
    await Promise.all([...Array.from({ length: CONNECTIONS }, client), poll()]);
    const load = { ...summary(sustained), rps: Math.round((sustained.length / DURATION_S) * 10) / 10 };
    const healthFig = {
      requests: health.length,
      notOk: health.filter((h) => h.status !== 200).length,
      p50Ms: Math.round(
        pct(
          health.map((h) => h.ms),
          50,
        ),
      ),
      p95Ms: Math.round(
        pct(
          health.map((h) => h.ms),
          95,
        ),
      ),
      maxMs: Math.round(Math.max(...health.map((h) => h.ms))),
    };
    console.log(`sustained:  ${JSON.stringify(load)}`);
    console.log(`health:     ${JSON.stringify(healthFig)}`);

    const failures: string[] = [];
    for (const [name, s] of [
      ['after idle', burst],
      ['sustained', load],
    ] as const) {
      if (s.timeouts) failures.push(`${name}: ${s.timeouts} requests waited past 10 s`);
      if (s.maxMs >= TIMEOUT_MS) failures.push(`${name}: a request took ${s.maxMs} ms`);
      if (s.refusedWithoutRetryAfter) failures.push(`${name}: ${s.refusedWithoutRetryAfter} refusals without Retry-After`);
      if (s.other) failures.push(`${name}: ${s.other} answers neither 2xx nor 503`);
    }
    if (!(healthFig.p95Ms < 200)) failures.push(`/api/health p95 ${healthFig.p95Ms} ms (target < 200 ms)`);
    console.log(
      failures.length
        ? `NOT MET:\n  ${failures.join('\n  ')}`
        : 'targets met: no request past 10 s, refusals are 503 with Retry-After, health p95 < 200 ms',
    );
    if (failures.length) console.log(serverErrors(output()));

    writeResults('engineLoad', {
      date: new Date().toISOString(),
      machine: { cpus: os.cpus().length, cpu: os.cpus()[0]?.model, node: process.version },
      idleS: IDLE_S,
      burst: BURST,
      connections: CONNECTIONS,
      durationS: DURATION_S,
      afterIdle: burst,
      sustained: load,
      health: healthFig,
      failures,
    });
    if (failures.length) process.exitCode = 1;
  } finally {
    await stopAll(server, dir, 1500);
  }
}

await main();
