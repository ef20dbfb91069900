import { createHash } from 'node:crypto';
import { LRUCache } from 'lru-cache';
import { Op } from 'sequelize';
import { fitCalibration, shotStats, statsBy, suggestMoves } from '../../../engine/index';
import type { Calibration, CalibrationObservation, ShotRecord } from '../../../engine/shotlog/types';
import type { BowlerProfile, OilPattern } from '../../../engine/types';
import { ballToSpec } from '../../../shared/balls';
import type { StatsQuery, StatsResult } from '../../../shared/sessions';
import type { AuthUser } from '../../middleware/auth';
import { AppError } from '../../lib/AppError';
import { calibrateInWorker } from '../../lib/enginePool';
import { Ball } from '../../models/index';
import { readableBowlerId } from '../coaching/coaching.access';
import { patternsService } from '../patterns/patterns.service';
import { profileService } from '../profile/profile.service';
import { sessionsRepository, toShotRecord, type ShotRow } from '../sessions/sessions.repository';

/**
 * Where the ball lands relative to where the bowler stands: a right-hander's ball is laid down a few boards
 * outside the slide foot (toward the hand-side gutter), so the laydown board is the feet board minus this.
 * Source: common coaching practice (from memory: "the ball lays down about 5–7 boards outside the slide foot");
 * the calibration fits the friction scale on top of it.
 */
export const LAYDOWN_OFFSET_BOARDS = 6;

export async function bowlerOf(userId: number): Promise<BowlerProfile> {
  const { profile } = await profileService.get(userId);
  return {
    hand: profile.hand,
    speedMph: profile.speedMph,
    revRpm: profile.revRpm,
    axisRotationDeg: profile.axisRotationDeg,
    axisTiltDeg: profile.axisTiltDeg,
    ...(profile.papRightIn != null ? { papRightIn: profile.papRightIn } : {}),
    ...(profile.papUpIn != null ? { papUpIn: profile.papUpIn } : {}),
  };
}

/**
 * At most this many of a ball's most recent usable shots go into its fit: they describe the bowler's game as it
 * is now, and the fit costs about 25 ms of model deliveries per shot (measured: 12 shots 0.4 s, 40 shots 1.1 s
 * on this machine), so a ball's fit stays under a second. Lanewright's choice (the engine needs 12 per ball).
 */
export const CALIBRATION_SHOTS_PER_BALL = 30;

/**
 * The logged first balls that say something about the ball's motion: thrown at a full rack from a known
 * feet board at a known target, with the breakpoint board or the pocket result recorded. The ball is taken
 * with the surface it had when the shot was thrown.
 */
export function observationsOf(rows: ShotRow[], balls: Map<number, Ball>): CalibrationObservation[] {
  const out: CalibrationObservation[] = [];
  const perBall = new Map<number, number>();
  // Newest first, so each ball keeps its most recent shots.
  for (const r of [...rows].reverse()) {
    if (r.delivery !== 1 || r.feet_board == null || r.target_board == null) continue;
    if (r.breakpoint_board == null && r.hit == null) continue;
    const b = balls.get(r.ball_id);
    if (!b || (perBall.get(b.id) ?? 0) >= CALIBRATION_SHOTS_PER_BALL) continue;
    perBall.set(b.id, (perBall.get(b.id) ?? 0) + 1);
    out.push({
      ball: { id: String(b.id), ...ballToSpec({ ...b.get({ plain: true }), surfaceGrit: r.surface_grit ?? b.surfaceGrit, polished: r.surface_polished ?? b.polished }) },
      laydownBoard: Math.max(1, r.feet_board - LAYDOWN_OFFSET_BOARDS),
      targetBoard: r.target_board,
      breakpointBoard: r.breakpoint_board,
      hit: r.hit,
      gamesBowled: r.game_number - 1,
    });
  }
  return out.reverse();
}

/** Fits are deterministic: cached by the exact input they came from (the shots, the balls as thrown, the release, the pattern). */
const calibrationCache = new LRUCache<string, Calibration>({ max: 200 });
/** Fits being computed, so simultaneous requests for the same input share one. */
const inFlight = new Map<string, Promise<Calibration>>();

