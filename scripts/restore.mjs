// npm run db:restore -- <file> [--url postgres://…] [--yes]: restores a db:backup file into the app's
// database (or --url) with pg_restore, in one transaction: existing objects of the dump are dropped and
// recreated (--clean --if-exists), so the database ends up exactly as backed up; any error rolls it all
// back. Asks for --yes before overwriting a database that has tables.
import { spawnSync } from 'node:child_process';
import fs from 'node:fs';
import path from 'node:path';
import { connection, databaseUrl, parseArgs, pgTool } from './lib/pgclient.mjs';

const { opts, rest } = parseArgs(process.argv.slice(2));
const file = rest[0] ?? opts.file;
if (!file || !fs.existsSync(file)) {
  console.error(`[restore] usage: npm run db:restore -- <backup file> [--url postgres://…] [--yes]${file ? `\n[restore] no such file: ${file}` : ''}`);
  process.exit(2);
}
const url = databaseUrl(opts.url);
const c = connection(url);

const list = spawnSync(pgTool('pg_restore'), ['--list', file], { encoding: 'utf8' });
if (list.status !== 0) {
  console.error(`[restore] ${file} is not a pg_dump custom-format file:\n${list.stderr}`);
  process.exit(1);
}
const count = spawnSync(pgTool('psql'), [...c.args, '-tAc', "SELECT count(*) FROM information_schema.tables WHERE table_schema = 'public'"], { env: c.env, encoding: 'utf8' });
if (count.status !== 0) {
  console.error(`[restore] cannot reach ${c.label}:\n${count.stderr}`);
  process.exit(1);
}
const tables = Number(count.stdout.trim());
if (tables > 0 && !opts.yes) {
  console.error(`[restore] ${c.label} has ${tables} tables; their contents will be replaced by ${path.basename(file)}. Run again with --yes to go ahead.`);
  process.exit(3);
}
const r = spawnSync(pgTool('pg_restore'), [...c.args, '--clean', '--if-exists', '--no-owner', '--no-privileges', '--single-transaction', '--exit-on-error', file], { env: c.env, encoding: 'utf8' });
if (r.status !== 0) {
  console.error(`[restore] pg_restore into ${c.label} failed (nothing was changed):\n${r.stderr || r.stdout}`);
  process.exit(1);
}
console.log(`[restore] ${path.basename(file)} → ${c.label}`);
