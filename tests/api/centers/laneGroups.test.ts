import { PDFParse } from 'pdf-parse';
import { describe, expect, it } from 'vitest';
import { Follow } from '../../../server/models/index';
import { api, createUser, errorOf } from '../../helpers/api';
import { createCenter, createPattern, LONG_HEAVY, SHORT_LIGHT } from '../../helpers/fixtures';
import { waitForMail } from '../../helpers/mail';

/**
 * A center's condition as lane groups: what is on each lane at an instant (`?at=`), in the center's own time zone,
 * and what comes next. December 2026: the 12th is a Saturday, the 15th a Tuesday; Denver is UTC−7 in winter.
 */

type Group = {
  key: string;
  lanes: number[];
  from: number;
  to: number;
  current: { id: number; pattern: { name: string } } | null;
  currentUntil: string | null;
  next: { condition: { id: number }; from: string } | null;
};

async function world(laneCount = 24, timeZone = 'UTC') {
  const owner = await createUser('proprietor');
  const center = await createCenter(owner.user.id, laneCount);
  center.timeZone = timeZone;
  await center.save();
  const house = await createPattern(owner.user.id, LONG_HEAVY);
  const sport = await createPattern(owner.user.id, SHORT_LIGHT);
  async function publish(body: Record<string, unknown>): Promise<number> {
    const res = await api
      .post(`/api/centers/${center.id}/conditions`)
      .set(owner.auth)
      .send({ patternId: house.id, ...body });
    expect(res.status, JSON.stringify(res.body)).toBe(201);
    return res.body.item.id as number;
  }
  async function groups(at: string): Promise<{ today: string; groups: Group[] }> {
    const res = await api.get(`/api/centers/${center.id}/conditions/lane-groups`).query({ at });
    expect(res.status, JSON.stringify(res.body)).toBe(200);
    return res.body;
  }
  return { owner, center, house, sport, publish, groups };
}

const lanes = (from: number, to: number) => Array.from({ length: to - from + 1 }, (_, i) => from + i);

