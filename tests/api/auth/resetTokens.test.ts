import { describe, expect, it } from 'vitest';
import { PasswordReset } from '../../../server/models/index';
import { api, createUser, uniqueEmail } from '../../helpers/api';
import { capturedMail } from '../../../server/dev/mailCapture';

async function resetTokens(email: string, n: number, timeoutMs = 8000): Promise<string[]> {
  const deadline = Date.now() + timeoutMs;
  for (;;) {
    const tokens = capturedMail()
      .filter((m) => m.to.includes(email) && /reset/i.test(m.subject))
      .map((m) => /token=([\w-]+)/.exec(m.text)![1])
      .reverse(); // oldest first
    if (tokens.length >= n || Date.now() > deadline) return tokens;
    await new Promise((r) => setTimeout(r, 50));
  }
}

/** Finding 6: one open reset link per user. */
describe('reset links', () => {
  it('a newer link closes the older one; using one closes every other', async () => {
    const { user } = await createUser();
    await api.post('/api/auth/forgot').send({ email: user.email });
    const [first] = await resetTokens(user.email, 1);
    await api.post('/api/auth/forgot').send({ email: user.email });
    const [, second] = await resetTokens(user.email, 2);
    expect(second).toBeTruthy();
    expect(await PasswordReset.count({ where: { userId: user.id, usedAt: null } })).toBe(1);
    expect((await api.post('/api/auth/reset').send({ token: first, password: 'amber-kettle-fjord-nine' })).status).toBe(400);
    expect((await api.post('/api/auth/reset').send({ token: second, password: 'amber-kettle-fjord-nine' })).status).toBe(200);
    expect(await PasswordReset.count({ where: { userId: user.id, usedAt: null } })).toBe(0);
  });

  it('the old finding: an older link used after a newer one was used is refused', async () => {
    const { user } = await createUser();
    await api.post('/api/auth/forgot').send({ email: user.email });
    await resetTokens(user.email, 1);
    await api.post('/api/auth/forgot').send({ email: user.email });
    const [older, newer] = await resetTokens(user.email, 2);
    expect((await api.post('/api/auth/reset').send({ token: newer, password: 'amber-kettle-fjord-nine' })).status).toBe(200);
    expect((await api.post('/api/auth/reset').send({ token: older, password: 'willow-anchor-gravel-six' })).status).toBe(400);
  });

  it('ten requests at once leave exactly one open link (no duplicate-key error)', async () => {
    const { user } = await createUser();
    const answers = await Promise.all(Array.from({ length: 10 }, () => api.post('/api/auth/forgot').send({ email: user.email })));
    expect(answers.every((r) => r.status === 202)).toBe(true);
    await resetTokens(user.email, 10);
    expect(await PasswordReset.count({ where: { userId: user.id, usedAt: null } })).toBe(1);
  });
});

const median = (xs: number[]) => [...xs].sort((a, b) => a - b)[Math.floor(xs.length / 2)];
async function timed(send: () => Promise<{ status: number }>): Promise<number> {
  const t = performance.now();
  await send();
  return performance.now() - t;
}

/** Finding 10: the answers to sign-up and reset say nothing about which addresses have accounts, by content or by time. */
describe('neutral answers', () => {
  it('forgot answers alike, in about the same time, for a known and an unknown address', async () => {
    const known: number[] = [];
    const unknown: number[] = [];
    for (let i = 0; i < 12; i++) {
      const { user } = await createUser();
      known.push(
        await timed(() =>
          api
            .post('/api/auth/forgot')
            .set('X-Forwarded-For', `198.51.100.${i + 1}`)
            .send({ email: user.email }),
        ),
      );
      unknown.push(
        await timed(() =>
          api
            .post('/api/auth/forgot')
            .set('X-Forwarded-For', `198.51.100.${i + 101}`)
            .send({ email: uniqueEmail('nobody') }),
        ),
      );
    }
    // The lookup and the mail run after the answer: both medians are a few ms apart at most.
    expect(Math.abs(median(known) - median(unknown))).toBeLessThan(Math.max(15, 0.5 * median(unknown)));
  });

  it('sign-up answers alike, in about the same time, for a new and a taken address', async () => {
    const fresh: number[] = [];
    const taken: number[] = [];
    for (let i = 0; i < 8; i++) {
      const { user } = await createUser();
      const body = (email: string) => ({ email, password: 'amber-kettle-fjord-nine', displayName: 'Timing Test' });
      const a = await api
        .post('/api/auth/register')
        .set('X-Forwarded-For', `198.51.101.${i + 1}`)
        .send(body(uniqueEmail('fresh')));
      const b = await api
        .post('/api/auth/register')
        .set('X-Forwarded-For', `198.51.101.${i + 101}`)
        .send(body(user.email));
      expect(a.status).toBe(201);
      expect(b.status).toBe(201);
      expect(b.body).toEqual(a.body);
      fresh.push(
        await timed(() =>
          api
            .post('/api/auth/register')
            .set('X-Forwarded-For', `198.51.102.${i + 1}`)
            .send(body(uniqueEmail('fresh'))),
        ),
      );
      taken.push(
        await timed(() =>
          api
            .post('/api/auth/register')
            .set('X-Forwarded-For', `198.51.102.${i + 101}`)
            .send(body(user.email)),
        ),
      );
    }
    // Both paths hash the password, run one INSERT … ON CONFLICT and queue one mail.
    expect(Math.abs(median(fresh) - median(taken))).toBeLessThan(Math.max(25, 0.35 * median(fresh)));
  }, 60000);
});
