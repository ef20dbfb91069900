import { describe, expect, it } from 'vitest';
import { elsewhere, feedUp } from '../../helpers/changeFeed';
import { api, createUser, uniqueMarker } from '../../helpers/api';

// The signed-in user's row and the arsenal pages are cached in the process (CACHE_TTL_MS, 10 s by default) while
// it hears the database's change feed. These tests show the caches answer, and that a change still takes effect on
// the very next request: made through the API (this process, dropped when it commits), or written by another
// connection (another process: heard through the feed as soon as PostgreSQL delivers the notification).

const students = (auth: { Authorization: string }) => api.get('/api/coach/students').set(auth);

describe('signed-in user cache', () => {
  it('is in use: a change that skipped the change feed is not seen within the cache’s lifetime', async () => {
    await feedUp();
    const coach = await createUser('coach');
    expect((await students(coach.auth)).status).toBe(200); // cached now
    // The same demotion with the feed's trigger switched off: nobody tells the process.
    await elsewhere(`BEGIN; ALTER TABLE users DISABLE TRIGGER users_notify_change; UPDATE users SET role = 'bowler' WHERE id = ${coach.user.id};
      ALTER TABLE users ENABLE TRIGGER users_notify_change; COMMIT`);
    expect((await students(coach.auth)).status).toBe(200);
    // Any later change of the row reaches it through the feed.
    await elsewhere('UPDATE users SET updated_at = now() WHERE id = $1', [coach.user.id]);
    expect((await students(coach.auth)).status).toBe(403);
  });

  it('refuses a demoted coach on the next request (role changed through the API)', async () => {
    await feedUp();
    const admin = await createUser('admin');
    const coach = await createUser('coach');
    expect((await students(coach.auth)).status).toBe(200);
    expect((await students(coach.auth)).status).toBe(200);
    const demoted = await api.patch(`/api/admin/users/${coach.user.id}/role`).set(admin.auth).send({ role: 'bowler' });
    expect(demoted.status).toBe(200);
    expect((await students(coach.auth)).status).toBe(403);
    const me = await api.get('/api/auth/me').set(coach.auth);
    expect(me.body.user.role).toBe('bowler');
  });

  it('refuses a demoted coach on the next request (role changed by another process)', async () => {
    await feedUp();
    const coach = await createUser('coach');
    expect((await students(coach.auth)).status).toBe(200);
    await elsewhere("UPDATE users SET role = 'bowler' WHERE id = $1", [coach.user.id]);
    expect((await students(coach.auth)).status).toBe(403);
  });

  it('refuses a token of an older version on the next request (a password reset elsewhere ends every session)', async () => {
    await feedUp();
    const { user, auth } = await createUser('bowler');
    expect((await api.get('/api/auth/me').set(auth)).status).toBe(200);
    await elsewhere('UPDATE users SET token_version = token_version + 1 WHERE id = $1', [user.id]);
    expect((await api.get('/api/auth/me').set(auth)).status).toBe(401);
  });

  it('shows a new ball in the arsenal list at once, and drops a ball another process deleted', async () => {
    await feedUp();
    const { auth } = await createUser('bowler');
    const name = uniqueMarker('Cached list');
    const list = async () =>
      (await api.get('/api/arsenal').query({ q: name }).set(auth)).body as {
        items: { id: number; name: string; nickname: string | null }[];
        total: number;
      };
    expect((await list()).total).toBe(0);
    const created = await api.post('/api/arsenal').set(auth).send({
      name,
      weightLb: 15,
      rg: 2.5,
      differential: 0.04,
      intermediateDifferential: 0,
      coverType: 'reactive-solid',
      coreType: 'symmetric',
      surfaceGrit: 2000,
      polished: false,
    });
    expect(created.status).toBe(201);
    const after = await list();
    expect(after.total).toBe(1);
    expect(after.items.map((b) => b.id)).toEqual([created.body.item.id]);
    // The page is cached: a change that skipped the feed is not seen …
    await elsewhere(`BEGIN; ALTER TABLE balls DISABLE TRIGGER balls_notify_change; UPDATE balls SET nickname = 'Unheard' WHERE id = ${Number(created.body.item.id)};
      ALTER TABLE balls ENABLE TRIGGER balls_notify_change; COMMIT`);
    expect((await list()).items[0]).not.toHaveProperty('nickname', 'Unheard');
    // … and one that goes through it is, on the next request.
    await elsewhere('UPDATE balls SET deleted_at = now() WHERE id = $1', [created.body.item.id]);
    expect((await list()).total).toBe(0);
  });
});
