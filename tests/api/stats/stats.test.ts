import { describe, expect, it } from 'vitest';
import { QueryTypes } from 'sequelize';
import { scoreGame } from '../../../engine/index';
import { calibrate, calibrationFor } from '../../../server/features/stats/calibration.service';
import { sequelize } from '../../../server/models/index';
import { api, calibrationsIdle, createUser, errorOf } from '../../helpers/api';
import { createBall, createCenter, createPattern, POLISHED_PEARL, SHORT_LIGHT } from '../../helpers/fixtures';
import { expandGame, linkRow, logGame, randomGame, SAMPLE_GAME } from '../sessions/shotlog';

interface Rate {
  hits: number;
  n: number;
  pct: number | null;
  low: number | null;
  high: number | null;
}

async function session(auth: { Authorization: string }, date: string, patternId?: number): Promise<number> {
  return (
    await api
      .post('/api/sessions')
      .set(auth)
      .send({ date, kind: 'practice', ...(patternId ? { patternId } : {}) })
  ).body.item.id as number;
}

/** Two sessions on a pattern: SAMPLE_GAME with one ball at 2000 grit, then the same ball at 4000 grit alternating with a second ball. */
async function loggedBowler() {
  const me = await createUser();
  const pattern = await createPattern(null);
  const solid = await createBall(me.user.id, undefined, { surfaceGrit: 2000, polished: false });
  const pearl = await createBall(me.user.id, POLISHED_PEARL);
  const s1 = await session(me.auth, '2026-11-10', pattern.id);
  await logGame(
    me.auth,
    s1,
    1,
    SAMPLE_GAME,
    (d) => (d.delivery === 1 ? { feetBoard: 20, targetBoard: 11, breakpointBoard: 7, hit: 'pocket' } : {}),
    solid.id,
  );
  await api.post(`/api/arsenal/${solid.id}/surface`).set(me.auth).send({ surfaceGrit: 4000, polished: false });
  const s2 = await session(me.auth, '2026-11-12', pattern.id);
  const second = randomGame(42);
  await logGame(
    me.auth,
    s2,
    1,
    second,
    () => ({}),
    (_d, i) => (i % 2 === 0 ? solid.id : pearl.id),
  );
  return {
    me,
    pattern,
    solid,
    pearl,
    s1,
    s2,
    totals: [scoreGame(expandGame(SAMPLE_GAME).rolls).total, scoreGame(expandGame(second).rolls).total],
    counts: [expandGame(SAMPLE_GAME).deliveries.length, expandGame(second).deliveries.length],
  };
}

