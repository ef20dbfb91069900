import { describe, expect, it } from 'vitest';
import { User } from '../../../server/models/index';
import { api, errorOf, uniqueEmail } from '../../helpers/api';

describe('errors everywhere share one shape', () => {
  it('answers an unknown API route with 404 in the error shape', async () => {
    for (const [method, path] of [
      ['get', '/api/no-such-route'],
      ['post', '/api/auth/nothing'],
      ['delete', '/api/unknown/thing'],
    ] as const) {
      const res = await api[method](path);
      expect(res.status).toBe(404);
      expect(errorOf(res.body).code).toBe('not_found');
    }
  });

  it('answers an oversized JSON body with 413 and stores nothing', async () => {
    const email = uniqueEmail('big');
    const res = await api
      .post('/api/auth/register')
      .set('Content-Type', 'application/json')
      .send(JSON.stringify({ email, password: 'long-enough-pass', displayName: 'x'.repeat(200 * 1024) }));
    expect(res.status).toBe(413);
    expect(errorOf(res.body).code).toBe('payload_too_large');
    expect(await User.count({ where: { email } })).toBe(0);
  });

  it('answers malformed JSON with 400, not a stack trace', async () => {
    const res = await api.post('/api/auth/login').set('Content-Type', 'application/json').send('{"email": "a@b.c", ');
    expect(res.status).toBe(400);
    expect(errorOf(res.body).code).toBe('malformed_json');
    expect(JSON.stringify(res.body)).not.toMatch(/at .*\.(ts|js):\d+/);
  });

  it('reports every bad field at once, nested JSON types included', async () => {
    const res = await api.post('/api/auth/register').send({ email: ['a'], password: { x: 1 }, displayName: 42 });
    expect(res.status).toBe(400);
    expect(Object.keys(errorOf(res.body).fields ?? {}).sort()).toEqual(['body.displayName', 'body.email', 'body.password']);
  });

  it('sets security headers (helmet, CSP) and hides the framework', async () => {
    const res = await api.get('/api/health');
    expect(res.headers['x-powered-by']).toBeUndefined();
    expect(res.headers['content-security-policy']).toMatch(/default-src 'self'/);
    expect(res.headers['x-content-type-options']).toBe('nosniff');
  });
});
