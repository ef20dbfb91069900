import crypto from 'node:crypto';
import { api, createUser } from '../../helpers/api';
import { createBall, createCenter, createModel, createPattern } from '../../helpers/fixtures';
import { Condition, Follow } from '../../../server/models/index';
import type { Ball, Center, Pattern, User } from '../../../server/models/index';

/** The columns of the access matrix, in table order. */
export const ROLES = ['anonymous', 'owner', 'otherBowler', 'coachLinked', 'coachUnlinked', 'proprietorThis', 'proprietorOther', 'admin'] as const;
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
  /** Headers for one actor (none for anonymous). */
  as(actor: Actor): Record<string, string>;
  /** Fresh records for routes that consume them (delete, restore, import, …). */
  freshBall(opts?: { deleted?: boolean; withPhoto?: boolean }): Promise<Ball>;
  freshPattern(ownerId?: number): Promise<Pattern>;
  freshModelId(): Promise<{ id: number; version: number }>;
  freshUserId(): Promise<number>;
  freshUnsubscribeToken(): Promise<string>;
}

/** A 1×1 PNG (valid signature and chunks). */
export const TINY_PNG = Buffer.from('iVBORw0KGgoAAAANSUhEUgAAAAEAAAABCAYAAAAfFcSJAAAADUlEQVR42mP8z8BQDwAEhQGAhKmMIQAAAABJRU5ErkJggg==', 'base64');

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
  const photo = await api.put(`/api/arsenal/${ball.id}/photo`).set(owner.auth).attach('file', TINY_PNG, { filename: 'ball.png', contentType: 'image/png' });
  if (photo.status !== 200) throw new Error(`fixture: photo upload answered ${photo.status} ${JSON.stringify(photo.body)}`);
  const today = new Date().toISOString().slice(0, 10);
  const pub = await api.post(`/api/centers/${center.id}/conditions`).set(proprietorThis.auth).send({ patternId: pattern.id, lanes: [1, 2, 3, 4], validFrom: today });
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

  return {
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
      if (opts.withPhoto) await api.put(`/api/arsenal/${b.id}/photo`).set(owner.auth).attach('file', TINY_PNG, { filename: 'b.png', contentType: 'image/png' }).expect(200);
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
    async freshUnsubscribeToken() {
      const u = await createUser('bowler');
      const token = crypto.randomBytes(24).toString('hex');
      await Follow.create({ userId: u.user.id, centerId: center.id, unsubscribeToken: token });
      return token;
    },
  };
}
