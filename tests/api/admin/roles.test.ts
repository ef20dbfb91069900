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
