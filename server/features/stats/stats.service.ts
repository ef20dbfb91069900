import { createHash } from 'node:crypto';
import pLimit from 'p-limit';
import { Op, type Transaction } from 'sequelize';
import { CALIBRATION, fitCalibration, isCalibrationShot, laydownBoardOf } from '../../../engine/index';
import type { Calibration, CalibrationObservation, ShotRecord } from '../../../engine/shotlog/types';
import type { BallSpec, BowlerProfile, LaneSurface, OilPattern } from '../../../engine/types';
import { ballToSpec } from '../../../shared/balls';
import { DEFAULT_LANE_SURFACE } from '../../../shared/centers';
import type { PatternSummary } from '../../../shared/patterns';
import type { CalibrationQuery, StatsQuery, StatsResult } from '../../../shared/sessions';
import type { AuthUser } from '../../middleware/auth';
import { AppError } from '../../lib/AppError';
import { config } from '../../config/index';
import { hasReplicas } from '../../db/sequelize';
import { changedAfterCommit, ScopedCache, type CacheTicket } from '../../lib/changeFeed';
import { calibrateInWorker, statsInWorker } from '../../lib/enginePool';
import { calibrationFitSeconds } from '../../lib/metrics';
import { Ball, BowlingSession, CalibrationFit } from '../../models/index';
import { centersRepository, laneOf } from '../centers/centers.repository';
import { readableBowlerId } from '../coaching/coaching.access';
import { requestCalibrationFit, type FitRequest } from './calibrationJobs';
import { patternsService } from '../patterns/patterns.service';
import { profileService } from '../profile/profile.service';
import { sessionsRepository, shotBallName, toShotRecord, type ShotRow } from '../sessions/sessions.repository';

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

