import { Sequelize, type Options } from 'sequelize';
import { config } from '../config/index';
import { logger, requestContext } from '../lib/logger';

/** Sequelize's connection fields from a postgres:// URL (replication takes one object per server). */
function serverOf(url: string): { host: string; port: number; username: string; password: string; database: string } {
  const u = new URL(url);
  return {
    host: u.hostname,
    port: Number(u.port || 5432),
    username: decodeURIComponent(u.username),
    password: decodeURIComponent(u.password),
    database: decodeURIComponent(u.pathname.slice(1)),
  };
}

const common: Options = {
  dialect: 'postgres',
  logging: (sql) => logger.trace({ sql }, 'sql'),
  timezone: '+00:00',
  pool: { max: config.DB_POOL_MAX, min: 0, idle: 10000, acquire: 10000 },
  dialectOptions: { connectionTimeoutMillis: 5000, statement_timeout: 15000, application_name: 'lanewright' },
  define: { underscored: true },
};

/**
 * The one Sequelize instance (PostgreSQL through pg). Timestamps in UTC. With DATABASE_REPLICA_URLS, Sequelize's
 * `replication` sends writes and transactions to the primary and plain SELECTs to the replicas — but only
 * where this process says a replica may answer (below): everything else reads the primary.
 */
export const sequelize = config.replicaUrls.length
  ? new Sequelize({ ...common, replication: { write: serverOf(config.databaseUrl), read: config.replicaUrls.map(serverOf) } })
  : new Sequelize(config.databaseUrl, common);

/**
 * Which reads a replica may serve: only a GET request's, and only when its user wrote nothing within
 * READ_YOUR_WRITES_MS (middleware/auth.ts marks and reads each user's last write on the primary). Requests
 * that write, the job worker, migrations and anything outside a request read the primary, so a read that
 * follows its own write never sees a replica that has not caught up yet (read-your-writes consistency,
 * common practice with asynchronous replicas).
 */
sequelize.addHook('beforePoolAcquire', (options: { useMaster?: boolean }) => {
  if (!requestContext.getStore()?.replicaReads) options.useMaster = true;
});

/** Whether reads may go to a replica at all (replicas configured). */
export const hasReplicas = config.replicaUrls.length > 0;

/** A trivial query on the primary (health and readiness checks). */
export async function pingPrimary(): Promise<void> {
  await sequelize.query('SELECT 1', { useMaster: true });
}
