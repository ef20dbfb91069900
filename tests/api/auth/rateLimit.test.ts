import { describe, expect, it } from 'vitest';
import { config } from '../../../server/config/index';
import { api, errorOf } from '../../helpers/api';

describe('sign-in rate limit', () => {
  it('answers 429 in the error shape once a client passes the limit', async () => {
    let last = 0;
    for (let i = 0; i <= config.RATE_LIMIT_AUTH; i++) {
      last = (await api.post('/api/auth/login').send({ email: 'nobody@example.test', password: 'wrong-password' })).status;
      if (i < config.RATE_LIMIT_AUTH) expect(last).toBe(401);
    }
    expect(last).toBe(429);
    const res = await api.post('/api/auth/login').send({ email: 'nobody@example.test', password: 'wrong-password' });
    expect(errorOf(res.body).code).toBe('rate_limited');
  });
});
