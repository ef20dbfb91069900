import { describe, expect, it } from 'vitest';
import { AuditEvent, User } from '../../../server/models/index';
import { api, createUser, errorOf, uniqueMarker } from '../../helpers/api';

describe('PATCH /api/admin/users/:id/role', () => {
  it('lets an admin grant coach, stores it, and records an audit event', async () => {
    const admin = await createUser('admin');
    const { user } = await createUser('bowler');
    const res = await api.patch(`/api/admin/users/${user.id}/role`).set(admin.auth).send({ role: 'coach' });
    expect(res.status).toBe(200);
    expect(res.body.user).toMatchObject({ id: user.id, role: 'coach' });
    expect((await User.findByPk(user.id))!.role).toBe('coach');
    const ev = await AuditEvent.findOne({ where: { subjectType: 'user', subjectId: String(user.id), action: 'user.role_changed' } });
    expect(ev).not.toBeNull();
    expect(ev!.actorId).toBe(admin.user.id);
    expect(ev!.details).toEqual({ from: 'bowler', to: 'coach' });
  });

  it.each(['bowler', 'coach', 'proprietor'] as const)('refuses a %s with 403 whatever the id, changing nothing', async (role) => {
    const caller = await createUser(role);
    const { user: target } = await createUser('bowler');
    for (const id of [target.id, caller.user.id, 999999]) {
      const res = await api.patch(`/api/admin/users/${id}/role`).set(caller.auth).send({ role: 'admin' });
      expect(res.status).toBe(403);
      expect(errorOf(res.body).code).toBe('forbidden');
    }
    expect((await User.findByPk(target.id))!.role).toBe('bowler');
    expect((await User.findByPk(caller.user.id))!.role).toBe(role);
  });

  it('answers 401 without a token', async () => {
    expect((await api.patch('/api/admin/users/1/role').send({ role: 'admin' })).status).toBe(401);
  });

  it('refuses an unknown role and a non-numeric id with field messages', async () => {
    const admin = await createUser('admin');
    const res = await api.patch('/api/admin/users/abc/role').set(admin.auth).send({ role: 'wizard' });
    expect(res.status).toBe(400);
    expect(Object.keys(errorOf(res.body).fields ?? {}).sort()).toEqual(['body.role', 'params.id']);
  });

  it('answers 404 for a user that does not exist', async () => {
    const admin = await createUser('admin');
    const res = await api.patch('/api/admin/users/999999/role').set(admin.auth).send({ role: 'coach' });
    expect(res.status).toBe(404);
    expect(errorOf(res.body).code).toBe('not_found');
  });

  it('does not let an admin demote themselves', async () => {
    const admin = await createUser('admin');
    const res = await api.patch(`/api/admin/users/${admin.user.id}/role`).set(admin.auth).send({ role: 'bowler' });
    expect(res.status).toBe(409);
    expect((await User.findByPk(admin.user.id))!.role).toBe('admin');
  });
});

describe('GET /api/admin/users', () => {
  it('pages, filters by role and searches by text', async () => {
    const admin = await createUser('admin');
    // Three coaches and a bowler share a marker in their names; every query asks for it, so only they can answer.
    const tag = uniqueMarker('Roster');
    const coaches = [];
    for (const n of [1, 2, 3]) coaches.push(await createUser('coach', undefined, { displayName: `${tag} Coach ${n}` }));
    const bowler = await createUser('bowler', undefined, { displayName: `${tag} Bowler` });
    const page = (p: number) =>
      api
        .get('/api/admin/users')
        .query({ q: tag, role: 'coach', pageSize: 2, page: p, sort: 'displayName', order: 'desc' })
        .set(admin.auth);
    const first = await page(1);
    expect(first.status).toBe(200);
    expect(first.body).toMatchObject({ total: 3, page: 1, pageSize: 2 });
    expect(first.body.items.map((u: { id: number; role: string }) => [u.id, u.role])).toEqual([
      [coaches[2].user.id, 'coach'],
      [coaches[1].user.id, 'coach'],
    ]);
    expect((await page(2)).body.items.map((u: { id: number }) => u.id)).toEqual([coaches[0].user.id]);
    const anyRole = await api.get('/api/admin/users').query({ q: tag, sort: 'displayName' }).set(admin.auth);
    expect(anyRole.body.items.map((u: { id: number }) => u.id)).toEqual([bowler.user.id, ...coaches.map((c) => c.user.id)]);
    const search = await api.get('/api/admin/users').query({ q: coaches[0].user.email }).set(admin.auth);
    expect(search.body.items.map((u: { id: number }) => u.id)).toEqual([coaches[0].user.id]);
  });

  it('refuses a page size over 100', async () => {
    const admin = await createUser('admin');
    const res = await api.get('/api/admin/users').query({ pageSize: 1000 }).set(admin.auth);
    expect(res.status).toBe(400);
    expect(errorOf(res.body).fields).toHaveProperty(['query.pageSize']);
  });

  it('refuses a bowler with 403', async () => {
    const b = await createUser('bowler');
    expect((await api.get('/api/admin/users').set(b.auth)).status).toBe(403);
  });
});

