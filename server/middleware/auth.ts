import { createSecretKey } from 'node:crypto';
import type { NextFunction, Request, Response } from 'express';
import jwt from 'jsonwebtoken';
import passport from 'passport';
import { ExtractJwt, Strategy as JwtStrategy } from 'passport-jwt';
import { holdsRole, type Role } from '../../shared/auth';
import { config } from '../config/index';
import { AppError } from '../lib/AppError';
import { ScopedCache } from '../lib/changeFeed';
import { QueryTypes, type Transaction } from 'sequelize';
import { hasReplicas } from '../db/sequelize';
import { requestContext } from '../lib/logger';
import { sequelize, User } from '../models/index';

export interface AuthUser {
  id: number;
  email: string;
  displayName: string;
  /** The highest role held (as before roles became a set). */
  role: Role;
  /** Every role held: authorisation checks read these (`holdsRole`). */
  roles: Role[];
}

declare global {
  // eslint-disable-next-line @typescript-eslint/no-namespace
  namespace Express {
    // eslint-disable-next-line @typescript-eslint/no-empty-object-type
    interface User extends AuthUser {}
  }
}

interface TokenPayload {
  sub: string;
  ver: number;
}

const ISSUER = 'lanewright';
const AUDIENCE = 'lanewright-api';

/**
 * The signing secret as a KeyObject, made once: given a string, jsonwebtoken first tries to read it as a public key
 * (createPublicKey) on every verify and catches the failure, which cost more than the rest of a list request.
 */
const SIGNING_KEY = createSecretKey(Buffer.from(config.JWT_SECRET, 'utf8'));

/** Signs an access token for a user (HS256, expires after JWT_EXPIRES_IN). */
export function signToken(user: { id: number; tokenVersion: number }): string {
  return jwt.sign({ ver: user.tokenVersion }, SIGNING_KEY, {
    subject: String(user.id),
    expiresIn: config.JWT_EXPIRES_IN as jwt.SignOptions['expiresIn'],
    issuer: ISSUER,
    audience: AUDIENCE,
    algorithm: 'HS256',
  });
}

/**
 * The signed-in user's row (one primary-key lookup on the primary, with the user's last write from
 * user_write_marks, which decides whether this request's reads may go to a replica), kept for CACHE_TTL_MS in
 * this process. The cache answers only while this process hears the database's change feed
 * (server/lib/changeFeed.ts): a change of the user's row (role, e-mail, name, token version: a password reset, a
 * sign-out everywhere, a deletion) or of their write mark, made by any process, drops the entry when it commits,
 * so a demoted user or a reset password takes effect at once in every process (in the writer's when the change
 * commits, in the others within the notification's delivery, milliseconds); the token's version is still compared
 * with the row's on every request. With replicas configured nothing is cached.
 */
interface AuthRow {
  id: number;
  email: string;
  display_name: string;
  role: Role;
  roles: Role[];
  token_version: number;
  wrote_at: Date | null;
}

const authRows = new ScopedCache<AuthRow>('user', { ttlMs: config.CACHE_TTL_MS, maxIds: 10_000, maxPerId: 1 });

async function authRow(id: number): Promise<AuthRow | null> {
  const hit = authRows.get(id);
  if (hit !== undefined) return hit;
  const ticket = authRows.ticket(id);
  const [u] = await sequelize.query<AuthRow>(
    'SELECT u.id, u.email, u.display_name, u.role, u.roles, u.token_version, w.at AS wrote_at FROM users u LEFT JOIN user_write_marks w ON w.user_id = u.id WHERE u.id = :id',
    { replacements: { id }, type: QueryTypes.SELECT, useMaster: true },
  );
  // An unknown id is never cached (only a committed user row is); nor is anything with replicas, where the write mark
  // must be read fresh on every request so a user's reads after their own write (in any process) skip the replicas.
  if (u && !hasReplicas) authRows.set(ticket, '', u);
  return u ?? null;
}

/** Drops a user's cached sign-in row in this process at once (call after the change commits; other processes hear the change feed). */
export function forgetSignedInUser(id: number): void {
  authRows.invalidate(id);
}

// Every saved or deleted user row (a role change, a password reset, a new e-mail) is dropped here when it commits.
for (const hook of ['afterSave', 'afterDestroy'] as const) {
  User.addHook(hook, (user: User, options: { transaction?: Transaction | null }) => {
    forgetSignedInUser(user.id);
    options.transaction?.afterCommit(() => forgetSignedInUser(user.id));
  });
}

passport.use(
  new JwtStrategy(
    {
      jwtFromRequest: ExtractJwt.fromAuthHeaderAsBearerToken(),
      secretOrKey: SIGNING_KEY as unknown as string, // a KeyObject: passport-jwt hands it to jsonwebtoken as it is
      issuer: ISSUER,
      audience: AUDIENCE,
      algorithms: ['HS256'],
    },
    (payload: TokenPayload, done: (err: unknown, user?: AuthUser | false) => void) => {
      const id = Number(payload.sub);
      if (!Number.isInteger(id) || id <= 0 || id > 2147483647) {
        done(null, false);
        return;
      }
      authRow(id)
        .then((u) => {
          if (!u || u.token_version !== payload.ver) return done(null, false);
          const ctx = requestContext.getStore();
          if (ctx && u.wrote_at && Date.now() - new Date(u.wrote_at).getTime() < config.READ_YOUR_WRITES_MS) ctx.replicaReads = false;
          return done(null, { id: u.id, email: u.email, displayName: u.display_name, role: u.role, roles: u.roles });
        })
        .catch((err: unknown) => done(err));
    },
  ),
);

/** Before a signed-in user's write: note it on the primary, so their reads for the next READ_YOUR_WRITES_MS (from any process) skip the replicas. */
async function markWrite(req: Request, user: AuthUser): Promise<void> {
  if (req.method === 'GET' || req.method === 'HEAD' || !hasReplicas) return;
  await sequelize.query('INSERT INTO user_write_marks (user_id, at) VALUES (:id, now()) ON CONFLICT (user_id) DO UPDATE SET at = now()', {
    replacements: { id: user.id },
  });
  forgetSignedInUser(user.id);
}

export const passportInitialize = passport.initialize();

/** Requires a valid bearer token; 401 in the error shape otherwise. */
export function requireAuth(req: Request, res: Response, next: NextFunction): void {
  passport.authenticate('jwt', { session: false }, (err: unknown, user: AuthUser | false) => {
    if (err) return next(err);
    if (!user) return next(AppError.unauthorized('Your session is missing, expired or invalid; sign in again'));
    req.user = user;
    markWrite(req, user).then(() => next(), next);
  })(req, res, next);
}

/** Requires one of the roles (after requireAuth); 403 otherwise. */
export function requireRole(...roles: Role[]) {
  return (req: Request, _res: Response, next: NextFunction): void => {
    if (!req.user) return next(AppError.unauthorized());
    if (!holdsRole(req.user, ...roles)) return next(AppError.forbidden('Your role does not allow this'));
    next();
  };
}

/** The signed-in user (routes behind requireAuth only). */
export function currentUser(req: Request): AuthUser {
  if (!req.user) throw AppError.unauthorized();
  return req.user;
}

/** Signs the user in when a valid bearer token is sent; public routes go on without one. */
export function optionalAuth(req: Request, res: Response, next: NextFunction): void {
  if (!req.headers.authorization) return next();
  passport.authenticate('jwt', { session: false }, (err: unknown, user: AuthUser | false) => {
    if (err) return next(err);
    if (!user) return next();
    req.user = user;
    markWrite(req, user).then(() => next(), next);
  })(req, res, next);
}
