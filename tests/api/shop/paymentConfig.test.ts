import { spawnSync } from 'node:child_process';
import fs from 'node:fs';
import os from 'node:os';
import path from 'node:path';
import { afterAll, describe, expect, it } from 'vitest';
import { root } from '../../helpers/database';

/** Loads the configuration in a fresh process with the given environment; returns its error text (empty when it loads). */
function loadConfig(env: Record<string, string>): string {
  const r = spawnSync(
    path.join(root, 'node_modules', '.bin', 'tsx'),
    ['-e', "import('./server/config/index.ts').then(() => console.log('loaded'))"],
    {
      cwd: root,
      env: { PATH: process.env.PATH ?? '', HOME: process.env.HOME ?? '', ...env },
      encoding: 'utf8',
      timeout: 60000,
    },
  );
  return r.stdout.includes('loaded') ? '' : r.stderr;
}

const PROD = {
  NODE_ENV: 'production',
  JWT_SECRET: 'a-real-production-secret-0123456789abcdef',
  PUBLIC_URL: 'https://lanes.example',
  DATABASE_URL: 'postgres://u:p@127.0.0.1:5432/db',
  SMTP_URL: 'smtp://127.0.0.1:25',
};

/** Development loads keep their generated secret in a folder of this test, not the project's .data. */
const DEV = { NODE_ENV: 'development', DATA_DIR: path.join(os.tmpdir(), `lanewright-payment-config-${process.pid}`) };
afterAll(() => fs.rmSync(DEV.DATA_DIR, { recursive: true, force: true }));

describe('payment configuration', () => {
  it('production refuses to start without a real secret key and webhook secret (no fake in production)', () => {
    const err = loadConfig(PROD);
    expect(err).toContain('STRIPE_SECRET_KEY');
    expect(err).toContain('STRIPE_WEBHOOK_SECRET');
    expect(loadConfig({ ...PROD, STRIPE_SECRET_KEY: 'sk_live_example', STRIPE_WEBHOOK_SECRET: 'whsec_example' })).toBe('');
  }, 120000);

  it('a key without its webhook secret, or malformed ones, are refused anywhere', () => {
    expect(loadConfig({ ...DEV, STRIPE_SECRET_KEY: 'sk_test_example' })).toContain('STRIPE_WEBHOOK_SECRET');
    expect(loadConfig({ ...DEV, STRIPE_SECRET_KEY: 'pk_test_public', STRIPE_WEBHOOK_SECRET: 'whsec_x' })).toContain('STRIPE_SECRET_KEY');
    expect(loadConfig(DEV)).toBe('');
  }, 120000);
});
