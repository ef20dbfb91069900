import { QueryTypes, type Transaction } from 'sequelize';
import type { GameCountsRow } from '../../../engine/index';
import { sequelize } from '../../models/index';
import { SHOT_COLUMNS, type ShotRow } from '../sessions/sessions.repository';

/** A game of a session (what `shot_aggregate_changes` marks and `shot_aggregates` counts per row). */
export interface GameRef {
  session_id: number;
  game_number: number;
}

/** The filters of the statistics page. */
export interface StatsFilter {
  from?: string;
  to?: string;
  ballId?: number;
  patternId?: number;
}

/** The counted columns of `shot_aggregates` (their engine names in ShotCounts). */
export const COUNT_COLUMNS = {
  shots: 'shots',
  strikes: 'strikes',
  strike_n: 'strikeN',
  spares: 'spares',
  spare_n: 'spareN',
  single_made: 'singleMade',
  single_n: 'singleN',
  multi_made: 'multiMade',
  multi_n: 'multiN',
  split_made: 'splitMade',
  split_n: 'splitN',
  pocket: 'pocket',
  pocket_n: 'pocketN',
  carried: 'carried',
} as const;
type CountColumn = keyof typeof COUNT_COLUMNS;

/** One group of summed counts: GROUPING bits `g` (7 overall, 3 per ball, 1 per ball and surface, 6 per session). */
export type SumRow = Record<CountColumn, number> & {
  g: number;
  ball_id: number | null;
  surface_key: string | null;
  session_id: number | null;
  first_date: string | null;
  ball_model_name: string | null;
  ball_nickname: string | null;
  games: number;
  game_sum: number;
  game_n: number;
  ball_sum: number;
  ball_n: number;
  row_sum: number;
  row_n: number;
};

export interface TallyRow {
  g: number;
  ball_id: number | null;
  surface_key: string | null;
  session_id: number | null;
  key: string;
  n: number;
}

/**
 * The newest `:perBall` calibration shots of each ball of the bowler on a pattern (a first ball from known feet and
 * target boards with its breakpoint or hit recorded: engine isCalibrationShot), over every session (not deleted).
 */
const calibrationSelect = `
  SELECT ${SHOT_COLUMNS}, s.date, s.pattern_id, 'calibration' AS part FROM (
    SELECT sh.id, ROW_NUMBER() OVER (PARTITION BY sh.ball_id ORDER BY s.date DESC, s.id DESC, sh.game_number DESC, sh.frame DESC, sh.delivery DESC) AS rn
    FROM shots sh JOIN sessions s ON s.id = sh.session_id
    WHERE s.user_id = :userId AND s.deleted_at IS NULL AND s.pattern_id = :calibrationPatternId AND sh.delivery = 1
      AND sh.feet_board IS NOT NULL AND sh.target_board IS NOT NULL AND (sh.breakpoint_board IS NOT NULL OR sh.hit IS NOT NULL)
  ) c JOIN shots sh ON sh.id = c.id JOIN sessions s ON s.id = sh.session_id JOIN balls b ON b.id = sh.ball_id
  WHERE c.rn <= :perBall`;

/** The WHERE of a filtered read of a bowler's (not deleted) sessions `s` (the ball is filtered on the shots or rows); `alone` rows (one ball's shots) when a ball is named. */
/**
 * The bowler's session of each aggregate row, looked up by its key (OFFSET 0 keeps the planner from flattening it): one
 * index probe per row whatever the planner's estimates (a freshly written season has no table statistics yet). The
 * rows are the bowler's (`a.user_id`), so the session's owner is not checked again (that would invite the owner's index).
 */
const sessionOf = (where: string, cols = 's.date') =>
  `CROSS JOIN LATERAL (SELECT ${cols} FROM sessions s WHERE s.id = a.session_id AND ${where.replace('s.user_id = :userId AND ', '')} OFFSET 0) s`;

