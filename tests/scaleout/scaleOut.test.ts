import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { deploy, type Deployment } from './harness';
import { leagueNight, type NightReport } from './leagueNight';

/**
 * Scale-out, all real: a PostgreSQL primary and a hot standby streaming from it, two API processes and one job
 * worker from the production build, and a league night (24 lanes × 5 bowlers) during which one API process and
 * the worker are killed (SIGKILL) and started again. Printed and asserted: every shot stored exactly once, every
 * mail and refund job done once, reads served by the standby, no read-after-write miss, rate limits shared by
 * both API processes.
 */
let d: Deployment;
let night: NightReport;
const killed: string[] = [];

beforeAll(async () => {
  d = await deploy({ apis: 2, extraEnv: { RATE_LIMIT_AUTH: '12' } });
  await d.standby('SELECT pg_stat_statements_reset()');
}, 180000);
afterAll(async () => {
  await d?.stop();
});

async function until<T>(fn: () => Promise<T>, ok: (v: T) => boolean, timeoutMs: number): Promise<T> {
  const deadline = Date.now() + timeoutMs;
  let v = await fn();
  while (!ok(v) && Date.now() < deadline) {
    await new Promise((r) => setTimeout(r, 250));
    v = await fn();
  }
  return v;
}

describe('league night on two API processes, a worker and a hot standby', () => {
  it('shots exactly once, jobs done once, reads on the standby, read-your-writes, through a crash of an API process and the worker', async () => {
    night = await leagueNight(d, {
      lanes: 24,
      perLane: 5,
      refunds: 6,
      midRunAt: 0.4,
      midRun: async () => {
        // A crash, not a stop: no chance to finish requests or jobs.
        const api = d.apis[0];
        const worker = d.worker!;
        await Promise.all([api.kill('SIGKILL'), worker.kill('SIGKILL')]);
        killed.push(`api pid ${api.child.pid}`, `worker pid ${worker.child.pid}`);
        d.apis.splice(0, 1);
        await new Promise((r) => setTimeout(r, 1500));
        d.worker = await d.startWorker();
        d.apis.unshift(await d.startApi());
      },
    });

    // Shots: 12 per bowler, none lost, none doubled.
    const shots = await d.primary<{ session_id: number; n: string }>(
      'SELECT session_id, count(*) AS n FROM shots WHERE session_id = ANY($1) GROUP BY session_id',
      [night.sessionIds],
    );
    const stored = shots.reduce((s, r) => s + Number(r.n), 0);
    const expected = night.bowlers * 12;
    const lost = expected - stored;
    const doubled = (
      await d.primary<{ n: string }>(
        'SELECT count(*) AS n FROM (SELECT session_id, game_number, frame, delivery FROM shots WHERE session_id = ANY($1) GROUP BY 1, 2, 3, 4 HAVING count(*) > 1) x',
        [night.sessionIds],
      )
    )[0].n;

    // Jobs: every mail sent and every refund made, each job completed once.
    const jobsDone = await until(
      () =>
        d.primary<{ name: string; state: string; n: string }>(
          "SELECT name, state, count(*) AS n FROM pgboss.job WHERE name IN ('mail', 'refund', 'calibration') GROUP BY 1, 2",
        ),
      (rows) =>
        rows.every((r) => r.state === 'completed' || (r.name === 'calibration' && r.state !== 'failed')) &&
        rows.some((r) => r.name === 'refund' && Number(r.n) >= night.refundOrderIds.length),
      90000,
    );
    const outbox = await until(
      () => d.primary<{ status: string; n: string }>('SELECT status, count(*) AS n FROM mail_outbox GROUP BY 1'),
      (rows) => rows.every((r) => r.status === 'sent'),
      60000,
    );
    const sentRows = Number(outbox.find((r) => r.status === 'sent')?.n ?? 0);
    const ids = d.smtp.messages.map((m) => m.messageId);
    const distinct = new Set(ids).size;
    const resent = ids.length - distinct;
    const refundRows = await d.primary<{ order_id: number; refund_id: string | null; auto_refund_reason: string | null }>(
      'SELECT order_id, refund_id, auto_refund_reason FROM payments WHERE order_id = ANY($1)',
      [night.refundOrderIds],
    );
    await until(async () => d.fake.idle().then(() => true), Boolean, 30000);
    const refundEvents = d.fake.events.filter((e) => e.type === 'charge.refunded');
    const refundsPerIntent = new Map<string, number>();
    for (const e of refundEvents) {
      const pi = String((e.data.object as { payment_intent?: unknown }).payment_intent);
      refundsPerIntent.set(pi, (refundsPerIntent.get(pi) ?? 0) + 1);
    }
    const refundedOrders = await until(
      () =>
        d.primary<{ id: number; payment_status: string }>('SELECT id, payment_status FROM orders WHERE id = ANY($1)', [
          night.refundOrderIds,
        ]),
      (rows) => rows.every((r) => r.payment_status === 'refunded'),
      30000,
    );

    // Reads on the standby: its own statement counters (pg_stat_statements runs there too).
    const standbyReads = await d.standby<{ query: string; calls: string }>(
      "SELECT query, calls FROM pg_stat_statements WHERE query ILIKE 'SELECT%' AND (query ILIKE '%conditions%' OR query ILIKE '%sessions%' OR query ILIKE '%shots%') ORDER BY calls DESC",
    );
    const standbyCalls = standbyReads.reduce((s, r) => s + Number(r.calls), 0);
    const lag = await d.standby<{ replaying: boolean }>('SELECT pg_is_in_recovery() AS replaying');

    // Rate limits shared: failed sign-ins from one client address, alternating between the two processes.
    const statuses: number[] = [];
    for (let i = 0; i < 14; i++) {
      const base = d.apis[i % 2].base;
      const r = await fetch(`${base}/api/auth/login`, {
        method: 'POST',
        headers: { 'content-type': 'application/json', 'x-forwarded-for': '198.51.100.77' },
        body: JSON.stringify({ email: `nobody-${i}-${Date.now()}@example.test`, password: 'a wrong guess' }),
      });
      statuses.push(r.status);
    }

    const figures = {
      bowlers: night.bowlers,
      duration: `${night.durationS.toFixed(1)} s`,
      requests: night.requests,
      throughput: `${night.throughput.toFixed(1)} req/s`,
      killed,
      shots: { expected, stored, lost, doubled: Number(doubled), retriedOnAnotherProcess: night.shotRetries },
      readAfterWriteMisses: night.readAfterWriteMisses,
      mail: { outboxSent: sentRows, received: ids.length, distinct, resentAfterCrash: resent },
      jobs: Object.fromEntries(jobsDone.map((r) => [`${r.name}.${r.state}`, Number(r.n)])),
      refunds: {
        orders: night.refundOrderIds.length,
        refundedAtService: refundsPerIntent.size,
        maxPerPayment: Math.max(0, ...refundsPerIntent.values()),
        ordersRefunded: refundedOrders.filter((r) => r.payment_status === 'refunded').length,
      },
      standby: { inRecovery: lag[0]?.replaying, readCalls: standbyCalls },
      rateLimit: statuses.join(' '),
      routes: night.routes,
    };
    console.log(`[scale-out] ${JSON.stringify(figures, null, 2)}`);

    expect(night.shotsSent).toBe(expected);
    expect(lost).toBe(0);
    expect(Number(doubled)).toBe(0);
    expect(night.readAfterWriteMisses).toBe(0);
    expect(outbox.every((r) => r.status === 'sent')).toBe(true);
    // Every outbox row reached the mail server; a message whose worker died between the mail server's answer and
    // the row's update is sent again (SMTP has no transaction; the same Message-ID marks it) — at most one per mail worker killed.
    expect(distinct).toBe(sentRows);
    expect(resent).toBeLessThanOrEqual(4);
    expect(jobsDone.filter((r) => r.name !== 'calibration').every((r) => r.state === 'completed')).toBe(true);
    expect(Number(jobsDone.find((r) => r.name === 'refund' && r.state === 'completed')?.n ?? 0)).toBe(night.refundOrderIds.length);
    expect(refundRows.filter((r) => r.auto_refund_reason).length).toBe(night.refundOrderIds.length);
    expect(refundsPerIntent.size).toBe(night.refundOrderIds.length);
    expect(Math.max(0, ...refundsPerIntent.values())).toBe(1);
    expect(refundedOrders.every((r) => r.payment_status === 'refunded')).toBe(true);
    expect(lag[0]?.replaying).toBe(true);
    expect(standbyCalls).toBeGreaterThanOrEqual(night.routes['GET /api/centers/:id/conditions/current']?.count ?? 0);
    // RATE_LIMIT_AUTH=12 failed attempts per address, counted across both processes: the 13th is refused.
    expect(statuses.slice(0, 12).every((s) => s === 401)).toBe(true);
    expect(statuses.slice(12)).toEqual([429, 429]);
  }, 600000);
});
