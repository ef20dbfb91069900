// npm run db:backup [-- [file] [--url postgres://…]]: a pg_dump of the app's database in PostgreSQL's
// custom format (compressed, restorable table by table with pg_restore). Default file:
// .data/backups/lanewright-<UTC date-time>.dump. Uses Debian's pg_dump (the server's own version).
import { spawnSync } from 'node:child_process';
import fs from 'node:fs';
import path from 'node:path';
import { root } from './lib/deps.mjs';
import { connection, databaseUrl, parseArgs, pgTool } from './lib/pgclient.mjs';

const { opts, rest } = parseArgs(process.argv.slice(2));
const url = databaseUrl(opts.url);
const stamp = new Date().toISOString().replace(/[-:]/g, '').replace(/\..*/, 'Z');
const file = path.resolve(rest[0] ?? opts.out ?? path.join(root, '.data', 'backups', `lanewright-${stamp}.dump`));
fs.mkdirSync(path.dirname(file), { recursive: true });

const c = connection(url);
const tmp = `${file}.partial`;
const r = spawnSync(pgTool('pg_dump'), [...c.args, '--format=custom', '--compress=6', '--no-owner', '--no-privileges', '--file', tmp], {
  env: c.env,
  encoding: 'utf8',
});
if (r.status !== 0) {
  fs.rmSync(tmp, { force: true });
  console.error(`[backup] pg_dump of ${c.label} failed:\n${r.stderr || r.stdout}`);
  process.exit(1);
}
fs.renameSync(tmp, file); // a backup file is only ever complete
fs.chmodSync(file, 0o600);
console.log(`[backup] ${c.label} → ${path.relative(process.cwd(), file) || file} (${(fs.statSync(file).size / 1024).toFixed(1)} kB)`);
