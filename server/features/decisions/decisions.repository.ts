import { Op, type CreationAttributes } from 'sequelize';
import { Ball, BallModel, Pattern, Trial } from '../../models/index';
import { NEWEST_FIRST } from '../../db/paging';

/** The rows the decisions read and write: trials, the balls a coverage weighs, the catalogue it suggests from, pattern names. */
export const decisionsRepository = {
  findTrial(id: number): Promise<Trial | null> {
    return Trial.findByPk(id);
  },
  /** A bowler's newest trials, at most `limit`. */
  trialsOf(userId: number, limit: number): Promise<Trial[]> {
    return Trial.findAll({
      where: { userId },
      order: NEWEST_FIRST,
      limit,
    });
  },
  createTrial(data: CreationAttributes<Trial>): Promise<Trial> {
    return Trial.create(data);
  },
  /** The names of these patterns, by id (a deleted pattern is left out). */
  async patternNames(ids: number[]): Promise<Map<number, string>> {
    if (ids.length === 0) return new Map();
    const rows = await Pattern.findAll({ where: { id: { [Op.in]: ids } }, attributes: ['id', 'name'] });
    return new Map(rows.map((p) => [p.id, p.name]));
  },
  /** The owner's balls that are not retired, in the order they were added. */
  activeBalls(ownerId: number): Promise<Ball[]> {
    return Ball.findAll({ where: { ownerId, status: { [Op.ne]: 'retired' } }, order: [['id', 'ASC']] });
  },
  /** Every catalogue model, in id order. */
  catalogue(): Promise<BallModel[]> {
    return BallModel.findAll({ order: [['id', 'ASC']] });
  },
};
