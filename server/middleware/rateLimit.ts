import rateLimit from 'express-rate-limit';
import { config } from '../config/index';
import { PostgresRateLimitStore } from '../lib/rateLimitStore';

const tooMany = (_req: unknown, res: { status: (n: number) => { json: (b: unknown) => void } }) => {
  res.status(429).json({ error: { code: 'rate_limited', message: 'Too many attempts; wait a few minutes and try again' } });
};

/** Counters live in PostgreSQL (rate_limit_hits), shared by every API process. */

/** Sign-in, reset: counts only failed attempts per client address (15 minutes), so guessing is slow and normal use is not limited. */
export const authRateLimit = rateLimit({
  windowMs: 15 * 60 * 1000,
  limit: config.RATE_LIMIT_AUTH,
  skipSuccessfulRequests: true,
  store: new PostgresRateLimitStore('auth'),
  standardHeaders: 'draft-8',
  legacyHeaders: false,
  handler: tooMany,
});

/** Sign-up and reset-mail requests: every attempt counts, per client address (15 minutes). */
export const signupRateLimit = rateLimit({
  windowMs: 15 * 60 * 1000,
  store: new PostgresRateLimitStore('signup'),
  limit: config.RATE_LIMIT_AUTH,
  standardHeaders: 'draft-8',
  legacyHeaders: false,
  handler: tooMany,
});

/** Uploads accepted per client address per 15 minutes (CSV imports, pattern files, photos). */
export const UPLOAD_RATE_LIMIT = 60;

/**
 * File uploads (any multipart request under /api): every attempt counts, per client address (15 minutes),
 * so nobody can fill the disk or keep the CSV parser busy. Mounted once in app.ts for every route.
 */
export const uploadRateLimit = rateLimit({
  windowMs: 15 * 60 * 1000,
  limit: UPLOAD_RATE_LIMIT,
  skip: (req) => !(req.headers['content-type'] ?? '').toLowerCase().startsWith('multipart/'),
  store: new PostgresRateLimitStore('upload'),
  standardHeaders: 'draft-8',
  legacyHeaders: false,
  handler: tooMany,
});
