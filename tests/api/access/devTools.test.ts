import { build } from 'esbuild';
import jwt from 'jsonwebtoken';
import path from 'node:path';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { api, createUser, errorOf } from '../../helpers/api';
import { root } from '../../helpers/database';
import { call, startServer, type ServerProcess } from '../../faults/harness';
import { event, signature } from '../shop/shopHelpers';

/** Findings 1–3: no shared secret from the repository; developer tools only in development, only for the admin. */

/** The values once committed as development defaults (kept here only to prove they no longer work). */
const OLD_JWT_SECRET = 'lanewright-development-secret-change-me';
const OLD_FAKE_WEBHOOK_SECRET = ['whsec', 'lanewright_local_fake_signing_secret'].join('_');

describe('the committed default secrets are gone', () => {
  it('an admin token signed with the old default JWT secret is 401', async () => {
    const { user } = await createUser('admin');
    const forged = jwt.sign({ ver: user.tokenVersion }, OLD_JWT_SECRET, {
      subject: String(user.id),
      issuer: 'lanewright',
      audience: 'lanewright-api',
      expiresIn: '1h',
      algorithm: 'HS256',
    });
    const res = await api.get('/api/admin/users').set('Authorization', `Bearer ${forged}`);
    expect(res.status).toBe(401);
  });

  it('a checkout.session.completed signed with the old payment-fake secret is 400 and changes nothing', async () => {
    const ev = event('checkout.session.completed', {
      id: 'cs_test_forged',
      object: 'checkout.session',
      metadata: { orderId: '1' },
      payment_status: 'paid',
      amount_total: 1,
      currency: 'usd',
    });
    const res = await api
      .post('/api/payments/webhook')
      .set('Content-Type', 'application/json')
      .set('Stripe-Signature', signature(ev.payload, { secret: OLD_FAKE_WEBHOOK_SECRET }))
      .send(ev.payload);
    expect(res.status).toBe(400);
    expect(errorOf(res.body).code).toBe('bad_signature');
  });
});

describe('the dev mailbox is the admin’s (development and tests)', () => {
  it('anonymous 401, any other role 403, the admin 200', async () => {
    expect((await api.get('/api/dev/mail')).status).toBe(401);
    for (const role of ['bowler', 'coach', 'proprietor'] as const) {
      const { auth } = await createUser(role);
      const res = await api.get('/api/dev/mail').set(auth);
      expect(res.status, role).toBe(403);
      expect(res.body).not.toHaveProperty('items');
    }
    const admin = await createUser('admin');
    const ok = await api.get('/api/dev/mail').set(admin.auth);
    expect(ok.status).toBe(200);
    expect(Array.isArray(ok.body.items)).toBe(true);
  });
});

describe('production loads no developer-tool code', () => {
  it('nothing under server/dev or server/features/dev is reachable from server/index.ts by a static import', async () => {
    const result = await build({
      entryPoints: [path.join(root, 'server/index.ts')],
      bundle: true,
      write: false,
      metafile: true,
      platform: 'node',
      format: 'esm',
      packages: 'external',
      logLevel: 'silent',
      outdir: path.join(root, 'dist', 'graph-check'),
      splitting: true,
    });
    const inputs = result.metafile.inputs;
    const seen = new Set<string>();
    const visit = (file: string) => {
      if (seen.has(file) || !inputs[file]) return;
      seen.add(file);
      for (const imp of inputs[file].imports) if (imp.kind === 'import-statement' && !imp.external) visit(imp.path);
    };
    visit('server/index.ts');
    expect(seen.size).toBeGreaterThan(50);
    expect([...seen].filter((f) => f.startsWith('server/dev/') || f.startsWith('server/features/dev/'))).toEqual([]);
    // …while the development build does reach them, through dynamic imports only.
    expect(Object.keys(inputs).some((f) => f.startsWith('server/dev/'))).toBe(true);
  });
});

describe('a production server', () => {
  let server: ServerProcess;
  beforeAll(async () => {
    server = await startServer({
      NODE_ENV: 'production',
      DATABASE_URL: process.env.DATABASE_URL!,
      JWT_SECRET: 'production-test-secret-0123456789abcdef',
      PUBLIC_URL: 'https://lanes.example',
      SMTP_URL: 'smtp://127.0.0.1:9',
      STRIPE_SECRET_KEY: 'sk_test_production_check',
      STRIPE_WEBHOOK_SECRET: 'whsec_production_check',
      STRIPE_API_URL: 'http://127.0.0.1:9',
      TRUST_PROXY: '',
    });
  }, 90000);
  afterAll(async () => server?.kill());

  it('has no dev mailbox (404, also for an admin) and runs no payment fake', async () => {
    const admin = await createUser('admin');
    expect((await call(server.base, 'GET', '/api/dev/mail')).status).toBe(404);
    expect(
      (
        await call(server.base, 'GET', '/api/dev/mail', {
          token: (await call(server.base, 'POST', '/api/auth/login', { body: { email: admin.user.email, password: admin.password } })).body
            .token,
        })
      ).status,
    ).toBe(404);
    expect(server.output()).not.toMatch(/payment fake listening|development SMTP server/);
  });
});
