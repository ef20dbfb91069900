import type { QueryInterface } from 'sequelize';
import pg from 'pg';
import { SequelizeStorage, Umzug } from 'umzug';
import { config } from '../config/index';
import { installJobSchema } from '../lib/jobs';
import { logger } from '../lib/logger';
import { MIGRATIONS } from './migrations/index';
import { sequelize } from './sequelize';

export type MigrationContext = QueryInterface;

/** Runs the migrations of server/db/migrations/index.ts in order; their state lives in table "migrations". */
export const migrator = new Umzug<QueryInterface>({
  migrations: MIGRATIONS.map(({ name, module }) => ({
    name,
    up: ({ context }) => module.up({ context }),
    down: ({ context }) => module.down({ context }),
  })),
  context: sequelize.getQueryInterface(),
  storage: new SequelizeStorage({ sequelize, tableName: 'migrations' }),
  logger: { info: (m) => logger.debug(m), warn: (m) => logger.warn(m), error: (m) => logger.error(m), debug: (m) => logger.trace(m) },
});

/** The advisory-lock key every Lanewright process takes around migrations (an arbitrary 64-bit constant). */
export const MIGRATION_LOCK_KEY = 7431_2026_0008;

/**
 * Runs `work` while holding a PostgreSQL session-level advisory lock on its own connection to the primary, so
 * several processes started at once migrate one after the other: the first applies the pending migrations,
 * the others wait, then find nothing pending (PostgreSQL documentation, "Advisory Locks").
 */
export async function withMigrationLock<T>(work: () => Promise<T>): Promise<T> {
  const client = new pg.Client({ connectionString: config.databaseUrl, application_name: 'lanewright-migrate' });
  await client.connect();
  try {
    await client.query('SELECT pg_advisory_lock($1)', [MIGRATION_LOCK_KEY]);
    try {
      return await work();
    } finally {
      await client.query('SELECT pg_advisory_unlock($1)', [MIGRATION_LOCK_KEY]).catch(() => undefined);
    }
  } finally {
    await client.end().catch(() => undefined);
  }
}

/** Applies every pending migration, then installs or upgrades the job queue's schema and queues, all under the lock; returns the names applied. */
export async function migrateUp(): Promise<string[]> {
  return withMigrationLock(async () => {
    const done = (await migrator.up()).map((m) => m.name);
    await installJobSchema();
    return done;
  });
}