describe('PUT /api/admin/users/:id/roles', () => {
  it('gives a bowler the coach role too: both held, role is the highest, audited with the sets', async () => {
    const admin = await createUser('admin');
    const { user } = await createUser('bowler');
    const res = await api
      .put(`/api/admin/users/${user.id}/roles`)
      .set(admin.auth)
      .send({ roles: ['coach', 'bowler'] });
    expect(res.status).toBe(200);
    expect(res.body.user).toMatchObject({ id: user.id, role: 'coach', roles: ['bowler', 'coach'] });
    const row = (await User.findByPk(user.id))!;
    expect([row.role, [...row.roles].sort()]).toEqual(['coach', ['bowler', 'coach']]);
    const ev = await AuditEvent.findOne({ where: { subjectType: 'user', subjectId: String(user.id), action: 'user.roles_changed' } });
    expect(ev!.actorId).toBe(admin.user.id);
    expect(ev!.details).toEqual({ from: ['bowler'], to: ['bowler', 'coach'] });
  });

  it('honours every held role: a proprietor who is also a coach reaches coach-only routes and proprietor-only ones', async () => {
    const admin = await createUser('admin');
    const both = await createUser('proprietor');
    expect((await api.get('/api/coach/students').set(both.auth)).status).toBe(403);
    expect(
      (
        await api
          .put(`/api/admin/users/${both.user.id}/roles`)
          .set(admin.auth)
          .send({ roles: ['proprietor', 'coach'] })
      ).status,
    ).toBe(200);
    expect((await api.get('/api/coach/students').set(both.auth)).status).toBe(200);
    expect((await api.get('/api/centers/mine').set(both.auth)).status).toBe(200);
  });

  it('refuses admin mixed with another role, an empty set and an unknown role with 400 by field, changing nothing', async () => {
    const admin = await createUser('admin');
    const { user } = await createUser('bowler');
    for (const roles of [['admin', 'bowler'], [], ['wizard'], 'coach']) {
      const res = await api.put(`/api/admin/users/${user.id}/roles`).set(admin.auth).send({ roles });
      expect(res.status, JSON.stringify(roles)).toBe(400);
      expect(
        Object.keys(errorOf(res.body).fields ?? {}).some((k) => k.startsWith('body.roles')),
        JSON.stringify(roles),
      ).toBe(true);
    }
    expect(
      errorOf(
        (
          await api
            .put(`/api/admin/users/${user.id}/roles`)
            .set(admin.auth)
            .send({ roles: ['admin', 'coach'] })
        ).body,
      ).fields,
    ).toEqual({
      'body.roles': expect.stringMatching(/admin role alone/),
    });
    expect((await User.findByPk(user.id))!.roles).toEqual(['bowler']);
  });

  it('does not let an admin drop their own admin role (409), and answers 404, 403 and 401', async () => {
    const admin = await createUser('admin');
    const self = await api
      .put(`/api/admin/users/${admin.user.id}/roles`)
      .set(admin.auth)
      .send({ roles: ['bowler'] });
    expect(self.status).toBe(409);
    expect((await User.findByPk(admin.user.id))!.roles).toEqual(['admin']);
    expect(
      (
        await api
          .put('/api/admin/users/999999/roles')
          .set(admin.auth)
          .send({ roles: ['coach'] })
      ).status,
    ).toBe(404);
    const coach = await createUser('coach');
    expect(
      (
        await api
          .put(`/api/admin/users/${coach.user.id}/roles`)
          .set(coach.auth)
          .send({ roles: ['admin'] })
      ).status,
    ).toBe(403);
    expect((await api.put(`/api/admin/users/${coach.user.id}/roles`).send({ roles: ['admin'] })).status).toBe(401);
  });

  it('lists a user under every role they hold', async () => {
    const admin = await createUser('admin');
    const tag = uniqueMarker('Both');
    const u = await createUser('bowler', undefined, { displayName: `${tag} Two Hats` });
    await api
      .put(`/api/admin/users/${u.user.id}/roles`)
      .set(admin.auth)
      .send({ roles: ['bowler', 'proprietor'] });
    for (const role of ['bowler', 'proprietor']) {
      const res = await api.get('/api/admin/users').query({ q: tag, role }).set(admin.auth);
      expect(
        res.body.items.map((x: { id: number }) => x.id),
        role,
      ).toEqual([u.user.id]);
    }
    expect((await api.get('/api/admin/users').query({ q: tag, role: 'coach' }).set(admin.auth)).body.total).toBe(0);
  });
});

