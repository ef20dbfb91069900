import crypto from 'node:crypto';
import { Op, QueryTypes, type Transaction } from 'sequelize';
import { buildGame, CALIBRATION, LAYDOWN_OFFSET_BOARDS, simulateShot, surfaceWords } from '../engine/index';
import type { BallSpec, BowlerProfile as EngineBowler, LaneSurface, OilPattern } from '../engine/types';
import type { HitKind, LoggedDelivery } from '../engine/shotlog/types';
import { specAsThrown } from '../server/features/stats/calibration.service';
import { laneOf } from '../server/features/centers/centers.repository';
import { sessionsRepository } from '../server/features/sessions/sessions.repository';
import { requestCalibrationFit } from '../server/features/stats/calibrationJobs';
import { DEFAULT_LANE_SURFACE } from '../shared/centers';
import {
  Annotation,
  Ball,
  BowlerProfile,
  BowlingSession,
  Center,
  CoachLink,
  Condition,
  Plan,
  sequelize,
  Shot,
  SurfaceEvent,
  type User,
} from '../server/models/index';
import { mulberry32 as rng } from '../shared/random';

const DAY_MS = 24 * 60 * 60 * 1000;

interface Throw extends LoggedDelivery {
  feetBoard: number | null;
  targetBoard: number | null;
  breakpointBoard: number | null;
  hit: HitKind | null;
  strikeBall: boolean;
}

/**
 * Dana's "true" friction multiplier: the demo's breakpoints are what the ball-motion model predicts with it
 * (plus a bowler's half-board reading error), so the calibration has something real to recover.
 */
export const DEMO_FRICTION_SCALE = 1.15;

/** Leaves a right-hander sees after each kind of hit, and how often the hit carries (common practice, invented weights). */
const LEAVES: Record<Exclude<HitKind, 'miss'>, { strike: number; leaves: number[][] }> = {
  pocket: { strike: 0.55, leaves: [[10], [7], [8], [5]] },
  light: { strike: 0.25, leaves: [[10], [6, 10], [2, 4, 5, 8], [3, 6, 10], [4, 7, 10]] },
  high: {
    strike: 0.3,
    leaves: [
      [4, 7],
      [7, 10],
      [4, 6],
      [4, 6, 7, 10],
      [6, 7, 10],
    ],
  },
  brooklyn: {
    strike: 0.2,
    leaves: [
      [1, 2, 4, 7],
      [1, 2, 4],
      [8, 10],
    ],
  },
};

/** The hit a predicted entry board reads as (the bands fitCalibration reads hits with). */
function hitOf(entryBoard: number): Exclude<HitKind, 'miss'> {
  const b = CALIBRATION.hitEntryBoards;
  if (entryBoard < b.light[1]) return 'light';
  if (entryBoard < b.pocket[1]) return 'pocket';
  if (entryBoard < b.high[1]) return 'high';
  return 'brooklyn';
}

interface StrikeLine {
  spec: BallSpec;
  bowler: EngineBowler;
  pattern: OilPattern;
  lane: LaneSurface;
  laydownBoard: number;
  targetBoard: number;
}

/** One first ball at a full rack: the target missed by up to two boards, the motion from the model. */
function firstBall(rand: () => number, line: StrikeLine, game: number, frame: number, delivery: number): Throw {
  const miss = [-2, -1.5, -1, -0.5, 0, 0, 0.5, 1, 1.5, 2][Math.floor(rand() * 10)];
  const targetBoard = Math.min(39, Math.max(1, line.targetBoard + miss));
  const p = simulateShot({
    ball: line.spec,
    bowler: line.bowler,
    pattern: line.pattern,
    lane: line.lane,
    laydownBoard: line.laydownBoard,
    targetBoard,
    gamesBowled: game - 1,
    frictionScale: DEMO_FRICTION_SCALE,
  });
  const noise = rand() < 0.5 ? 0 : rand() < 0.5 ? -0.5 : 0.5;
  const hit = hitOf(p.entryBoard + noise);
  const kind = LEAVES[hit];
  const standing = rand() < kind.strike ? [] : kind.leaves[Math.floor(rand() * kind.leaves.length)];
  return {
    frame,
    delivery,
    standing: [...standing],
    hit,
    feetBoard: Math.round((line.laydownBoard + LAYDOWN_OFFSET_BOARDS) * 2) / 2,
    targetBoard,
    breakpointBoard: Math.round((p.breakpoint.board + noise) * 2) / 2,
    strikeBall: true,
  };
}

