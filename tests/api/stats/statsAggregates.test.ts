import { describe, expect, it } from 'vitest';
import { QueryTypes } from 'sequelize';
import { recentShotsSuffice, shotStats, statsBy, suggestMoves, type HitKind } from '../../../engine/index';
import { aggregatesRepository } from '../../../server/features/stats/aggregates.repository';
import { CALIBRATION_SHOTS_PER_BALL, observationsOf } from '../../../server/features/stats/calibration.service';
import { bowlerOf } from '../../../server/features/stats/engineInput.service';
import { RECENT_SHOTS } from '../../../server/features/stats/stats.service';
import { arsenalRepository } from '../../../server/features/arsenal/arsenal.repository';
import { sessionsRepository, shotBallName, toShotRecord } from '../../../server/features/sessions/sessions.repository';
import { sequelize } from '../../../server/models/index';
import { mulberry32 } from '../../../shared/random';
import { api, createUser } from '../../helpers/api';
import { createBall, createPattern, POLISHED_PEARL, SHORT_LIGHT } from '../../helpers/fixtures';
import { expandGame, logGame, randomGame } from '../sessions/shotlog';

type Filter = { from?: string; to?: string; ballId?: number; patternId?: number };

/**
 * The statistics page as computed from the raw shots (every filtered shot replayed: shotStats, statsBy, suggestMoves),
 * the reference the kept counts must reproduce exactly.
 */
async function fromRawShots(bowlerId: number, f: Filter) {
  const rows = await sessionsRepository.shotsForStats(bowlerId, f);
  const records = rows.map((r) => toShotRecord(r, r.date!));
  const { hand } = await bowlerOf(bowlerId);
  const names = new Map(rows.map((r) => [String(r.ball_id), shotBallName(r)]));
  const dates = new Map(rows.map((r) => [String(r.session_id), r.date!]));
  return {
    overall: shotStats(records),
    byBall: statsBy(records, 'ballId').map((g) => ({ ballId: Number(g.key), name: names.get(g.key), stats: g.stats })),
    bySurface: statsBy(records, ['ballId', 'surfaceKey']).map((g) => ({
      ballId: Number(g.keys.ballId),
      name: names.get(g.keys.ballId!),
      surfaceKey: g.keys.surfaceKey,
      stats: g.stats,
    })),
    trend: statsBy(records, 'sessionId')
      .map((g) => ({
        sessionId: Number(g.key),
        date: dates.get(g.key),
        games: g.stats.games,
        average: g.stats.average,
        strikePct: g.stats.strike.pct,
        sparePct: g.stats.spare.pct,
      }))
      .sort((a, b) => a.date!.localeCompare(b.date!) || a.sessionId - b.sessionId),
    moves: suggestMoves({ shots: records, hand }),
  };
}

/**
 * A season written straight into the database (as a script or a restore would: the triggers mark its games): 30
 * sessions of three random games on two patterns, first balls with a strike ball (changed halfway), most spares with a
 * spare ball (so frames mix balls), the strike ball resurfaced now and then, lines held for a while and moved, hits and
 * breakpoints recorded on most first balls, a game left unfinished.
 */
