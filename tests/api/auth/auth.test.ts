import bcrypt from 'bcryptjs';
import jwt from 'jsonwebtoken';
import { describe, expect, it } from 'vitest';
import { config } from '../../../server/config/index';
import { REGISTER_ANSWER } from '../../../server/features/auth/auth.service';
import { User } from '../../../server/models/index';
import { api, createUser, errorOf, uniqueEmail } from '../../helpers/api';
import { waitForMail } from '../../helpers/mail';

describe('POST /api/auth/register', () => {
  it('creates an unverified bowler with a bcrypt hash (cost ≥ 10), answers neutrally, and the password signs in', async () => {
    const email = uniqueEmail('reg');
    const res = await api
      .post('/api/auth/register')
      .send({ email: email.toUpperCase(), password: 'a-long-enough-pass', displayName: '  Rory Penn  ' });
    expect(res.status).toBe(201);
    expect(res.body).toEqual(REGISTER_ANSWER);
    const row = await User.findOne({ where: { email } });
    expect(row).toMatchObject({ email, displayName: 'Rory Penn', role: 'bowler', emailVerifiedAt: null });
    expect(row!.passwordHash).not.toContain('a-long-enough-pass');
    expect(bcrypt.getRounds(row!.passwordHash)).toBeGreaterThanOrEqual(10);
    expect(await bcrypt.compare('a-long-enough-pass', row!.passwordHash)).toBe(true);
    const login = await api.post('/api/auth/login').send({ email, password: 'a-long-enough-pass' });
    expect(login.status).toBe(200);
    expect(login.body.user).toMatchObject({ email, emailVerified: false });
    const me = await api.get('/api/auth/me').set('Authorization', `Bearer ${login.body.token}`);
    expect(me.status).toBe(200);
    expect(me.body.user.email).toBe(email);
  });

  it('refuses a short password, a bad e-mail and a missing name with one message per field, saving nothing', async () => {
    const email = uniqueEmail('not-an-email').replace('@', '-at-');
    const res = await api.post('/api/auth/register').send({ email, password: 'short' });
    expect(res.status).toBe(400);
    const e = errorOf(res.body);
    expect(e.code).toBe('validation_failed');
    expect(Object.keys(e.fields ?? {}).sort()).toEqual(['body.displayName', 'body.email', 'body.password']);
    expect(e.fields!['body.password']).toMatch(/at least 10/);
    expect(await User.count({ where: { email } })).toBe(0);
  });

  it('a taken address gets the same answer as a new one, no second account, and its owner a mail saying so', async () => {
    const { user } = await createUser();
    const res = await api.post('/api/auth/register').send({ email: user.email, password: 'a-long-enough-pass', displayName: 'Copy' });
    expect(res.status).toBe(201);
    expect(res.body).toEqual(REGISTER_ANSWER);
    expect(await User.count({ where: { email: user.email } })).toBe(1);
    const mail = await waitForMail(user.email);
    expect(mail.subject).toMatch(/already have/i);
    expect(mail.text).not.toMatch(/token=/);
  });

  it('ignores a role in the body: a new account is always a bowler', async () => {
    const email = uniqueEmail('sneaky');
    const res = await api.post('/api/auth/register').send({ email, password: 'a-long-enough-pass', displayName: 'Sneaky', role: 'admin' });
    expect(res.status).toBe(201);
    expect((await User.findOne({ where: { email } }))!.role).toBe('bowler');
  });
});

describe('POST /api/auth/login', () => {
  it('returns a token and the user for the right password', async () => {
    const { user, password } = await createUser('coach');
    const res = await api.post('/api/auth/login').send({ email: user.email, password });
    expect(res.status).toBe(200);
    expect(res.body.user).toMatchObject({ id: user.id, email: user.email, role: 'coach' });
    expect(res.body.user).not.toHaveProperty('passwordHash');
    const payload = jwt.decode(res.body.token) as jwt.JwtPayload;
    expect(payload.sub).toBe(String(user.id));
    expect(payload.exp! - payload.iat!).toBeGreaterThan(0);
  });

  it('gives the same generic 401 for a wrong password and an unknown e-mail', async () => {
    const { user } = await createUser();
    const wrong = await api.post('/api/auth/login').send({ email: user.email, password: 'not-the-password' });
    const unknown = await api.post('/api/auth/login').send({ email: uniqueEmail('ghost'), password: 'not-the-password' });
    expect(wrong.status).toBe(401);
    expect(unknown.status).toBe(401);
    expect(errorOf(wrong.body)).toEqual(errorOf(unknown.body));
    expect(errorOf(wrong.body).code).toBe('invalid_credentials');
  });

  it('refuses a malformed body with field messages', async () => {
    const res = await api.post('/api/auth/login').send({ email: 'x' });
    expect(res.status).toBe(400);
    expect(errorOf(res.body).fields).toMatchObject({ 'body.email': expect.any(String), 'body.password': expect.any(String) });
  });
});

describe('GET /api/auth/me', () => {
  it('returns the user with its role', async () => {
    const { user, auth } = await createUser('proprietor');
    const res = await api.get('/api/auth/me').set(auth);
    expect(res.status).toBe(200);
    expect(res.body).toEqual({
      user: {
        id: user.id,
        email: user.email,
        displayName: user.displayName,
        role: 'proprietor',
        roles: ['proprietor'],
        emailVerified: true,
        createdAt: user.createdAt.toISOString(),
      },
    });
  });

  it('answers 401 without a token', async () => {
    const res = await api.get('/api/auth/me');
    expect(res.status).toBe(401);
    expect(errorOf(res.body).code).toBe('unauthorized');
  });

  it('answers 401 to an expired token', async () => {
    const { user } = await createUser();
    const expired = jwt.sign({ ver: 0, exp: Math.floor(Date.now() / 1000) - 60 }, config.JWT_SECRET, {
      subject: String(user.id),
      issuer: 'lanewright',
      audience: 'lanewright-api',
    });
    const res = await api.get('/api/auth/me').set('Authorization', `Bearer ${expired}`);
    expect(res.status).toBe(401);
    expect(errorOf(res.body).code).toBe('unauthorized');
  });

  it('answers 401 to a tampered token (payload changed to another user, signature kept)', async () => {
    const a = await createUser();
    const b = await createUser('admin');
    const [h, , s] = a.token.split('.');
    const forged = Buffer.from(JSON.stringify({ ...(jwt.decode(a.token) as object), sub: String(b.user.id) })).toString('base64url');
    const res = await api.get('/api/auth/me').set('Authorization', `Bearer ${h}.${forged}.${s}`);
    expect(res.status).toBe(401);
  });

  it('answers 401 to a token signed with another secret and to an unsigned (alg none) token', async () => {
    const { user } = await createUser();
    const other = jwt.sign({ ver: 0 }, 'some-other-secret-entirely', {
      subject: String(user.id),
      issuer: 'lanewright',
      audience: 'lanewright-api',
      expiresIn: '1h',
    });
    const none = jwt.sign({ ver: 0 }, '', {
      subject: String(user.id),
      issuer: 'lanewright',
      audience: 'lanewright-api',
      algorithm: 'none',
    });
    for (const t of [other, none, 'not.a.token']) {
      const res = await api.get('/api/auth/me').set('Authorization', `Bearer ${t}`);
      expect(res.status).toBe(401);
    }
  });

  it('answers 401 once the user no longer exists', async () => {
    const { user, auth } = await createUser();
    await user.destroy();
    expect((await api.get('/api/auth/me').set(auth)).status).toBe(401);
  });
});
