import supertest from 'supertest';
import type { Role } from '../../shared/auth';
import { createApp } from '../../server/app';
import { hashPassword } from '../../server/features/auth/auth.service';
import { signToken } from '../../server/middleware/auth';
import { User } from '../../server/models/index';

export const app = createApp();
export const api = supertest(app);

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

/** Inserts a user with the given role straight into the database and returns it with a valid token. */
export async function createUser(
  role: Role = 'bowler',
  password = 'correct-horse-battery',
  opts: { displayName?: string } = {},
): Promise<{ user: User; token: string; password: string; auth: { Authorization: string } }> {
  if (!hashCache.has(password)) hashCache.set(password, hashPassword(password));
  const user = await User.create({ email: uniqueEmail(role), passwordHash: await hashCache.get(password)!, displayName: opts.displayName ?? `Test ${role}`, role });
  const token = signToken(user);
  return { user, token, password, auth: { Authorization: `Bearer ${token}` } };
}

/** Asserts the one error shape and returns its parts. */
export function errorOf(body: unknown): { code: string; message: string; fields?: Record<string, string> } {
  const e = (body as { error?: { code?: unknown; message?: unknown; fields?: Record<string, string> } }).error;
  if (!e || typeof e.code !== 'string' || typeof e.message !== 'string') throw new Error(`not the error shape: ${JSON.stringify(body)}`);
  return { code: e.code, message: e.message, fields: e.fields };
}
