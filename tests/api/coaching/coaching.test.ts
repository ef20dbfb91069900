import { describe, expect, it } from 'vitest';
import { AuditEvent, CoachLink, MailOutbox, Plan } from '../../../server/models/index';
import { api, createUser, errorOf, uniqueEmail } from '../../helpers/api';
import { createBall } from '../../helpers/fixtures';
import { mailedToken, waitForMail } from '../../helpers/mail';
import { linkRow } from '../sessions/shotlog';

const audited = (action: string, subjectId: number) => AuditEvent.findOne({ where: { action, subjectId: String(subjectId) } });

describe('invitations: a coach invites, the student accepts', () => {
  it('invites an existing bowler: pending link, an outbox e-mail that is delivered, an audit event; both sides list it', async () => {
    const coach = await createUser('coach');
    const student = await createUser();
    const third = await createUser();
    const res = await api.post('/api/coach/invitations').set(coach.auth).send({ email: student.user.email.toUpperCase() });
    expect(res.status).toBe(201);
    // Nothing about the invitee until they accept: only the address the coach typed.
    expect(res.body.item).toMatchObject({
      status: 'pending',
      email: student.user.email,
      acceptedAt: null,
      student: null,
      coach: { id: coach.user.id, displayName: coach.user.displayName, email: coach.user.email },
    });
    const id = res.body.item.id as number;
    const outbox = await MailOutbox.findOne({ where: { kind: 'coach_invitation', ref: String(id) } });
    expect(outbox?.toAddress).toBe(student.user.email);
    const mail = await waitForMail(student.user.email);
    expect(mail.subject).toContain(coach.user.displayName);
    expect(await audited('coach.invited', id)).not.toBeNull();

    for (const who of [coach, student]) {
      const links = await api.get('/api/coach/links').set(who.auth);
      expect(links.status).toBe(200);
      expect(links.body.items.map((l: { id: number }) => l.id)).toContain(id);
      expect(links.body).toMatchObject({ page: 1 });
    }
    expect((await api.get('/api/coach/links').set(third.auth)).body.items).toEqual([]);
    expect((await api.get('/api/coach/links')).status).toBe(401);
  });

  it('only a coach invites (bowler 403, anonymous 401); bad e-mail, my own e-mail and a second invitation are refused', async () => {
    const coach = await createUser('coach');
    const bowler = await createUser();
    const target = await createUser();
    expect((await api.post('/api/coach/invitations').set(bowler.auth).send({ email: target.user.email })).status).toBe(403);
    expect((await api.post('/api/coach/invitations').send({ email: target.user.email })).status).toBe(401);
    const bad = await api.post('/api/coach/invitations').set(coach.auth).send({ email: 'not-an-address' });
    expect(bad.status).toBe(400);
    expect(errorOf(bad.body).fields).toHaveProperty(['body.email']);
    const self = await api.post('/api/coach/invitations').set(coach.auth).send({ email: coach.user.email });
    expect(errorOf(self.body).fields).toHaveProperty(['body.email']);
    expect((await api.post('/api/coach/invitations').set(coach.auth).send({ email: target.user.email })).status).toBe(201);
    const again = await api.post('/api/coach/invitations').set(coach.auth).send({ email: target.user.email });
    expect(again.status).toBe(409);
    expect(errorOf(again.body).code).toBe('already_invited');
    expect(await CoachLink.count({ where: { coachId: coach.user.id } })).toBe(1);
  });

  it('only the invited student accepts (others 404); accepting is audited and opens the student’s page to the coach', async () => {
    const coach = await createUser('coach');
    const student = await createUser();
    const other = await createUser();
    await createBall(student.user.id);
    const { id } = (await api.post('/api/coach/invitations').set(coach.auth).send({ email: student.user.email })).body.item;
    // Before acceptance the coach reads nothing.
    expect((await api.get(`/api/coach/students/${student.user.id}`).set(coach.auth)).status).toBe(404);
    expect((await api.post(`/api/coach/links/${id}/accept`).set(other.auth)).status).toBe(404);
    expect((await api.post(`/api/coach/links/${id}/accept`).set(coach.auth)).status).toBe(404);
    expect((await api.post(`/api/coach/links/${id}/accept`)).status).toBe(401);
    const ok = await api.post(`/api/coach/links/${id}/accept`).set(student.auth);
    expect(ok.status).toBe(200);
    expect(ok.body.item).toMatchObject({ id, status: 'active', student: { id: student.user.id } });
    expect(ok.body.item.acceptedAt).not.toBeNull();
    expect(await audited('coach.link_accepted', id)).toMatchObject({ actorId: student.user.id });
    const page = await api.get(`/api/coach/students/${student.user.id}`).set(coach.auth);
    expect(page.status).toBe(200);
    expect(page.body.item.student).toMatchObject({ id: student.user.id, displayName: student.user.displayName });
    expect(page.body.item.profile).toHaveProperty('hand');
    expect(page.body.item.arsenal).toHaveLength(1);
  });

  it('an invitation to an e-mail with no account yet is accepted after signing up with it', async () => {
    const coach = await createUser('coach');
    const email = uniqueEmail('newcomer');
    const inv = await api.post('/api/coach/invitations').set(coach.auth).send({ email });
    expect(inv.status).toBe(201);
    expect(inv.body.item.student).toBeNull();
    expect((await waitForMail(email)).text).toMatch(/sign up/i);
    const reg = await api.post('/api/auth/register').send({ email, password: 'a-long-enough-password', displayName: 'New Student' });
    expect(reg.status).toBe(201);
    const login = await api.post('/api/auth/login').send({ email, password: 'a-long-enough-password' });
    const auth = { Authorization: `Bearer ${login.body.token}` };
    // Until the address is confirmed the invitation is neither listed nor claimable.
    expect((await api.get('/api/coach/links').set(auth)).body.items).toEqual([]);
    const early = await api.post(`/api/coach/links/${inv.body.item.id}/accept`).set(auth);
    expect(early.status).toBe(403);
    expect(errorOf(early.body).code).toBe('email_unverified');
    const token = await mailedToken(email, '/verify-email', /confirm/i);
    expect((await api.post('/api/auth/verify-email').send({ token })).status).toBe(200);
    const mine = await api.get('/api/coach/links').set(auth);
    expect(mine.body.items.map((l: { id: number }) => l.id)).toEqual([inv.body.item.id]);
    const ok = await api.post(`/api/coach/links/${inv.body.item.id}/accept`).set(auth);
    expect(ok.body.item).toMatchObject({ status: 'active', student: { id: login.body.user.id, displayName: 'New Student' } });
  });
});

