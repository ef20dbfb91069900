import { Op, type CreationAttributes, type Transaction, type WhereOptions } from 'sequelize';
import type { PatternListItem, PatternQuery } from '../../../shared/patterns';
import { Center, Pattern, sequelize, User } from '../../models/index';
import { likeText } from '../catalogue/catalogue.repository';

export function toPatternListItem(p: Pattern): PatternListItem {
  return {
    id: p.id,
    name: p.name,
    description: p.description,
    ownerId: p.ownerId,
    ownerName: p.owner?.displayName ?? null,
    visibility: p.visibility,
    centerId: p.centerId,
    summary: p.summary,
    version: p.version,
    createdAt: p.createdAt.toISOString(),
  };
}

const SORT_COLUMNS: Record<PatternQuery['sort'], string> = {
  name: '"Pattern"."name"',
  createdAt: '"Pattern"."created_at"',
  lengthFt: `("Pattern"."summary"->>'lengthFt')::float`,
  volumeMl: `("Pattern"."summary"->>'volumeMl')::float`,
};

const withOwner = { model: User, as: 'owner', attributes: ['displayName'] };

/**
 * The patterns a user may see: published ones, their own, and those shared with a center they run. `null`
 * (an admin) sees every pattern.
 */
export function visibleWhere(viewerId: number | null): Record<string | symbol, unknown> {
  if (viewerId === null) return {};
  return {
    [Op.or]: [
      { visibility: 'published' },
      { ownerId: viewerId },
      {
        visibility: 'shared',
        centerId: { [Op.in]: sequelize.literal(`(SELECT id FROM centers WHERE owner_id = ${Number(viewerId)})`) },
      },
    ],
  };
}

export const patternsRepository = {
  /** A page of the patterns `viewerId` may see (null: all, for an admin). */
  list(q: PatternQuery, viewerId: number | null, callerId: number): Promise<{ rows: Pattern[]; count: number }> {
    const where: Record<string | symbol, unknown> = {};
    if (q.q) where.name = { [Op.iLike]: likeText(q.q) };
    for (const k of ['lengthClass', 'volumeClass', 'ratioClass'] as const) if (q[k]) where[`summary.${k}`] = q[k];
    if (q.visibility) where.visibility = q.visibility;
    if (q.mine === 'true') where.ownerId = callerId;
    return Pattern.findAndCountAll({
      where: { [Op.and]: [where, visibleWhere(viewerId)] } as WhereOptions<Pattern>,
      include: [withOwner],
      order: [
        [Pattern.sequelize!.literal(SORT_COLUMNS[q.sort]), q.order.toUpperCase()],
        ['id', 'ASC'],
      ],
      limit: q.pageSize,
      offset: (q.page - 1) * q.pageSize,
    });
  },
  findById(id: number, transaction?: Transaction): Promise<Pattern | null> {
    return Pattern.findByPk(id, { transaction, include: [withOwner] });
  },
  /** The owner's pattern of this name (letter case ignored), other than `exceptId`. */
  findByOwnerAndName(ownerId: number, name: string, exceptId?: number, transaction?: Transaction): Promise<Pattern | null> {
    return Pattern.findOne({
      where: {
        [Op.and]: [
          { ownerId },
          sequelize.where(sequelize.fn('lower', sequelize.col('name')), name.toLowerCase()),
          ...(exceptId ? [{ id: { [Op.ne]: exceptId } }] : []),
        ],
      },
      transaction,
    });
  },
  /** The owner's pattern names starting with `base` (letter case ignored), to find a free "… (2)". */
  async namesLike(ownerId: number, base: string): Promise<Set<string>> {
    const rows = await Pattern.findAll({
      where: { ownerId, name: { [Op.iLike]: likeText(base).slice(1) } },
      attributes: ['name'],
    });
    return new Set(rows.map((r) => r.name.toLowerCase()));
  },
  /** Whether the user runs the center (the staff a shared pattern is shown to). */
  async runsCenter(userId: number, centerId: number): Promise<boolean> {
    return (await Center.count({ where: { id: centerId, ownerId: userId } })) > 0;
  },
  centerExists(centerId: number, transaction?: Transaction): Promise<Center | null> {
    return Center.findByPk(centerId, { transaction });
  },
  create(data: CreationAttributes<Pattern>, transaction?: Transaction): Promise<Pattern> {
    return Pattern.create(data, { transaction });
  },
};
