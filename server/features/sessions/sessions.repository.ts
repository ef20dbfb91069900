import { Op, QueryTypes, type CreationAttributes, type Transaction } from 'sequelize';
import type { ShotRecord } from '../../../engine/shotlog/types';
import type { LaneSurface } from '../../../engine/types';
import { ballLabel } from '../../../shared/balls';
import type { Annotation as AnnotationDto } from '../../../shared/coaching';
import type { Session as SessionDto, SessionKind, Shot as ShotDto } from '../../../shared/sessions';
import { Annotation, BowlingSession, sequelize, Shot, User } from '../../models/index';

interface SessionRow {
  id: number;
  user_id: number;
  date: string;
  kind: SessionKind;
  center_id: number | null;
  center_name: string | null;
  condition_id: number | null;
  pattern_id: number | null;
  pattern_name: string | null;
  league_id: number | null;
  league_name: string | null;
  lane_pair: string | null;
  notes: string;
  created_at: Date;
  games: string | number;
  shots: string | number;
  full_count?: string;
}

export function toSessionDto(r: SessionRow): SessionDto {
  return {
    id: r.id,
    userId: r.user_id,
    date: r.date,
    kind: r.kind,
    centerId: r.center_id,
    centerName: r.center_name,
    conditionId: r.condition_id,
    patternId: r.pattern_id,
    patternName: r.pattern_name,
    leagueId: r.league_id,
    leagueName: r.league_name,
    lanePair: r.lane_pair,
    notes: r.notes,
    games: Number(r.games),
    shots: Number(r.shots),
    createdAt: new Date(r.created_at).toISOString(),
  };
}

/** Sessions with their center's name and shot/game counts, in one statement (the counts by a lateral join). */
const SESSION_SELECT = `
  SELECT s.id, s.user_id, s.date, s.kind, s.center_id, c.name AS center_name, s.condition_id, s.pattern_id, s.pattern_name,
         s.league_id, l.name AS league_name, s.lane_pair, s.notes, s.created_at,
         agg.games, agg.shots
  FROM sessions s
  LEFT JOIN centers c ON c.id = s.center_id
  LEFT JOIN leagues l ON l.id = s.league_id
  LEFT JOIN LATERAL (SELECT COUNT(DISTINCT sh.game_number) AS games, COUNT(*) AS shots FROM shots sh WHERE sh.session_id = s.id) agg ON TRUE`;

export interface ShotRow {
  id: number;
  session_id: number;
  game_number: number;
  frame: number;
  delivery: number;
  ball_id: number;
  /** The ball's model name and nickname, for its label (ballLabel). */
  ball_model_name: string;
  ball_nickname: string | null;
  surface_key: string;
  feet_board: number | null;
  target_board: number | null;
  breakpoint_board: number | null;
  standing: number[];
  foul: boolean;
  hit: ShotDto['hit'];
  note: string;
  created_at: Date;
  // Joined for statistics and calibration.
  date?: string;
  pattern_id?: number | null;
  surface_grit?: number;
  surface_polished?: boolean;
}

export function toShotDto(r: ShotRow): ShotDto {
  return {
    id: r.id,
    sessionId: r.session_id,
    gameNumber: r.game_number,
    frame: r.frame,
    delivery: r.delivery,
    ballId: r.ball_id,
    ballName: shotBallName(r),
    surfaceKey: r.surface_key,
    feetBoard: r.feet_board,
    targetBoard: r.target_board,
    breakpointBoard: r.breakpoint_board,
    standing: [...r.standing].sort((a, b) => a - b),
    foul: r.foul,
    hit: r.hit,
    note: r.note,
    createdAt: new Date(r.created_at).toISOString(),
  };
}

/** The engine's view of a logged shot. */
export function toShotRecord(r: ShotRow, date: string): ShotRecord {
  return {
    frame: r.frame,
    delivery: r.delivery,
    standing: r.standing,
    foul: r.foul,
    sessionId: String(r.session_id),
    gameNumber: r.game_number,
    date,
    ballId: String(r.ball_id),
    surfaceKey: r.surface_key,
    feetBoard: r.feet_board,
    targetBoard: r.target_board,
    breakpointBoard: r.breakpoint_board,
    hit: r.hit,
  };
}

