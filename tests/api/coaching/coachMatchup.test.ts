import { describe, expect, it } from 'vitest';
import { simulateShot } from '../../../engine/index';
import type { BowlerProfile } from '../../../engine/types';
import { ballToSpec } from '../../../shared/balls';
import { DEFAULT_PROFILE } from '../../../shared/profile';
import { LAYDOWN_OFFSET_BOARDS } from '../../../engine/index';
import { api, calibrationsIdle, createUser } from '../../helpers/api';
import { createBall, createPattern, URETHANE } from '../../helpers/fixtures';
import { linkRow, newKey } from '../sessions/shotlog';

interface Ranking {
  ballId: number;
  frictionScale?: number;
  reasons: { rule: string }[];
}

describe('POST /api/matchups with studentId', () => {
  it('a linked coach ranks the student’s arsenal; an unlinked coach, a revoked one and another bowler get 404', async () => {
    const student = await createUser();
    const coach = await createUser('coach');
    const unlinked = await createUser('coach');
    const former = await createUser('coach');
    const other = await createUser();
    const a = await createBall(student.user.id);
    const b = await createBall(student.user.id, URETHANE);
    await createBall(coach.user.id);
    await linkRow(coach.user.id, student.user);
    await linkRow(former.user.id, student.user, 'revoked');
    const p = await createPattern(null);
    const res = await api.post('/api/matchups').set(coach.auth).send({ patternId: p.id, studentId: student.user.id });
    expect(res.status).toBe(200);
    expect(res.body.rankings.map((r: Ranking) => r.ballId).sort()).toEqual([a.id, b.id].sort());
    expect(res.body.calibration).toMatchObject({ applied: false, shots: 0 });
    for (const who of [unlinked, former, other])
      expect((await api.post('/api/matchups').set(who.auth).send({ patternId: p.id, studentId: student.user.id })).status).toBe(404);
    // My own id as studentId is simply my own matchup.
    expect((await api.post('/api/matchups').set(student.auth).send({ patternId: p.id, studentId: student.user.id })).status).toBe(200);
  });
});

describe('calibration from logged shots', () => {
  it('shots whose breakpoints follow the model with a known friction scale: the fit recovers it within 0.05, and matchups apply it and say so', async () => {
    // A scale clearly above 1 whose solved line leaves room on the lane for targets 2 boards either side (the
    // pocket-line solver plays board 1 on this pattern at scales from 0.95 to 1.3, where such targets are refused).
    const TRUE_SCALE = 1.4;
    const me = await createUser();
    const ball = await createBall(me.user.id);
    const pattern = await createPattern(null);
    const bowler: BowlerProfile = { ...DEFAULT_PROFILE, papRightIn: DEFAULT_PROFILE.papRightIn!, papUpIn: DEFAULT_PROFILE.papUpIn! };
    const spec = ballToSpec(ball);
    const solved = simulateShot({ ball: spec, bowler, pattern: { name: pattern.name, sweeps: pattern.sweeps }, frictionScale: TRUE_SCALE });
    const laydown = Math.round(solved.laydownBoard);
    expect(solved.targetBoard, 'the solved target leaves room for targets 2 boards either side').toBeGreaterThanOrEqual(3);
    expect(solved.targetBoard).toBeLessThanOrEqual(37);
    const before = await api.post('/api/matchups').set(me.auth).send({ patternId: pattern.id });
    expect(before.body.calibration).toMatchObject({ applied: false, shots: 0 });

    const sid = (await api.post('/api/sessions').set(me.auth).send({ date: '2026-11-25', kind: 'practice', patternId: pattern.id })).body
      .item.id;
    // A perfect game (twelve strikes) at targets around the solved one; breakpoints read to the half board from the model.
    const targets = [-2, -1.5, -1, -0.5, 0, 0.5, 1, 1.5, 2, -1, 0, 1].map((d) => Math.round(solved.targetBoard) + d);
    for (const [i, target] of targets.entries()) {
      const p = simulateShot({
        ball: spec,
        bowler,
        pattern: { name: pattern.name, sweeps: pattern.sweeps },
        laydownBoard: laydown,
        targetBoard: target,
        frictionScale: TRUE_SCALE,
      });
      const res = await api
        .post(`/api/sessions/${sid}/shots`)
        .set(me.auth)
        .set('Idempotency-Key', newKey())
        .send({
          gameNumber: 1,
          frame: i < 9 ? i + 1 : 10,
          delivery: i < 9 ? 1 : i - 8,
          ballId: ball.id,
          standing: [],
          feetBoard: laydown + LAYDOWN_OFFSET_BOARDS,
          targetBoard: target,
          breakpointBoard: Math.round(p.breakpoint.board * 2) / 2,
        });
      expect(res.status, JSON.stringify(res.body)).toBe(201);
    }
    // The fit is computed by the job worker after the shots are logged; readers get the stored fit.
    await calibrationsIdle(me.user.id);
    const cal = (await api.get(`/api/calibration?patternId=${pattern.id}`).set(me.auth)).body.item;
    // Only delivery-1 shots count: frames 1–10 → 10 shots, below the engine's 12: not yet enough.
    expect(cal).toMatchObject({ shots: 10, enough: false });
    // A second game brings the first balls to 20.
    for (let f = 1; f <= 10; f++) {
      const target = targets[f - 1];
      const p = simulateShot({
        ball: spec,
        bowler,
        pattern: { name: pattern.name, sweeps: pattern.sweeps },
        laydownBoard: laydown,
        targetBoard: target,
        frictionScale: TRUE_SCALE,
      });
      const res = await api
        .post(`/api/sessions/${sid}/shots`)
        .set(me.auth)
        .set('Idempotency-Key', newKey())
        .send({
          gameNumber: 2,
          frame: f,
          delivery: 1,
          ballId: ball.id,
          standing: [],
          feetBoard: laydown + LAYDOWN_OFFSET_BOARDS,
          targetBoard: target,
          breakpointBoard: Math.round(p.breakpoint.board * 2) / 2,
        });
      expect(res.status, JSON.stringify(res.body)).toBe(201);
    }
    await calibrationsIdle(me.user.id);
    const fitted = (await api.get(`/api/calibration?patternId=${pattern.id}`).set(me.auth)).body.item;
    expect(fitted).toMatchObject({ shots: 20, enough: true });
    const mine = fitted.perBall.find((b: { ballId: string }) => b.ballId === String(ball.id));
    // Tolerance: the breakpoints are read to the half board, so the scale is recovered to within 0.05.
    expect(Math.abs(mine.frictionScale - TRUE_SCALE)).toBeLessThanOrEqual(0.05);
    expect(mine.low).toBeLessThanOrEqual(mine.frictionScale);
    expect(mine.high).toBeGreaterThanOrEqual(mine.frictionScale);

    const after = await api.post('/api/matchups').set(me.auth).send({ patternId: pattern.id });
    expect(after.status).toBe(200);
    expect(after.body.calibration).toMatchObject({ applied: true, shots: 20 });
    expect(after.body.calibration.note.length).toBeGreaterThan(0);
    const ranked = after.body.rankings.find((r: Ranking) => r.ballId === ball.id);
    expect(ranked.frictionScale).toBeCloseTo(mine.frictionScale, 9);
    expect(ranked.reasons.map((r: { rule: string }) => r.rule)).toContain('motion-calibration');
  });
});