export async function calibrate(input: { bowler: BowlerProfile; pattern: OilPattern; observations: CalibrationObservation[] }): Promise<Calibration> {
  const key = createHash('sha256').update(JSON.stringify(input)).digest('base64url');
  const hit = calibrationCache.get(key);
  if (hit) return hit;
  const running = inFlight.get(key);
  if (running) return running;
  // Nothing to fit is instant; a real fit runs in the engine worker pool, off the request thread.
  if (input.observations.length === 0) return fitCalibration(input);
  const job = calibrateInWorker(input).finally(() => inFlight.delete(key));
  inFlight.set(key, job);
  const result = await job;
  calibrationCache.set(key, result);
  return result;
}

/** The bowler's calibration on a pattern from every logged shot on it. */
export async function calibrationFor(bowlerId: number, patternId: number, known: { rows?: ShotRow[]; pattern?: OilPattern; bowler?: BowlerProfile } = {}): Promise<Calibration> {
  const pattern = known.pattern ?? (await patternsService.engineInput(patternId)).pattern;
  const shots = known.rows ?? (await sessionsRepository.shotsForStats(bowlerId, { patternId }));
  const ids = [...new Set(shots.map((r) => r.ball_id))];
  const balls = new Map((ids.length ? await Ball.findAll({ where: { ownerId: bowlerId, id: { [Op.in]: ids } }, paranoid: false }) : []).map((b) => [b.id, b]));
  return calibrate({ bowler: known.bowler ?? (await bowlerOf(bowlerId)), pattern, observations: observationsOf(shots, balls) });
}

export const statsService = {
  /** Statistics over the filtered shots (one query for all sessions), per ball, per ball and surface, per session, with moves and the calibration. */
  async stats(user: AuthUser, q: StatsQuery): Promise<StatsResult> {
    const bowlerId = await readableBowlerId(user, q.studentId);
    const rows = await sessionsRepository.shotsForStats(bowlerId, q);
    const records: ShotRecord[] = rows.map((r) => toShotRecord(r, r.date!));
    const names = new Map(rows.map((r) => [String(r.ball_id), r.ball_name]));
    const dates = new Map(rows.map((r) => [String(r.session_id), r.date!]));
    const { hand } = await bowlerOf(bowlerId);
    const calibrationPatternId = q.patternId ?? (await sessionsRepository.latestPatternId(bowlerId));
    let calibration: Calibration | null = null;
    if (calibrationPatternId !== null) {
      try {
        calibration = await calibrationFor(bowlerId, calibrationPatternId, q.patternId && !q.from && !q.to && !q.ballId ? { rows } : {});
      } catch (err) {
        if (!(err instanceof AppError)) throw err; // an unknown pattern simply has no calibration
      }
    }
    return {
      overall: shotStats(records),
      byBall: statsBy(records, 'ballId').map((g) => ({ ballId: Number(g.key), name: names.get(g.key) ?? '', stats: g.stats })),
      // Grouped within each full game, so a spare thrown with another ball keeps its leave.
      bySurface: statsBy(records, ['ballId', 'surfaceKey']).map((g) => ({ ballId: Number(g.keys.ballId), name: names.get(g.keys.ballId!) ?? '', surfaceKey: g.keys.surfaceKey!, stats: g.stats })),
      trend: statsBy(records, 'sessionId')
        .map((g) => ({ sessionId: Number(g.key), date: dates.get(g.key)!, games: g.stats.games, average: g.stats.average, strikePct: g.stats.strike.pct, sparePct: g.stats.spare.pct }))
        .sort((a, b) => a.date.localeCompare(b.date) || a.sessionId - b.sessionId),
      moves: suggestMoves({ shots: records, hand }),
      calibration,
      calibrationPatternId,
    };
  },

  async calibration(user: AuthUser, q: { patternId: number; studentId?: number }): Promise<Calibration> {
    const bowlerId = await readableBowlerId(user, q.studentId);
    return calibrationFor(bowlerId, q.patternId);
  },
};