describe('GET /api/stats', () => {
  it('overall, per ball, per ball and surface (2000 vs 4000 grit side by side) and per session, with Wilson intervals', async () => {
    const { me, solid, pearl, s1, s2, totals, counts } = await loggedBowler();
    const res = await api.get('/api/stats').set(me.auth);
    expect(res.status).toBe(200);
    const { overall, byBall, bySurface, trend, moves } = res.body.item;
    expect(overall.shots).toBe(counts[0] + counts[1]);
    expect(overall.games).toBe(2);
    expect(overall.average).toBeCloseTo((totals[0] + totals[1]) / 2, 9);
    for (const r of [overall.strike, overall.spare] as Rate[]) {
      expect(r.n).toBeGreaterThan(0);
      expect(r.low!).toBeLessThanOrEqual(r.pct!);
      expect(r.high!).toBeGreaterThanOrEqual(r.pct!);
    }
    expect(byBall.map((b: { ballId: number }) => b.ballId).sort()).toEqual([solid.id, pearl.id].sort());
    expect(byBall.reduce((n: number, b: { stats: { shots: number } }) => n + b.stats.shots, 0)).toBe(overall.shots);
    expect(byBall.find((b: { ballId: number }) => b.ballId === solid.id).name).toBe(solid.name);
    const solidSurfaces = bySurface.filter((b: { ballId: number }) => b.ballId === solid.id);
    expect(solidSurfaces.map((b: { surfaceKey: string }) => b.surfaceKey).sort()).toEqual(['2000 grit', '4000 grit']);
    expect(solidSurfaces.find((b: { surfaceKey: string }) => b.surfaceKey === '2000 grit').stats.shots).toBe(counts[0]);
    expect(trend).toEqual([
      expect.objectContaining({ sessionId: s1, date: '2026-11-10', games: 1, average: totals[0] }),
      expect.objectContaining({ sessionId: s2, date: '2026-11-12', games: 1, average: totals[1] }),
    ]);
    expect(Array.isArray(moves)).toBe(true);
  });

  it('strike, spare, single/multi-pin spare and split conversion of a known game (counted by hand from the scoresheet rules)', async () => {
    const me = await createUser();
    const ball = await createBall(me.user.id);
    const sid = await session(me.auth, '2026-11-15');
    await logGame(me.auth, sid, 1, SAMPLE_GAME, () => ({}), ball.id);
    const { overall } = (await api.get('/api/stats').set(me.auth)).body.item;
    // First balls at a full rack: frames 1–9 plus the tenth's first two = 11; strikes in 1, 4, 5 and 10 = 4.
    expect(overall.strike).toMatchObject({ hits: 4, n: 11 });
    expect(overall.strike.pct).toBeCloseTo((4 / 11) * 100, 6);
    // Second balls: frames 2, 3, 6, 7, 8, 9 and the tenth's third = 7; spares in 2, 6, 9 and 10 = 4.
    expect(overall.spare).toMatchObject({ hits: 4, n: 7 });
    expect(overall.singlePinSpare).toMatchObject({ hits: 1, n: 2 }); // the 10 (made), the 6 (missed)
    expect(overall.multiPinSpare).toMatchObject({ hits: 3, n: 5 });
    expect(overall.splitConversion).toMatchObject({ hits: 0, n: 1 }); // the 7-10
    expect(overall.average).toBe(scoreGame(expandGame(SAMPLE_GAME).rolls).total);
  });

  it('filters by date, ball and pattern; deleted sessions are left out', async () => {
    const { me, pattern, pearl, s1, counts } = await loggedBowler();
    const later = await api.get('/api/stats?from=2026-11-11&to=2026-11-30').set(me.auth);
    expect(later.body.item.overall.shots).toBe(counts[1]);
    expect(later.body.item.trend).toHaveLength(1);
    const onePearl = await api.get(`/api/stats?ballId=${pearl.id}`).set(me.auth);
    expect(onePearl.body.item.byBall.map((b: { ballId: number }) => b.ballId)).toEqual([pearl.id]);
    expect(onePearl.body.item.overall.shots).toBe(Math.floor(counts[1] / 2));
    const other = await createPattern(null, SHORT_LIGHT);
    expect((await api.get(`/api/stats?patternId=${other.id}`).set(me.auth)).body.item.overall.shots).toBe(0);
    expect((await api.get(`/api/stats?patternId=${pattern.id}`).set(me.auth)).body.item.overall.shots).toBe(counts[0] + counts[1]);
    await api.delete(`/api/sessions/${s1}`).set(me.auth);
    expect((await api.get('/api/stats').set(me.auth)).body.item.overall.shots).toBe(counts[1]);
    const bad = await api.get('/api/stats?ballId=x&from=1-2-3').set(me.auth);
    expect(bad.status).toBe(400);
    expect(Object.keys(errorOf(bad.body).fields ?? {}).sort()).toEqual(['query.ballId', 'query.from']);
    const backwards = await api.get('/api/stats?from=2026-11-30&to=2026-11-01').set(me.auth);
    expect(errorOf(backwards.body).fields).toHaveProperty(['query.to']);
  });

  it('an empty log answers empty statistics, not an error', async () => {
    const me = await createUser();
    const res = await api.get('/api/stats').set(me.auth);
    expect(res.status).toBe(200);
    expect(res.body.item).toMatchObject({
      overall: { shots: 0, games: 0, average: null },
      byBall: [],
      bySurface: [],
      trend: [],
      calibration: null,
    });
  });

  it('the owner and the linked coach read it; another bowler, an unlinked and a revoked coach get 404; anonymous 401', async () => {
    const owner = await createUser();
    const ball = await createBall(owner.user.id);
    await logGame(owner.auth, await session(owner.auth, '2026-11-20'), 1, SAMPLE_GAME, () => ({}), ball.id);
    const coach = await createUser('coach');
    const unlinked = await createUser('coach');
    const former = await createUser('coach');
    const other = await createUser();
    await linkRow(coach.user.id, owner.user);
    await linkRow(former.user.id, owner.user, 'revoked');
    const mine = await api.get('/api/stats').set(owner.auth);
    const asCoach = await api.get(`/api/stats?studentId=${owner.user.id}`).set(coach.auth);
    expect(asCoach.status).toBe(200);
    expect(asCoach.body.item.overall).toEqual(mine.body.item.overall);
    for (const who of [other, unlinked, former])
      expect((await api.get(`/api/stats?studentId=${owner.user.id}`).set(who.auth)).status).toBe(404);
    expect((await api.get('/api/stats')).status).toBe(401);
  });

  it('reads the shots in one query whatever the number of sessions (no query per session)', async () => {
    const count = async (sessions: number) => {
      const me = await createUser();
      const ball = await createBall(me.user.id);
      for (let i = 0; i < sessions; i++)
        await logGame(me.auth, await session(me.auth, `2026-11-0${i + 1}`), 1, randomGame(i), () => ({}), ball.id);
      const seen: string[] = [];
      // Every statement the request runs passes through Sequelize's logging hook.
      const options = (sequelize as unknown as { options: { logging: unknown } }).options;
      const logging = options.logging;
      options.logging = (sql: string) => void seen.push(sql);
      try {
        expect((await api.get('/api/stats').set(me.auth)).status).toBe(200);
      } finally {
        options.logging = logging;
      }
      return seen.filter((q) => /\bshots\b/.test(q)).length;
    };
    const one = await count(1);
    expect(one).toBeGreaterThan(0);
    expect(await count(4)).toBe(one);
  });
});

