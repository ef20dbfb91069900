import { describe, expect, it } from 'vitest';
import { Shot } from '../../../server/models/index';
import { api, createUser, errorOf } from '../../helpers/api';
import { createBall } from '../../helpers/fixtures';
import { newKey } from './shotlog';

const today = () => new Date().toISOString().slice(0, 10);

describe('a shot’s own measured speed and rev rate', () => {
  it('are stored and answered when logged, left empty when not; out-of-range values are 400 naming the field', async () => {
    const me = await createUser();
    const ball = await createBall(me.user.id);
    const sid = (await api.post('/api/sessions').set(me.auth).send({ date: today(), kind: 'practice' })).body.item.id as number;
    const post = (body: Record<string, unknown>) =>
      api
        .post(`/api/sessions/${sid}/shots`)
        .set(me.auth)
        .set('Idempotency-Key', newKey())
        .send({ gameNumber: 1, ballId: ball.id, ...body });
    const measured = await post({ frame: 1, delivery: 1, standing: [], speedMph: 18.4, revRpm: 320 });
    expect(measured.status).toBe(201);
    expect(measured.body.item).toMatchObject({ speedMph: 18.4, revRpm: 320 });
    expect(await Shot.findByPk(measured.body.item.id)).toMatchObject({ speedMph: 18.4, revRpm: 320 });
    const plain = await post({ frame: 2, delivery: 1, standing: [] });
    expect(plain.body.item).toMatchObject({ speedMph: null, revRpm: null });

    const fast = await post({ frame: 3, delivery: 1, standing: [], speedMph: 41 });
    expect(fast.status).toBe(400);
    expect(errorOf(fast.body).fields!['body.speedMph']).toBe('Speed: 8 to 30 mph');
    const revs = await post({ frame: 3, delivery: 1, standing: [], revRpm: 350.5 });
    expect(errorOf(revs.body).fields!['body.revRpm']).toBe('Rev rate: whole rpm');
    const detail = await api.get(`/api/sessions/${sid}`).set(me.auth);
    expect(detail.body.item.shots.map((s: { speedMph: number | null }) => s.speedMph)).toEqual([18.4, null]);
  });
});