/** A spare attempt: usually made, a single pin more often than a split. */
function spareBall(rand: () => number, frame: number, delivery: number, before: number[]): Throw {
  const odds =
    before.length === 1 ? 0.85 : before.length === 2 && before.includes(7) && before.includes(10) ? 0.05 : before.length <= 2 ? 0.6 : 0.55;
  const standing = rand() < odds ? [] : before.filter((_, i) => i % 2 === 0);
  return { frame, delivery, standing, hit: null, feetBoard: null, targetBoard: null, breakpointBoard: null, strikeBall: false };
}

/** A complete, valid game (checked by buildGame). */
function demoGame(seed: number, line: StrikeLine, game: number): Throw[] {
  const rand = rng(seed);
  const out: Throw[] = [];
  for (let f = 1; f <= 9; f++) {
    const a = firstBall(rand, line, game, f, 1);
    out.push(a);
    if (a.standing.length) out.push(spareBall(rand, f, 2, a.standing));
  }
  const a = firstBall(rand, line, game, 10, 1);
  out.push(a);
  const b = a.standing.length ? spareBall(rand, 10, 2, a.standing) : firstBall(rand, line, game, 10, 2);
  out.push(b);
  if (b.standing.length === 0) out.push(firstBall(rand, line, game, 10, 3));
  else if (a.standing.length === 0) out.push(spareBall(rand, 10, 3, b.standing));
  buildGame(out);
  return out;
}

/** The ball's surface on a day, from its surface history. */
async function surfaceOn(ball: Ball, day: Date, transaction: Transaction): Promise<{ grit: number; polished: boolean }> {
  const e = await SurfaceEvent.findOne({
    where: { ballId: ball.id, at: { [Op.lte]: day } },
    order: [
      ['at', 'DESC'],
      ['id', 'DESC'],
    ],
    transaction,
  });
  return e ? { grit: e.toGrit, polished: e.toPolished } : { grit: ball.surfaceGrit, polished: ball.polished };
}

