import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { config } from '../../../server/config/index';
import { api, createUser, errorOf, uniqueEmail } from '../../helpers/api';
import { call, startServer, type ServerProcess } from '../../faults/harness';

/** Finding 11: per-account backoff beside the per-address limit, and a client address that a header cannot change. */
describe('per-account backoff after failed sign-ins', () => {
  it('25 failures from 25 addresses, then the right password waits (429, Retry-After); another account is not affected', async () => {
    const { user, password } = await createUser();
    const other = await createUser();
    const statuses: number[] = [];
    for (let i = 0; i < 25; i++) {
      statuses.push(
        (
          await api
            .post('/api/auth/login')
            .set('X-Forwarded-For', `192.0.2.${i + 1}`)
            .send({ email: user.email, password: `wrong-guess-${i}` })
        ).status,
      );
    }
    expect(statuses.slice(0, config.LOGIN_FAILURES_BEFORE_BACKOFF).every((s) => s === 401)).toBe(true);
    expect(statuses.slice(config.LOGIN_FAILURES_BEFORE_BACKOFF).every((s) => s === 429 || s === 401)).toBe(true);
    expect(statuses.filter((s) => s === 429).length).toBeGreaterThan(10);

    const right = await api.post('/api/auth/login').set('X-Forwarded-For', '192.0.2.200').send({ email: user.email, password });
    expect(right.status).toBe(429);
    expect(errorOf(right.body).code).toBe('too_many_failures');
    expect(Number(right.headers['retry-after'])).toBeGreaterThanOrEqual(1);
    expect(
      (await api.post('/api/auth/login').set('X-Forwarded-For', '192.0.2.201').send({ email: other.user.email, password: other.password }))
        .status,
    ).toBe(200);
  });

  it('an unknown address backs off the same way (which accounts exist does not show)', async () => {
    const ghost = uniqueEmail('ghost');
    const statuses: number[] = [];
    for (let i = 0; i < config.LOGIN_FAILURES_BEFORE_BACKOFF + 1; i++)
      statuses.push(
        (
          await api
            .post('/api/auth/login')
            .set('X-Forwarded-For', `192.0.2.${100 + i}`)
            .send({ email: ghost, password: 'wrong-guess' })
        ).status,
      );
    expect(statuses.at(-1)).toBe(429);
  });

  it('the backoff doubles from one second: after waiting it out, the right password works and clears the count', async () => {
    const { user, password } = await createUser();
    for (let i = 0; i < config.LOGIN_FAILURES_BEFORE_BACKOFF; i++)
      await api
        .post('/api/auth/login')
        .set('X-Forwarded-For', `192.0.2.${150 + i}`)
        .send({ email: user.email, password: 'wrong-guess' });
    const locked = await api.post('/api/auth/login').set('X-Forwarded-For', '192.0.2.160').send({ email: user.email, password });
    expect(locked.status).toBe(429);
    expect(locked.headers['retry-after']).toBe('1');
    await new Promise((r) => setTimeout(r, 1100));
    expect((await api.post('/api/auth/login').set('X-Forwarded-For', '192.0.2.161').send({ email: user.email, password })).status).toBe(
      200,
    );
  });
});

describe('with the default TRUST_PROXY (none), X-Forwarded-For does not change the client address', () => {
  let server: ServerProcess;
  beforeAll(async () => {
    server = await startServer({ DATABASE_URL: process.env.DATABASE_URL!, TRUST_PROXY: '', RATE_LIMIT_AUTH: '5' });
  }, 90000);
  afterAll(async () => server?.kill());

  it('rotating X-Forwarded-For from loopback does not reset the per-address limit', async () => {
    const statuses: number[] = [];
    for (let i = 0; i < 7; i++) {
      const r = await call(server.base, 'POST', '/api/auth/login', {
        headers: { 'X-Forwarded-For': `203.0.113.${i + 1}` },
        body: { email: `rotate-${i}-${Date.now()}@example.test`, password: 'wrong-guess' },
      });
      statuses.push(r.status);
    }
    expect(statuses.slice(0, 5)).toEqual([401, 401, 401, 401, 401]);
    expect(statuses.slice(5)).toEqual([429, 429]);
  });
});
