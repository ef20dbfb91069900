import { describe, expect, it } from 'vitest';
import { AuditEvent, MailOutbox } from '../../../server/models/index';
import { api, createUser, errorOf } from '../../helpers/api';
import { waitForMail } from '../../helpers/mail';
import { linkRow } from '../sessions/shotlog';

const today = () => new Date().toISOString().slice(0, 10);

describe('answering a plan', () => {
  it('the student answers, the coach answers back: both see the thread in order, each answer is mailed to the other side and audited', async () => {
    const coach = await createUser('coach');
    const student = await createUser();
    await linkRow(coach.user.id, student.user);
    const sent = await api
      .post(`/api/coach/students/${student.user.id}/plans`)
      .set(coach.auth)
      .send({ title: 'Two left for the late shift', kind: 'line', body: 'Move your feet two boards left after game 2.' });
    expect(sent.status).toBe(201);
    const planId = sent.body.item.id as number;
    expect(sent.body.item.replies).toEqual([]);

    const a = await api.post(`/api/plans/${planId}/replies`).set(student.auth).send({ text: 'Done: the 10 pins stopped.' });
    expect(a.status).toBe(201);
    expect(a.body.item.replies).toMatchObject([
      { authorId: student.user.id, authorName: student.user.displayName, text: 'Done: the 10 pins stopped.' },
    ]);
    const toCoach = await waitForMail(coach.user.email, 20000, /answered/);
    expect(toCoach.subject).toBe(`${student.user.displayName} answered: Two left for the late shift`);
    expect(toCoach.text).toContain('Done: the 10 pins stopped.');

    const b = await api.post(`/api/plans/${planId}/replies`).set(coach.auth).send({ text: 'Good. Keep it for next week.' });
    expect(b.status).toBe(201);
    const toStudent = await waitForMail(student.user.email, 20000, /answered/);
    expect(toStudent.text).toContain('Good. Keep it for next week.');

    const mine = await api.get('/api/plans').set(student.auth);
    const thread = mine.body.items.find((p: { id: number }) => p.id === planId).replies.map((r: { text: string }) => r.text);
    expect(thread).toEqual(['Done: the 10 pins stopped.', 'Good. Keep it for next week.']);
    const coachView = await api.get(`/api/coach/students/${student.user.id}/plans`).set(coach.auth);
    expect(coachView.body.items[0].replies).toHaveLength(2);
    expect(await AuditEvent.count({ where: { action: 'coach.plan_replied', subjectId: String(planId) } })).toBe(2);
  });

  it('anyone else gets 404; an empty answer is 400 naming the field; anonymous 401', async () => {
    const coach = await createUser('coach');
    const student = await createUser();
    const other = await createUser();
    await linkRow(coach.user.id, student.user);
    const planId = (
      await api
        .post(`/api/coach/students/${student.user.id}/plans`)
        .set(coach.auth)
        .send({ title: 'Polish', kind: 'surface', body: 'Polish it.' })
    ).body.item.id;
    expect((await api.post(`/api/plans/${planId}/replies`).set(other.auth).send({ text: 'Hi' })).status).toBe(404);
    expect((await api.post(`/api/plans/${planId}/replies`).send({ text: 'Hi' })).status).toBe(401);
    const empty = await api.post(`/api/plans/${planId}/replies`).set(student.auth).send({ text: '  ' });
    expect(empty.status).toBe(400);
    expect(errorOf(empty.body).fields!['body.text']).toBe('Write your answer');
  });
});

describe('a coach’s note on a session is mailed to the bowler', () => {
  it('the linked coach annotates frame 3 of game 1: the bowler gets an e-mail with the note and a link; the bowler’s own note sends none', async () => {
    const coach = await createUser('coach');
    const student = await createUser();
    await linkRow(coach.user.id, student.user);
    const sid = (await api.post('/api/sessions').set(student.auth).send({ date: today(), kind: 'practice' })).body.item.id as number;
    const res = await api
      .post(`/api/sessions/${sid}/annotations`)
      .set(coach.auth)
      .send({ gameNumber: 1, frame: 3, text: 'Your feet drifted right here.' });
    expect(res.status).toBe(201);
    const mail = await waitForMail(student.user.email, 20000, /A note from/);
    expect(mail.subject).toBe(`A note from ${coach.user.displayName} on your session of ${today()}`);
    expect(mail.text).toContain('on game 1, frame 3');
    expect(mail.text).toContain('Your feet drifted right here.');
    expect(mail.text).toMatch(new RegExp(`/sessions/${sid}$`, 'm'));

    const own = await api.post(`/api/sessions/${sid}/annotations`).set(student.auth).send({ text: 'Felt tired in game 2.' });
    expect(own.status).toBe(201);
    expect(await MailOutbox.count({ where: { kind: 'session_annotation', ref: String(own.body.item.id) } })).toBe(0);
  });
});