describe('GET /api/calibration', () => {
  it('fits from the logged first balls with boards on the pattern; patternId required; unknown pattern 404; an unlinked coach 404', async () => {
    const { me, pattern } = await loggedBowler();
    // The logged shots (and the resurfacing after them) queued fits; the job worker (in this test process) computes and stores them.
    await calibrationsIdle(me.user.id);
    const res = await api.get(`/api/calibration?patternId=${pattern.id}`).set(me.auth);
    expect(res.status).toBe(200);
    const cal = res.body.item;
    // SAMPLE_GAME's first deliveries (one per frame, with feet, target, breakpoint and hit) are usable; the second session has no boards.
    expect(cal.shots).toBe(expandGame(SAMPLE_GAME).deliveries.filter((d) => d.delivery === 1).length);
    expect(typeof cal.enough).toBe('boolean');
    expect(typeof cal.note).toBe('string');
    expect((await api.get('/api/calibration').set(me.auth)).status).toBe(400);
    expect((await api.get('/api/calibration?patternId=99999999').set(me.auth)).status).toBe(404);
    const stranger = await createUser('coach');
    expect((await api.get(`/api/calibration?patternId=${pattern.id}&studentId=${me.user.id}`).set(stranger.auth)).status).toBe(404);
    const coach = await createUser('coach');
    await linkRow(coach.user.id, me.user);
    expect((await api.get(`/api/calibration?patternId=${pattern.id}&studentId=${me.user.id}`).set(coach.auth)).body.item).toEqual(cal);
    expect((await api.get(`/api/calibration?patternId=${pattern.id}`)).status).toBe(401);
    // The stored fit is read, never recomputed on the request: the same input gives the same fit back, and no new job is queued.
    expect(await calibrationFor(me.user.id, pattern.id)).toEqual(cal);
    const [queued] = await sequelize.query<{ n: string }>(
      "SELECT count(*) AS n FROM pgboss.job WHERE name = 'calibration' AND state IN ('created', 'retry', 'active') AND data->>'bowlerId' = :bowler",
      { type: QueryTypes.SELECT, replacements: { bowler: String(me.user.id) } },
    );
    expect(Number(queued.n)).toBe(0);
    const input = {
      bowler: { hand: 'right' as const, speedMph: 17, revRpm: 300, axisRotationDeg: 45, axisTiltDeg: 15 },
      pattern: { name: pattern.name, sweeps: pattern.sweeps },
      observations: [],
    };
    expect(await calibrate(input)).toEqual(await calibrate({ ...input }));
    // Statistics carry the calibration of the latest session's pattern.
    const stats = await api.get('/api/stats').set(me.auth);
    expect(stats.body.item.calibration).toEqual(cal);
    expect(stats.body.item.calibrationPatternId).toBe(pattern.id);
  });
});

