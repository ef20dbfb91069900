/**
 * League-night benchmark (the last part of `npm run bench`; alone: `npm run bench:league`): the simulated league
 * night of the scale-out test (tests/scaleout/leagueNight.ts: bowlers logging shots with idempotency keys and
 * reading them back, matchups, anonymous condition readers, a proprietor publishing, orders refunded after a
 * cancellation), without the crash, run from the production build on loopback in two set-ups:
 *
 *  - scaled out: a PostgreSQL primary and a hot standby streaming from it, two API processes behind a round-robin
 *    client (JOBS_IN_PROCESS=false, reads of GET requests on the standby) and one job worker;
 *  - single process: one API process that also works the job queue, everything on the primary.
 *
 * For each: the night's duration, requests per second over it, and p50 / p95 / max latency per route (every
 * response timed by the client), plus retries. Written to bench/results.json under "leagueNight".
 * Environment: BENCH_LANES (default 24) and BENCH_PER_LANE (default 5) size the night.
 * Both set-ups share this machine's cores with their databases and with the client itself, so the figures are
 * a comparison on one machine, not a capacity for a fleet.
 */
import fs from 'node:fs';
import os from 'node:os';
import path from 'node:path';
import { fileURLToPath } from 'node:url';
import { deploy, type Deployment } from '../tests/scaleout/harness';
import { leagueNight, type NightReport, type RouteFigures } from '../tests/scaleout/leagueNight';

const here = path.dirname(fileURLToPath(import.meta.url));
const LANES = Number(process.env.BENCH_LANES ?? 24);
const PER_LANE = Number(process.env.BENCH_PER_LANE ?? 5);

interface SetupFigures {
  setup: string;
  durationS: number;
  requests: number;
  throughput: number;
  retries: number;
  readAfterWriteMisses: number;
  shotsStored: number;
  shotsExpected: number;
  standbyReadCalls: number | null;
  /** Calibration fits still queued or running when the night's last request was answered (the worker catches up after). */
  calibrationBacklog: number;
  routes: Record<string, RouteFigures>;
}

async function night(setup: string, d: Deployment): Promise<SetupFigures> {
  if (d.standbyUrl) await d.standby('SELECT pg_stat_statements_reset()');
  const r: NightReport = await leagueNight(d, { lanes: LANES, perLane: PER_LANE, refunds: 6 });
  const [backlog] = await d.primary<{ n: string }>(
    "SELECT count(*) AS n FROM pgboss.job WHERE name = 'calibration' AND state IN ('created', 'retry', 'active')",
  );
  const [stored] = await d.primary<{ n: string }>('SELECT count(*) AS n FROM shots WHERE session_id = ANY($1)', [r.sessionIds]);
  const standbyReadCalls = d.standbyUrl
    ? (await d.standby<{ calls: string }>("SELECT calls FROM pg_stat_statements WHERE query ILIKE 'SELECT%'")).reduce(
        (s, x) => s + Number(x.calls),
        0,
      )
    : null;
  return {
    setup,
    durationS: r.durationS,
    requests: r.requests,
    throughput: r.throughput,
    retries: Object.values(r.routes).reduce((s, x) => s + x.failures, 0),
    readAfterWriteMisses: r.readAfterWriteMisses,
    shotsStored: Number(stored.n),
    shotsExpected: r.bowlers * 12,
    standbyReadCalls,
    calibrationBacklog: Number(backlog.n),
    routes: r.routes,
  };
}

async function run(setup: string, opts: Parameters<typeof deploy>[0]): Promise<SetupFigures> {
  console.log(`[league] ${setup}: deploying …`);
  const d = await deploy(opts);
  try {
    console.log(`[league] ${setup}: ${LANES} lanes × ${PER_LANE} bowlers …`);
    return await night(setup, d);
  } finally {
    await d.stop();
  }
}

const scaled = await run('scaled out (2 API + worker + standby)', { apis: 2, worker: true, standby: true });
const single = await run('single process (jobs in process, primary only)', { apis: 1, worker: false, standby: false });

const fmt = (n: number, w = 8) => n.toFixed(0).padStart(w);
console.log(
  `\nLeague night: ${LANES} lanes × ${PER_LANE} bowlers, 12 shots each, from the production build on loopback (${os.cpus().length} cores)`,
);
for (const s of [scaled, single]) {
  console.log(`\n${s.setup}`);
  console.log(
    `  ${s.durationS.toFixed(1)} s, ${s.requests} requests, ${s.throughput.toFixed(1)} req/s; shots stored ${s.shotsStored}/${s.shotsExpected}; read-after-write misses ${s.readAfterWriteMisses}; retries ${s.retries}; calibration fits still queued at the end ${s.calibrationBacklog}${s.standbyReadCalls === null ? '' : `; SELECTs on the standby ${s.standbyReadCalls}`}`,
  );
}
console.log(
  `\n${'route'.padEnd(44)} ${'scaled p50'.padStart(11)} ${'p95'.padStart(8)} ${'single p50'.padStart(11)} ${'p95'.padStart(8)}  (ms; count)`,
);
for (const route of [...new Set([...Object.keys(scaled.routes), ...Object.keys(single.routes)])].sort()) {
  const a = scaled.routes[route];
  const b = single.routes[route];
  console.log(
    `${route.padEnd(44)} ${a ? fmt(a.p50, 11) : ''.padStart(11)} ${a ? fmt(a.p95) : ''.padStart(8)} ${b ? fmt(b.p50, 11) : ''.padStart(11)} ${b ? fmt(b.p95) : ''.padStart(8)}  (${a?.count ?? 0}; ${b?.count ?? 0})`,
  );
}

const file = path.join(here, 'results.json');
const prev = fs.existsSync(file) ? (JSON.parse(fs.readFileSync(file, 'utf8')) as Record<string, unknown>) : {};
fs.writeFileSync(
  file,
  `${JSON.stringify({ ...prev, leagueNight: { date: new Date().toISOString(), lanes: LANES, perLane: PER_LANE, cores: os.cpus().length, results: [scaled, single] } }, null, 2)}\n`,
);
console.log('\nwrote bench/results.json (leagueNight)');
process.exit(0);
