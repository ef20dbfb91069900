import { describe, expect, it } from 'vitest';
import { api, errorOf } from '../../helpers/api';

describe('GET /api/health', () => {
  it('answers ok with the database reachable', async () => {
    const res = await api.get('/api/health');
    expect(res.status).toBe(200);
    expect(res.body).toMatchObject({ status: 'ok', db: 'ok', mail: 'ok' });
  });
});

describe('GET /api/health/metrics without METRICS_TOKEN', () => {
  it('does not exist: 404 in the error shape, with or without a bearer token', async () => {
    for (const auth of [undefined, 'Bearer some-token-0123456789abcdefghij']) {
      const req = api.get('/api/health/metrics');
      const res = auth ? await req.set('Authorization', auth) : await req;
      expect(res.status).toBe(404);
      expect(errorOf(res.body).code).toBe('not_found');
      expect(res.text).not.toContain('lanewright_');
    }
  });
});
