import supertest from 'supertest';
import type { Role } from '../../shared/auth';
import { createApp } from '../../server/app';
import { hashPassword } from '../../server/features/auth/auth.service';
import { signToken } from '../../server/middleware/auth';
import { QueryTypes } from 'sequelize';
import { startWorkers } from '../../server/lib/workers';
import { sequelize, User } from '../../server/models/index';

export const app = createApp();
export const api = supertest(app);
// The test process plays the whole server: it also works the job queue (mail, refunds, calibration fits), as a
// single `npm start` process does.
await startWorkers();

/** Waits (up to `timeoutMs`) until the outbox has nothing pending or being sent: background mail work has settled. */
export async function outboxIdle(timeoutMs = 10000): Promise<void> {
  const deadline = Date.now() + timeoutMs;
  while (Date.now() < deadline) {
    const [row] = await sequelize.query<{ n: string }>("SELECT count(*) AS n FROM mail_outbox WHERE status IN ('pending', 'sending')", { type: QueryTypes.SELECT });
    if (Number(row.n) === 0) return;
    await new Promise((r) => setTimeout(r, 50));
  }
}

let counter = 0;
/** A unique e-mail for this test run. */
export function uniqueEmail(tag = 'user'): string {
  counter += 1;
  return `${tag}-${process.pid}-${Date.now()}-${counter}@example.test`;
}

const hashCache = new Map<string, Promise<string>>();

/** Inserts a user with the given role straight into the database and returns it with a valid token (address verified unless `verified: false`). */
export async function createUser(role: Role = 'bowler', password = 'correct-horse-battery', opts: { verified?: boolean } = {}): Promise<{ user: User; token: string; password: string; auth: { Authorization: string } }> {
  if (!hashCache.has(password)) hashCache.set(password, hashPassword(password));
  const user = await User.create({ email: uniqueEmail(role), passwordHash: await hashCache.get(password)!, displayName: `Test ${role}`, role, emailVerifiedAt: opts.verified === false ? null : new Date() });
  const token = signToken(user);
  return { user, token, password, auth: { Authorization: `Bearer ${token}` } };
}

/** Asserts the one error shape and returns its parts. */
export function errorOf(body: unknown): { code: string; message: string; fields?: Record<string, string> } {
  const e = (body as { error?: { code?: unknown; message?: unknown; fields?: Record<string, string> } }).error;
  if (!e || typeof e.code !== 'string' || typeof e.message !== 'string') throw new Error(`not the error shape: ${JSON.stringify(body)}`);
  return { code: e.code, message: e.message, fields: e.fields };
}

/** Waits (up to `timeoutMs`) until no calibration fit is queued or running: the stored fits are current. */
export async function calibrationsIdle(timeoutMs = 30000): Promise<void> {
  const deadline = Date.now() + timeoutMs;
  while (Date.now() < deadline) {
    const [row] = await sequelize.query<{ n: string }>("SELECT count(*) AS n FROM pgboss.job WHERE name = 'calibration' AND state IN ('created', 'retry', 'active')", { type: QueryTypes.SELECT });
    if (Number(row.n) === 0) return;
    await new Promise((r) => setTimeout(r, 50));
  }
  throw new Error(`calibration fits still queued after ${timeoutMs} ms`);
}
