import { describe, expect, it } from 'vitest';
import { differenceInterval } from '../../../engine/index';
import { api, createUser } from '../../helpers/api';
import { createBall } from '../../helpers/fixtures';
import { linkRow, logGame, type FrameLog } from './shotlog';

// Check values are hand counts of the frames below. The interval of the change is the hybrid score interval
// of a difference of two proportions (R. G. Newcombe, Statistics in Medicine 17 (1998) 873–890), checked
// against Newcombe's worked example in the engine's own tests.

const today = () => new Date().toISOString().slice(0, 10);
const X: number[][] = [[]];
const SPARED: number[][] = [[10], []];
const OPEN10: number[][] = [[10], [10]];

/**
 * Game 1, frames 1–8 on feet board 20, target 10: two pocket strikes, then six high hits (spared).
 * The bowler moves 2 left and 1 left (22 and 11) from frame 9 on: a pocket strike, an open tenth on a pocket
 * hit; game 2: eight pocket strikes, a light hit, an open tenth on a pocket hit.
 */
const GAME1: FrameLog[] = [X, X, SPARED, SPARED, SPARED, SPARED, SPARED, SPARED, X, OPEN10];
const HITS1 = ['pocket', 'pocket', 'high', 'high', 'high', 'high', 'high', 'high', 'pocket', 'pocket'];
const GAME2: FrameLog[] = [X, X, X, X, X, X, X, X, SPARED, OPEN10];
const HITS2 = ['pocket', 'pocket', 'pocket', 'pocket', 'pocket', 'pocket', 'pocket', 'pocket', 'light', 'pocket'];

describe('GET /api/sessions/:id followUps', () => {
  it('a move 2 left and 1 left after high hits: before 2 of 8 pocket, after 11 of 12 — it worked, by hand count', async () => {
    const me = await createUser();
    const coach = await createUser('coach');
    await linkRow(coach.user.id, me.user);
    const ball = await createBall(me.user.id);
    const sid = (await api.post('/api/sessions').set(me.auth).send({ date: today(), kind: 'practice' })).body.item.id as number;
    const line = (game: 1 | 2) => (d: { frame: number; delivery: number }) => {
      const moved = game === 2 || d.frame >= 9;
      const hits = game === 1 ? HITS1 : HITS2;
      return { feetBoard: moved ? 22 : 20, targetBoard: moved ? 11 : 10, ...(d.delivery === 1 ? { hit: hits[d.frame - 1] } : {}) };
    };
    await logGame(me.auth, sid, 1, GAME1, line(1), ball.id);
    await logGame(me.auth, sid, 2, GAME2, line(2), ball.id);

    const res = await api.get(`/api/sessions/${sid}`).set(me.auth);
    expect(res.status).toBe(200);
    const followUps = res.body.item.followUps;
    expect(followUps).toHaveLength(1);
    const [f] = followUps;
    expect(f).toMatchObject({
      at: { sessionId: String(sid), gameNumber: 1, frame: 9 },
      feet: { direction: 'left', boards: 2 },
      target: { direction: 'left', boards: 1 },
      before: { firstBalls: 8, pocket: { hits: 2, n: 8 }, strike: { hits: 2, n: 8 } },
      after: { firstBalls: 12, pocket: { hits: 11, n: 12 }, strike: { hits: 9, n: 12 } },
      judgedBy: 'pocket',
      verdict: 'better',
    });
    // 11/12 − 2/8 = 66.7 points; 9/12 − 2/8 = 50 points
    expect(f.pocketChange.diff).toBeCloseTo((100 * 2) / 3, 9);
    expect(f.strikeChange.diff).toBeCloseTo(50, 9);
    const d = differenceInterval({ hits: 11, n: 12 }, { hits: 2, n: 8 });
    expect(f.pocketChange.low).toBeCloseTo(100 * d.low, 9);
    expect(f.pocketChange.high).toBeCloseTo(100 * d.high, 9);
    expect(f.pocketChange.low).toBeGreaterThan(0);

    // the linked coach reads the same follow-up; another bowler cannot read the session
    const asCoach = await api.get(`/api/sessions/${sid}`).set(coach.auth);
    expect(asCoach.status).toBe(200);
    expect(asCoach.body.item.followUps).toEqual(followUps);
    const other = await createUser();
    expect((await api.get(`/api/sessions/${sid}`).set(other.auth)).status).toBe(404);
  });

  it('a session with no move has no follow-up', async () => {
    const me = await createUser();
    const ball = await createBall(me.user.id);
    const sid = (await api.post('/api/sessions').set(me.auth).send({ date: today(), kind: 'practice' })).body.item.id as number;
    await logGame(me.auth, sid, 1, GAME2, () => ({ feetBoard: 20, targetBoard: 10 }), ball.id);
    const res = await api.get(`/api/sessions/${sid}`).set(me.auth);
    expect(res.body.item.followUps).toEqual([]);
  });
});
