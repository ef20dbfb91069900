import pLimit from 'p-limit';
import { emptyShotCounts } from '../../../engine/index';
import type { Calibration, ShotCounts } from '../../../engine/shotlog/types';
import { DEFAULT_LANE_SURFACE } from '../../../shared/centers';
import type { CalibrationQuery, StatsQuery, StatsResult } from '../../../shared/sessions';
import type { AuthUser } from '../../middleware/auth';
import { AppError } from '../../lib/AppError';
import { config } from '../../config/index';
import { hasReplicas } from '../../db/sequelize';
import { ScopedCache, type CacheTicket } from '../../lib/changeFeed';
import { movesInWorker, statsInWorker } from '../../lib/enginePool';
import { readableBowlerId } from '../coaching/coaching.access';
import { sessionsRepository, shotBallName, toShotRecord, type ShotRow } from '../sessions/sessions.repository';
import { aggregatesRepository, COUNT_COLUMNS, type SumRow } from './aggregates.repository';
import { refreshShotAggregates } from './aggregates.service';
import { CALIBRATION_SHOTS_PER_BALL, calibrationFor, observationsKept } from './calibration.service';
import { bowlerOf, engineCondition } from './engineInput.service';

/** The computed statistics of a bowler per filter and hand (dropped when their shots, sessions or balls change). */
type StatsParts = Omit<StatsResult, 'calibration' | 'calibrationPatternId' | 'calibrationLane'>;
const statsCache = new ScopedCache<StatsParts>(['shots', 'balls'], { ttlMs: config.CACHE_TTL_MS, maxIds: 2_000, maxPerId: 8 });

/** Statistics computations running at once in this process (one reading while one is on the stats thread). */
export const SEASONS_AT_ONCE = 2;
const seasonLimit = pLimit(SEASONS_AT_ONCE);
const inFlight = new Map<
  string,
  { ticket: CacheTicket; answer: Promise<{ parts: StatsParts; rowsForCalibration?: { rows: ShotRow[]; ticket: CacheTicket } }> }
>();

/**
 * The filtered shots of the latest whole sessions read for the moves: enough for suggestMoves as a rule
 * (recentShotsSuffice decides; when they do not suffice, four times as many are read, and so on).
 */
export const RECENT_SHOTS = 1000;

/** The grouping key of a summed row (GROUPING bits: 7 overall, 3 per ball, 1 per ball and surface, 6 per session). */
const groupKey = (r: { g: number; ball_id: number | null; surface_key: string | null; session_id: number | null }): string =>
  r.g === 7 ? '' : r.g === 3 ? String(r.ball_id) : r.g === 1 ? `${r.ball_id} | ${r.surface_key}` : String(r.session_id);

/** ShotCounts of a summed row: the complete games' scores as the group counts them (engine gameCounts). */
function countsOfRow(r: SumRow, tallies: Record<string, number>): ShotCounts {
  const [totalSum, completeGames] = r.g === 3 ? [r.ball_sum, r.ball_n] : r.g === 1 ? [r.row_sum, r.row_n] : [r.game_sum, r.game_n];
  // PostgreSQL sums and counts may arrive as strings (bigint, numeric): the engine checks for numbers
  const c: ShotCounts = {
    ...emptyShotCounts(),
    games: Number(r.games),
    totalSum: Number(totalSum),
    completeGames: Number(completeGames),
    tallies: Object.fromEntries(Object.entries(tallies).map(([k, v]) => [k, Number(v)])),
  };
  for (const [col, name] of Object.entries(COUNT_COLUMNS)) c[name] = Number(r[col as keyof typeof COUNT_COLUMNS]);
  return c;
}

/** statsBy's order of groups: earliest date, then key (as strings). */
const byDateThenKey = (a: { date: string; key: string }, b: { date: string; key: string }) =>
  a.date < b.date ? -1 : a.date > b.date ? 1 : a.key < b.key ? -1 : a.key > b.key ? 1 : 0;