describe('revoking a link', () => {
  it('either side revokes (audited); the coach loses access at once; a stranger gets 404', async () => {
    const coach = await createUser('coach');
    const student = await createUser();
    const stranger = await createUser('coach');
    for (const by of ['student', 'coach'] as const) {
      const link = await linkRow(coach.user.id, student.user);
      expect((await api.get(`/api/coach/students/${student.user.id}`).set(coach.auth)).status).toBe(200);
      expect((await api.delete(`/api/coach/links/${link.id}`).set(stranger.auth)).status).toBe(404);
      expect((await api.delete(`/api/coach/links/${link.id}`)).status).toBe(401);
      const actor = by === 'student' ? student : coach;
      expect((await api.delete(`/api/coach/links/${link.id}`).set(actor.auth)).status).toBe(204);
      await link.reload();
      expect(link).toMatchObject({ status: 'revoked', revokedBy: actor.user.id });
      expect(await audited('coach.link_revoked', link.id)).toMatchObject({ actorId: actor.user.id });
      expect((await api.get(`/api/coach/students/${student.user.id}`).set(coach.auth)).status).toBe(404);
      expect((await api.get(`/api/sessions?studentId=${student.user.id}`).set(coach.auth)).status).toBe(404);
      expect((await api.get('/api/coach/links').set(student.auth)).body.items).toEqual([]);
    }
  });

  it('a student declines a pending invitation; it cannot be accepted afterwards', async () => {
    const coach = await createUser('coach');
    const student = await createUser();
    const { id } = (await api.post('/api/coach/invitations').set(coach.auth).send({ email: student.user.email })).body.item;
    expect((await api.delete(`/api/coach/links/${id}`).set(student.auth)).status).toBe(204);
    expect((await api.post(`/api/coach/links/${id}/accept`).set(student.auth)).status).toBe(404);
    // A fresh invitation is possible after a declined one.
    expect((await api.post('/api/coach/invitations').set(coach.auth).send({ email: student.user.email })).status).toBe(201);
  });
});

