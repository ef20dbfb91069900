import { QueryTypes, type CreationAttributes } from 'sequelize';
import { League, sequelize } from '../../models/index';

/** A league row with its center's name and how many nights (sessions) it has. */
export interface LeagueRow {
  id: number;
  user_id: number;
  name: string;
  center_id: number | null;
  center_name: string | null;
  weekday: number | null;
  season_start: string;
  season_end: string | null;
  games_per_night: number;
  handicap_basis: number | null;
  handicap_percent: number | null;
  handicap_max: number | null;
  entering_average: number | null;
  nights: string | number;
  created_at: Date;
}

const LEAGUE_SELECT = `
  SELECT l.*, c.name AS center_name,
         (SELECT COUNT(*) FROM sessions s WHERE s.league_id = l.id AND s.deleted_at IS NULL) AS nights
  FROM leagues l LEFT JOIN centers c ON c.id = l.center_id`;

/** The rows the leagues feature reads and writes. */
export const leaguesRepository = {
  findById(id: number): Promise<League | null> {
    return League.findByPk(id);
  },
  create(data: CreationAttributes<League>): Promise<League> {
    return League.create(data);
  },
  /** A bowler's leagues, the newest season first. */
  rowsOf(userId: number): Promise<LeagueRow[]> {
    return sequelize.query<LeagueRow>(`${LEAGUE_SELECT} WHERE l.user_id = :userId ORDER BY l.season_start DESC, l.id DESC`, {
      type: QueryTypes.SELECT,
      replacements: { userId },
    });
  },
  async rowById(id: number): Promise<LeagueRow | null> {
    const [row] = await sequelize.query<LeagueRow>(`${LEAGUE_SELECT} WHERE l.id = :id`, { type: QueryTypes.SELECT, replacements: { id } });
    return row ?? null;
  },
  /** The league's nights (its sessions, not deleted) in date order. */
  nightsOf(leagueId: number): Promise<{ id: number; date: string; lane_pair: string | null }[]> {
    return sequelize.query(
      `SELECT id, date, lane_pair FROM sessions WHERE league_id = :leagueId AND deleted_at IS NULL ORDER BY date, id`,
      { type: QueryTypes.SELECT, replacements: { leagueId } },
    );
  },
  /** Every delivery of those sessions, in the order thrown (for the game totals). */
  deliveriesOf(
    sessionIds: number[],
  ): Promise<{ session_id: number; game_number: number; frame: number; delivery: number; standing: number[]; foul: boolean }[]> {
    if (sessionIds.length === 0) return Promise.resolve([]);
    return sequelize.query(
      `SELECT session_id, game_number, frame, delivery, standing, foul FROM shots WHERE session_id IN (:sessionIds)
       ORDER BY session_id, game_number, frame, delivery`,
      { type: QueryTypes.SELECT, replacements: { sessionIds } },
    );
  },
};
