import { createHash } from 'node:crypto';
import { Op, type Transaction } from 'sequelize';
import { CALIBRATION, fitCalibration, shotStats, statsBy, suggestMoves } from '../../../engine/index';
import type { Calibration, CalibrationObservation, ShotRecord } from '../../../engine/shotlog/types';
import type { BowlerProfile, LaneSurface, OilPattern } from '../../../engine/types';
import { ballToSpec } from '../../../shared/balls';
import type { StatsQuery, StatsResult } from '../../../shared/sessions';
import type { AuthUser } from '../../middleware/auth';
import { AppError } from '../../lib/AppError';
import { calibrateInWorker } from '../../lib/enginePool';
import { sendJob } from '../../lib/jobs';
import { calibrationFitSeconds } from '../../lib/metrics';
import { Ball, CalibrationFit } from '../../models/index';
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

type FitInput = { bowler: BowlerProfile; pattern: OilPattern; observations: CalibrationObservation[]; lane?: LaneSurface };

const inputHash = (input: FitInput) => createHash('sha256').update(JSON.stringify(input)).digest('hex');

/** A fit computed now, in the engine worker pool (nothing to fit is instant and stays on this thread). Used by the `calibration` job. */
export async function calibrate(input: FitInput): Promise<Calibration> {
  if (input.observations.length === 0) return fitCalibration(input);
  return calibrateInWorker(input);
}

/** The input of a bowler's fit on a pattern: their logged shots on it, the balls as thrown, the release, the pattern. */
async function fitInput(bowlerId: number, patternId: number, known: { rows?: ShotRow[]; pattern?: OilPattern; bowler?: BowlerProfile } = {}): Promise<FitInput> {
  const pattern = known.pattern ?? (await patternsService.engineInput(patternId)).pattern;
  const shots = known.rows ?? (await sessionsRepository.shotsForStats(bowlerId, { patternId }));
  const ids = [...new Set(shots.map((r) => r.ball_id))];
  const balls = new Map((ids.length ? await Ball.findAll({ where: { ownerId: bowlerId, id: { [Op.in]: ids } }, paranoid: false }) : []).map((b) => [b.id, b]));
  return { bowler: known.bowler ?? (await bowlerOf(bowlerId)), pattern, observations: observationsOf(shots, balls) };
}

/** Asks the worker for a fit of this bowler on this pattern (at most one queued per pair; it reads the newest shots when it runs). */
export async function requestCalibrationFit(bowlerId: number, patternId: number, transaction?: Transaction): Promise<void> {
  await sendJob('calibration', `${bowlerId}:${patternId}:${Date.now()}`, { bowlerId, patternId }, { transaction, singletonKey: `${bowlerId}:${patternId}` });
}

/** The `calibration` job: fits from the current input unless the stored fit already came from it, and stores it. */
export async function runCalibrationFit(bowlerId: number, patternId: number): Promise<'fitted' | 'current' | 'gone'> {
  let input: FitInput;
  try {
    input = await fitInput(bowlerId, patternId);
  } catch (err) {
    if (err instanceof AppError && err.status === 404) return 'gone'; // the pattern was deleted meanwhile
    throw err;
  }
  const hash = inputHash(input);
  const stored = await CalibrationFit.findOne({ where: { bowlerId, patternId }, useMaster: true });
  if (stored?.inputHash === hash) return 'current';
  const started = Date.now();
  const fit = await calibrate(input);
  const fitMs = Date.now() - started;
  await CalibrationFit.upsert({ bowlerId, patternId, inputHash: hash, calibration: fit as unknown as Record<string, unknown>, shots: fit.shots, fittedAt: new Date(), fitMs });
  calibrationFitSeconds.observe(fitMs / 1000);
  return 'fitted';
}

/**
 * The bowler's calibration on a pattern, as stored by the worker: readers never wait on a fit. When the stored
 * fit came from other input (new shots, a changed ball or release), it is still answered — the newer fit is
 * queued and replaces it within seconds; with no stored fit yet, the answer says it is being computed.
 */
export async function calibrationFor(bowlerId: number, patternId: number, known: { rows?: ShotRow[]; pattern?: OilPattern; bowler?: BowlerProfile } = {}): Promise<Calibration> {
  const input = await fitInput(bowlerId, patternId, known);
  if (input.observations.length === 0) return fitCalibration(input);
  const hash = inputHash(input);
  const stored = await CalibrationFit.findOne({ where: { bowlerId, patternId } });
  if (stored?.inputHash !== hash) await requestCalibrationFit(bowlerId, patternId);
  if (stored) return stored.calibration as unknown as Calibration;
  return {
    shots: input.observations.length,
    enough: false,
    minShots: CALIBRATION.minShots,
    perBall: [],
    rmsBoardsBefore: null,
    rmsBoardsAfter: null,
    note: `Your ${input.observations.length} logged shots on this pattern are being fitted; the calibration appears here within a few seconds.`,
  };
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
