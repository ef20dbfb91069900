// npm run db:restore -- <file> [--url postgres://…] [--yes]: restores a db:backup file into the app's
// database (or --url), in one transaction: existing objects of the dump are dropped and recreated
// (pg_restore --clean --if-exists), so the database ends up exactly as backed up; any error rolls it all back.
// Schemas other than public that the dump holds (the job queue's `pgboss`) are dropped whole first: their
// partitioned tables cannot be cleaned object by object (a partition's inherited key cannot be dropped alone).
// pg_restore writes the script to a private temporary file; psql runs it only when it is complete.
// Asks for --yes before overwriting a database that has tables.
import { spawnSync } from 'node:child_process';
import fs from 'node:fs';
import os from 'node:os';
import path from 'node:path';
import { connection, databaseUrl, parseArgs, pgTool } from './lib/pgclient.mjs';

const { opts, rest } = parseArgs(process.argv.slice(2));
const file = rest[0] ?? opts.file;
if (!file || !fs.existsSync(file)) {
  console.error(
    `[restore] usage: npm run db:restore -- <backup file> [--url postgres://…] [--yes]${file ? `\n[restore] no such file: ${file}` : ''}`,
  );
  process.exit(2);
}
const url = databaseUrl(opts.url);
const c = connection(url);

const list = spawnSync(pgTool('pg_restore'), ['--list', file], { encoding: 'utf8' });
if (list.status !== 0) {
  console.error(`[restore] ${file} is not a pg_dump custom-format file:\n${list.stderr}`);
  process.exit(1);
}
const count = spawnSync(
  pgTool('psql'),
  [...c.args, '-tAc', "SELECT count(*) FROM information_schema.tables WHERE table_schema = 'public'"],
  { env: c.env, encoding: 'utf8' },
);
if (count.status !== 0) {
  console.error(`[restore] cannot reach ${c.label}:\n${count.stderr}`);
  process.exit(1);
}
const tables = Number(count.stdout.trim());
if (tables > 0 && !opts.yes) {
  console.error(
    `[restore] ${c.label} has ${tables} tables; their contents will be replaced by ${path.basename(file)}. Run again with --yes to go ahead.`,
  );
  process.exit(3);
}
const schemas = [...new Set([...list.stdout.matchAll(/^\d+; \d+ \d+ SCHEMA - (\S+)/gm)].map((m) => m[1]))].filter((s) => s !== 'public');
const quote = (id) => `"${id.replace(/"/g, '""')}"`;
const tmp = fs.mkdtempSync(path.join(os.tmpdir(), 'lanewright-restore-'));
let failure = null;
try {
  const script = path.join(tmp, 'restore.sql');
  const gen = spawnSync(pgTool('pg_restore'), ['--clean', '--if-exists', '--no-owner', '--no-privileges', '--file', script, file], {
    encoding: 'utf8',
  });
  if (gen.status !== 0) failure = `pg_restore could not read ${file} (nothing was changed):\n${gen.stderr}`;
  else {
    const drops = schemas.flatMap((s) => ['-c', `DROP SCHEMA IF EXISTS ${quote(s)} CASCADE`]);
    const r = spawnSync(pgTool('psql'), [...c.args, '-X', '-q', '--single-transaction', '-v', 'ON_ERROR_STOP=1', ...drops, '-f', script], {
      env: { ...c.env, PGOPTIONS: '--client-min-messages=warning' },
      encoding: 'utf8',
    });
    if (r.status !== 0) failure = `restoring into ${c.label} failed (nothing was changed):\n${r.stderr || r.stdout}`;
  }
} finally {
  fs.rmSync(tmp, { recursive: true, force: true });
}
if (failure) {
  console.error(`[restore] ${failure}`);
  process.exit(1);
}
console.log(`[restore] ${path.basename(file)} → ${c.label}`);
