import { describe, expect, it } from 'vitest';
import { api } from '../../helpers/api';

describe('GET /api/health', () => {
  it('answers ok with the database reachable', async () => {
    const res = await api.get('/api/health');
    expect(res.status).toBe(200);
    expect(res.body).toMatchObject({ status: 'ok', db: 'ok', mail: 'ok' });
  });
});
