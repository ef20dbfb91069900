import { spawnSync } from 'node:child_process';
import fs from 'node:fs';
import os from 'node:os';
import path from 'node:path';
import { describe, expect, it } from 'vitest';
import { config } from '../../../server/config/index';
import { UPLOAD_RATE_LIMIT } from '../../../server/middleware/rateLimit';
import { SANE_REQUEST_ID } from '../../../server/middleware/requestId';
import { Upload } from '../../../server/models/index';
import { api, createUser, errorOf, uniqueEmail } from '../../helpers/api';
import { root } from '../../helpers/database';
import { createBall } from '../../helpers/fixtures';
import { TINY_PNG } from './fixture';

/** Security habits the whole API keeps: CORS closed, rate limits, where uploads go, secrets, request ids. */

let ip = 0;
/** A client address of its own, so each limiter is measured from zero (the app trusts X-Forwarded-For from loopback only). */
const freshIp = () => `203.0.113.${++ip}`;

describe('CORS is closed by default', () => {
  it('no Access-Control-Allow-Origin for a foreign Origin, on reads and on errors', async () => {
    for (const url of ['/api/health', '/api/centers', '/api/arsenal', '/api/nope']) {
      const res = await api.get(url).set('Origin', 'https://elsewhere.example');
      expect(res.headers['access-control-allow-origin']).toBeUndefined();
      expect(res.headers['access-control-allow-credentials']).toBeUndefined();
    }
  });

  it('a preflight gets no CORS permission (the browser refuses the cross-origin call)', async () => {
    const res = await api
      .options('/api/auth/login')
      .set('Origin', 'https://elsewhere.example')
      .set('Access-Control-Request-Method', 'POST')
      .set('Access-Control-Request-Headers', 'content-type, authorization');
    expect(res.headers['access-control-allow-origin']).toBeUndefined();
    expect(res.headers['access-control-allow-methods']).toBeUndefined();
    expect(res.headers['access-control-allow-headers']).toBeUndefined();
  });
});

describe('rate limits', () => {
  const limit = config.RATE_LIMIT_AUTH;
  async function until429(send: (addr: string) => Promise<{ status: number; body: unknown }>, max: number) {
    const addr = freshIp();
    const statuses: number[] = [];
    for (let i = 0; i <= max; i++) statuses.push((await send(addr)).status);
    const last = await send(addr);
    return { statuses, last };
  }

  it('sign-in: failed attempts per address', async () => {
    const { statuses, last } = await until429(
      (a) =>
        api
          .post('/api/auth/login')
          .set('X-Forwarded-For', a)
          .send({ email: uniqueEmail('nobody'), password: 'wrong-password' }),
      limit,
    );
    expect(statuses.slice(0, limit).every((s) => s === 401)).toBe(true);
    expect(last.status).toBe(429);
    expect(errorOf(last.body).code).toBe('rate_limited');
  });

  it('sign-up: every attempt per address', async () => {
    const { statuses, last } = await until429(
      (a) => api.post('/api/auth/register').set('X-Forwarded-For', a).send({ email: 'not-an-email', password: 'short', displayName: '' }),
      limit,
    );
    expect(statuses.slice(0, limit).every((s) => s === 400)).toBe(true);
    expect(last.status).toBe(429);
  });

  it('reset: asking for mails and trying tokens', async () => {
    const forgot = await until429(
      (a) => api.post('/api/auth/forgot').set('X-Forwarded-For', a).send({ email: 'nobody@example.test' }),
      limit,
    );
    expect(forgot.statuses.slice(0, limit).every((s) => s === 202)).toBe(true);
    expect(forgot.last.status).toBe(429);
    const reset = await until429(
      (a) =>
        api
          .post('/api/auth/reset')
          .set('X-Forwarded-For', a)
          .send({ token: 'y'.repeat(43), password: 'another-long-password' }),
      limit,
    );
    expect(reset.statuses.slice(0, limit).every((s) => s === 400)).toBe(true);
    expect(reset.last.status).toBe(429);
  });

  it(`uploads: ${UPLOAD_RATE_LIMIT} per address per 15 minutes on every upload route, other requests not counted`, async () => {
    const { auth } = await createUser('admin');
    const addr = freshIp();
    const routes = ['/api/arsenal/import', '/api/catalogue/import', '/api/patterns/import'];
    const statuses: number[] = [];
    for (let i = 0; i < UPLOAD_RATE_LIMIT; i++) {
      statuses.push(
        (
          await api
            .post(routes[i % 3])
            .set(auth)
            .set('X-Forwarded-For', addr)
            .attach('file', Buffer.from('not,a\nvalid'), { filename: 'x.csv', contentType: 'text/csv' })
        ).status,
      );
      if (i % 10 === 0) expect((await api.get('/api/arsenal').set(auth).set('X-Forwarded-For', addr)).status).toBe(200); // JSON requests are not counted
    }
    expect(statuses.every((s) => s === 400)).toBe(true);
    const over = await api
      .post('/api/patterns/import')
      .set(auth)
      .set('X-Forwarded-For', addr)
      .attach('file', Buffer.from('{}'), { filename: 'p.json', contentType: 'application/json' });
    expect(over.status).toBe(429);
    expect(errorOf(over.body).code).toBe('rate_limited');
    expect((await api.get('/api/arsenal').set(auth).set('X-Forwarded-For', addr)).status).toBe(200);
  });
});

