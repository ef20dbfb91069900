import { Sequelize } from 'sequelize';
import { config } from '../config/index';
import { logger } from '../lib/logger';

/** The one Sequelize instance (PostgreSQL through pg). Timestamps in UTC. */
export const sequelize = new Sequelize(config.databaseUrl, {
  dialect: 'postgres',
  logging: (sql) => logger.trace({ sql }, 'sql'),
  timezone: '+00:00',
  pool: { max: config.DB_POOL_MAX, min: 0, idle: 10000, acquire: 10000 },
  dialectOptions: { connectionTimeoutMillis: 5000, statement_timeout: 15000 },
  define: { underscored: true },
});
