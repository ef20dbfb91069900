import { describe, expect, it } from 'vitest';
import { AuditEvent, Center } from '../../../server/models/index';
import { api, createUser, errorOf, uniqueMarker } from '../../helpers/api';

describe('admin: centers and their proprietors', () => {
  it('creates a center with its lane count and IANA time zone, attaches and detaches its proprietor, audited', async () => {
    const admin = await createUser('admin');
    const owner = await createUser('bowler');
    // A bowler who is given the proprietor role too may run a center.
    expect(
      (
        await api
          .put(`/api/admin/users/${owner.user.id}/roles`)
          .set(admin.auth)
          .send({ roles: ['bowler', 'proprietor'] })
      ).status,
    ).toBe(200);
    const name = uniqueMarker('Ridgeback Lanes');
    const res = await api.post('/api/centers').set(admin.auth).send({ name, town: 'Eastwick', laneCount: 16, timeZone: 'America/Chicago' });
    expect(res.status).toBe(201);
    expect(res.body.item).toMatchObject({ name, laneCount: 16, timeZone: 'America/Chicago', ownerId: null });
    const id = res.body.item.id as number;
    expect((await Center.findByPk(id))!.timeZone).toBe('America/Chicago');

    const attach = await api.patch(`/api/centers/${id}`).set(admin.auth).send({ ownerId: owner.user.id });
    expect(attach.status).toBe(200);
    expect(attach.body.item.ownerId).toBe(owner.user.id);
    expect((await api.get('/api/centers/mine').set(owner.auth)).body.items.map((c: { id: number }) => c.id)).toEqual([id]);
    const detach = await api.patch(`/api/centers/${id}`).set(admin.auth).send({ ownerId: null });
    expect(detach.body.item.ownerId).toBeNull();
    const events = await AuditEvent.findAll({ where: { subjectType: 'center', subjectId: String(id) }, order: [['id', 'ASC']] });
    expect(events.map((e) => [e.action, e.details])).toEqual([
      ['center.created', { ownerId: null }],
      ['center.owner_assigned', { from: null, to: owner.user.id }],
      ['center.owner_assigned', { from: owner.user.id, to: null }],
    ]);
    const log = await api.get('/api/admin/audit').query({ action: 'center.owner_assigned', actorId: admin.user.id }).set(admin.auth);
    expect(log.body.items.map((e: { subjectName: string }) => e.subjectName)).toEqual([name, name]);
  });

  it('refuses a time zone that is not an IANA name and an owner without the proprietor role, by field', async () => {
    const admin = await createUser('admin');
    const bowler = await createUser('bowler');
    for (const timeZone of ['Mars/Olympus', '+05:00', 'Not a zone', '']) {
      const res = await api
        .post('/api/centers')
        .set(admin.auth)
        .send({ name: uniqueMarker('Zone'), town: 'X', laneCount: 8, timeZone });
      expect(res.status, timeZone).toBe(400);
      expect(errorOf(res.body).fields, timeZone).toHaveProperty(['body.timeZone']);
    }
    const res = await api
      .post('/api/centers')
      .set(admin.auth)
      .send({ name: uniqueMarker('Owned'), town: 'X', laneCount: 8, ownerId: bowler.user.id });
    expect(res.status).toBe(400);
    expect(errorOf(res.body).fields).toHaveProperty(['body.ownerId']);
    const proprietor = await createUser('proprietor');
    expect(
      (
        await api
          .post('/api/centers')
          .set(proprietor.auth)
          .send({ name: uniqueMarker('Mine'), town: 'X', laneCount: 8 })
      ).status,
    ).toBe(403);
  });
});
