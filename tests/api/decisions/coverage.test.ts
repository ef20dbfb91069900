import { describe, expect, it } from 'vitest';
import { api, createUser, errorOf } from '../../helpers/api';
import type { Sweep } from '../../../engine/index';
import {
  createBall,
  createCenter,
  createModel,
  createPattern,
  POLISHED_PEARL,
  SHORT_LIGHT,
  STRONG_SOLID,
  URETHANE,
} from '../../helpers/fixtures';

const today = () => new Date().toISOString().slice(0, 10);
const sw = (fromBoard: number, toBoard: number, endFt: number, crossings: number, microlitersPerBoard: number): Sweep => ({
  direction: 'forward',
  fromBoard,
  toBoard,
  startFt: 0,
  endFt,
  crossings,
  microlitersPerBoard,
});
/** An invented medium-heavy league pattern, 44 ft. */
const LEAGUE_44: Sweep[] = [sw(2, 38, 44, 2, 55), sw(8, 32, 42, 4, 55), sw(14, 26, 40, 4, 55)];

describe('GET /api/coverage', () => {
  it('finds the planted gap: a bag of pearl and urethane has no ball for the followed center’s heavy league lanes, and a strong solid from the catalogue is suggested', async () => {
    const me = await createUser();
    const owner = await createUser('proprietor');
    const center = await createCenter(owner.user.id);
    const heavy = await createPattern(owner.user.id, LEAGUE_44, 'League heavy');
    const light = await createPattern(owner.user.id, SHORT_LIGHT, 'Open play short');
    await api
      .post(`/api/centers/${center.id}/conditions`)
      .set(owner.auth)
      .send({ patternId: heavy.id, lanes: Array.from({ length: 12 }, (_, i) => i + 1), validFrom: today() })
      .expect(201);
    await api
      .post(`/api/centers/${center.id}/conditions`)
      .set(owner.auth)
      .send({ patternId: light.id, lanes: Array.from({ length: 12 }, (_, i) => i + 13), validFrom: today() })
      .expect(201);
    await api.post(`/api/centers/${center.id}/follow`).set(me.auth).expect(200);
    await createBall(me.user.id, POLISHED_PEARL);
    await createBall(me.user.id, URETHANE);
    const solidModel = await createModel(STRONG_SOLID, 'Coverage Test Solid');

    const res = await api.get('/api/coverage').set(me.auth);
    expect(res.status).toBe(200);
    const { conditions, coverage } = res.body.item;
    expect(conditions.map((c: { lanes: number[] }) => c.lanes.length)).toEqual([12, 12]);
    const heavyId = conditions.find((c: { label: string }) => c.label.includes('League heavy')).id;
    const gap = coverage.gaps.find((g: { conditionId: string; gamesBowled: number }) => g.conditionId === heavyId && g.gamesBowled === 0);
    expect(gap).toBeDefined();
    expect(gap.need).toBe('more');
    expect(gap.suggestions.map((s: { id: string }) => s.id)).toContain(String(solidModel.id));
    expect(coverage.cells).toHaveLength(4);
  });

  it('with no followed center there is nothing to cover; a coach needs a link to read a student’s', async () => {
    const me = await createUser();
    const coach = await createUser('coach');
    const res = await api.get('/api/coverage').set(me.auth);
    expect(res.status).toBe(200);
    expect(res.body.item.coverage).toEqual({ cells: [], gaps: [], duplicates: [] });
    expect((await api.get(`/api/coverage?studentId=${me.user.id}`).set(coach.auth)).status).toBe(404);
    expect((await api.get('/api/coverage?studentId=abc').set(me.auth)).status).toBe(400);
  });
});

describe('POST /api/layout-lab', () => {
  it('draws and simulates two layouts of my ball on a pattern; pin-to-PAP as the pro shop writes it', async () => {
    const me = await createUser();
    const ball = await createBall(me.user.id);
    const pattern = await createPattern(null);
    const res = await api
      .post('/api/layout-lab')
      .set(me.auth)
      .send({
        ballId: ball.id,
        patternId: pattern.id,
        layouts: [
          { label: 'Pin near the PAP', pinToPapIn: '1 1/2' },
          { label: 'Pin at 4 3/8', pinToPapIn: '4 3/8', drillingAngleDeg: 50, valAngleDeg: 40 },
        ],
      });
    expect(res.status).toBe(200);
    const [near, far] = res.body.item.items;
    expect(far.layout.pinToPapIn).toBe(4.375);
    expect(Math.hypot(far.pin.x, far.pin.y)).toBeCloseTo(4.375, 6);
    expect(far.flareIn).toBeGreaterThan(near.flareIn);
    expect(far.rings.length).toBeGreaterThan(1);
    expect(far.prediction.path.length).toBeGreaterThan(50);
  });

  it('refuses another bowler’s ball, a bad pin-to-PAP and a missing condition, field by field', async () => {
    const me = await createUser();
    const other = await createUser();
    const theirs = await createBall(other.user.id);
    const mine = await createBall(me.user.id);
    const pattern = await createPattern(null);
    const foreign = await api
      .post('/api/layout-lab')
      .set(me.auth)
      .send({ ballId: theirs.id, patternId: pattern.id, layouts: [{ label: 'A', pinToPapIn: 4 }] });
    expect(foreign.status).toBe(400);
    expect(errorOf(foreign.body).fields).toEqual({ 'body.ballId': 'Not a ball in your arsenal' });
    const bad = await api
      .post('/api/layout-lab')
      .set(me.auth)
      .send({ ballId: mine.id, patternId: pattern.id, layouts: [{ label: 'A', pinToPapIn: 'four' }] });
    expect(bad.status).toBe(400);
    expect(Object.keys(errorOf(bad.body).fields ?? {})).toEqual(['body.layouts.0.pinToPapIn']);
    const none = await api
      .post('/api/layout-lab')
      .set(me.auth)
      .send({ ballId: mine.id, layouts: [{ label: 'A', pinToPapIn: 4 }] });
    expect(none.status).toBe(400);
    expect(errorOf(none.body).fields).toHaveProperty(['body.patternId']);
  });
});
