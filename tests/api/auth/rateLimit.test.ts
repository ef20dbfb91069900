import { describe, expect, it } from 'vitest';
import { config } from '../../../server/config/index';
import { api, createUser, errorOf, uniqueEmail } from '../../helpers/api';

// Each test signs in from a client address of its own (the app trusts X-Forwarded-For from loopback only), so the
// limiter counts from zero in each, whichever runs first.
describe('sign-in rate limit', () => {
  it('does not count successful sign-ins', async () => {
    const { user, password } = await createUser();
    for (let i = 0; i <= config.RATE_LIMIT_AUTH; i++) {
      expect((await api.post('/api/auth/login').set('X-Forwarded-For', '198.51.100.10').send({ email: user.email, password })).status).toBe(
        200,
      );
    }
  });

  it('answers 429 in the error shape once a client passes the limit of failed attempts (each on another account)', async () => {
    let last = 0;
    for (let i = 0; i <= config.RATE_LIMIT_AUTH; i++) {
      last = (
        await api
          .post('/api/auth/login')
          .set('X-Forwarded-For', '198.51.100.20')
          .send({ email: uniqueEmail('nobody'), password: 'wrong-password' })
      ).status;
      if (i < config.RATE_LIMIT_AUTH) expect(last).toBe(401);
    }
    expect(last).toBe(429);
    const res = await api
      .post('/api/auth/login')
      .set('X-Forwarded-For', '198.51.100.20')
      .send({ email: uniqueEmail('nobody'), password: 'wrong-password' });
    expect(errorOf(res.body).code).toBe('rate_limited');
  });
});
