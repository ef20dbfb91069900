// Command line: `tsx server/db/migrate.ts up|down|pending`.
import { migrator } from './migrator';
import { sequelize } from './sequelize';

const cmd = process.argv[2] ?? 'up';
try {
  if (cmd === 'up') {
    const done = await migrator.up();
    console.log(done.length ? `Applied ${done.length} migration(s): ${done.map((m) => m.name).join(', ')}` : 'Database schema is up to date.');
  } else if (cmd === 'down') {
    const done = await migrator.down();
    console.log(`Reverted: ${done.map((m) => m.name).join(', ') || 'nothing'}`);
  } else if (cmd === 'pending') {
    console.log((await migrator.pending()).map((m) => m.name).join('\n') || 'none');
  } else {
    throw new Error(`unknown command ${cmd}; use up, down or pending`);
  }
} finally {
  await sequelize.close();
}
