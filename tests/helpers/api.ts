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

/** Polls a count query until it answers 0 or `timeoutMs` pass; returns whether it reached 0. */
async function untilNone(sql: string, replacements: Record<string, unknown>, timeoutMs: number): Promise<boolean> {
  const deadline = Date.now() + timeoutMs;
  while (Date.now() < deadline) {
    const [row] = await sequelize.query<{ n: string }>(sql, { type: QueryTypes.SELECT, replacements });
    if (Number(row.n) === 0) return true;
    await new Promise((r) => setTimeout(r, 50));
  }
  return false;
}

/** Waits (up to `timeoutMs`) until the outbox has nothing pending or being sent: background mail work has settled. */
export async function outboxIdle(timeoutMs = 10000): Promise<void> {
  await untilNone("SELECT count(*) AS n FROM mail_outbox WHERE status IN ('pending', 'sending')", {}, timeoutMs);
}

let counter = 0;
/** A unique e-mail for this test run. */
export function uniqueEmail(tag = 'user'): string {
  counter += 1;
  return `${tag}-${process.pid}-${Date.now()}-${counter}@example.test`;
}

let markers = 0;
/**
 * A text no other record has (`Class Filter 4711-lq3x9a-1`): put it in the names of the records a test creates and
 * query the list by it (`q`), so the answer holds only the test's own records, never a page of someone else's.
 */
export function uniqueMarker(tag = 'Marker'): string {
  markers += 1;
  return `${tag} ${process.pid}-${Date.now().toString(36)}-${markers}`;
}

const hashCache = new Map<string, Promise<string>>();

/** Inserts a user with the given role straight into the database and returns it with a valid token (address verified unless `verified: false`). */
export async function createUser(
  role: Role = 'bowler',
  password = 'correct-horse-battery',
  opts: { verified?: boolean; displayName?: string } = {},
): Promise<{ user: User; token: string; password: string; auth: { Authorization: string } }> {
  if (!hashCache.has(password)) hashCache.set(password, hashPassword(password));
  const user = await User.create({
    email: uniqueEmail(role),
    passwordHash: await hashCache.get(password)!,
    displayName: opts.displayName ?? `Test ${role}`,
    role,
    emailVerifiedAt: opts.verified === false ? null : new Date(),
  });
  const token = signToken(user);
  return { user, token, password, auth: { Authorization: `Bearer ${token}` } };
}

/** Asserts the one error shape and returns its parts. */
export function errorOf(body: unknown): { code: string; message: string; fields?: Record<string, string> } {
  const e = (body as { error?: { code?: unknown; message?: unknown; fields?: Record<string, string> } }).error;
  if (!e || typeof e.code !== 'string' || typeof e.message !== 'string') throw new Error(`not the error shape: ${JSON.stringify(body)}`);
  return { code: e.code, message: e.message, fields: e.fields };
}

/**
 * Waits (up to `timeoutMs`) until no calibration fit of this bowler is queued or running (of anyone's without a
 * bowler): the stored fits are current. Another test file's process may have left a job of its own bowlers running.
 */
export async function calibrationsIdle(bowlerId?: number, timeoutMs = 15000): Promise<void> {
  const sql = `SELECT count(*) AS n FROM pgboss.job WHERE name = 'calibration' AND state IN ('created', 'retry', 'active')${bowlerId === undefined ? '' : " AND data->>'bowlerId' = :bowler"}`;
  if (!(await untilNone(sql, { bowler: String(bowlerId) }, timeoutMs)))
    throw new Error(`calibration fits still queued after ${timeoutMs} ms`);
}