describe('lane groups', () => {
  it('two lane groups in force at once are both current, on the lane-groups route, the current condition and the follow list', async () => {
    const w = await world();
    const league = await w.publish({ lanes: lanes(1, 12), validFrom: '2026-12-01', notes: 'League lanes' });
    const open = await w.publish({ patternId: w.sport.id, lanes: lanes(13, 24), validFrom: '2026-12-01', notes: 'Open play' });
    const at = '2026-12-05T18:00:00Z';
    const { today, groups } = await w.groups(at);
    expect(today).toBe('2026-12-05');
    expect(groups.map((g) => [g.key, g.current?.id])).toEqual([
      ['lanes-1-12', league],
      ['lanes-13-24', open],
    ]);
    expect(groups[0].lanes).toEqual(lanes(1, 12));
    expect(groups[1]).toMatchObject({ from: 13, to: 24, current: { pattern: { name: w.sport.name } }, next: null, currentUntil: null });

    const cur = await api.get(`/api/centers/${w.center.id}/conditions/current`).query({ at });
    expect(cur.status).toBe(200);
    // The fields there were before stay (the newest publication in force); every group is listed beside them.
    expect(cur.body).toMatchObject({ condition: { id: open }, lanes: lanes(13, 24), today: '2026-12-05', timeZone: 'UTC' });
    expect(cur.body.groups.map((g: Group) => g.current?.id)).toEqual([league, open]);

    // Both show in the public history as in force (neither replaced the other).
    const history = await api.get(`/api/centers/${w.center.id}/conditions`);
    expect(history.body.items.map((c: { id: number; supersededBy: number | null }) => [c.id, c.supersededBy])).toEqual([
      [open, null],
      [league, null],
    ]);

    // A follower's list names both, each with its lanes (the Home card and the Matchup picker read it).
    const fan = await createUser();
    await api.post(`/api/centers/${w.center.id}/follow`).set(fan.auth).expect(200);
    const follows = await api.get('/api/follows').set(fan.auth);
    const mine = follows.body.items.find((f: { center: { id: number } }) => f.center.id === w.center.id);
    // The follow list is about today, so its publications started on 2026-12-01 are in force from then on.
    expect(mine.inForce.map((x: { condition: { id: number }; lanes: number[] }) => [x.condition.id, x.lanes])).toEqual([
      [league, lanes(1, 12)],
      [open, lanes(13, 24)],
    ]);
    expect(mine.groups).toHaveLength(2);
  });

  it('a future group appears as "next" and becomes current on its date in the center’s time zone; a later open-ended publication does not replace it', async () => {
    const w = await world(24, 'America/Denver');
    const house = await w.publish({ lanes: lanes(1, 24), validFrom: '2026-11-01' });
    const weekend = await w.publish({ patternId: w.sport.id, lanes: lanes(17, 24), validFrom: '2026-12-12', validTo: '2026-12-13' });
    // Published after the weekend shot, open-ended from before it: it takes the house lanes, not the weekend.
    const house2 = await w.publish({ lanes: lanes(1, 24), validFrom: '2026-12-01', notes: 'Re-oiled house shot' });

    // 06:30 UTC on the 12th is still Friday the 11th in Denver: the weekend shot is next, not current.
    const friday = await w.groups('2026-12-12T06:30:00Z');
    expect(friday.today).toBe('2026-12-11');
    expect(friday.groups.map((g) => [g.key, g.current?.id, g.next?.condition.id ?? null, g.next?.from ?? null, g.currentUntil])).toEqual([
      ['lanes-1-16', house2, null, null, null],
      ['lanes-17-24', house2, weekend, '2026-12-12', '2026-12-11'],
    ]);

    // An hour later it is Saturday in Denver: the weekend shot is current until Sunday, then the house shot again.
    const saturday = await w.groups('2026-12-12T07:30:00Z');
    expect(saturday.today).toBe('2026-12-12');
    expect(saturday.groups.map((g) => [g.key, g.current?.id, g.currentUntil, g.next?.condition.id ?? null, g.next?.from ?? null])).toEqual([
      ['lanes-1-16', house2, null, null, null],
      ['lanes-17-24', weekend, '2026-12-13', house2, '2026-12-14'],
    ]);
    const cur = await api.get(`/api/centers/${w.center.id}/conditions/current`).query({ at: '2026-12-12T07:30:00Z' });
    expect(cur.body.today).toBe('2026-12-12');
    expect(cur.body.groups.map((g: Group) => g.current?.id)).toEqual([house2, weekend]);

    // The first house shot was replaced by the second on every lane; the weekend shot was not.
    const history = await api.get(`/api/centers/${w.center.id}/conditions`);
    const by = new Map(history.body.items.map((c: { id: number; supersededBy: number | null }) => [c.id, c.supersededBy]));
    expect([by.get(house), by.get(weekend), by.get(house2)]).toEqual([house2, null, null]);
  });

  it('a recurring league night is current on its day only, and the group says when it comes back', async () => {
    const w = await world(24, 'America/Denver');
    const house = await w.publish({ lanes: lanes(1, 24), validFrom: '2026-11-01' });
    const league = await w.publish({ patternId: w.sport.id, lanes: lanes(1, 12), validFrom: '2026-12-01', weekdays: [2] });
    // Monday 14th, 20:00 in Denver (03:00 UTC on the 15th): the league is tomorrow.
    const monday = await w.groups('2026-12-15T03:00:00Z');
    expect(monday.today).toBe('2026-12-14');
    expect(monday.groups.map((g) => [g.key, g.current?.id, g.next?.condition.id ?? null, g.next?.from ?? null])).toEqual([
      ['lanes-1-12', house, league, '2026-12-15'],
      ['lanes-13-24', house, null, null],
    ]);
    const tuesday = await w.groups('2026-12-16T03:00:00Z');
    expect(tuesday.groups.map((g) => [g.key, g.current?.id, g.currentUntil, g.next?.condition.id ?? null, g.next?.from ?? null])).toEqual([
      ['lanes-1-12', league, '2026-12-15', house, '2026-12-16'],
      ['lanes-13-24', house, null, null, null],
    ]);
    const bad = await api
      .post(`/api/centers/${w.center.id}/conditions`)
      .set(w.owner.auth)
      .send({ patternId: w.house.id, lanes: [1], validFrom: '2026-12-01', weekdays: [0, 8] });
    expect(bad.status).toBe(400);
    expect(Object.keys(errorOf(bad.body).fields ?? {})).toEqual(expect.arrayContaining(['body.weekdays.0', 'body.weekdays.1']));
  });

  it('a partial-lane publication leaves the other lanes’ condition alone, and is not marked as replacing it', async () => {
    const w = await world();
    const all = await w.publish({ lanes: lanes(1, 24), validFrom: '2026-12-01' });
    const part = await w.publish({ patternId: w.sport.id, lanes: lanes(1, 12), validFrom: '2026-12-02' });
    const at = '2026-12-05T12:00:00Z';
    expect((await w.groups(at)).groups.map((g) => [g.key, g.current?.id])).toEqual([
      ['lanes-1-12', part],
      ['lanes-13-24', all],
    ]);
    let history = await api.get(`/api/centers/${w.center.id}/conditions`);
    expect(history.body.items.find((c: { id: number }) => c.id === all).supersededBy).toBeNull();
    // Once lanes 13–24 get theirs too, the first publication governs no lane: it is replaced.
    const rest = await w.publish({ lanes: lanes(13, 24), validFrom: '2026-12-03' });
    history = await api.get(`/api/centers/${w.center.id}/conditions`);
    expect(history.body.items.find((c: { id: number }) => c.id === all).supersededBy).toBe(rest);
    expect((await w.groups(at)).groups.map((g) => [g.key, g.current?.id])).toEqual([
      ['lanes-1-12', part],
      ['lanes-13-24', rest],
    ]);
  });

  it('the sheet carries every lane group, the legend, arrows and dots; `at` is validated; an unknown center is 404', async () => {
    const w = await world();
    await w.publish({ lanes: lanes(1, 12), validFrom: '2026-12-01', notes: 'League lanes. '.repeat(120) });
    await w.publish({ patternId: w.sport.id, lanes: lanes(13, 24), validFrom: '2026-12-01', notes: 'Open play' });
    const res = await api
      .get(`/api/centers/${w.center.id}/conditions/current.pdf`)
      .query({ at: '2026-12-05T12:00:00Z' })
      .buffer(true)
      .parse((r, cb) => {
        const chunks: Buffer[] = [];
        r.on('data', (c: Buffer) => chunks.push(c));
        r.on('end', () => cb(null, Buffer.concat(chunks)));
      });
    expect(res.status).toBe(200);
    const parser = new PDFParse({ data: new Uint8Array(res.body as Buffer) });
    const { text, total } = await parser.getText();
    await parser.destroy();
    const flat = text.replace(/\s+/g, ' ');
    expect(flat).toContain(`Lanes 1–12: ${w.house.name}`);
    expect(flat).toContain(`Lanes 13–24: ${w.sport.name}`);
    for (const s of ['Legend', 'Dry outside boards (hatched)', 'Arrows', 'Dots', 'Open play', 'foul line']) expect(flat).toContain(s);
    // The long notes are printed whole, running onto a further page instead of squashing the maps.
    expect(flat.match(/League lanes\./g)).toHaveLength(120);
    expect(total).toBeGreaterThanOrEqual(2);

    for (const url of ['current', 'current.pdf', 'lane-groups']) {
      const bad = await api.get(`/api/centers/${w.center.id}/conditions/${url}`).query({ at: 'next Tuesday' });
      expect(bad.status).toBe(400);
      expect(errorOf(bad.body).fields).toHaveProperty(['query.at']);
    }
    expect((await api.get('/api/centers/99999999/conditions/lane-groups')).status).toBe(404);
    // Nothing published: 200 with no groups (the current condition answers 404 no_condition).
    const empty = await createCenter(null);
    expect((await api.get(`/api/centers/${empty.id}/conditions/lane-groups`)).body.groups).toEqual([]);
  });
});