/**
 * The statistics of the bowler's shots under a filter, from the kept game counts (shot_aggregates, counted again first
 * where shots changed): the counts summed in SQL overall, per ball, per ball and surface and per session; one read of
 * shots for the moves (the latest sessions) and the calibration (the newest calibration shots of each ball on its
 * pattern); the statistics and the moves computed on the stats thread; kept.
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
  const fromPrimary = (await refreshShotAggregates(bowlerId)) && hasReplicas;
  const f = { from: q.from, to: q.to, ballId: q.ballId, patternId: q.patternId };
  const [sums, tallyRows, shots] = await Promise.all([
    aggregatesRepository.sums(bowlerId, f, { fromPrimary }),
    aggregatesRepository.tallies(bowlerId, f, { fromPrimary }),
    aggregatesRepository.recentShots(bowlerId, f, {
      limit: RECENT_SHOTS,
      // the calibration's shots too, unless its observations are kept (a page shown with another filter)
      calibration:
        calibrationPatternId !== null && !observationsKept(bowlerId, calibrationPatternId)
          ? { patternId: calibrationPatternId, perBall: CALIBRATION_SHOTS_PER_BALL }
          : null,
      fromPrimary,
    }),
  ]);
  const tallies = new Map<string, Record<string, number>>();
  for (const t of tallyRows) {
    const k = `${t.g}:${groupKey(t)}`;
    const cur = tallies.get(k) ?? {};
    cur[t.key] = Number(t.n);
    tallies.set(k, cur);
  }
  const groups = sums.map((r) => ({ row: r, key: groupKey(r), counts: countsOfRow(r, tallies.get(`${r.g}:${groupKey(r)}`) ?? {}) }));
  const ordered = (g: number) =>
    groups
      .filter((x) => x.row.g === g)
      .map((x) => ({ ...x, date: x.row.first_date! }))
      .sort(byDateThenKey);
  const overall = groups.find((x) => x.row.g === 7)?.counts ?? emptyShotCounts();
  const byBall = ordered(3);
  const bySurface = ordered(1);
  const bySession = ordered(6);
  const recent = shots.recent.map((r) => toShotRecord(r, r.date!));
  const computed = await statsInWorker({
    overall,
    byBall: byBall.map((x) => ({ key: x.key, counts: x.counts })),
    bySurface: bySurface.map((x) => ({ key: x.key, counts: x.counts })),
    bySession: bySession.map((x) => ({ key: x.key, counts: x.counts })),
    recent,
    complete: recent.length === overall.shots,
    hand,
  });
  // The moves: when the latest sessions did not suffice, four times as many, until they do or hold every filtered shot.
  let moves = computed.moves;
  for (let limit = RECENT_SHOTS * 4; moves === null; limit *= 4) {
    const more = (await aggregatesRepository.recentShots(bowlerId, f, { limit, calibration: null, fromPrimary })).recent;
    moves = await movesInWorker({ shots: more.map((r) => toShotRecord(r, r.date!)), hand, complete: more.length === overall.shots });
  }
  const names = new Map(
    byBall.map((x) => [x.key, shotBallName({ ball_model_name: x.row.ball_model_name!, ball_nickname: x.row.ball_nickname })]),
  );
  const dates = new Map(bySession.map((x) => [x.key, x.date]));
  const parts: StatsParts = {
    overall: computed.overall,
    byBall: computed.byBall.map((g) => ({ ballId: Number(g.key), name: names.get(g.key) ?? '', stats: g.stats })),
    // Counted within each full game, so a spare thrown with another ball keeps its leave.
    bySurface: computed.bySurface.map((g, i) => ({
      ballId: Number(bySurface[i].row.ball_id),
      name: names.get(String(bySurface[i].row.ball_id)) ?? '',
      surfaceKey: bySurface[i].row.surface_key!,
      stats: g.stats,
    })),
    trend: computed.bySession
      .map((g) => ({
        sessionId: Number(g.key),
        date: dates.get(g.key)!,
        games: g.games,
        average: g.average,
        strikePct: g.strikePct,
        sparePct: g.sparePct,
      }))
      .sort((a, b) => a.date.localeCompare(b.date) || a.sessionId - b.sessionId),
    moves,
  };
  if (!hasReplicas) statsCache.set(ticket, key, parts);
  return {
    parts,
    ...(calibrationPatternId !== null && shots.calibrationRead ? { rowsForCalibration: { rows: shots.calibration, ticket } } : {}),
  };
}

export const statsService = {
  /**
   * Statistics over the filtered shots, per ball, per ball and surface, per session, with moves and the calibration.
   * The figures come from the kept game counts summed in SQL (a page never replays a season: only games whose shots
   * changed are counted again), the moves from the latest sessions and the calibration from each ball's newest
   * calibration shots, both in one shot read; the little left to compute runs on the stats thread, and the answer is
   * kept per bowler, filter and hand until the bowler's shots, sessions or balls change.
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