/** The name a shot's ball is shown by: the one ball label of shared/balls. */
export const shotBallName = (r: Pick<ShotRow, 'ball_model_name' | 'ball_nickname'>): string =>
  ballLabel({ name: r.ball_model_name, nickname: r.ball_nickname });

const SHOT_COLUMNS = `sh.id, sh.session_id, sh.game_number, sh.frame, sh.delivery, sh.ball_id, b.name AS ball_model_name, b.nickname AS ball_nickname, sh.surface_key,
  sh.feet_board, sh.target_board, sh.breakpoint_board, sh.standing, sh.foul, sh.hit, sh.note, sh.created_at, sh.surface_grit, sh.surface_polished`;

export function toAnnotationDto(a: Annotation & { author?: User }): AnnotationDto {
  return {
    id: a.id,
    sessionId: a.sessionId,
    authorId: a.authorId,
    authorName: a.author?.displayName ?? '',
    gameNumber: a.gameNumber,
    frame: a.frame,
    text: a.text,
    createdAt: a.createdAt.toISOString(),
  };
}

export const sessionsRepository = {
  create(data: CreationAttributes<BowlingSession>): Promise<BowlingSession> {
    return BowlingSession.create(data);
  },
  createShot(data: CreationAttributes<Shot>, transaction: Transaction): Promise<Shot> {
    return Shot.create(data, { transaction });
  },
  findShot(sessionId: number, id: number, transaction: Transaction): Promise<Shot | null> {
    return Shot.findOne({ where: { id, sessionId }, transaction });
  },
  createAnnotation(data: CreationAttributes<Annotation>): Promise<Annotation> {
    return Annotation.create(data);
  },
  /** One page of a bowler's sessions, newest first, and the total, in one statement. */
  async list(
    userId: number,
    q: { page: number; pageSize: number; from?: string; to?: string },
  ): Promise<{ rows: SessionDto[]; count: number }> {
    const where = ['s.user_id = :userId', 's.deleted_at IS NULL'];
    if (q.from) where.push('s.date >= :from');
    if (q.to) where.push('s.date <= :to');
    const rows = await sequelize.query<SessionRow>(
      `${SESSION_SELECT.replace('agg.games, agg.shots', 'agg.games, agg.shots, COUNT(*) OVER () AS full_count')}
       WHERE ${where.join(' AND ')} ORDER BY s.date DESC, s.id DESC LIMIT :limit OFFSET :offset`,
      {
        type: QueryTypes.SELECT,
        replacements: { userId, from: q.from ?? null, to: q.to ?? null, limit: q.pageSize, offset: (q.page - 1) * q.pageSize },
      },
    );
    const count = rows.length
      ? Number(rows[0].full_count)
      : Number(
          (
            await sequelize.query<{ n: string }>(`SELECT COUNT(*) AS n FROM sessions s WHERE ${where.join(' AND ')}`, {
              type: QueryTypes.SELECT,
              replacements: { userId, from: q.from ?? null, to: q.to ?? null },
            })
          )[0].n,
        );
    return { rows: rows.map(toSessionDto), count };
  },

  async findDto(id: number, transaction?: Transaction): Promise<SessionDto | null> {
    const [row] = await sequelize.query<SessionRow>(`${SESSION_SELECT} WHERE s.id = :id AND s.deleted_at IS NULL`, {
      type: QueryTypes.SELECT,
      replacements: { id },
      transaction,
    });
    return row ? toSessionDto(row) : null;
  },

  findModel(id: number, opts: { transaction?: Transaction; lock?: boolean; paranoid?: boolean } = {}): Promise<BowlingSession | null> {
    return BowlingSession.findOne({
      where: { id },
      transaction: opts.transaction,
      paranoid: opts.paranoid ?? true,
      ...(opts.lock && opts.transaction ? { lock: opts.transaction.LOCK.UPDATE } : {}),
    });
  },

  /** A session's shots in the order thrown (game, frame, delivery), with the ball's name (also for a ball since removed). */
  shotsOf(sessionId: number, transaction?: Transaction): Promise<ShotRow[]> {
    return sequelize.query<ShotRow>(
      `SELECT ${SHOT_COLUMNS} FROM shots sh JOIN balls b ON b.id = sh.ball_id WHERE sh.session_id = :sessionId ORDER BY sh.game_number, sh.frame, sh.delivery`,
      { type: QueryTypes.SELECT, replacements: { sessionId }, transaction },
    );
  },

  /** One game's shots in order (for checking the next delivery). */
  gameShots(sessionId: number, gameNumber: number, transaction: Transaction): Promise<Shot[]> {
    return Shot.findAll({
      where: { sessionId, gameNumber },
      order: [
        ['frame', 'ASC'],
        ['delivery', 'ASC'],
      ],
      transaction,
    });
  },

  async lastGameNumber(sessionId: number, transaction: Transaction): Promise<number> {
    const n = (await Shot.max('gameNumber', { where: { sessionId }, transaction })) as number | null;
    return n ?? 0;
  },

  findShotByKey(sessionId: number, idempotencyKey: string, transaction?: Transaction): Promise<Shot | null> {
    return Shot.findOne({ where: { sessionId, idempotencyKey }, transaction });
  },

  async shotDto(id: number, transaction?: Transaction): Promise<ShotDto | null> {
    const [row] = await sequelize.query<ShotRow>(
      `SELECT ${SHOT_COLUMNS} FROM shots sh JOIN balls b ON b.id = sh.ball_id WHERE sh.id = :id`,
      {
        type: QueryTypes.SELECT,
        replacements: { id },
        transaction,
      },
    );
    return row ? toShotDto(row) : null;
  },

  /**
   * Every shot of a bowler's (not deleted) sessions that matches the filters, with the session's date and
   * pattern, in one statement — statistics never query session by session.
   */
  shotsForStats(userId: number, f: { from?: string; to?: string; ballId?: number; patternId?: number }): Promise<ShotRow[]> {
    const where = ['s.user_id = :userId', 's.deleted_at IS NULL'];
    if (f.from) where.push('s.date >= :from');
    if (f.to) where.push('s.date <= :to');
    if (f.ballId) where.push('sh.ball_id = :ballId');
    if (f.patternId) where.push('s.pattern_id = :patternId');
    return sequelize.query<ShotRow>(
      `SELECT ${SHOT_COLUMNS}, s.date, s.pattern_id FROM shots sh JOIN sessions s ON s.id = sh.session_id JOIN balls b ON b.id = sh.ball_id
       WHERE ${where.join(' AND ')} ORDER BY s.date, s.id, sh.game_number, sh.frame, sh.delivery`,
      {
        type: QueryTypes.SELECT,
        replacements: { userId, from: f.from ?? null, to: f.to ?? null, ballId: f.ballId ?? null, patternId: f.patternId ?? null },
      },
    );
  },

  /** The pattern of the bowler's latest session that has one (for the calibration shown with statistics). */
  async latestPatternId(userId: number): Promise<number | null> {
    const s = await BowlingSession.findOne({
      where: { userId, patternId: { [Op.ne]: null } },
      attributes: ['patternId'],
      order: [
        ['date', 'DESC'],
        ['id', 'DESC'],
      ],
    });
    return s?.patternId ?? null;
  },

  /** The lane surface of the published condition of the bowler's latest session on a pattern that was bowled on one (null: none was). */
  async latestConditionLane(userId: number, patternId: number): Promise<LaneSurface | null> {
    const [row] = await sequelize.query<{ lane_kind: LaneSurface['kind']; lane_friction: LaneSurface['friction'] }>(
      `SELECT c.lane_kind, c.lane_friction FROM sessions s JOIN conditions c ON c.id = s.condition_id
       WHERE s.user_id = :userId AND s.pattern_id = :patternId AND s.deleted_at IS NULL ORDER BY s.date DESC, s.id DESC LIMIT 1`,
      { type: QueryTypes.SELECT, replacements: { userId, patternId } },
    );
    return row ? { kind: row.lane_kind, friction: row.lane_friction } : null;
  },

  annotationsOf(sessionId: number): Promise<Annotation[]> {
    return Annotation.findAll({
      where: { sessionId },
      include: [{ model: User, as: 'author', attributes: ['id', 'displayName'] }],
      order: [
        ['createdAt', 'ASC'],
        ['id', 'ASC'],
      ],
    });
  },
};