describe('students', () => {
  it('GET /api/coach/students lists active students with their session count and last date; a bowler gets 403', async () => {
    const coach = await createUser('coach');
    const a = await createUser();
    const b = await createUser();
    const pending = await createUser();
    await linkRow(coach.user.id, a.user);
    await linkRow(coach.user.id, b.user);
    await linkRow(coach.user.id, pending.user, 'pending');
    for (const date of ['2026-11-20', '2026-11-27']) await api.post('/api/sessions').set(a.auth).send({ date, kind: 'practice' });
    const res = await api.get('/api/coach/students').set(coach.auth);
    expect(res.status).toBe(200);
    expect(res.body.total).toBe(2);
    const byId = new Map(res.body.items.map((s: { student: { id: number } }) => [s.student.id, s]));
    expect(byId.get(a.user.id)).toMatchObject({ sessions: 2, lastSessionDate: '2026-11-27' });
    expect(byId.get(b.user.id)).toMatchObject({ sessions: 0, lastSessionDate: null });
    expect(byId.has(pending.user.id)).toBe(false);
    const paged = await api.get('/api/coach/students?pageSize=1&page=2').set(coach.auth);
    expect(paged.body).toMatchObject({ total: 2, page: 2, pageSize: 1 });
    expect(paged.body.items).toHaveLength(1);
    expect((await api.get('/api/coach/students').set(a.auth)).status).toBe(403);
    expect((await api.get('/api/coach/students')).status).toBe(401);
  });

  it('a student’s page is 404 for an unlinked coach, a pending link, another bowler; 400 for a malformed id', async () => {
    const coach = await createUser('coach');
    const student = await createUser();
    const unlinked = await createUser('coach');
    const pendingCoach = await createUser('coach');
    const bowler = await createUser();
    await linkRow(coach.user.id, student.user);
    await linkRow(pendingCoach.user.id, student.user, 'pending');
    expect((await api.get(`/api/coach/students/${student.user.id}`).set(coach.auth)).status).toBe(200);
    for (const who of [unlinked, pendingCoach, bowler])
      expect((await api.get(`/api/coach/students/${student.user.id}`).set(who.auth)).status).toBe(404);
    expect((await api.get('/api/coach/students/abc').set(coach.auth)).status).toBe(400);
    expect((await api.get(`/api/coach/students/${student.user.id}`)).status).toBe(401);
  });
});

describe('plans', () => {
  it('a linked coach sends a plan: stored, audited, mailed through the outbox; the student sees it newest first', async () => {
    const coach = await createUser('coach');
    const student = await createUser();
    const ball = await createBall(student.user.id);
    await linkRow(coach.user.id, student.user);
    const first = await api
      .post(`/api/coach/students/${student.user.id}/plans`)
      .set(coach.auth)
      .send({ title: 'Move left 2 and 1', kind: 'line', body: 'Feet 2 left, eyes 1 left once the fronts hook.' });
    expect(first.status).toBe(201);
    const second = await api
      .post(`/api/coach/students/${student.user.id}/plans`)
      .set(coach.auth)
      .send({ title: 'Take it to 3000', kind: 'surface', body: 'Sand to 3000 grit for the long pattern.', ballId: ball.id });
    expect(second.status).toBe(201);
    expect(second.body.item).toMatchObject({
      coachId: coach.user.id,
      coachName: coach.user.displayName,
      studentId: student.user.id,
      kind: 'surface',
      ballId: ball.id,
      ballName: ball.name,
    });
    expect(await Plan.count({ where: { studentId: student.user.id } })).toBe(2);
    expect(await audited('coach.plan_sent', second.body.item.id)).toMatchObject({ actorId: coach.user.id });
    expect(await MailOutbox.findOne({ where: { kind: 'coach_plan', ref: String(second.body.item.id) } })).not.toBeNull();
    const mine = await api.get('/api/plans').set(student.auth);
    expect(mine.status).toBe(200);
    expect(mine.body.items.map((p: { id: number }) => p.id)).toEqual([second.body.item.id, first.body.item.id]);
    expect(mine.body.total).toBe(2);
    const coachView = await api.get(`/api/coach/students/${student.user.id}/plans`).set(coach.auth);
    expect(coachView.body.items).toHaveLength(2);
    expect((await api.get('/api/plans')).status).toBe(401);
  });

  it('refuses a plan from an unlinked or revoked coach (404), a ball that is not the student’s and bad fields (400)', async () => {
    const coach = await createUser('coach');
    const student = await createUser();
    const unlinked = await createUser('coach');
    const former = await createUser('coach');
    const othersBall = await createBall(coach.user.id);
    await linkRow(coach.user.id, student.user);
    await linkRow(former.user.id, student.user, 'revoked');
    const plan = { title: 'Layout', kind: 'layout', body: 'Pin up, 4 1/2 inch pin-to-PAP.' };
    for (const who of [unlinked, former]) {
      expect((await api.post(`/api/coach/students/${student.user.id}/plans`).set(who.auth).send(plan)).status).toBe(404);
      expect((await api.get(`/api/coach/students/${student.user.id}/plans`).set(who.auth)).status).toBe(404);
    }
    const wrongBall = await api
      .post(`/api/coach/students/${student.user.id}/plans`)
      .set(coach.auth)
      .send({ ...plan, ballId: othersBall.id });
    expect(wrongBall.status).toBe(400);
    expect(errorOf(wrongBall.body).fields).toHaveProperty(['body.ballId']);
    const bad = await api.post(`/api/coach/students/${student.user.id}/plans`).set(coach.auth).send({ title: '', kind: 'vibes', body: '' });
    expect(Object.keys(errorOf(bad.body).fields ?? {}).sort()).toEqual(['body.body', 'body.kind', 'body.title']);
    expect(await Plan.count({ where: { studentId: student.user.id } })).toBe(0);
    expect((await api.post(`/api/coach/students/${student.user.id}/plans`).send(plan)).status).toBe(401);
  });
});
