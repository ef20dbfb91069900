import { Op, type CreationAttributes, type Transaction, type WhereOptions } from 'sequelize';
import type { PatternListItem, PatternQuery } from '../../../shared/patterns';
import { Pattern } from '../../models/index';
import { likeText } from '../catalogue/catalogue.repository';

export function toPatternListItem(p: Pattern): PatternListItem {
  return {
    id: p.id,
    name: p.name,
    description: p.description,
    ownerId: p.ownerId,
    summary: p.summary,
    version: p.version,
    createdAt: p.createdAt.toISOString(),
  };
}

const SORT_COLUMNS: Record<PatternQuery['sort'], string> = {
  name: 'name',
  createdAt: 'created_at',
  lengthFt: "(summary->>'lengthFt')::float",
  volumeMl: "(summary->>'volumeMl')::float",
};

export const patternsRepository = {
  list(q: PatternQuery): Promise<{ rows: Pattern[]; count: number }> {
    const where: Record<string | symbol, unknown> = {};
    if (q.q) where.name = { [Op.iLike]: likeText(q.q) };
    for (const k of ['lengthClass', 'volumeClass', 'ratioClass'] as const) if (q[k]) where[`summary.${k}`] = q[k];
    return Pattern.findAndCountAll({
      where: where as WhereOptions<Pattern>,
      order: [
        [Pattern.sequelize!.literal(SORT_COLUMNS[q.sort]), q.order.toUpperCase()],
        ['id', 'ASC'],
      ],
      limit: q.pageSize,
      offset: (q.page - 1) * q.pageSize,
    });
  },
  findById(id: number, transaction?: Transaction): Promise<Pattern | null> {
    return Pattern.findByPk(id, { transaction });
  },
  create(data: CreationAttributes<Pattern>, transaction?: Transaction): Promise<Pattern> {
    return Pattern.create(data, { transaction });
  },
};
