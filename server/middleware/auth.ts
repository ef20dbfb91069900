import type { NextFunction, Request, Response } from 'express';
import jwt from 'jsonwebtoken';
import { LRUCache } from 'lru-cache';
import passport from 'passport';
import { ExtractJwt, Strategy as JwtStrategy } from 'passport-jwt';
import type { Role } from '../../shared/auth';
import { config } from '../config/index';
import { AppError } from '../lib/AppError';
import { User } from '../models/index';

export interface AuthUser {
  id: number;
  email: string;
  displayName: string;
  role: Role;
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

/** Signs an access token for a user (HS256, expires after JWT_EXPIRES_IN). */
export function signToken(user: { id: number; tokenVersion: number }): string {
  return jwt.sign({ ver: user.tokenVersion }, config.JWT_SECRET, {
    subject: String(user.id),
    expiresIn: config.JWT_EXPIRES_IN as jwt.SignOptions['expiresIn'],
    issuer: ISSUER,
    audience: AUDIENCE,
    algorithm: 'HS256',
  });
}

/**
 * Signed-in users looked up in the last few seconds, by id: saves one query per request. Role changes and
 * password resets call forgetAuthUser, so they take effect at once; anything else at most AUTH_CACHE_MS later.
 */
const AUTH_CACHE_MS = 5000;
const authCache = new LRUCache<number, { user: AuthUser; tokenVersion: number }>({ max: 10000, ttl: AUTH_CACHE_MS });

/** Drops a user from the sign-in cache (after a role change, a password reset or a deletion). */
export function forgetAuthUser(id: number): void {
  authCache.delete(id);
}

passport.use(
  new JwtStrategy(
    {
      jwtFromRequest: ExtractJwt.fromAuthHeaderAsBearerToken(),
      secretOrKey: config.JWT_SECRET,
      issuer: ISSUER,
      audience: AUDIENCE,
      algorithms: ['HS256'],
    },
    (payload: TokenPayload, done: (err: unknown, user?: AuthUser | false) => void) => {
      const id = Number(payload.sub);
      if (!Number.isInteger(id)) {
        done(null, false);
        return;
      }
      const cached = authCache.get(id);
      if (cached) {
        done(null, cached.tokenVersion === payload.ver ? cached.user : false);
        return;
      }
      User.findByPk(id)
        .then((u) => {
          if (!u) return done(null, false);
          const user: AuthUser = { id: u.id, email: u.email, displayName: u.displayName, role: u.role };
          authCache.set(id, { user, tokenVersion: u.tokenVersion });
          if (u.tokenVersion !== payload.ver) return done(null, false);
          return done(null, user);
        })
        .catch((err: unknown) => done(err));
    },
  ),
);

export const passportInitialize = passport.initialize();

/** Requires a valid bearer token; 401 in the error shape otherwise. */
export function requireAuth(req: Request, res: Response, next: NextFunction): void {
  passport.authenticate('jwt', { session: false }, (err: unknown, user: AuthUser | false) => {
    if (err) return next(err);
    if (!user) return next(AppError.unauthorized('Your session is missing, expired or invalid; sign in again'));
    req.user = user;
    return next();
  })(req, res, next);
}

/** Requires one of the roles (after requireAuth); 403 otherwise. */
export function requireRole(...roles: Role[]) {
  return (req: Request, _res: Response, next: NextFunction): void => {
    if (!req.user) return next(AppError.unauthorized());
    if (!roles.includes(req.user.role)) return next(AppError.forbidden('Your role does not allow this'));
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
    if (user) req.user = user;
    return next();
  })(req, res, next);
}
