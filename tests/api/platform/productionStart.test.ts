import { spawnSync } from 'node:child_process';
import path from 'node:path';
import pg from 'pg';
import { beforeAll, describe, expect, it } from 'vitest';
import { freshDatabase, root, throwawayCluster } from '../../helpers/database';

/** Finding 5: the demo accounts (their password is in the README) never reach a production database; finding 4: production needs PUBLIC_URL. */
let url = '';
beforeAll(async () => {
  url = await freshDatabase((await throwawayCluster()).adminUrl, 'lw_prod_start');
}, 60000);

async function userCount(): Promise<number> {
  const c = new pg.Client({ connectionString: url });
  await c.connect();
  try {
    return Number((await c.query('SELECT count(*) AS n FROM users')).rows[0].n);
  } finally {
    await c.end();
  }
}

const PROD = () => ({
  PATH: process.env.PATH ?? '',
  HOME: process.env.HOME ?? '/tmp',
  NODE_ENV: 'production',
  DATABASE_URL: url,
  JWT_SECRET: 'production-start-test-0123456789abcdef',
  SMTP_URL: 'smtp://127.0.0.1:9',
  STRIPE_SECRET_KEY: 'sk_test_start_check',
  STRIPE_WEBHOOK_SECRET: 'whsec_start_check',
  STRIPE_API_URL: 'http://127.0.0.1:9',
  PORT: '0',
});

describe('npm start with NODE_ENV=production', () => {
  it('refuses to start without PUBLIC_URL, naming it, and seeds nothing into the empty database', async () => {
    const r = spawnSync(process.execPath, [path.join(root, 'scripts', 'start.mjs')], {
      cwd: root,
      env: PROD(),
      encoding: 'utf8',
      timeout: 120000,
    });
    expect(r.status).not.toBe(0);
    expect(`${r.stdout}${r.stderr}`).toContain('PUBLIC_URL');
    expect(`${r.stdout}${r.stderr}`).not.toMatch(/Demo accounts/);
    expect(await userCount()).toBe(0);
  }, 150000);

  it('the seeder itself refuses a production database, even fully configured', async () => {
    const r = spawnSync(path.join(root, 'node_modules', '.bin', 'tsx'), ['seeders/index.ts'], {
      cwd: root,
      env: { ...PROD(), PUBLIC_URL: 'https://lanes.example' },
      encoding: 'utf8',
      timeout: 60000,
    });
    expect(r.status).not.toBe(0);
    expect(r.stderr).toContain('Refusing to seed');
    expect(await userCount()).toBe(0);
  }, 90000);
});