describe('uploads are stored outside the web root under generated names', () => {
  it('a photo named by its sender lands as <random hex>.<type> in UPLOAD_DIR, never under the client dist, and is not served statically', async () => {
    const { user, auth } = await createUser('bowler');
    const ball = await createBall(user.id);
    const res = await api
      .put(`/api/arsenal/${ball.id}/photo`)
      .set(auth)
      .attach('file', TINY_PNG, { filename: '../../../dist/client/evil.html', contentType: 'image/png' });
    expect(res.status).toBe(200);
    const up = (await Upload.findOne({ where: { ownerId: user.id }, order: [['id', 'DESC']] }))!;
    expect(up.storageKey).toMatch(/^[a-f0-9]{32}\.png$/);
    const uploadDir = path.resolve(config.UPLOAD_DIR);
    const stored = path.join(uploadDir, up.storageKey);
    expect(fs.readFileSync(stored).equals(TINY_PNG)).toBe(true);
    const webRoot = path.resolve(config.CLIENT_DIST);
    expect(path.relative(webRoot, uploadDir).startsWith('..')).toBe(true);
    expect(fs.existsSync(path.join(webRoot, 'evil.html'))).toBe(false);
    for (const url of [`/${up.storageKey}`, `/uploads/${up.storageKey}`, `/api/uploads/${up.storageKey}`]) {
      const r = await api.get(url);
      expect(Buffer.isBuffer(r.body) && (r.body as Buffer).equals(TINY_PNG)).toBe(false);
    }
    // The default UPLOAD_DIR (.data/uploads) is outside dist/ too.
    expect(path.relative(path.join(root, 'dist'), path.join(root, '.data', 'uploads')).startsWith('..')).toBe(true);
  });
});

