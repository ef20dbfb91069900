import { QueryTypes } from 'sequelize';
import { Ball, sequelize } from '../../models/index';

export interface UpkeepRow {
  id: number;
  name: string;
  nickname: string | null;
  surface_grit: number;
  polished: boolean;
  upkeep_resurface_games: number | null;
  upkeep_extraction_games: number | null;
  since_resurface: string | number;
  since_extraction: string | number;
}

/**
 * The rows upkeep reads: each of a bowler's balls in the bag with its games since the last resurface and oil
 * extraction — the count last set plus the games logged with it since (a game counts once per ball, in sessions
 * not deleted).
 */
export const upkeepRepository = {
  rowsOf(ownerId: number, ballId?: number): Promise<UpkeepRow[]> {
    return sequelize.query<UpkeepRow>(
      `SELECT b.id, b.name, b.nickname, b.surface_grit, b.polished, b.upkeep_resurface_games, b.upkeep_extraction_games,
              b.games_since_resurface + g.after_resurface AS since_resurface,
              b.games_since_extraction + g.after_extraction AS since_extraction
       FROM balls b
       LEFT JOIN LATERAL (
         SELECT COUNT(DISTINCT (sh.session_id, sh.game_number)) FILTER (WHERE sh.created_at > b.resurface_counted_at) AS after_resurface,
                COUNT(DISTINCT (sh.session_id, sh.game_number)) FILTER (WHERE sh.created_at > b.extraction_counted_at) AS after_extraction
         FROM shots sh JOIN sessions s ON s.id = sh.session_id AND s.deleted_at IS NULL
         WHERE sh.ball_id = b.id
       ) g ON TRUE
       WHERE b.owner_id = :ownerId AND b.deleted_at IS NULL AND b.status <> 'retired' ${ballId ? 'AND b.id = :ballId' : ''}
       ORDER BY b.name, b.id`,
      { type: QueryTypes.SELECT, replacements: { ownerId, ballId: ballId ?? null } },
    );
  },
  findOwned(ownerId: number, id: number): Promise<Ball | null> {
    return Ball.findOne({ where: { id, ownerId } });
  },
};