describe('GET /api/admin/audit', () => {
  it('names the actor and the subject, filters by actor, action and day, and pages', async () => {
    const admin = await createUser('admin', undefined, { displayName: uniqueMarker('Auditor') });
    const targets = [];
    for (const n of [1, 2, 3]) {
      const t = await createUser('bowler', undefined, { displayName: `${uniqueMarker('Target')} ${n}` });
      targets.push(t);
      await api
        .put(`/api/admin/users/${t.user.id}/roles`)
        .set(admin.auth)
        .send({ roles: ['bowler', 'coach'] });
    }
    const today = new Date().toISOString().slice(0, 10);
    const q = { actorId: admin.user.id, action: 'user.roles_changed', from: today, to: today, pageSize: 2 };
    const first = await api
      .get('/api/admin/audit')
      .query({ ...q, page: 1 })
      .set(admin.auth);
    expect(first.status).toBe(200);
    expect(first.body).toMatchObject({ total: 3, page: 1, pageSize: 2 });
    expect(first.body.items.map((e: { subjectName: string }) => e.subjectName)).toEqual([
      targets[2].user.displayName,
      targets[1].user.displayName,
    ]);
    expect(first.body.items[0]).toMatchObject({ actorId: admin.user.id, actorName: admin.user.displayName, subjectType: 'user' });
    const second = await api
      .get('/api/admin/audit')
      .query({ ...q, page: 2 })
      .set(admin.auth);
    expect(second.body.items.map((e: { subjectId: string }) => e.subjectId)).toEqual([String(targets[0].user.id)]);
    const otherAction = await api
      .get('/api/admin/audit')
      .query({ ...q, action: 'catalogue.created' })
      .set(admin.auth);
    expect(otherAction.body.total).toBe(0);
    const yesterday = new Date(Date.now() - 86_400_000).toISOString().slice(0, 10);
    expect(
      (
        await api
          .get('/api/admin/audit')
          .query({ ...q, from: yesterday, to: yesterday })
          .set(admin.auth)
      ).body.total,
    ).toBe(0);
    const actions = await api.get('/api/admin/audit/actions').set(admin.auth);
    expect(actions.status).toBe(200);
    expect(actions.body.items).toContain('user.roles_changed');
  });

  it('refuses a bad date, an end before the start and a bad action name by field', async () => {
    const admin = await createUser('admin');
    const res = await api.get('/api/admin/audit').query({ from: '2026-13-xx', action: 'DROP TABLE' }).set(admin.auth);
    expect(res.status).toBe(400);
    expect(Object.keys(errorOf(res.body).fields ?? {}).sort()).toEqual(['query.action', 'query.from']);
    const order = await api.get('/api/admin/audit').query({ from: '2026-12-05', to: '2026-12-01' }).set(admin.auth);
    expect(errorOf(order.body).fields).toHaveProperty(['query.to']);
  });

  it('is for admins only', async () => {
    const b = await createUser('proprietor');
    expect((await api.get('/api/admin/audit').set(b.auth)).status).toBe(403);
    expect((await api.get('/api/admin/audit/actions').set(b.auth)).status).toBe(403);
  });
});

describe('role and roles stay in step in the database', () => {
  it('a role written the old way (raw SQL, another process) becomes the whole set; a new set decides the role', async () => {
    const { user } = await createUser('coach');
    await User.sequelize!.query("UPDATE users SET role = 'proprietor' WHERE id = $1", { bind: [user.id] });
    let row = (await User.findByPk(user.id))!;
    expect([row.role, row.roles]).toEqual(['proprietor', ['proprietor']]);
    await User.sequelize!.query("UPDATE users SET roles = ARRAY['bowler','coach']::varchar(16)[] WHERE id = $1", { bind: [user.id] });
    row = (await User.findByPk(user.id))!;
    expect([row.role, [...row.roles].sort()]).toEqual(['coach', ['bowler', 'coach']]);
    await expect(
      User.sequelize!.query("UPDATE users SET roles = ARRAY['wizard']::varchar(16)[] WHERE id = $1", { bind: [user.id] }),
    ).rejects.toThrow(/users_roles_known/);
  });
});