describe('secrets come from the environment; production refuses to start without them', () => {
  const loadConfig = (env: Record<string, string>) =>
    spawnSync(
      path.join(root, 'node_modules', '.bin', 'tsx'),
      ['-e', "import('./server/config/index.ts').then((m) => console.log('loaded', m.config.NODE_ENV, m.config.jwtSecretSource))"],
      {
        cwd: root,
        encoding: 'utf8',
        env: { PATH: process.env.PATH ?? '', HOME: process.env.HOME ?? '/tmp', ...env },
      },
    );
  const PROD = {
    NODE_ENV: 'production',
    JWT_SECRET: 'a-real-secret-from-the-environment-0123456789',
    PUBLIC_URL: 'https://lanes.example',
    DATABASE_URL: 'postgres://u:p@127.0.0.1:5432/x',
    SMTP_URL: 'smtp://127.0.0.1:25',
    STRIPE_SECRET_KEY: 'sk_test_x',
    STRIPE_WEBHOOK_SECRET: 'whsec_x',
  };

  it('NODE_ENV=production without real secrets: the process refuses to start and names each missing setting', () => {
    const r = loadConfig({ NODE_ENV: 'production' });
    expect(r.status).not.toBe(0);
    const out = `${r.stdout}${r.stderr}`;
    for (const v of ['JWT_SECRET', 'PUBLIC_URL', 'DATABASE_URL', 'SMTP_URL', 'STRIPE_SECRET_KEY', 'STRIPE_WEBHOOK_SECRET'])
      expect(out).toContain(v);
    expect(out).not.toContain('loaded');
  });

  it('the secret once published as the development default is refused in every environment', () => {
    for (const env of [{ ...PROD }, { NODE_ENV: 'development' }, { NODE_ENV: 'test' }]) {
      const r = loadConfig({ ...env, JWT_SECRET: 'lanewright-development-secret-change-me' });
      expect(r.status).not.toBe(0);
      expect(`${r.stdout}${r.stderr}`).toContain('this JWT_SECRET was published in the repository');
    }
  });

  it('with every setting from the environment production starts; development and tests start without any', () => {
    const prod = loadConfig(PROD);
    expect(prod.stdout).toContain('loaded production environment');
    const dataDir = fs.mkdtempSync(path.join(os.tmpdir(), 'lanewright-config-'));
    try {
      expect(loadConfig({ DATA_DIR: dataDir }).stdout).toContain('loaded development installation');
      expect(loadConfig({ NODE_ENV: 'test' }).stdout).toContain('loaded test process');
    } finally {
      fs.rmSync(dataDir, { recursive: true, force: true });
    }
  });

  it('the development mailbox is not mounted in production', () => {
    const r = spawnSync(
      path.join(root, 'node_modules', '.bin', 'tsx'),
      ['-e', "import('./server/lib/mailer.ts').then((m) => console.log('capture', m.mailCaptureEnabled))"],
      {
        cwd: root,
        encoding: 'utf8',
        env: { PATH: process.env.PATH ?? '', HOME: process.env.HOME ?? '/tmp', ...PROD },
      },
    );
    expect(r.stdout).toContain('capture false');
  });

  it('no secret is written in the server code', () => {
    const hits = spawnSync(
      'grep',
      [
        '-rnE',
        '((sk|rk)_(live|test)_[A-Za-z0-9_]{8,}|whsec_[A-Za-z0-9_]{8,}|-----BEGIN [A-Z ]*PRIVATE KEY)',
        'server',
        'shared',
        'client/src',
        'seeders',
      ],
      { cwd: root, encoding: 'utf8' },
    );
    expect(hits.stdout).toBe('');
  });
});

describe('request ids', () => {
  it('a sane X-Request-Id is kept and echoed; a missing or odd one is replaced by a generated id', async () => {
    const kept = await api.get('/api/health').set('X-Request-Id', 'client-req-0001');
    expect(kept.headers['x-request-id']).toBe('client-req-0001');
    const made = await api.get('/api/health');
    expect(made.headers['x-request-id']).toMatch(/^[0-9a-f-]{36}$/);
    for (const odd of ['short', 'has spaces in it', '<script>x</script>', 'a'.repeat(200), 'line\u2028break1']) {
      const r = await api.get('/api/health').set('X-Request-Id', encodeURIComponent(odd) === odd ? odd : 'bad id with spaces');
      expect(r.headers['x-request-id']).not.toBe(odd);
      expect(r.headers['x-request-id']).toMatch(SANE_REQUEST_ID);
    }
    const err = await api.get('/api/arsenal').set('X-Request-Id', 'client-req-0002');
    expect(err.status).toBe(401);
    expect(err.headers['x-request-id']).toBe('client-req-0002');
  });
});
