import crypto from 'node:crypto';
import jwt from 'jsonwebtoken';
import type { Deployment } from './harness';

/**
 * A simulated league night against a deployment (tests/scaleout/harness.ts), shared by the scale-out test and
 * `npm run bench`: `lanes` lanes of `perLane` bowlers each log a game of shots with idempotency keys (retried
 * with the same key on another API process when one fails), each shot followed by a read of the session from
 * the next process (read-after-write check); bowlers run matchups; anonymous readers poll the public
 * condition; the proprietor publishes a new condition mid-run (a mail to every follower); a few orders are paid
 * after being cancelled (each must be refunded automatically, once).
 */
export interface NightOptions {
  lanes: number;
  perLane: number;
  refunds: number;
  /** Called once when this share of the shots has been logged (e.g. to kill and restart processes). */
  midRunAt?: number;
  midRun?: () => Promise<void>;
}

export interface RouteFigures {
  count: number;
  p50: number;
  p95: number;
  max: number;
  failures: number;
}

export interface NightReport {
  bowlers: number;
  shotsSent: number;
  shotRetries: number;
  readAfterWriteMisses: number;
  durationS: number;
  requests: number;
  throughput: number;
  routes: Record<string, RouteFigures>;
  centerId: number;
  sessionIds: number[];
  refundOrderIds: number[];
  publishedConditions: number;
  bowlerIds: number[];
}

type Res = { status: number; body: any }; // eslint-disable-line @typescript-eslint/no-explicit-any

/** Round-robin over the live API processes; a request that finds a process gone (or 502/503) goes to the next one. */
export class Balancer {
  private i = 0;
  readonly timings = new Map<string, { ms: number[]; failures: number }>();
  requests = 0;
  retries = 0;

  constructor(private readonly bases: () => string[]) {}

  private next(): string {
    const b = this.bases();
    this.i = (this.i + 1) % b.length;
    return b[this.i];
  }

  async call(
    route: string,
    method: string,
    url: string,
    opts: { token?: string; body?: unknown; headers?: Record<string, string>; base?: string } = {},
  ): Promise<Res & { base: string }> {
    for (let attempt = 0; attempt < 12; attempt++) {
      const base = attempt === 0 && opts.base ? opts.base : this.next();
      const started = performance.now();
      let res: Res;
      try {
        const r = await fetch(`${base}${url}`, {
          method,
          headers: {
            ...(opts.body !== undefined ? { 'content-type': 'application/json' } : {}),
            ...(opts.token ? { authorization: `Bearer ${opts.token}` } : {}),
            ...(opts.headers ?? {}),
          },
          body: opts.body !== undefined ? JSON.stringify(opts.body) : undefined,
          signal: AbortSignal.timeout(20000),
        });
        const text = await r.text();
        res = { status: r.status, body: text ? JSON.parse(text) : null };
      } catch {
        res = { status: 0, body: null };
      }
      this.requests += 1;
      const t = this.timings.get(route) ?? { ms: [], failures: 0 };
      this.timings.set(route, t);
      if (res.status === 0 || res.status === 502 || res.status === 503) {
        t.failures += 1;
        this.retries += 1;
        await new Promise((r) => setTimeout(r, 100 * (attempt + 1)));
        continue;
      }
      t.ms.push(performance.now() - started);
      return { ...res, base };
    }
    throw new Error(`${method} ${url}: no API process answered`);
  }

  figures(): Record<string, RouteFigures> {
    const out: Record<string, RouteFigures> = {};
    for (const [route, t] of this.timings) {
      const s = [...t.ms].sort((a, b) => a - b);
      const q = (p: number) => (s.length ? s[Math.min(s.length - 1, Math.ceil(p * s.length) - 1)] : 0);
      out[route] = {
        count: s.length,
        p50: Math.round(q(0.5)),
        p95: Math.round(q(0.95)),
        max: Math.round(s.at(-1) ?? 0),
        failures: t.failures,
      };
    }
    return out;
  }
}

const today = () => new Date().toISOString().slice(0, 10);

/** A game of twelve strikes: frames 1–9 one delivery, the tenth three. */
const STRIKES = [
  ...Array.from({ length: 9 }, (_, i) => ({ frame: i + 1, delivery: 1 })),
  { frame: 10, delivery: 1 },
  { frame: 10, delivery: 2 },
  { frame: 10, delivery: 3 },
];

