import { describe, expect, it } from 'vitest';
import { DEFAULT_PROFILE } from '../../../shared/profile';
import { BowlerProfile } from '../../../server/models/index';
import { api, createUser, errorOf } from '../../helpers/api';

describe('/api/profile', () => {
  it('returns the typical starting values for a bowler who never saved one', async () => {
    const { auth } = await createUser();
    const res = await api.get('/api/profile').set(auth);
    expect(res.status).toBe(200);
    expect(res.body).toEqual({ profile: DEFAULT_PROFILE, saved: false });
  });

  it('saves the bowler parameters and returns them on the next read', async () => {
    const { user, auth } = await createUser();
    const body = {
      hand: 'left',
      speedMph: 15.5,
      revRpm: 420,
      axisRotationDeg: 60,
      axisTiltDeg: 20,
      papRightIn: 5.75,
      papUpIn: 0.5,
      units: 'metric',
    };
    const put = await api.put('/api/profile').set(auth).send(body);
    expect(put.status).toBe(200);
    expect(put.body.profile).toEqual(body);
    const row = await BowlerProfile.findByPk(user.id);
    expect(row).toMatchObject({ hand: 'left', revRpm: 420, units: 'metric' });
    const partial = await api.put('/api/profile').set(auth).send({ revRpm: 400 });
    expect(partial.body.profile).toEqual({ ...body, revRpm: 400 });
    expect((await api.get('/api/profile').set(auth)).body).toEqual({ profile: { ...body, revRpm: 400 }, saved: true });
  });

  it('refuses out-of-range and mistyped values with a message per field, keeping what was saved', async () => {
    const { user, auth } = await createUser();
    await api
      .put('/api/profile')
      .set(auth)
      .send({ ...DEFAULT_PROFILE, revRpm: 350 });
    const res = await api
      .put('/api/profile')
      .set(auth)
      .send({ speedMph: -3, revRpm: 'fast', hand: 'both', axisRotationDeg: 200, extra: 1 });
    expect(res.status).toBe(400);
    const fields = errorOf(res.body).fields ?? {};
    for (const f of ['body.speedMph', 'body.revRpm', 'body.hand', 'body.axisRotationDeg']) expect(fields).toHaveProperty([f]);
    expect((await BowlerProfile.findByPk(user.id))!.revRpm).toBe(350);
  });

  it('answers 401 without a token, and each bowler sees only their own profile', async () => {
    expect((await api.get('/api/profile')).status).toBe(401);
    const a = await createUser();
    const b = await createUser();
    await api
      .put('/api/profile')
      .set(a.auth)
      .send({ ...DEFAULT_PROFILE, revRpm: 500 });
    expect((await api.get('/api/profile').set(b.auth)).body.profile.revRpm).toBe(DEFAULT_PROFILE.revRpm);
  });
});