/** The observations of the bowler's shots on a pattern, from rows already read (`rows`) or read now. */
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
  const shots = rows?.rows ?? (await sessionsRepository.shotsForStats(bowlerId, { patternId }));
  const ids = [...new Set(shots.map((r) => r.ball_id))];
  const balls = new Map(
    (ids.length ? await Ball.findAll({ where: { ownerId: bowlerId, id: { [Op.in]: ids } }, paranoid: false }) : []).map((b) => [b.id, b]),
  );
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
  const stored = await CalibrationFit.findOne({ where: key, useMaster: true });
  if (stored?.inputHash === hash) return 'current';
  const started = Date.now();
  const fit = await calibrate(input);
  const fitMs = Date.now() - started;
  await CalibrationFit.upsert({
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
  const stored = await CalibrationFit.findOne({ where: { bowlerId, patternId, ...subjectOf(input.pattern, input.lane) } });
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

/**
 * What a matchup or a calibration is worked out on: a plain pattern on a lane surface, or a published condition
 * (its pattern as published and its lane surface; the shots counted are those logged on the pattern it was
 * published from, none when that pattern is gone). 404 for an unknown pattern or condition.
 */
export async function engineCondition(ref: { patternId?: number; conditionId?: number; lane?: LaneSurface }): Promise<{
  patternId: number | null;
  name: string;
  pattern: OilPattern;
  summary: PatternSummary;
  lane: LaneSurface;
  condition: { id: number; centerId: number; centerName: string; lanes: number[]; validFrom: string; validTo: string | null } | null;
}> {
  if (ref.conditionId !== undefined) {
    const c = await centersRepository.findCondition(ref.conditionId);
    if (!c) throw AppError.notFound('Condition');
    return {
      patternId: c.patternId,
      name: c.patternName,
      pattern: { name: c.patternName, sweeps: c.sweeps },
      summary: c.summary,
      lane: laneOf(c),
      condition: { id: c.id, centerId: c.centerId, centerName: c.center.name, lanes: c.lanes, validFrom: c.validFrom, validTo: c.validTo },
    };
  }
  const { id, name, pattern, summary } = await patternsService.engineInput(ref.patternId!);
  const lane = ref.lane ?? DEFAULT_LANE_SURFACE;
  return { patternId: id, name, pattern, summary, lane: { kind: lane.kind, friction: lane.friction }, condition: null };
}

/** The computed statistics of a bowler per filter and hand (dropped when their shots, sessions or balls change). */
type StatsParts = Omit<StatsResult, 'calibration' | 'calibrationPatternId' | 'calibrationLane'>;
const statsCache = new ScopedCache<StatsParts>(['shots', 'balls'], { ttlMs: config.CACHE_TTL_MS, maxIds: 2_000, maxPerId: 8 });

/** Season computations running at once in this process (one reading its shots while one is on the stats thread). */
export const SEASONS_AT_ONCE = 2;
const seasonLimit = pLimit(SEASONS_AT_ONCE);
const inFlight = new Map<
  string,
  { ticket: CacheTicket; answer: Promise<{ parts: StatsParts; rowsForCalibration?: { rows: ShotRow[]; ticket: CacheTicket } }> }
>();

/**
 * The statistics of the bowler's shots under a filter: the bowler's shots read once (shared with the calibration,
 * whose pattern's rows are handed back), computed on the stats thread, kept.
 */
async function computeParts(
  bowlerId: number,
  q: StatsQuery,
  key: string,
  hand: 'right' | 'left',
  calibrationPatternId: number | null,
  ticket: CacheTicket,
) {
  const kept = statsCache.get(bowlerId, key); // a computation that finished while this one waited for its turn
  if (kept) return { parts: kept };
  const all = await sessionsRepository.shotsForStats(bowlerId, {});
  const rows = all.filter(
    (r) =>
      (!q.from || r.date! >= q.from) &&
      (!q.to || r.date! <= q.to) &&
      (!q.ballId || r.ball_id === q.ballId) &&
      (!q.patternId || r.pattern_id === q.patternId),
  );
  const records: ShotRecord[] = rows.map((r) => toShotRecord(r, r.date!));
  const computed = await statsInWorker({ records, hand });
  const names = new Map(rows.map((r) => [String(r.ball_id), shotBallName(r)]));
  const dates = new Map(rows.map((r) => [String(r.session_id), r.date!]));
  const parts: StatsParts = {
    overall: computed.overall,
    byBall: computed.byBall.map((g) => ({ ballId: Number(g.key), name: names.get(g.key) ?? '', stats: g.stats })),
    // Grouped within each full game, so a spare thrown with another ball keeps its leave.
    bySurface: computed.bySurface.map((g) => ({
      ballId: Number(g.keys.ballId),
      name: names.get(g.keys.ballId!) ?? '',
      surfaceKey: g.keys.surfaceKey!,
      stats: g.stats,
    })),
    trend: computed.bySession
      .map((g) => ({
        sessionId: Number(g.key),
        date: dates.get(g.key)!,
        games: g.stats.games,
        average: g.stats.average,
        strikePct: g.stats.strike.pct,
        sparePct: g.stats.spare.pct,
      }))
      .sort((a, b) => a.date.localeCompare(b.date) || a.sessionId - b.sessionId),
    moves: computed.moves,
  };
  if (!hasReplicas) statsCache.set(ticket, key, parts);
  return {
    parts,
    ...(calibrationPatternId !== null
      ? { rowsForCalibration: { rows: all.filter((r) => r.pattern_id === calibrationPatternId), ticket } }
      : {}),
  };
}

// A session saved, deleted or restored in this process drops its bowler's kept statistics when it commits.
for (const hook of ['afterSave', 'afterDestroy', 'afterRestore'] as const) {
  BowlingSession.addHook(hook, (session: BowlingSession, options: { transaction?: Transaction | null }) =>
    changedAfterCommit('shots', session.userId, options.transaction),
  );
}

export const statsService = {
  /**
   * Statistics over the filtered shots, per ball, per ball and surface, per session, with moves and the calibration.
   * At most one shot query per request, shared by the statistics and the calibration (the bowler's shots, filtered
   * here); the statistics are computed on their own thread (statsInWorker: a season of shots takes hundreds of
   * milliseconds) and kept per bowler, filter and hand until the bowler's shots, sessions or balls change, so a page
   * shown again reads no shots at all.
   */
  async stats(user: AuthUser, q: StatsQuery): Promise<StatsResult> {
    const bowlerId = await readableBowlerId(user, q.studentId);
    const [{ hand }, latestPattern] = await Promise.all([
      bowlerOf(bowlerId),
      q.patternId ? Promise.resolve(q.patternId) : sessionsRepository.latestPatternId(bowlerId),
    ]);
    const calibrationPatternId = latestPattern;
    const key = JSON.stringify({ from: q.from, to: q.to, ballId: q.ballId, patternId: q.patternId, hand });
    let parts = statsCache.get(bowlerId, key);
    let rowsForCalibration: { rows: ShotRow[]; ticket: CacheTicket } | undefined;
    if (!parts) {
      // One computation per bowler and filter at a time (a request that finds one running waits for its answer), and
      // at most SEASONS_AT_ONCE in the process: each holds a season of rows, so memory stays bounded under any load.
      // A running computation is joined only if nothing of the bowler's changed since it started.
      const flightKey = `${bowlerId}:${key}`;
      const running = inFlight.get(flightKey);
      if (running && !statsCache.changedSince(running.ticket)) {
        ({ parts } = await running.answer);
      } else {
        const ticket = statsCache.ticket(bowlerId);
        const answer = seasonLimit(() => computeParts(bowlerId, q, key, hand, calibrationPatternId, ticket));
        const flight = { ticket, answer };
        inFlight.set(flightKey, flight);
        try {
          ({ parts, rowsForCalibration } = await answer);
        } finally {
          if (inFlight.get(flightKey) === flight) inFlight.delete(flightKey);
        }
      }
    }
    let calibration: Calibration | null = null;
    // The lanes the bowler last bowled this pattern on (a published condition's lane surface), as a matchup there would use.
    const calibrationLane =
      calibrationPatternId === null
        ? null
        : ((await sessionsRepository.latestConditionLane(bowlerId, calibrationPatternId)) ?? { ...DEFAULT_LANE_SURFACE });
    if (calibrationPatternId !== null) {
      try {
        calibration = await calibrationFor(bowlerId, calibrationPatternId, {
          ...(rowsForCalibration ? { rows: rowsForCalibration.rows, rowsTicket: rowsForCalibration.ticket } : {}),
          lane: calibrationLane ?? undefined,
        });
      } catch (err) {
        if (!(err instanceof AppError)) throw err; // an unknown pattern simply has no calibration
      }
    }
    return { ...parts, calibration, calibrationPatternId, calibrationLane };
  },

  /** The calibration a matchup on this pattern and lane surface (or this published condition) applies. */
  async calibration(user: AuthUser, q: CalibrationQuery): Promise<Calibration> {
    const bowlerId = await readableBowlerId(user, q.studentId);
    const lane =
      q.laneKind || q.laneFriction
        ? { kind: q.laneKind ?? DEFAULT_LANE_SURFACE.kind, friction: q.laneFriction ?? DEFAULT_LANE_SURFACE.friction }
        : undefined;
    const on = await engineCondition({ patternId: q.patternId, conditionId: q.conditionId, lane });
    // A condition whose pattern is gone has no logged shots to fit: an empty fit, as for a pattern never bowled.
    return calibrationFor(bowlerId, on.patternId ?? 0, {
      pattern: on.pattern,
      lane: on.lane,
      ...(on.condition ? { conditionId: on.condition.id } : {}),
      ...(on.patternId === null ? { rows: [] } : {}),
    });
  },
};
