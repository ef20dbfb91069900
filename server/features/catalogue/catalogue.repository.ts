import { Op, type Transaction, type WhereOptions } from 'sequelize';
import type { BallModel as BallModelDto, BallModelInput, CatalogueQuery } from '../../../shared/balls';
import { BallModel } from '../../models/index';

export function toBallModelDto(m: BallModel): BallModelDto {
  return {
    id: m.id,
    maker: m.maker,
    name: m.name,
    coverType: m.coverType,
    coreType: m.coreType,
    rg: m.rg,
    differential: m.differential,
    intermediateDifferential: m.intermediateDifferential,
    factoryGrit: m.factoryGrit,
    factoryPolished: m.factoryPolished,
    hardnessD: m.hardnessD,
    releaseYear: m.releaseYear,
    version: m.version,
  };
}

/** Escapes LIKE wildcards in user text. */
export function likeText(q: string): string {
  return `%${q.replace(/[\\%_]/g, (c) => `\\${c}`)}%`;
}

export const catalogueRepository = {
  list(q: CatalogueQuery): Promise<{ rows: BallModel[]; count: number }> {
    const where: Record<string | symbol, unknown> = {};
    if (q.coverType) where.coverType = q.coverType;
    if (q.coreType) where.coreType = q.coreType;
    if (q.rgMin !== undefined || q.rgMax !== undefined)
      where.rg = { ...(q.rgMin !== undefined ? { [Op.gte]: q.rgMin } : {}), ...(q.rgMax !== undefined ? { [Op.lte]: q.rgMax } : {}) };
    if (q.diffMin !== undefined || q.diffMax !== undefined)
      where.differential = {
        ...(q.diffMin !== undefined ? { [Op.gte]: q.diffMin } : {}),
        ...(q.diffMax !== undefined ? { [Op.lte]: q.diffMax } : {}),
      };
    if (q.q) where[Op.or] = [{ maker: { [Op.iLike]: likeText(q.q) } }, { name: { [Op.iLike]: likeText(q.q) } }];
    return BallModel.findAndCountAll({
      where: where as WhereOptions<BallModel>,
      order: [
        [q.sort, q.order.toUpperCase()],
        ['id', 'ASC'],
      ],
      limit: q.pageSize,
      offset: (q.page - 1) * q.pageSize,
    });
  },
  findById(id: number, transaction?: Transaction): Promise<BallModel | null> {
    return BallModel.findByPk(id, { transaction });
  },
  create(data: BallModelInput, transaction?: Transaction): Promise<BallModel> {
    return BallModel.create({ ...data, hardnessD: data.hardnessD ?? null, releaseYear: data.releaseYear ?? null }, { transaction });
  },
  bulkCreate(rows: BallModelInput[], transaction: Transaction): Promise<BallModel[]> {
    return BallModel.bulkCreate(
      rows.map((d) => ({ ...d, hardnessD: d.hardnessD ?? null, releaseYear: d.releaseYear ?? null })),
      { transaction },
    );
  },
};