function filterOf(userId: number, f: StatsFilter) {
  const where = ['s.user_id = :userId', 's.deleted_at IS NULL'];
  if (f.from) where.push('s.date >= :from');
  if (f.to) where.push('s.date <= :to');
  if (f.patternId) where.push('s.pattern_id = :patternId');
  return {
    where: where.join(' AND '),
    replacements: {
      userId,
      alone: Boolean(f.ballId),
      from: f.from ?? null,
      to: f.to ?? null,
      ballId: f.ballId ?? null,
      patternId: f.patternId ?? null,
    },
  };
}

const GROUPS = 'GROUPING(a.ball_id, a.surface_key, a.session_id)::int AS g, a.ball_id, a.surface_key, a.session_id';
const int = (sql: string) => `COALESCE(${sql}, 0)::int`;

/**
 * The kept counts of a bowler's games (`shot_aggregates`, migration 20261230-0016): the games whose shots changed are
 * counted again (engine gameCounts) before a statistics read, and the statistics sum the rows in SQL.
 */
export const aggregatesRepository = {
  /** Whether any game of the bowler waits to be counted again (read on the primary: the marks are written there). */
  async hasChanges(userId: number): Promise<boolean> {
    const [row] = await sequelize.query<{ any: boolean }>(
      'SELECT EXISTS (SELECT 1 FROM shot_aggregate_changes WHERE user_id = :userId) AS any',
      { type: QueryTypes.SELECT, replacements: { userId }, useMaster: true },
    );
    return Boolean(row?.any);
  },

  /** The bowlers with games waiting to be counted again. */
  async changedBowlers(transaction?: Transaction): Promise<number[]> {
    const rows = await sequelize.query<{ user_id: number }>('SELECT DISTINCT user_id FROM shot_aggregate_changes ORDER BY user_id', {
      type: QueryTypes.SELECT,
      transaction,
    });
    return rows.map((r) => r.user_id);
  },

  /** Takes the bowler's marks of changed games (held until the transaction ends: one counting per bowler at a time). */
  async claimChangedGames(userId: number, transaction: Transaction): Promise<GameRef[]> {
    await sequelize.query("SELECT pg_advisory_xact_lock(hashtext('shot_aggregates'), :userId)", { replacements: { userId }, transaction });
    return sequelize.query<GameRef>(
      `WITH taken AS (DELETE FROM shot_aggregate_changes WHERE user_id = :userId RETURNING session_id, game_number)
       SELECT DISTINCT session_id, game_number FROM taken ORDER BY session_id, game_number`,
      { type: QueryTypes.SELECT, replacements: { userId }, transaction },
    );
  },

  /** The shots of these games with their session's date, in the order thrown. */
  gameShots(games: GameRef[], transaction: Transaction): Promise<ShotRow[]> {
    return sequelize.query<ShotRow>(
      `SELECT ${SHOT_COLUMNS}, s.date, s.pattern_id FROM shots sh JOIN sessions s ON s.id = sh.session_id JOIN balls b ON b.id = sh.ball_id
       JOIN jsonb_to_recordset(CAST(:games AS jsonb)) AS g(session_id int, game_number int)
         ON g.session_id = sh.session_id AND g.game_number = sh.game_number
       ORDER BY s.date, s.id, sh.game_number, sh.frame, sh.delivery`,
      { type: QueryTypes.SELECT, replacements: { games: JSON.stringify(games) }, transaction },
    );
  },

  /** Replaces the rows of these games by their counts now (a game with no shots left has none). */
  async replaceGames(userId: number, games: GameRef[], rows: GameCountsRow[], transaction: Transaction): Promise<void> {
    await sequelize.query(
      `DELETE FROM shot_aggregates a USING jsonb_to_recordset(CAST(:games AS jsonb)) AS g(session_id int, game_number int)
       WHERE a.session_id = g.session_id AND a.game_number = g.game_number`,
      { replacements: { games: JSON.stringify(games) }, transaction },
    );
    if (rows.length === 0) return;
    const records = rows.map((r) => ({
      session_id: Number(r.sessionId),
      game_number: r.gameNumber,
      ball_id: Number(r.ballId),
      surface_key: r.surfaceKey,
      alone: r.alone,
      ...Object.fromEntries(Object.entries(COUNT_COLUMNS).map(([col, name]) => [col, r.counts[name]])),
      tallies: r.counts.tallies,
      game_total: r.gameTotal,
      game_balls: r.gameBalls,
      game_rows: r.gameRows,
      lead: r.lead,
    }));
    const cols = Object.keys(COUNT_COLUMNS);
    await sequelize.query(
      `INSERT INTO shot_aggregates (session_id, game_number, ball_id, surface_key, alone, user_id, ${cols.join(', ')}, tallies, game_total, game_balls, game_rows, lead)
       SELECT r.session_id, r.game_number, r.ball_id, r.surface_key, r.alone, :userId, ${cols.map((c) => `r.${c}`).join(', ')}, r.tallies, r.game_total,
         r.game_balls, r.game_rows, r.lead
       FROM jsonb_to_recordset(CAST(:rows AS jsonb)) AS r(session_id int, game_number int, ball_id int, surface_key text, alone boolean,
         ${cols.map((c) => `${c} int`).join(', ')}, tallies jsonb, game_total int, game_balls int, game_rows int, lead boolean)
       WHERE EXISTS (SELECT 1 FROM sessions s WHERE s.id = r.session_id)`,
      { replacements: { userId, rows: JSON.stringify(records) }, transaction },
    );
  },

  /**
   * The counts summed overall, per ball, per ball and surface and per session (GROUPING SETS), with each group's earliest
   * session date and, per ball, its name; the complete games' scores summed three ways (ShotCounts' totalSum for the
   * whole filter and per session, per ball, per ball and surface: engine gameCounts).
   */
  sums(userId: number, f: StatsFilter, opts: { fromPrimary?: boolean } = {}): Promise<SumRow[]> {
    const { where, replacements } = filterOf(userId, f);
    const ballWhere = f.ballId ? ' AND a.ball_id = :ballId' : '';
    const whole = 'a.lead AND (NOT a.alone OR a.game_balls = 1)';
    return sequelize.query<SumRow>(
      `SELECT ${GROUPS}, MIN(s.date) AS first_date, MIN(b.name) AS ball_model_name, MIN(b.nickname) AS ball_nickname,
         COUNT(DISTINCT (a.session_id, a.game_number))::int AS games,
         ${Object.keys(COUNT_COLUMNS)
           .map((c) => `${int(`SUM(a.${c})`)} AS ${c}`)
           .join(', ')},
         ${int(`SUM(a.game_total) FILTER (WHERE ${whole})`)} AS game_sum, COUNT(a.game_total) FILTER (WHERE ${whole})::int AS game_n,
         ${int('SUM(a.game_total) FILTER (WHERE a.lead AND a.game_balls = 1)')} AS ball_sum,
         COUNT(a.game_total) FILTER (WHERE a.lead AND a.game_balls = 1)::int AS ball_n,
         ${int('SUM(a.game_total) FILTER (WHERE a.game_rows = 1)')} AS row_sum, COUNT(a.game_total) FILTER (WHERE a.game_rows = 1)::int AS row_n
       FROM shot_aggregates a ${sessionOf(where)} JOIN balls b ON b.id = a.ball_id
       WHERE a.user_id = :userId AND a.alone = :alone${ballWhere}
       GROUP BY GROUPING SETS ((), (a.ball_id), (a.ball_id, a.surface_key), (a.session_id))`,
      { type: QueryTypes.SELECT, replacements, ...(opts.fromPrimary ? { useMaster: true } : {}) },
    );
  },

  /** The tallies (first balls by pins, leaves) summed for the groups of sums but the sessions (the trend shows no tally). */
  tallies(userId: number, f: StatsFilter, opts: { fromPrimary?: boolean } = {}): Promise<TallyRow[]> {
    const { where, replacements } = filterOf(userId, f);
    const ballWhere = f.ballId ? ' AND a.ball_id = :ballId' : '';
    return sequelize.query<TallyRow>(
      // the GROUPING bits of sums (7 overall, 3 per ball, 1 per ball and surface) with no session bit
      `SELECT (GROUPING(a.ball_id, a.surface_key) * 2 + 1)::int AS g, a.ball_id, a.surface_key, NULL::int AS session_id, t.key, SUM(t.value::int)::int AS n
       FROM shot_aggregates a ${sessionOf(where)} CROSS JOIN LATERAL jsonb_each_text(a.tallies) t
       WHERE a.user_id = :userId AND a.alone = :alone${ballWhere}
       GROUP BY GROUPING SETS ((t.key), (a.ball_id, t.key), (a.ball_id, a.surface_key, t.key))`,
      { type: QueryTypes.SELECT, replacements, ...(opts.fromPrimary ? { useMaster: true } : {}) },
    );
  },

  /** The newest `perBall` calibration shots of each ball on a pattern (calibrationSelect), in the order thrown. */
  calibrationShots(userId: number, patternId: number, perBall: number, transaction?: Transaction): Promise<ShotRow[]> {
    return sequelize.query<ShotRow>(`${calibrationSelect} ORDER BY date, session_id, game_number, frame, delivery`, {
      type: QueryTypes.SELECT,
      replacements: { userId, calibrationPatternId: patternId, perBall },
      transaction,
    });
  },

  /**
   * One read of shots for a statistics page: `recent` the filtered shots of the latest whole sessions that hold at least
   * `limit` of them (null: every filtered shot), in the order thrown; with `calibration`, also `calibration` the
   * newest `perBall` calibration shots (a first ball from known feet and target boards with its breakpoint or hit
   * recorded: engine isCalibrationShot) of each ball on that pattern, over every session, in the order thrown.
   */
  async recentShots(
    userId: number,
    f: StatsFilter,
    opts: { limit: number | null; calibration: { patternId: number; perBall: number } | null; fromPrimary?: boolean },
  ): Promise<{ recent: ShotRow[]; calibration: ShotRow[]; calibrationRead: boolean }> {
    const { where: sessionWhere, replacements } = filterOf(userId, f);
    const where = `${sessionWhere}${f.ballId ? ' AND sh.ball_id = :ballId' : ''}`;
    const aggWhere = filterOf(userId, f).where;
    const ballWhere = f.ballId ? ' AND a.ball_id = :ballId' : '';
    const windowed =
      opts.limit === null
        ? ''
        : `AND sh.session_id IN (
            SELECT session_id FROM (
              SELECT session_id, SUM(n) OVER (ORDER BY date DESC, session_id DESC) - n AS before FROM (
                SELECT a.session_id, s.date, SUM(a.shots) AS n FROM shot_aggregates a ${sessionOf(aggWhere)}
                WHERE a.user_id = :userId AND a.alone = :alone${ballWhere} GROUP BY a.session_id, s.date
              ) per
            ) w WHERE before < :limit)`;
    const recent = `SELECT ${SHOT_COLUMNS}, s.date, s.pattern_id, 'recent' AS part FROM shots sh JOIN sessions s ON s.id = sh.session_id
       JOIN balls b ON b.id = sh.ball_id WHERE ${where} ${windowed}`;
    const calibration = opts.calibration ? `UNION ALL ${calibrationSelect}` : '';
    const rows = await sequelize.query<ShotRow & { part: 'recent' | 'calibration' }>(
      `${recent} ${calibration} ORDER BY part DESC, date, session_id, game_number, frame, delivery`,
      {
        type: QueryTypes.SELECT,
        replacements: {
          ...replacements,
          limit: opts.limit ?? 0,
          calibrationPatternId: opts.calibration?.patternId ?? null,
          perBall: opts.calibration?.perBall ?? 0,
        },
        ...(opts.fromPrimary ? { useMaster: true } : {}),
      },
    );
    return {
      recent: rows.filter((r) => r.part === 'recent'),
      calibration: rows.filter((r) => r.part === 'calibration'),
      calibrationRead: opts.calibration !== null,
    };
  },
};
