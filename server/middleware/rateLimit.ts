import rateLimit from 'express-rate-limit';
import { config } from '../config/index';

/** Limits sign-in, sign-up and reset attempts per client address (per 15 minutes). */
export const authRateLimit = rateLimit({
  windowMs: 15 * 60 * 1000,
  limit: config.RATE_LIMIT_AUTH,
  standardHeaders: 'draft-8',
  legacyHeaders: false,
  handler: (_req, res) => {
    res.status(429).json({ error: { code: 'rate_limited', message: 'Too many attempts; wait a few minutes and try again' } });
  },
});
