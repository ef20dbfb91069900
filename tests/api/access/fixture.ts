import crypto from 'node:crypto';
import { api, createUser } from '../../helpers/api';
import { createBall, createCenter, createModel, createPattern } from '../../helpers/fixtures';
import { Condition, EmailVerification, Follow, League, ShopService } from '../../../server/models/index';
import { event, getOrder, listenForWebhooks, signature, submitCard, waitFor } from '../shop/shopHelpers';
import type { Ball, Center, Pattern, User } from '../../../server/models/index';

/** The columns of the access matrix, in table order. */
export const ROLES = [
  'anonymous',
  'owner',
  'otherBowler',
  'coachLinked',
  'coachUnlinked',
  'proprietorThis',
  'proprietorOther',
  'admin',
] as const;
export type Actor = (typeof ROLES)[number];

export interface Person {
  user: User;
  auth: { Authorization: string };
  password: string;
}

/**
 * The actors and records every matrix row reads, created once per file:
 *  - owner (bowler): owns `ball` (with a photo) and follows `center`;
 *  - otherBowler: another bowler with a ball of their own;
 *  - coachLinked: a coach with an active coaching link to owner (when the coaching routes exist); coachUnlinked: a coach without;
 *  - proprietorThis owns `center` (24 lanes, a condition in force) and `pattern`; proprietorOther owns `otherCenter`;
 *  - admin.
 */
export interface Fixture {
  people: Record<Exclude<Actor, 'anonymous'>, Person>;
  ball: Ball;
  otherBall: Ball;
  pattern: Pattern;
  center: Center;
  otherCenter: Center;
  condition: Condition;
  coachLinked: boolean;
  /** owner's practice session with one shot; the center's price list (a resurface). */
  sessionId: number;
  serviceId: number;
  /** An order of owner at center (unpaid). */
  orderId: number;
  /** Headers for one actor (none for anonymous). */
  as(actor: Actor): Record<string, string>;
  /** Fresh records for routes that consume them (delete, restore, import, …). */
  freshBall(opts?: { deleted?: boolean; withPhoto?: boolean }): Promise<Ball>;
  freshPattern(ownerId?: number): Promise<Pattern>;
  freshModelId(): Promise<{ id: number; version: number }>;
  freshUserId(): Promise<number>;
  freshUnsubscribeToken(): Promise<string>;
  /** The verification token of a new, unverified account (as the sign-up mail would carry it). */
  freshVerificationToken(): Promise<string>;
  /** A new session of owner, with a ball of its own (fuzzed routes may have removed the fixture's ball). */
  freshSession(opts?: { deleted?: boolean; withShot?: boolean }): Promise<{ id: number; shotId: number | null; ballId: number }>;
  /** A new coaching link of a new coach to owner: pending, or accepted by owner. */
  freshLink(accepted: boolean): Promise<number>;
  freshServiceId(): Promise<{ id: number; version: number }>;
  /** A new equipment trial of owner: one fresh ball on two surfaces. */
  freshTrial(): Promise<number>;
  /** A new league of owner's (for routes that change or delete one). */
  freshLeague(): Promise<number>;
  /**
   * A new order of owner at center, unpaid or paid by card on the payment fake's page. Paid orders are always paid
   * through the fake, never by a made-up webhook alone: the payment service must know every payment in this
   * database, or a refund that a fuzzed id happens to reach is refused upstream (502).
   */
  freshOrderId(paid?: false | 'card'): Promise<number>;
  /** Stops the loopback listener the payment fake delivers webhooks to. */
  close(): Promise<void>;
  /** A ball of the given actor (for routes that need one of the caller's balls). */
  ballOf(actor: Actor): Promise<number>;
  /** A validly signed webhook event of a type the server ignores. */
  signedEvent(): { payload: string; header: string };
}

/** A 1×1 PNG (valid signature and chunks). */
export const TINY_PNG = Buffer.from(
  'iVBORw0KGgoAAAANSUhEUgAAAAEAAAABCAYAAAAfFcSJAAAADUlEQVR42mP8z8BQDwAEhQGAhKmMIQAAAABJRU5ErkJggg==',
  'base64',
);