/** Dana's three practice sessions on the house condition, her link with the coach (a plan, an annotation), Lee's pending invitation. */
export async function seedSessions(users: Map<string, User>, transaction: Transaction): Promise<void> {
  const dana = users.get('dana@copperline.example')!;
  const lee = users.get('lee@copperline.example')!;
  const coach = users.get('coach@copperline.example')!;
  const center = (await Center.findOne({ where: { name: 'Copperline Bowl' }, transaction }))!;
  const condition = (await Condition.findOne({ where: { centerId: center.id }, order: [['publishedAt', 'DESC']], transaction }))!;
  const balls = await Ball.findAll({ where: { ownerId: dana.id }, transaction });
  const byName = new Map(balls.map((b) => [b.name, b]));
  const spare = byName.get('Clear Sky Spare')!;
  const plan = [
    { daysAgo: 20, strike: ['Thunderhead Talon', 'Crosswind Falchion'], notes: 'Fresh house shot. Big Red was still at 4000 then.' },
    { daysAgo: 9, strike: ['Thunderhead Talon', 'Skylark Arc'], notes: 'Back at 2000 on Big Red; the pearl for when the fronts dry up.' },
    { daysAgo: 3, strike: ['Thunderhead Talon', 'Deep Root'], notes: 'Working on the 10 pin with the spare ball.' },
  ];
  const prof = (await BowlerProfile.findByPk(dana.id, { transaction }))!;
  const bowler: EngineBowler = {
    hand: prof.hand,
    speedMph: prof.speedMph,
    revRpm: prof.revRpm,
    axisRotationDeg: prof.axisRotationDeg,
    axisTiltDeg: prof.axisTiltDeg,
    ...(prof.papRightIn != null ? { papRightIn: prof.papRightIn } : {}),
    ...(prof.papUpIn != null ? { papUpIn: prof.papUpIn } : {}),
  };
  const pattern: OilPattern = { name: condition.patternName, sweeps: condition.sweeps };
  const lane = laneOf(condition);
  let seed = 7;
  let latest: BowlingSession | null = null;
  for (const [si, p] of plan.entries()) {
    const day = new Date(Date.now() - p.daysAgo * DAY_MS);
    const s = await BowlingSession.create(
      {
        userId: dana.id,
        date: day.toISOString().slice(0, 10),
        kind: 'practice',
        centerId: center.id,
        conditionId: condition.id,
        patternId: condition.patternId,
        patternName: condition.patternName,
        notes: p.notes,
      },
      { transaction },
    );
    for (const [gi, ballName] of p.strike.entries()) {
      const strikeBall = byName.get(ballName)!;
      const surfaces = new Map<number, { grit: number; polished: boolean }>();
      for (const b of [strikeBall, spare]) surfaces.set(b.id, await surfaceOn(b, day, transaction));
      const rack = surfaces.get(strikeBall.id)!;
      // The ball as it was then (the spec the calibration reads these shots with), on the condition's lanes.
      const spec = specAsThrown(strikeBall, rack.grit, rack.polished);
      // Dana plays the line the pocket solver finds for this ball (with her true friction), at whole boards.
      const solved = simulateShot({ ball: spec, bowler, pattern, lane, gamesBowled: gi, frictionScale: DEMO_FRICTION_SCALE });
      const line: StrikeLine = {
        spec,
        bowler,
        pattern,
        lane,
        laydownBoard: Math.round(solved.laydownBoard),
        targetBoard: Math.round(solved.targetBoard),
      };
      const game = demoGame((seed += 11), line, gi + 1);
      const prior: LoggedDelivery[] = [];
      for (const t of game) {
        const ball = t.strikeBall ? strikeBall : spare;
        const surf = surfaces.get(ball.id)!;
        const delivery: LoggedDelivery = { frame: t.frame, delivery: t.delivery, standing: t.standing, foul: false };
        const row = await Shot.create(
          {
            sessionId: s.id,
            gameNumber: gi + 1,
            frame: t.frame,
            delivery: t.delivery,
            ballId: ball.id,
            surfaceGrit: surf.grit,
            surfacePolished: surf.polished,
            surfaceKey: surfaceWords(surf.grit, surf.polished),
            feetBoard: t.feetBoard,
            targetBoard: t.targetBoard,
            breakpointBoard: t.breakpointBoard,
            standing: [...t.standing].sort((a, b) => a - b),
            foul: false,
            hit: t.hit,
            note: '',
            idempotencyKey: `seed-${si}-${gi}-${t.frame}-${t.delivery}`,
            requestHash: crypto.createHash('sha256').update(`seed-${si}-${gi}-${t.frame}-${t.delivery}`).digest('hex'),
            createdAt: day,
            updatedAt: day,
          },
          { transaction },
        );
        prior.push(delivery);
        row.response = { item: await sessionsRepository.shotDto(row.id, transaction), game: { ...buildGame(prior), number: gi + 1 } };
        await row.save({ transaction });
      }
    }
    latest = s;
  }

  const accepted = new Date(Date.now() - 30 * DAY_MS);
  await CoachLink.create(
    {
      coachId: coach.id,
      studentId: dana.id,
      email: dana.email,
      status: 'active',
      acceptedAt: accepted,
      revokedAt: null,
      revokedBy: null,
      createdAt: new Date(accepted.getTime() - DAY_MS),
    },
    { transaction },
  );
  await CoachLink.create(
    { coachId: coach.id, studentId: lee.id, email: lee.email, status: 'pending', acceptedAt: null, revokedAt: null, revokedBy: null },
    { transaction },
  );
  const bigRed = byName.get('Thunderhead Talon')!;
  await Plan.create(
    {
      coachId: coach.id,
      studentId: dana.id,
      kind: 'surface',
      ballId: bigRed.id,
      title: 'Keep Big Red at 2000 for the house shot',
      body: 'Your light hits dropped after the move back to 2000 grit. Keep it there while the house shot is fresh; when the fronts dry up later in the evening, switch to the Skylark Arc rather than sanding again.\nLeave surface work to the pro shop: sanding makes fine dust and the cleaners are solvents, so wear a mask and gloves and work where the air moves.',
    },
    { transaction },
  );
  await Annotation.create(
    {
      sessionId: latest!.id,
      authorId: coach.id,
      gameNumber: 1,
      frame: 4,
      text: 'Good move two left with the feet here: the ball stopped going light and the 10 pin went away.',
    },
    { transaction },
  );
}

/**
 * Asks the job worker for the calibration fits of the seeded sessions (each bowler on each condition, or pattern on
 * the default lanes, with first balls that carry boards), as logging those shots through the API would have: the
 * demo's matchups and Stats then find them stored once the server has worked the queue for a few seconds.
 */
export async function requestDemoCalibrations(): Promise<number> {
  const rows = await sequelize.query<{ user_id: number; condition_id: number | null; pattern_id: number }>(
    `SELECT DISTINCT s.user_id, s.condition_id, s.pattern_id FROM sessions s JOIN shots t ON t.session_id = s.id
      WHERE s.pattern_id IS NOT NULL AND s.deleted_at IS NULL AND t.delivery = 1 AND t.feet_board IS NOT NULL AND t.target_board IS NOT NULL`,
    { type: QueryTypes.SELECT },
  );
  for (const r of rows) {
    await requestCalibrationFit(
      r.condition_id
        ? { bowlerId: r.user_id, conditionId: r.condition_id }
        : { bowlerId: r.user_id, patternId: r.pattern_id, lane: DEFAULT_LANE_SURFACE },
    );
  }
  return rows.length;
}
