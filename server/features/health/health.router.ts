import { Router } from 'express';
import { sequelize } from '../../models/index';

export const healthRouter = Router();

/** Liveness and database reachability: 200 {status: ok, db: ok} or 503 {status: degraded, db: unreachable}. */
healthRouter.get('/', async (_req, res) => {
  try {
    await Promise.race([
      sequelize.query('SELECT 1'),
      new Promise((_, reject) => setTimeout(() => reject(new Error('database check timed out')), 3000).unref()),
    ]);
    res.json({ status: 'ok', db: 'ok' });
  } catch {
    res.status(503).json({ status: 'degraded', db: 'unreachable' });
  }
});