export async function leagueNight(d: Deployment, opts: NightOptions): Promise<NightReport> {
  const lb = new Balancer(() => d.apis.map((a) => a.base));
  const tag = crypto.randomBytes(3).toString('hex');
  const token = (id: number) =>
    jwt.sign({ ver: 0 }, d.env.JWT_SECRET, {
      subject: String(id),
      issuer: 'lanewright',
      audience: 'lanewright-api',
      expiresIn: '2h',
      algorithm: 'HS256',
    });
  const addUser = async (role: string, name: string) => {
    const [u] = await d.primary<{ id: number }>(
      `INSERT INTO users (email, password_hash, display_name, role, email_verified_at, created_at, updated_at) VALUES ($1, '!', $2, $3, now(), now(), now()) RETURNING id`,
      [`${name.toLowerCase().replace(/\W+/g, '-')}-${tag}@example.test`, name, role],
    );
    return { id: u.id, token: token(u.id) };
  };
  const must = (r: Res, what: string, status = [200, 201]) => {
    if (!status.includes(r.status)) throw new Error(`${what}: ${r.status} ${JSON.stringify(r.body)}`);
    return r.body;
  };

  // The venue: a center of `lanes` lanes, its proprietor, a house pattern published on every lane, a price list.
  const admin = await addUser('admin', `Night Admin ${tag}`);
  const owner = await addUser('proprietor', `Night Owner ${tag}`);
  const center = must(
    await lb.call('setup', 'POST', '/api/centers', {
      token: admin.token,
      body: { name: `Harrow Night Lanes ${tag}`, town: 'Testford', laneCount: opts.lanes },
    }),
    'center',
  ).item;
  await d.primary('UPDATE centers SET owner_id = $1 WHERE id = $2', [owner.id, center.id]);
  const sweeps = (len: number) => [
    { direction: 'forward', fromBoard: 2, toBoard: 38, startFt: 0, endFt: len, crossings: 4, microlitersPerBoard: 60 },
  ];
  const house = must(
    await lb.call('setup', 'POST', '/api/patterns', {
      token: owner.token,
      body: { name: `Night House 41 ${tag}`, sweeps: sweeps(41), visibility: 'published' },
    }),
    'pattern',
  ).item;
  const sport = must(
    await lb.call('setup', 'POST', '/api/patterns', {
      token: owner.token,
      body: { name: `Night Sport 44 ${tag}`, sweeps: sweeps(44), visibility: 'published' },
    }),
    'pattern',
  ).item;
  // the pattern list, sorted by name, from the production build (its sort names the model's table alias)
  must(await lb.call('setup', 'GET', '/api/patterns?sort=name', { token: owner.token }), 'pattern list');
  const allLanes = Array.from({ length: opts.lanes }, (_, i) => i + 1);
  must(
    await lb.call('setup', 'POST', `/api/centers/${center.id}/conditions`, {
      token: owner.token,
      body: { patternId: house.id, lanes: allLanes, validFrom: today() },
    }),
    'condition',
  );
  const service = must(
    await lb.call('setup', 'POST', `/api/centers/${center.id}/services`, {
      token: owner.token,
      body: { kind: 'drill', name: `Night Drill ${tag}`, priceCents: 4500 },
    }),
    'service',
  ).item;

  // The bowlers: a ball, a session on the house pattern, and a follow of the center.
  const bowlers: { id: number; token: string; ballId: number; sessionId: number; lane: number }[] = [];
  const specs = Array.from({ length: opts.lanes * opts.perLane }, (_, i) => ({
    lane: Math.floor(i / opts.perLane) + 1,
    seat: (i % opts.perLane) + 1,
  }));
  const setupOne = async (s: { lane: number; seat: number }) => {
    const u = await addUser('bowler', `Lane ${s.lane} Seat ${s.seat}`);
    const ball = must(
      await lb.call('setup', 'POST', '/api/arsenal', {
        token: u.token,
        body: {
          name: `Night Ball ${s.lane}-${s.seat}`,
          coverType: 'reactive-solid',
          coreType: 'asymmetric',
          rg: 2.5,
          differential: 0.05,
          intermediateDifferential: 0.015,
          weightLb: 15,
          surfaceGrit: 2000,
          polished: false,
        },
      }),
      'ball',
    ).item;
    const session = must(
      await lb.call('setup', 'POST', '/api/sessions', { token: u.token, body: { date: today(), kind: 'league', patternId: house.id } }),
      'session',
    ).item;
    must(await lb.call('setup', 'POST', `/api/centers/${center.id}/follow`, { token: u.token }), 'follow');
    bowlers.push({ id: u.id, token: u.token, ballId: ball.id, sessionId: session.id, lane: s.lane });
  };
  for (let i = 0; i < specs.length; i += 12) await Promise.all(specs.slice(i, i + 12).map(setupOne));
  await d.primary('DELETE FROM mail_outbox WHERE created_at < now()'); // nothing of the set-up is counted below

  // The night.
  const started = performance.now();
  const totalShots = bowlers.length * STRIKES.length;
  let logged = 0;
  let misses = 0;
  let midRunDone = !opts.midRun;
  let midRunP: Promise<void> = Promise.resolve();
  let stop = false;
  let published = 0;
  const refundOrders: number[] = [];

  const shoot = async (b: (typeof bowlers)[number], i: number) => {
    const s = STRIKES[i];
    const boards =
      s.delivery === 1 && s.frame <= 4 ? { feetBoard: 20, targetBoard: 11, breakpointBoard: 7 + (s.frame % 3), hit: 'pocket' } : {};
    const key = `night-${b.sessionId}-${s.frame}-${s.delivery}`;
    const r = await lb.call('POST /api/sessions/:id/shots', 'POST', `/api/sessions/${b.sessionId}/shots`, {
      token: b.token,
      headers: { 'Idempotency-Key': key },
      body: { gameNumber: 1, frame: s.frame, delivery: s.delivery, ballId: b.ballId, standing: [], ...boards },
    });
    must(r, `shot ${key}`, [200, 201]);
    logged += 1;
    // Read your own write from the next process: the shot must be there.
    const back = await lb.call('GET /api/sessions/:id', 'GET', `/api/sessions/${b.sessionId}`, { token: b.token });
    must(back, 'session read');
    if ((back.body.item.shots as unknown[]).length < i + 1) misses += 1;
    if (!midRunDone && logged >= totalShots * (opts.midRunAt ?? 0.4)) {
      midRunDone = true;
      midRunP = opts.midRun!();
    }
  };

  const lane = async (n: number) => {
    const mine = bowlers.filter((b) => b.lane === n);
    for (let i = 0; i < STRIKES.length; i++) {
      for (const b of mine) {
        await shoot(b, i);
        if (i === 2 || i === 8)
          must(
            await lb.call('POST /api/matchups', 'POST', '/api/matchups', {
              token: b.token,
              body: { patternId: i === 2 ? house.id : sport.id, gamesBowled: 1 },
            }),
            'matchup',
          );
      }
    }
  };

  const reader = async () => {
    while (!stop) {
      must(
        await lb.call('GET /api/centers/:id/conditions/current', 'GET', `/api/centers/${center.id}/conditions/current`),
        'condition read',
      );
      await new Promise((r) => setTimeout(r, 40));
    }
  };

  const proprietor = async () => {
    while (!stop && logged < totalShots * 0.5) await new Promise((r) => setTimeout(r, 200));
    if (stop) return;
    must(
      await lb.call('POST /api/centers/:id/conditions', 'POST', `/api/centers/${center.id}/conditions`, {
        token: owner.token,
        body: { patternId: sport.id, lanes: allLanes, validFrom: today(), notes: 'Sport pattern for the second half' },
      }),
      'publish',
    );
    published += 1;
    must(await lb.call('GET /api/centers/:id/orders', 'GET', `/api/centers/${center.id}/orders`, { token: owner.token }), 'orders board');
  };

  // Orders paid after their cancellation (a race the shop must settle with an automatic refund).
  const refunder = async (b: (typeof bowlers)[number]) => {
    const order = must(
      await lb.call('POST /api/orders', 'POST', '/api/orders', { token: b.token, body: { serviceId: service.id, ballId: b.ballId } }),
      'order',
    ).item;
    const checkout = must(
      await lb.call('POST /api/orders/:id/checkout', 'POST', `/api/orders/${order.id}/checkout`, { token: b.token }),
      'checkout',
    );
    await d.primary("UPDATE orders SET status = 'cancelled', cancelled_at = now() WHERE id = $1", [order.id]);
    const paid = await fetch(checkout.url, {
      method: 'POST',
      headers: { 'Content-Type': 'application/x-www-form-urlencoded' },
      body: new URLSearchParams({ cardnumber: '4242424242424242', exp: '12 / 34', cvc: '123', name: 'Night Bowler' }).toString(),
      redirect: 'manual',
    });
    if (paid.status !== 303 && paid.status !== 302) throw new Error(`card page answered ${paid.status}`);
    refundOrders.push(order.id);
  };

  const readers = Array.from({ length: 4 }, () => reader());
  const side = [proprietor(), ...bowlers.slice(0, opts.refunds).map((b) => refunder(b))];
  await Promise.all(Array.from({ length: opts.lanes }, (_, i) => lane(i + 1)));
  stop = true;
  await Promise.all([...readers, ...side, midRunP]);
  const durationS = (performance.now() - started) / 1000;

  return {
    bowlers: bowlers.length,
    shotsSent: logged,
    shotRetries: lb.timings.get('POST /api/sessions/:id/shots')?.failures ?? 0,
    readAfterWriteMisses: misses,
    durationS,
    requests: lb.requests,
    throughput: lb.requests / durationS,
    routes: Object.fromEntries(Object.entries(lb.figures()).filter(([k]) => k !== 'setup')),
    centerId: center.id,
    sessionIds: bowlers.map((b) => b.sessionId),
    refundOrderIds: refundOrders,
    publishedConditions: published,
    bowlerIds: bowlers.map((b) => b.id),
  };
}