export async function buildFixture(): Promise<Fixture> {
  const [owner, otherBowler, coachLinked, coachUnlinked, proprietorThis, proprietorOther, admin] = await Promise.all([
    createUser('bowler'),
    createUser('bowler'),
    createUser('coach'),
    createUser('coach'),
    createUser('proprietor'),
    createUser('proprietor'),
    createUser('admin'),
  ]);
  const people = { owner, otherBowler, coachLinked, coachUnlinked, proprietorThis, proprietorOther, admin };
  const [ball, otherBall, pattern, center, otherCenter] = await Promise.all([
    createBall(owner.user.id),
    createBall(otherBowler.user.id),
    createPattern(proprietorThis.user.id),
    createCenter(proprietorThis.user.id),
    createCenter(proprietorOther.user.id),
  ]);
  const photo = await api
    .put(`/api/arsenal/${ball.id}/photo`)
    .set(owner.auth)
    .attach('file', TINY_PNG, { filename: 'ball.png', contentType: 'image/png' });
  if (photo.status !== 200) throw new Error(`fixture: photo upload answered ${photo.status} ${JSON.stringify(photo.body)}`);
  const today = new Date().toISOString().slice(0, 10);
  const pub = await api
    .post(`/api/centers/${center.id}/conditions`)
    .set(proprietorThis.auth)
    .send({ patternId: pattern.id, lanes: [1, 2, 3, 4], validFrom: today });
  if (pub.status !== 201) throw new Error(`fixture: publishing answered ${pub.status} ${JSON.stringify(pub.body)}`);
  const condition = (await Condition.findByPk(pub.body.item.id))!;
  await api.post(`/api/centers/${center.id}/follow`).set(owner.auth).expect(200);

  // The coaching link, through the coaching routes themselves when they exist.
  let linked = false;
  const inv = await api.post('/api/coach/invitations').set(coachLinked.auth).send({ email: owner.user.email });
  if (inv.status === 201) {
    const acc = await api.post(`/api/coach/links/${inv.body.item.id}/accept`).set(owner.auth);
    if (acc.status !== 200) throw new Error(`fixture: accepting the coaching link answered ${acc.status} ${JSON.stringify(acc.body)}`);
    linked = true;
  }

  const newSession = async (withShot: boolean, ballId = ball.id) => {
    const r = await api
      .post('/api/sessions')
      .set(owner.auth)
      .send({ date: today, kind: 'practice', centerId: center.id, patternId: pattern.id });
    if (r.status !== 201) throw new Error(`fixture: session answered ${r.status} ${JSON.stringify(r.body)}`);
    let shotId: number | null = null;
    if (withShot) {
      const s = await api
        .post(`/api/sessions/${r.body.item.id}/shots`)
        .set(owner.auth)
        .set('Idempotency-Key', `fixture-${crypto.randomUUID()}`)
        .send({ gameNumber: 1, frame: 1, delivery: 1, ballId, standing: [7] });
      if (s.status !== 201) throw new Error(`fixture: shot answered ${s.status} ${JSON.stringify(s.body)}`);
      shotId = s.body.item.id as number;
    }
    return { id: r.body.item.id as number, shotId, ballId };
  };
  const session = await newSession(true);
  const listener = await listenForWebhooks(); // the payment fake's card page delivers its webhook here
  const service = await ShopService.create({
    centerId: center.id,
    kind: 'resurface',
    name: 'Resurface to 4000 grit',
    grit: 4000,
    description: null,
    priceCents: 4500,
    currency: 'usd',
  });
  const newOrder = async (ballId = ball.id) => {
    const r = await api.post('/api/orders').set(owner.auth).send({ serviceId: service.id, ballId });
    if (r.status !== 201) throw new Error(`fixture: order answered ${r.status} ${JSON.stringify(r.body)}`);
    return r.body.item;
  };
  const order = await newOrder();

  return {
    sessionId: session.id,
    serviceId: service.id,
    orderId: order.id as number,
    async freshSession(opts = {}) {
      const s = await newSession(Boolean(opts.withShot), (await createBall(owner.user.id)).id);
      if (opts.deleted) await api.delete(`/api/sessions/${s.id}`).set(owner.auth).expect(204);
      return s;
    },
    async freshLink(accepted) {
      const coach = await createUser('coach');
      const inv = await api.post('/api/coach/invitations').set(coach.auth).send({ email: owner.user.email });
      if (inv.status !== 201) throw new Error(`fixture: invitation answered ${inv.status} ${JSON.stringify(inv.body)}`);
      if (accepted) await api.post(`/api/coach/links/${inv.body.item.id}/accept`).set(owner.auth).expect(200);
      return inv.body.item.id as number;
    },
    async freshTrial() {
      const b = await createBall(owner.user.id);
      const r = await api
        .post('/api/trials')
        .set(owner.auth)
        .send({
          name: `Trial ${crypto.randomUUID().slice(0, 8)}`,
          arms: [
            { ballId: b.id, surfaceKey: '2000 grit' },
            { ballId: b.id, surfaceKey: '4000 grit' },
          ],
        });
      if (r.status !== 201) throw new Error(`fixture: trial answered ${r.status} ${JSON.stringify(r.body)}`);
      return r.body.item.id as number;
    },
    async freshLeague() {
      const l = await League.create({
        userId: owner.user.id,
        name: `League ${crypto.randomUUID().slice(0, 8)}`,
        centerId: null,
        weekday: 2,
        seasonStart: '2026-09-01',
        seasonEnd: null,
        gamesPerNight: 3,
        handicapBasis: 220,
        handicapPercent: 90,
        handicapMax: null,
        enteringAverage: null,
      });
      return l.id;
    },
    async freshServiceId() {
      const sv = await ShopService.create({
        centerId: center.id,
        kind: 'polish',
        name: `Polish ${crypto.randomUUID().slice(0, 8)}`,
        grit: null,
        description: null,
        priceCents: 2500,
        currency: 'usd',
      });
      return { id: sv.id, version: sv.version };
    },
    async freshOrderId(paid = false) {
      const o = await newOrder((await createBall(owner.user.id)).id);
      if (paid === 'card') {
        const co = await api.post(`/api/orders/${o.id}/checkout`).set(owner.auth);
        if (co.status !== 200) throw new Error(`fixture: checkout answered ${co.status} ${JSON.stringify(co.body)}`);
        await submitCard(co.body.url as string, '4242424242424242');
        await waitFor(
          () => getOrder(owner, o.id as number),
          (x) => x.status === 'paid',
        );
      }
      return o.id as number;
    },
    close: () => listener.close(),
    async ballOf(actor) {
      if (actor === 'anonymous') return ball.id;
      return (await createBall(people[actor].user.id)).id;
    },
    signedEvent() {
      const ev = event('customer.created', { id: `cus_test_${crypto.randomBytes(8).toString('hex')}`, object: 'customer' });
      return { payload: ev.payload, header: signature(ev.payload) };
    },
    people,
    ball,
    otherBall,
    pattern,
    center,
    otherCenter,
    condition,
    coachLinked: linked,
    as: (actor) => (actor === 'anonymous' ? {} : people[actor].auth),
    async freshBall(opts = {}) {
      const b = await createBall(owner.user.id);
      if (opts.withPhoto)
        await api
          .put(`/api/arsenal/${b.id}/photo`)
          .set(owner.auth)
          .attach('file', TINY_PNG, { filename: 'b.png', contentType: 'image/png' })
          .expect(200);
      if (opts.deleted) await b.destroy();
      return b;
    },
    freshPattern: (ownerId = proprietorThis.user.id) => createPattern(ownerId),
    async freshModelId() {
      const m = await createModel();
      return { id: m.id, version: m.version };
    },
    async freshUserId() {
      return (await createUser('bowler')).user.id;
    },
    async freshVerificationToken() {
      const u = await createUser('bowler', undefined, { verified: false });
      const token = crypto.randomBytes(32).toString('base64url');
      await EmailVerification.create({
        userId: u.user.id,
        tokenHash: crypto.createHash('sha256').update(token).digest('hex'),
        expiresAt: new Date(Date.now() + 3600_000),
        usedAt: null,
      });
      return token;
    },
    async freshUnsubscribeToken() {
      const u = await createUser('bowler');
      const token = crypto.randomBytes(24).toString('hex');
      await Follow.create({ userId: u.user.id, centerId: center.id, unsubscribeToken: token });
      return token;
    },
  };
}
