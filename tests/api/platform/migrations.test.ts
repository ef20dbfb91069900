import fs from 'node:fs';
import path from 'node:path';
import pg from 'pg';
import { describe, expect, it } from 'vitest';
import { MIGRATIONS } from '../../../server/db/migrations/index';
import { root } from '../../helpers/database';

/**
 * The migrations are a static list (server/db/migrations/index.ts) so the production build can bundle them; a
 * file added to the folder but not to the list would never run. These tests hold the list to the folder.
 */
const folder = path.join(root, 'server', 'db', 'migrations');
const files = fs
  .readdirSync(folder)
  .filter((f) => f.endsWith('.ts') && f !== 'index.ts')
  .sort();

describe('the migration list (server/db/migrations/index.ts)', () => {
  it('names every migration file of the folder, each once, in file-name order', () => {
    expect(files.length).toBeGreaterThanOrEqual(8);
    expect(MIGRATIONS.map((m) => m.name)).toEqual(files);
  });

  it('pairs each name with the module of that file (its up and down), not another one', async () => {
    for (const { name, module } of MIGRATIONS) {
      expect(typeof module.up, name).toBe('function');
      expect(typeof module.down, name).toBe('function');
      const own = (await import(path.join(folder, name))) as typeof module;
      expect(module.up, name).toBe(own.up);
      expect(module.down, name).toBe(own.down);
    }
  });

  it('is what `db:migrate` applied to the test database, in order', async () => {
    const c = new pg.Client({ connectionString: process.env.DATABASE_URL! });
    await c.connect();
    try {
      const applied = (await c.query<{ name: string }>('SELECT name FROM migrations ORDER BY name')).rows.map((r) => r.name);
      expect(applied).toEqual(files);
    } finally {
      await c.end();
    }
  });
});
