import path from 'node:path';
import { fileURLToPath, pathToFileURL } from 'node:url';
import type { QueryInterface } from 'sequelize';
import { SequelizeStorage, Umzug } from 'umzug';
import { sequelize } from './sequelize';
import { logger } from '../lib/logger';

const here = path.dirname(fileURLToPath(import.meta.url));

export type MigrationContext = QueryInterface;

interface MigrationModule {
  up: (args: { context: QueryInterface }) => Promise<void>;
  down: (args: { context: QueryInterface }) => Promise<void>;
}

/** Runs the migration files in server/db/migrations in name order; their state lives in table "migrations". */
export const migrator = new Umzug<QueryInterface>({
  migrations: {
    glob: ['migrations/*.ts', { cwd: here }],
    resolve: ({ name, path: file, context }) => ({
      name,
      up: async () => ((await import(pathToFileURL(file!).href)) as MigrationModule).up({ context }),
      down: async () => ((await import(pathToFileURL(file!).href)) as MigrationModule).down({ context }),
    }),
  },
  context: sequelize.getQueryInterface(),
  storage: new SequelizeStorage({ sequelize, tableName: 'migrations' }),
  logger: { info: (m) => logger.debug(m), warn: (m) => logger.warn(m), error: (m) => logger.error(m), debug: (m) => logger.trace(m) },
});
