// npm run db:start | db:stop — the project's own PostgreSQL cluster in .data/pg on DB_PORT (default 5433).
import { root } from './lib/deps.mjs';
import { projectClusterDir, startCluster, stopCluster } from './lib/pg.mjs';

const dataDir = projectClusterDir(root).dir;
const port = Number(process.env.DB_PORT ?? 5433);
const cmd = process.argv[2];
try {
  if (cmd === 'start') {
    const url = await startCluster({ dataDir, port });
    console.log(`PostgreSQL running: ${url.replace(/:[^:@/]+@/, ':***@')}`);
  } else if (cmd === 'stop') {
    console.log(stopCluster(dataDir) ? `Stopped the project's PostgreSQL (port ${port}).` : "The project's PostgreSQL was not running.");
  } else {
    throw new Error('usage: node scripts/db.mjs start|stop');
  }
} catch (err) {
  console.error(err instanceof Error ? err.message : err);
  process.exit(1);
}
