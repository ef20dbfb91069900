// Command line: `npm run db:migrate` (built: `node dist/server/migrate.js up|down|pending`).
// Safe when several processes run it at once: `up` holds a PostgreSQL advisory lock (migrator.ts).
import { migrateUp, migrator, withMigrationLock } from './migrator';
import { sequelize } from './sequelize';

const cmd = process.argv[2] ?? 'up';
try {
  if (cmd === 'up') {
    const done = await migrateUp();
    console.log(done.length ? `Applied ${done.length} migration(s): ${done.join(', ')}` : 'Database schema is up to date.');
  } else if (cmd === 'down') {
    const done = await withMigrationLock(() => migrator.down());
    console.log(`Reverted: ${done.map((m) => m.name).join(', ') || 'nothing'}`);
  } else if (cmd === 'pending') {
    console.log((await migrator.pending()).map((m) => m.name).join('\n') || 'none');
  } else {
    throw new Error(`unknown command ${cmd}; use up, down or pending`);
  }
} catch (err) {
  console.error(err instanceof Error ? err.message : err);
  process.exitCode = 1;
} finally {
  await sequelize.close();
}
