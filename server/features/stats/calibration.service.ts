import { createHash } from 'node:crypto';
import { CALIBRATION, fitCalibration, isCalibrationShot, laydownBoardOf } from '../../../engine/index';
import type { Calibration, CalibrationObservation } from '../../../engine/shotlog/types';
import type { BallSpec, BowlerProfile, LaneSurface, OilPattern } from '../../../engine/types';
import { ballToSpec } from '../../../shared/balls';
import { DEFAULT_LANE_SURFACE } from '../../../shared/centers';
import { AppError } from '../../lib/AppError';
import { config } from '../../config/index';
import { hasReplicas } from '../../db/sequelize';
import { ScopedCache, type CacheTicket } from '../../lib/changeFeed';
import { calibrateInWorker } from '../../lib/enginePool';
import { calibrationFitSeconds } from '../../lib/metrics';
import type { Ball } from '../../models/index';
import { arsenalRepository } from '../arsenal/arsenal.repository';
import { patternsService } from '../patterns/patterns.service';
import type { ShotRow } from '../sessions/sessions.repository';
import { aggregatesRepository } from './aggregates.repository';
import { requestCalibrationFit, type FitRequest } from './calibrationJobs';
import { bowlerOf, engineCondition } from './engineInput.service';
import { statsRepository } from './stats.repository';

/**
 * The bowler's calibration of the ball-motion model from their logged shots: the observations, the fit input, the
 * `calibration` job that fits and stores it, and the readers that answer the stored fit.
 */

/**
 * At most this many of a ball's most recent usable shots go into its fit: they describe the bowler's game as it
 * is now, and the fit costs about 25 ms of model deliveries per shot (measured: 12 shots 0.4 s, 40 shots 1.1 s
 * on this machine), so a ball's fit stays under a second. Lanewright's choice (the engine needs 12 per ball).
 */
export const CALIBRATION_SHOTS_PER_BALL = 30;

/**
 * A ball as it was when a shot was thrown: its surface then; its wear (games since the last resurface) is today's
 * when the shot was thrown on today's surface (the closest record kept: the shots are recent and the cover has
 * worn at most that much since), and left out (a fresh cover) for a shot on an earlier surface, whose wear was not
 * recorded. The seeded demo shots are generated with the same spec, so the fit recovers their friction.
 */
export function specAsThrown(b: Ball, surfaceGrit: number, polished: boolean): BallSpec {
  const sameSurface = surfaceGrit === b.surfaceGrit && polished === b.polished;
  return ballToSpec({ ...b.get({ plain: true }), surfaceGrit, polished, gamesSinceResurface: sameSurface ? b.gamesSinceResurface : 0 });
}

/**
 * The logged first balls that say something about the ball's motion: thrown at a full rack from a known
 * feet board at a known target, with the breakpoint board or the pocket result recorded. The ball is taken
 * as it was when the shot was thrown (specAsThrown).
 */
export function observationsOf(rows: ShotRow[], balls: Map<number, Ball>): CalibrationObservation[] {
  const out: CalibrationObservation[] = [];
  const perBall = new Map<number, number>();
  // Newest first, so each ball keeps its most recent shots.
  for (const r of [...rows].reverse()) {
    if (r.feet_board == null || r.target_board == null) continue;
    if (
      !isCalibrationShot({
        delivery: r.delivery,
        feetBoard: r.feet_board,
        targetBoard: r.target_board,
        breakpointBoard: r.breakpoint_board,
        hit: r.hit,
      })
    )
      continue;
    const b = balls.get(r.ball_id);
    if (!b || (perBall.get(b.id) ?? 0) >= CALIBRATION_SHOTS_PER_BALL) continue;
    perBall.set(b.id, (perBall.get(b.id) ?? 0) + 1);
    out.push({
      ball: { id: String(b.id), ...specAsThrown(b, r.surface_grit ?? b.surfaceGrit, r.surface_polished ?? b.polished) },
      laydownBoard: laydownBoardOf(r.feet_board),
      targetBoard: r.target_board,
      breakpointBoard: r.breakpoint_board,
      hit: r.hit,
      gamesBowled: r.game_number - 1,
      speedMph: r.speed_mph ?? null,
      revRpm: r.rev_rpm ?? null,
    });
  }
  return out.reverse();
}

type FitInput = { bowler: BowlerProfile; pattern: OilPattern; observations: CalibrationObservation[]; lane: LaneSurface };

const sha256 = (v: unknown) => createHash('sha256').update(JSON.stringify(v)).digest('hex');

/** A fit computed now, in the engine worker pool (nothing to fit is instant and stays on this thread). Used by the `calibration` job. */
export async function calibrate(input: {
  bowler: BowlerProfile;
  pattern: OilPattern;
  observations: CalibrationObservation[];
  lane?: LaneSurface;
}): Promise<Calibration> {
  if (input.observations.length === 0) return fitCalibration(input);
  return calibrateInWorker(input);
}

/** What a stored fit is about besides the bowler and the pattern id: the lane surface and the pattern's sweeps as fitted (a condition's as published). */
function subjectOf(
  pattern: OilPattern,
  lane: LaneSurface,
): { laneKind: LaneSurface['kind']; laneFriction: LaneSurface['friction']; patternHash: string } {
  return { laneKind: lane.kind, laneFriction: lane.friction, patternHash: sha256(pattern) };
}

/**
 * A bowler's calibration observations on a pattern (at most CALIBRATION_SHOTS_PER_BALL per ball), kept while none of
 * their shots, sessions or balls change (server/lib/changeFeed.ts): a page that shows the calibration reads no shots.
 */
const observationsCache = new ScopedCache<CalibrationObservation[]>(['shots', 'balls'], { ttlMs: config.CACHE_TTL_MS, maxIds: 5_000 });