describe('GET /api/calibration on a lane surface or a published condition', () => {
  it('fits on the lanes asked for (surfaces and keptReachable per ball); a condition brings its own lanes; bad combinations are 400 by field, an unknown condition 404', async () => {
    const { me, pattern } = await loggedBowler();
    await calibrationsIdle(me.user.id);
    const plain = (await api.get(`/api/calibration?patternId=${pattern.id}`).set(me.auth)).body.item;
    for (const b of plain.perBall) {
      expect(Array.isArray(b.surfaces)).toBe(true);
      expect(typeof b.keptReachable).toBe('boolean');
    }
    expect(plain.perBall.flatMap((b: { surfaces: string[] }) => b.surfaces)).toContain('2000 grit');
    const same = (await api.get(`/api/calibration?patternId=${pattern.id}&laneKind=synthetic&laneFriction=medium`).set(me.auth)).body.item;
    expect(same).toEqual(plain);
    // Lanes not fitted before: the first answer counts the shots and says the fit is on its way; the worker stores it.
    const first = await api.get(`/api/calibration?patternId=${pattern.id}&laneFriction=high`).set(me.auth);
    expect(first.status).toBe(200);
    expect(first.body.item).toMatchObject({ shots: plain.shots, enough: false, perBall: [] });
    expect(first.body.item.note).toMatch(/being fitted/);
    await calibrationsIdle(me.user.id);
    const high = await api.get(`/api/calibration?patternId=${pattern.id}&laneFriction=high`).set(me.auth);
    expect(high.status).toBe(200);
    expect(high.body.item.shots).toBe(plain.shots);
    expect(high.body.item.perBall.map((b: { ballId: string }) => b.ballId).sort()).toEqual(
      plain.perBall.map((b: { ballId: string }) => b.ballId).sort(),
    );

    const owner = await createUser('proprietor');
    const center = await createCenter(owner.user.id, 4);
    const published = await api
      .post(`/api/centers/${center.id}/conditions`)
      .set(owner.auth)
      .send({
        patternId: pattern.id,
        lanes: [1],
        validFrom: new Date().toISOString().slice(0, 10),
        lane: { kind: 'synthetic', friction: 'high' },
      });
    const onCondition = await api.get(`/api/calibration?conditionId=${published.body.item.id}`).set(me.auth);
    expect(onCondition.status).toBe(200);
    expect(onCondition.body.item).toEqual(high.body.item);

    const bad = await api.get(`/api/calibration?patternId=${pattern.id}&laneKind=carpet&laneFriction=sticky`).set(me.auth);
    expect(bad.status).toBe(400);
    expect(Object.keys(errorOf(bad.body).fields ?? {}).sort()).toEqual(['query.laneFriction', 'query.laneKind']);
    const both = await api.get(`/api/calibration?patternId=${pattern.id}&conditionId=${published.body.item.id}`).set(me.auth);
    expect(Object.keys(errorOf(both.body).fields ?? {})).toEqual(['query.conditionId']);
    const laneBeside = await api.get(`/api/calibration?conditionId=${published.body.item.id}&laneKind=wood`).set(me.auth);
    expect(Object.keys(errorOf(laneBeside.body).fields ?? {})).toEqual(['query.laneKind']);
    expect((await api.get('/api/calibration?conditionId=99999999').set(me.auth)).status).toBe(404);
  });
});
