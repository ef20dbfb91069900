import pLimit from 'p-limit';
import type { Calibration, ShotRecord } from '../../../engine/shotlog/types';
import { DEFAULT_LANE_SURFACE } from '../../../shared/centers';
import type { CalibrationQuery, StatsQuery, StatsResult } from '../../../shared/sessions';
import type { AuthUser } from '../../middleware/auth';
import { AppError } from '../../lib/AppError';
import { config } from '../../config/index';
import { hasReplicas } from '../../db/sequelize';
import { ScopedCache, type CacheTicket } from '../../lib/changeFeed';
import { statsInWorker } from '../../lib/enginePool';
import { readableBowlerId } from '../coaching/coaching.access';
import { sessionsRepository, shotBallName, toShotRecord, type ShotRow } from '../sessions/sessions.repository';
import { calibrationFor } from './calibration.service';
import { bowlerOf, engineCondition } from './engineInput.service';

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
