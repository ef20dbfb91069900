import { describe, expect, it } from 'vitest';
import { api, createUser, errorOf } from '../../helpers/api';
import { createBall, createPattern, LONG_HEAVY, PLASTIC, POLISHED_PEARL, SHORT_LIGHT, STRONG_SOLID, URETHANE } from '../../helpers/fixtures';

interface Ranking { ballId: number; score: number; reasons: { source: string }[]; suggestions: unknown[] }

describe('POST /api/matchups', () => {
  it('ranks my active balls with reasons and sources, and the order differs between a long heavy and a short light pattern', async () => {
    const me = await createUser();
    const solid = await createBall(me.user.id, STRONG_SOLID, { surfaceGrit: 1000, polished: false });
    const pearl = await createBall(me.user.id, POLISHED_PEARL);
    const ure = await createBall(me.user.id, URETHANE);
    const spare = await createBall(me.user.id, PLASTIC);
    await createBall(me.user.id, STRONG_SOLID, { status: 'retired' });
    const heavy = await createPattern(null, LONG_HEAVY);
    const short = await createPattern(null, SHORT_LIGHT);

    const onHeavy = await api.post('/api/matchups').set(me.auth).send({ patternId: heavy.id });
    expect(onHeavy.status).toBe(200);
    expect(onHeavy.body.pattern).toMatchObject({ id: heavy.id, name: heavy.name, summary: { lengthClass: 'long', volumeClass: 'heavy' } });
    const heavyOrder = onHeavy.body.rankings.map((r: Ranking) => r.ballId);
    expect(heavyOrder.sort()).toEqual([solid.id, pearl.id, ure.id, spare.id].sort());
    for (const r of onHeavy.body.rankings as Ranking[]) {
      expect(r.score).toBeGreaterThanOrEqual(0);
      expect(r.score).toBeLessThanOrEqual(100);
      expect(r.reasons.length).toBeGreaterThan(0);
      expect(r.reasons.every((x) => typeof x.source === 'string' && x.source.length > 0)).toBe(true);
    }
    // Directional rule (common practice, TRADE.md 7.2): on long heavy oil the strong rough solid leads; plastic is never first for strikes.
    expect(onHeavy.body.rankings[0].ballId).toBe(solid.id);
    expect(onHeavy.body.rankings.at(-1).ballId).toBe(spare.id);

    const onShort = await api.post('/api/matchups').set(me.auth).send({ patternId: short.id });
    expect(onShort.status).toBe(200);
    const shortOrder = onShort.body.rankings.map((r: Ranking) => r.ballId);
    expect(shortOrder).not.toEqual(onHeavy.body.rankings.map((r: Ranking) => r.ballId));
    expect(shortOrder.indexOf(solid.id)).toBeGreaterThan(shortOrder.indexOf(ure.id));
  });

  it('ranks only the chosen balls, and refuses another bowler’s ball with 404', async () => {
    const me = await createUser();
    const other = await createUser();
    const a = await createBall(me.user.id);
    await createBall(me.user.id, URETHANE);
    const theirs = await createBall(other.user.id);
    const p = await createPattern(null);
    const chosen = await api.post('/api/matchups').set(me.auth).send({ patternId: p.id, ballIds: [a.id] });
    expect(chosen.body.rankings.map((r: Ranking) => r.ballId)).toEqual([a.id]);
    const stolen = await api.post('/api/matchups').set(me.auth).send({ patternId: p.id, ballIds: [theirs.id] });
    expect(stolen.status).toBe(404);
  });

  it('answers 404 for an unknown pattern, 400 for a malformed id, 401 without sign-in', async () => {
    const me = await createUser();
    expect((await api.post('/api/matchups').set(me.auth).send({ patternId: 99999999 })).status).toBe(404);
    const bad = await api.post('/api/matchups').set(me.auth).send({ patternId: 'not-a-pattern', gamesBowled: -2 });
    expect(bad.status).toBe(400);
    expect(Object.keys(errorOf(bad.body).fields ?? {}).sort()).toEqual(['body.gamesBowled', 'body.patternId']);
    expect((await api.post('/api/matchups').send({ patternId: 1 })).status).toBe(401);
  });

  it('answers an empty ranking for an empty arsenal', async () => {
    const me = await createUser();
    const p = await createPattern(null);
    const res = await api.post('/api/matchups').set(me.auth).send({ patternId: p.id });
    expect(res.status).toBe(200);
    expect(res.body.rankings).toEqual([]);
  });
});
