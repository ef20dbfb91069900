import { describe, expect, it } from 'vitest';
import { EmailVerification, User } from '../../../server/models/index';
import { publicUrl } from '../../../server/lib/publicUrl';
import { api, createUser, errorOf, uniqueEmail } from '../../helpers/api';
import { mailedToken, waitForMail } from '../../helpers/mail';

/** Sign-up mails a verification link (finding 8: the address must be proven before it claims anything). */
describe('e-mail verification', () => {
  it('sign-up mails a link built from PUBLIC_URL; the token verifies the address once', async () => {
    const email = uniqueEmail('verify');
    expect(
      (await api.post('/api/auth/register').send({ email, password: 'slow-river-copper-lamp', displayName: 'Vera Fyne' })).status,
    ).toBe(201);
    const mail = await waitForMail(email, 5000, /confirm/i);
    expect(mail.text).toContain(`${publicUrl()}/verify-email?token=`);
    const token = await mailedToken(email, '/verify-email', /confirm/i);
    expect((await User.findOne({ where: { email } }))!.emailVerifiedAt).toBeNull();

    const ok = await api.post('/api/auth/verify-email').send({ token });
    expect(ok.status).toBe(200);
    expect(ok.body.user).toMatchObject({ email, emailVerified: true });
    expect((await User.findOne({ where: { email } }))!.emailVerifiedAt).not.toBeNull();

    const again = await api.post('/api/auth/verify-email').send({ token });
    expect(again.status).toBe(400);
    expect(errorOf(again.body).code).toBe('invalid_token');
  });

  it('a made-up, malformed or expired token is a 400 with a field message', async () => {
    const bad = await api.post('/api/auth/verify-email').send({ token: 'z'.repeat(43) });
    expect(bad.status).toBe(400);
    expect(errorOf(bad.body).fields).toHaveProperty(['body.token']);
    expect((await api.post('/api/auth/verify-email').send({ token: 'short' })).status).toBe(400);
    expect((await api.post('/api/auth/verify-email').send({})).status).toBe(400);

    const { user, auth } = await createUser('bowler', undefined, { verified: false });
    expect((await api.post('/api/auth/verify-email/send').set(auth)).status).toBe(202);
    const token = await mailedToken(user.email, '/verify-email', /confirm/i);
    await EmailVerification.update({ expiresAt: new Date(Date.now() - 1000) }, { where: { userId: user.id } });
    expect((await api.post('/api/auth/verify-email').send({ token })).status).toBe(400);
    expect((await User.findByPk(user.id))!.emailVerifiedAt).toBeNull();
  });

  it('asking for a new link closes the older one; a verified account gets no mail', async () => {
    const { user, auth } = await createUser('bowler', undefined, { verified: false });
    expect((await api.post('/api/auth/verify-email/send').set(auth)).body).toEqual({ ok: true, alreadyVerified: false });
    const first = await mailedToken(user.email, '/verify-email', /confirm/i);
    expect((await api.post('/api/auth/verify-email/send').set(auth)).status).toBe(202);
    let second = first;
    for (let i = 0; i < 100 && second === first; i++) {
      await new Promise((r) => setTimeout(r, 50));
      second = await mailedToken(user.email, '/verify-email', /confirm/i);
    }
    expect(second).not.toBe(first);
    expect(await EmailVerification.count({ where: { userId: user.id, usedAt: null } })).toBe(1);
    expect((await api.post('/api/auth/verify-email').send({ token: first })).status).toBe(400);
    expect((await api.post('/api/auth/verify-email').send({ token: second })).status).toBe(200);

    const verified = await createUser();
    expect((await api.post('/api/auth/verify-email/send').set(verified.auth)).body).toEqual({ ok: true, alreadyVerified: true });
    expect((await api.post('/api/auth/verify-email/send')).status).toBe(401);
  });
});

/** Finding 14: passwords checked against common passwords and the user's own e-mail and name; names refuse control and bidi characters. */
describe('password strength and safe names', () => {
  it('refuses common passwords and ones built from the e-mail or name, with a field message; a passphrase passes', async () => {
    const email = uniqueEmail('weak');
    for (const password of [
      'password12',
      'qwertyuiop',
      '1234567890',
      'iloveyou12',
      email,
      `${email.split('@')[0]}!`,
      'Ottoline Brack1',
      'ottolinebrack',
    ]) {
      const res = await api.post('/api/auth/register').send({ email, password, displayName: 'Ottoline Brack' });
      expect(res.status, password).toBe(400);
      expect(errorOf(res.body).code).toBe('weak_password');
      expect(errorOf(res.body).fields?.['body.password']).toMatch(/too easy to guess/i);
    }
    expect(await User.count({ where: { email } })).toBe(0);
    expect(
      (await api.post('/api/auth/register').send({ email, password: 'amber-kettle-fjord-nine', displayName: 'Ottoline Brack' })).status,
    ).toBe(201);
  });

  it('a reset to a weak password is refused too', async () => {
    const { user } = await createUser();
    await api.post('/api/auth/forgot').send({ email: user.email });
    const token = await mailedToken(user.email, '/reset-password', /reset/i);
    const res = await api.post('/api/auth/reset').send({ token, password: 'password123' });
    expect(res.status).toBe(400);
    expect(errorOf(res.body).fields).toHaveProperty(['body.password']);
    expect((await api.post('/api/auth/reset').send({ token, password: user.email })).status).toBe(400);
    expect((await api.post('/api/auth/reset').send({ token, password: 'amber-kettle-fjord-nine' })).status).toBe(200);
  });

  it('names with control or text-direction characters are refused with a field message', async () => {
    for (const displayName of ['Eve\u202Egnp.exe', 'Bob\u0007', 'Line\nBreak', 'Iso\u2066late', 'Mark\u200F']) {
      const res = await api
        .post('/api/auth/register')
        .send({ email: uniqueEmail('name'), password: 'amber-kettle-fjord-nine', displayName });
      expect(res.status, JSON.stringify(displayName)).toBe(400);
      expect(errorOf(res.body).fields?.['body.displayName']).toMatch(/control or text-direction/);
    }
    const { auth } = await createUser('proprietor');
    const pattern = await api
      .post('/api/patterns')
      .set(auth)
      .send({
        name: 'House\u202E04',
        sweeps: [{ direction: 'forward', fromBoard: 2, toBoard: 38, startFt: 0, endFt: 40, crossings: 2, microlitersPerBoard: 65 }],
      });
    expect(pattern.status).toBe(400);
    expect(errorOf(pattern.body).fields).toHaveProperty(['body.name']);
  });
});