async function season() {
  const me = await createUser();
  const [p1, p2] = [await createPattern(null), await createPattern(null, SHORT_LIGHT)];
  const strike = await createBall(me.user.id, undefined, { surfaceGrit: 2000, polished: false });
  const second = await createBall(me.user.id);
  const spare = await createBall(me.user.id, POLISHED_PEARL);
  const rand = mulberry32(20261230);
  const hits: (HitKind | null)[] = ['pocket', 'pocket', 'high', 'high', 'light', 'brooklyn', 'miss', null];
  const shots: Record<string, unknown>[] = [];
  let feet = 20;
  for (let si = 0; si < 30; si++) {
    const date = `2026-${String(9 + Math.floor(si / 10)).padStart(2, '0')}-${String(1 + (si % 10) * 2).padStart(2, '0')}`;
    const [{ id }] = await sequelize.query<{ id: number }>(
      `INSERT INTO sessions (user_id, date, kind, pattern_id, notes, version, created_at, updated_at)
       VALUES (:userId, :date, 'practice', :patternId, '', 0, now(), now()) RETURNING id`,
      { type: QueryTypes.SELECT, replacements: { userId: me.user.id, date, patternId: si % 3 === 2 ? p2.id : p1.id } },
    );
    const grit = si % 7 < 4 ? 2000 : 3000;
    for (let g = 1; g <= 3; g++) {
      let { deliveries } = expandGame(randomGame(si * 10 + g));
      if (si === 29 && g === 3) deliveries = deliveries.slice(0, 7);
      for (const d of deliveries) {
        if (rand() < 0.15) feet = Math.min(30, Math.max(10, feet + (rand() < 0.5 ? 2 : -2)));
        const firstBall = d.delivery === 1 || (d.frame === 10 && rand() < 0.5);
        const ball = firstBall ? (si < 15 ? strike : second) : rand() < 0.7 ? spare : si < 15 ? strike : second;
        const grit0 = ball.id === strike.id ? grit : ball.surfaceGrit;
        shots.push({
          session_id: id,
          game_number: g,
          frame: d.frame,
          delivery: d.delivery,
          ball_id: ball.id,
          surface_grit: grit0,
          surface_polished: ball.polished,
          surface_key: `${grit0} grit${ball.polished ? ' polished' : ''}`,
          feet_board: d.delivery === 1 ? feet : null,
          target_board: d.delivery === 1 ? 10 + Math.round(feet / 4) : null,
          breakpoint_board: d.delivery === 1 && rand() < 0.8 ? 5 + Math.floor(rand() * 6) : null,
          standing: d.standing,
          foul: false,
          hit: d.delivery === 1 ? hits[Math.floor(rand() * hits.length)] : null,
          key: `season-${id}-${g}-${d.frame}-${d.delivery}`,
        });
      }
    }
  }
  await sequelize.query(
    `INSERT INTO shots (session_id, game_number, frame, delivery, ball_id, surface_grit, surface_polished, surface_key, feet_board, target_board,
       breakpoint_board, standing, foul, hit, note, idempotency_key, request_hash, response, created_at, updated_at)
     SELECT r.session_id, r.game_number, r.frame, r.delivery, r.ball_id, r.surface_grit, r.surface_polished, r.surface_key, r.feet_board, r.target_board,
       r.breakpoint_board, ARRAY(SELECT jsonb_array_elements_text(r.standing)::int), r.foul, r.hit, '', r.key, '', '{}'::jsonb, now(), now()
     FROM jsonb_to_recordset(CAST(:rows AS jsonb)) AS r(session_id int, game_number int, frame int, delivery int, ball_id int, surface_grit int,
       surface_polished boolean, surface_key text, feet_board real, target_board real, breakpoint_board real, standing jsonb, foul boolean, hit text, key text)`,
    { replacements: { rows: JSON.stringify(shots) } },
  );
  return { me, p1, p2, strike, second, spare, shots: shots.length };
}

async function expectSameAsRaw(auth: { Authorization: string }, bowlerId: number, f: Filter) {
  const query = new URLSearchParams(Object.entries(f).map(([k, v]) => [k, String(v)])).toString();
  const res = await api.get(`/api/stats${query ? `?${query}` : ''}`).set(auth);
  expect(res.status).toBe(200);
  const { overall, byBall, bySurface, trend, moves } = res.body.item;
  const raw = await fromRawShots(bowlerId, f);
  expect({ overall, byBall, bySurface, trend, moves }).toEqual(raw);
  return res.body.item;
}

