import bcrypt from 'bcryptjs';
import { describe, expect, it } from 'vitest';
import { Op } from 'sequelize';
import { MailOutbox, PasswordReset, User } from '../../../server/models/index';
import { api, createUser, errorOf, uniqueEmail } from '../../helpers/api';
import { waitForMail } from '../../helpers/mail';

describe('password reset', () => {
  it('mails a link whose token sets a new password once, and ends older sessions', async () => {
    const { user, auth } = await createUser();
    const forgot = await api.post('/api/auth/forgot').send({ email: user.email });
    expect(forgot.status).toBe(202);
    const mail = await waitForMail(user.email);
    expect(mail.subject).toMatch(/reset/i);
    const token = /token=([\w-]+)/.exec(mail.text)?.[1];
    expect(token).toBeTruthy();

    const reset = await api.post('/api/auth/reset').send({ token, password: 'brand-new-password' });
    expect(reset.status).toBe(200);
    const row = await User.findByPk(user.id);
    expect(await bcrypt.compare('brand-new-password', row!.passwordHash)).toBe(true);
    expect((await api.get('/api/auth/me').set(auth)).status).toBe(401);
    expect((await api.post('/api/auth/login').send({ email: user.email, password: 'brand-new-password' })).status).toBe(200);

    const again = await api.post('/api/auth/reset').send({ token, password: 'another-new-password' });
    expect(again.status).toBe(400);
    expect(errorOf(again.body).code).toBe('invalid_token');
  });

  it('answers 202 for an unknown e-mail without creating a token', async () => {
    const email = uniqueEmail('nobody');
    const asked = new Date();
    const res = await api.post('/api/auth/forgot').send({ email });
    expect(res.status).toBe(202);
    // Nothing written for this request: no reset token since it was asked for, no mail queued to the address.
    expect(await PasswordReset.count({ where: { createdAt: { [Op.gte]: asked } } })).toBe(0);
    expect(await MailOutbox.count({ where: { toAddress: email } })).toBe(0);
  });

  it('refuses a made-up token and a short new password', async () => {
    const res = await api.post('/api/auth/reset').send({ token: 'x'.repeat(40), password: 'short' });
    expect(res.status).toBe(400);
    expect(errorOf(res.body).fields).toHaveProperty(['body.password']);
    const res2 = await api.post('/api/auth/reset').send({ token: 'x'.repeat(40), password: 'long-enough-password' });
    expect(res2.status).toBe(400);
    expect(errorOf(res2.body).code).toBe('invalid_token');
  });
});

describe('password reset expiry', () => {
  it('refuses a token past its hour, changing nothing', async () => {
    const { user } = await createUser();
    await api.post('/api/auth/forgot').send({ email: user.email });
    const mail = await waitForMail(user.email);
    const token = /token=([\w-]+)/.exec(mail.text)![1];
    await PasswordReset.update({ expiresAt: new Date(Date.now() - 1000) }, { where: { userId: user.id } });
    const res = await api.post('/api/auth/reset').send({ token, password: 'too-late-password' });
    expect(res.status).toBe(400);
    expect(errorOf(res.body).code).toBe('invalid_token');
    const row = await User.findByPk(user.id);
    expect(await bcrypt.compare('too-late-password', row!.passwordHash)).toBe(false);
  });
});