describe('follower e-mails and unsubscribing', () => {
  it('the e-mail links to its lane group; the unsubscribe link asks first (a GET changes nothing), a POST unsubscribes, and it can be undone', async () => {
    const w = await world();
    const fan = await createUser();
    await api.post(`/api/centers/${w.center.id}/follow`).set(fan.auth).expect(200);
    await w.publish({ patternId: w.sport.id, lanes: lanes(13, 24), validFrom: '2026-12-01' });
    const mail = await waitForMail(fan.user.email);
    expect(mail.text).toContain(`/centers/${w.center.id}/condition#lanes-13-24`);
    const token = /\/unsubscribe\?token=([\w-]+)/.exec(mail.text)?.[1];
    expect(token, 'the unsubscribe link opens the page, not the API').toBeTruthy();
    expect(mail.text).not.toContain('/api/unsubscribe');

    // A mail scanner following the old link changes nothing: it is sent to the page.
    const old = await api.get('/api/unsubscribe').query({ token });
    expect(old.status).toBe(303);
    expect(old.headers.location).toMatch(new RegExp(`/unsubscribe\\?token=${token}$`));
    expect(await Follow.count({ where: { centerId: w.center.id, userId: fan.user.id } })).toBe(1);
    expect((await api.get('/api/unsubscribe/info').query({ token })).body).toEqual({ center: w.center.name, subscribed: true });

    expect((await api.post('/api/unsubscribe').send({ token })).body).toEqual({ ok: true, center: w.center.name });
    expect(await Follow.count({ where: { centerId: w.center.id, userId: fan.user.id } })).toBe(0);
    expect((await api.get('/api/unsubscribe/info').query({ token })).body).toEqual({ center: w.center.name, subscribed: false });
    expect((await api.post('/api/unsubscribe').send({ token })).status).toBe(404);

    expect((await api.post('/api/unsubscribe/undo').send({ token })).body).toEqual({ ok: true, center: w.center.name });
    expect(await Follow.count({ where: { centerId: w.center.id, userId: fan.user.id } })).toBe(1);
    const follows = await api.get('/api/follows').set(fan.auth);
    expect(follows.body.items.map((f: { center: { id: number } }) => f.center.id)).toContain(w.center.id);

    // Unknown and malformed links: 404 and 400 with the field, never a 500.
    const unknown = await api.get('/api/unsubscribe/info').query({ token: 'x'.repeat(32) });
    expect(unknown.status).toBe(404);
    expect((await api.post('/api/unsubscribe/undo').send({ token: 'x'.repeat(32) })).status).toBe(404);
    expect(errorOf((await api.post('/api/unsubscribe/undo').send({ token: 'short' })).body).fields).toHaveProperty(['body.token']);
    // Following again in the app after an e-mail unsubscribe brings back the same follow and its link.
    await api.post('/api/unsubscribe').send({ token }).expect(200);
    await api.post(`/api/centers/${w.center.id}/follow`).set(fan.auth).expect(200);
    const back = await Follow.findAll({ where: { centerId: w.center.id, userId: fan.user.id }, paranoid: false });
    expect(back.map((f) => [f.unsubscribeToken, f.deletedAt])).toEqual([[token, null]]);
    // Unfollowing in the app ends the link for good: no undo.
    await api.delete(`/api/centers/${w.center.id}/follow`).set(fan.auth).expect(200);
    expect((await api.post('/api/unsubscribe/undo').send({ token })).status).toBe(404);
  });
});