describe('GET /api/stats from the kept game counts', () => {
  it('gives exactly the figures of the raw shots for a season, under every filter, and after shots are logged, undone and deleted', async () => {
    const { me, p1, p2, strike, second, spare, shots } = await season();
    const all = await expectSameAsRaw(me.auth, me.user.id, {});
    expect(all.overall.shots).toBe(shots);
    expect(shots).toBeGreaterThan(RECENT_SHOTS); // the moves are read from the latest sessions, not the season
    expect(all.overall.completeGames).toBe(89);
    expect(all.moves.length).toBeGreaterThan(0);
    // … and those latest sessions sufficed: the season's moves came from them
    const { recent } = await aggregatesRepository.recentShots(me.user.id, {}, { limit: RECENT_SHOTS, calibration: null });
    expect(recent.length).toBeLessThan(shots);
    expect(recentShotsSuffice(recent.map((r) => toShotRecord(r, r.date!)))).toBe(true);
    // every game was counted by that first read
    const [{ n }] = await sequelize.query<{ n: number }>('SELECT count(*)::int AS n FROM shot_aggregate_changes WHERE user_id = :u', {
      type: QueryTypes.SELECT,
      replacements: { u: me.user.id },
    });
    expect(n).toBe(0);
    for (const f of [
      { ballId: strike.id },
      { ballId: spare.id },
      { ballId: second.id, from: '2026-10-05' },
      { from: '2026-09-10', to: '2026-10-11' },
      { patternId: p2.id },
      { patternId: p1.id, ballId: spare.id },
      { from: '2027-01-01' },
    ])
      await expectSameAsRaw(me.auth, me.user.id, f);

    // a game logged through the API, its last shot undone, a session deleted: the next read counts them again
    const [{ id: last }] = await sequelize.query<{ id: number }>(
      'SELECT id FROM sessions WHERE user_id = :u ORDER BY date DESC, id DESC LIMIT 1',
      { type: QueryTypes.SELECT, replacements: { u: me.user.id } },
    );
    await logGame(
      me.auth,
      last,
      4,
      randomGame(7),
      (d) => (d.delivery === 1 ? { feetBoard: 24, targetBoard: 12, hit: 'light' } : {}),
      (d) => (d.delivery === 1 ? second.id : spare.id),
    );
    const { body } = await api.get(`/api/sessions/${last}`).set(me.auth);
    const shotIds = (body.item.shots as { id: number }[]).map((s) => s.id);
    expect(shotIds.length).toBeGreaterThan(0);
    const undo = await api.delete(`/api/sessions/${last}/shots/${Math.max(...shotIds)}`).set(me.auth);
    expect(undo.status).toBeLessThan(300);
    const [{ id: early }] = await sequelize.query<{ id: number }>('SELECT id FROM sessions WHERE user_id = :u ORDER BY date, id LIMIT 1', {
      type: QueryTypes.SELECT,
      replacements: { u: me.user.id },
    });
    expect((await api.delete(`/api/sessions/${early}`).set(me.auth)).status).toBeLessThan(300);
    await expectSameAsRaw(me.auth, me.user.id, {});
    await expectSameAsRaw(me.auth, me.user.id, { ballId: second.id });
  });

  it('the calibration reads only the newest calibration shots of each ball, and observes exactly what every shot on the pattern gives', async () => {
    const { me, p1, p2 } = await season();
    for (const p of [p1, p2]) {
      const every = await sessionsRepository.shotsForStats(me.user.id, { patternId: p.id });
      const { calibration } = await aggregatesRepository.recentShots(
        me.user.id,
        {},
        {
          limit: 0,
          calibration: { patternId: p.id, perBall: CALIBRATION_SHOTS_PER_BALL },
        },
      );
      const ids = [...new Set(every.map((r) => r.ball_id))];
      const balls = new Map((await arsenalRepository.findOwnedManyEvenRemoved(me.user.id, ids)).map((b) => [b.id, b]));
      expect(calibration.length).toBeLessThan(every.length);
      expect(calibration.length).toBeLessThanOrEqual(CALIBRATION_SHOTS_PER_BALL * ids.length);
      const expected = observationsOf(every, balls);
      expect(expected.length).toBeGreaterThan(0);
      expect(observationsOf(calibration, balls)).toEqual(expected);
      const alone = await aggregatesRepository.calibrationShots(me.user.id, p.id, CALIBRATION_SHOTS_PER_BALL);
      expect(observationsOf(alone, balls)).toEqual(expected);
    }
  });
});
