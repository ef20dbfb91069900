import type { ClientRateLimitInfo, Options, Store } from 'express-rate-limit';
import { QueryTypes } from 'sequelize';
import { sequelize } from '../db/sequelize';

/**
 * express-rate-limit's store on PostgreSQL (table rate_limit_hits), so every API process counts against the same
 * window (a fixed window per key, as express-rate-limit's own MemoryStore). One statement per hit:
 * an upsert that starts a new window when the old one has ended. Expired rows are deleted now and then.
 */
export class PostgresRateLimitStore implements Store {
  windowMs = 15 * 60 * 1000;
  localKeys = false;
  private lastSweep = 0;

  constructor(public prefix: string) {}

  init(options: Options): void {
    this.windowMs = options.windowMs;
  }

  private key(k: string): string {
    return `${this.prefix}:${k}`.slice(0, 300);
  }

  async get(key: string): Promise<ClientRateLimitInfo | undefined> {
    const [row] = await sequelize.query<{ hits: number; reset_at: Date }>(
      'SELECT hits, reset_at FROM rate_limit_hits WHERE key = :key AND reset_at > now()',
      {
        replacements: { key: this.key(key) },
        type: QueryTypes.SELECT,
        useMaster: true,
      },
    );
    return row ? { totalHits: row.hits, resetTime: new Date(row.reset_at) } : undefined;
  }

  async increment(key: string): Promise<ClientRateLimitInfo> {
    const [row] = await sequelize.query<{ hits: number; reset_at: Date }>(
      `INSERT INTO rate_limit_hits (key, hits, reset_at) VALUES (:key, 1, now() + make_interval(secs => :secs))
       ON CONFLICT (key) DO UPDATE SET
         hits = CASE WHEN rate_limit_hits.reset_at <= now() THEN 1 ELSE rate_limit_hits.hits + 1 END,
         reset_at = CASE WHEN rate_limit_hits.reset_at <= now() THEN EXCLUDED.reset_at ELSE rate_limit_hits.reset_at END
       RETURNING hits, reset_at`,
      { replacements: { key: this.key(key), secs: this.windowMs / 1000 }, type: QueryTypes.SELECT },
    );
    if (Date.now() - this.lastSweep > 60000) {
      this.lastSweep = Date.now();
      void sequelize.query('DELETE FROM rate_limit_hits WHERE reset_at < now()').catch(() => undefined);
    }
    return { totalHits: row.hits, resetTime: new Date(row.reset_at) };
  }

  async decrement(key: string): Promise<void> {
    await sequelize.query('UPDATE rate_limit_hits SET hits = GREATEST(hits - 1, 0) WHERE key = :key AND reset_at > now()', {
      replacements: { key: this.key(key) },
    });
  }

  async resetKey(key: string): Promise<void> {
    await sequelize.query('DELETE FROM rate_limit_hits WHERE key = :key', { replacements: { key: this.key(key) } });
  }

  async resetAll(): Promise<void> {
    await sequelize.query('DELETE FROM rate_limit_hits WHERE key LIKE :p', { replacements: { p: `${this.prefix}:%` } });
  }
}