/** Whether the observations of the bowler's shots on a pattern are kept (a statistics read then leaves them out). */
export function observationsKept(bowlerId: number, patternId: number): boolean {
  return observationsCache.get(bowlerId, String(patternId)) !== undefined;
}

/**
 * The observations of the bowler's shots on a pattern, from rows already read (`rows`: at least the newest
 * CALIBRATION_SHOTS_PER_BALL calibration shots of each ball) or read now (only those).
 */
async function observationsFor(
  bowlerId: number,
  patternId: number,
  rows?: { rows: ShotRow[]; ticket: CacheTicket },
): Promise<CalibrationObservation[]> {
  const key = String(patternId);
  if (!rows) {
    const hit = observationsCache.get(bowlerId, key);
    if (hit) return hit;
  }
  const ticket = rows?.ticket ?? observationsCache.ticket(bowlerId);
  const shots = rows?.rows ?? (await aggregatesRepository.calibrationShots(bowlerId, patternId, CALIBRATION_SHOTS_PER_BALL));
  const ids = [...new Set(shots.map((r) => r.ball_id))];
  const balls = new Map((ids.length ? await arsenalRepository.findOwnedManyEvenRemoved(bowlerId, ids) : []).map((b) => [b.id, b]));
  const observations = observationsOf(shots, balls);
  if (!hasReplicas) observationsCache.set(ticket, key, observations);
  return observations;
}

/** The input of a bowler's fit on a pattern and lane surface: their logged shots on the pattern, the balls as thrown, the release. */
async function fitInput(
  bowlerId: number,
  patternId: number,
  known: { rows?: ShotRow[]; rowsTicket?: CacheTicket; pattern?: OilPattern; bowler?: BowlerProfile; lane?: LaneSurface } = {},
): Promise<FitInput> {
  const pattern = known.pattern ?? (await patternsService.engineInput(patternId)).pattern;
  const observations = await observationsFor(
    bowlerId,
    patternId,
    known.rows ? { rows: known.rows, ticket: known.rowsTicket ?? observationsCache.ticket(bowlerId) } : undefined,
  );
  const lane = known.lane ?? DEFAULT_LANE_SURFACE;
  return { bowler: known.bowler ?? (await bowlerOf(bowlerId)), pattern, observations, lane: { kind: lane.kind, friction: lane.friction } };
}

/** The input of the fit a request names, with the pattern id its shots are logged on; null when the pattern or condition is gone. */
async function requestedInput(req: FitRequest): Promise<{ patternId: number; input: FitInput } | null> {
  try {
    const on = await engineCondition(
      'conditionId' in req ? { conditionId: req.conditionId } : { patternId: req.patternId, lane: req.lane },
    );
    if (on.patternId === null) return null; // the condition's pattern was deleted: no shots to fit
    return { patternId: on.patternId, input: await fitInput(req.bowlerId, on.patternId, { pattern: on.pattern, lane: on.lane }) };
  } catch (err) {
    if (err instanceof AppError && err.status === 404) return null; // the pattern or condition was deleted meanwhile
    throw err;
  }
}

/**
 * The `calibration` job: fits from the current input unless the stored fit already came from it, and stores it.
 * When the input changed while it was fitting (a shot or a ball change committed meanwhile), it asks for one more
 * fit, so the stored fit never stays behind a change that a request was absorbed into.
 */
export async function runCalibrationFit(req: FitRequest): Promise<'fitted' | 'current' | 'gone'> {
  const found = await requestedInput(req);
  if (!found) return 'gone';
  const { patternId, input } = found;
  const hash = sha256(input);
  const key = { bowlerId: req.bowlerId, patternId, ...subjectOf(input.pattern, input.lane) };
  const stored = await statsRepository.findFit(key, { fromPrimary: true });
  if (stored?.inputHash === hash) return 'current';
  const started = Date.now();
  const fit = await calibrate(input);
  const fitMs = Date.now() - started;
  await statsRepository.saveFit({
    ...key,
    conditionId: 'conditionId' in req ? req.conditionId : null,
    inputHash: hash,
    calibration: fit as unknown as Record<string, unknown>,
    shots: fit.shots,
    fittedAt: new Date(),
    fitMs,
  });
  calibrationFitSeconds.observe(fitMs / 1000);
  const now = await requestedInput(req);
  if (now && sha256(now.input) !== hash) await requestCalibrationFit(req);
  return 'fitted';
}

/**
 * The bowler's calibration on a pattern from every logged shot on it, on a lane surface (default synthetic, medium
 * friction): the model the fit adjusts is the one the matchup runs on those lanes. Readers never wait on a fit:
 * this answers the fit the worker stored. When it came from other input (new shots, a changed ball or release),
 * it is still answered and the newer fit is queued (it replaces it within seconds); with no stored fit yet, the
 * answer says it is being computed. `conditionId` names the published condition the pattern and lanes come from.
 */
export async function calibrationFor(
  bowlerId: number,
  patternId: number,
  known: {
    rows?: ShotRow[];
    rowsTicket?: CacheTicket;
    pattern?: OilPattern;
    bowler?: BowlerProfile;
    lane?: LaneSurface;
    conditionId?: number;
  } = {},
): Promise<Calibration> {
  const input = await fitInput(bowlerId, patternId, known);
  if (input.observations.length === 0) return fitCalibration(input);
  const stored = await statsRepository.findFit({ bowlerId, patternId, ...subjectOf(input.pattern, input.lane) });
  if (stored?.inputHash !== sha256(input)) {
    await requestCalibrationFit(
      known.conditionId !== undefined ? { bowlerId, conditionId: known.conditionId } : { bowlerId, patternId, lane: input.lane },
    );
  }
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
