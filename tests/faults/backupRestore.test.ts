import { spawnSync } from 'node:child_process';
import fs from 'node:fs';
import os from 'node:os';
import path from 'node:path';
import pg from 'pg';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { root, runTsx } from '../helpers/database';
import { ownCluster, type OwnCluster } from './harness';

/**
 * `npm run db:backup` and `npm run db:restore` round-trip the demo data: seed a throwaway database, back
 * it up with pg_dump, restore it into another database with pg_restore, and compare every table's row
 * count and content checksum (md5 over its rows in a stable order).
 */
let cluster: OwnCluster;
let restoredUrl: string;
const dir = fs.mkdtempSync(path.join(os.tmpdir(), 'lanewright-backup-'));
const file = path.join(dir, 'demo.dump');

beforeAll(async () => {
  cluster = await ownCluster('backup');
  runTsx(['seeders/index.ts'], cluster.url);
  restoredUrl = cluster.url.replace(/\/[^/]+$/, '/lw_restored');
  await cluster.query('CREATE DATABASE lw_restored');
}, 180000);
afterAll(() => {
  cluster?.remove();
  fs.rmSync(dir, { recursive: true, force: true });
});

async function tableSums(url: string): Promise<Record<string, { rows: number; md5: string }>> {
  const c = new pg.Client({ connectionString: url });
  await c.connect();
  try {
    const tables = (
      await c.query<{ t: string }>(
        `SELECT table_name AS t FROM information_schema.tables WHERE table_schema = 'public' AND table_type = 'BASE TABLE' ORDER BY 1`,
      )
    ).rows.map((r) => r.t);
    const out: Record<string, { rows: number; md5: string }> = {};
    for (const t of tables) {
      const r = await c.query<{ n: string; md5: string }>(
        `SELECT count(*) AS n, md5(coalesce(string_agg(x::text, '|' ORDER BY x::text), '')) AS md5 FROM "${t}" x`,
      );
      out[t] = { rows: Number(r.rows[0].n), md5: r.rows[0].md5 };
    }
    return out;
  } finally {
    await c.end();
  }
}

const npm = (args: string[]) =>
  spawnSync('npm', ['run', '--silent', ...args], { cwd: root, encoding: 'utf8', env: { ...process.env, DATABASE_URL: '' } });

describe('db:backup and db:restore', () => {
  it('round-trip the demo data: same tables, row counts and checksums', async () => {
    const b = npm(['db:backup', '--', file, '--url', cluster.url]);
    expect(b.status, b.stderr).toBe(0);
    expect(fs.statSync(file).size).toBeGreaterThan(1000);
    expect(fs.statSync(file).mode & 0o077).toBe(0); // readable by its owner only

    const r = npm(['db:restore', '--', file, '--url', restoredUrl]);
    expect(r.status, r.stderr).toBe(0);

    const [a, z] = await Promise.all([tableSums(cluster.url), tableSums(restoredUrl)]);
    expect(Object.keys(a).length).toBeGreaterThan(10);
    expect(a.users.rows).toBeGreaterThanOrEqual(5); // the demo accounts
    expect(a.conditions.rows).toBeGreaterThan(0);
    expect(z).toEqual(a);
  });

  it('refuses to overwrite a database with tables unless told to, then replaces its contents', async () => {
    await cluster.query(`UPDATE users SET display_name = 'Changed after the backup' WHERE id = (SELECT min(id) FROM users)`);
    const refused = npm(['db:restore', '--', file, '--url', cluster.url]);
    expect(refused.status).toBe(3);
    expect(refused.stderr).toContain('--yes');
    const done = npm(['db:restore', '--', file, '--url', cluster.url, '--yes']);
    expect(done.status, done.stderr).toBe(0);
    expect(await tableSums(cluster.url)).toEqual(await tableSums(restoredUrl));
  });

  it('a file that is not a backup changes nothing', async () => {
    const bad = path.join(dir, 'not-a-dump.dump');
    fs.writeFileSync(bad, 'this is not a pg_dump archive');
    const before = await tableSums(restoredUrl);
    const r = npm(['db:restore', '--', bad, '--url', restoredUrl, '--yes']);
    expect(r.status).toBe(1);
    expect(await tableSums(restoredUrl)).toEqual(before);
  });
});
