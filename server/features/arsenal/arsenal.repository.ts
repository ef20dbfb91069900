import { Op, literal, type CreationAttributes, type InferAttributes, type Transaction, type WhereOptions } from 'sequelize';
import type { ArsenalQuery, Ball as BallDto, SurfaceEvent as SurfaceEventDto } from '../../../shared/balls';
import { Ball, SurfaceEvent, Upload } from '../../models/index';
import { likeText } from '../catalogue/catalogue.repository';

export function toSurfaceEventDto(e: SurfaceEvent): SurfaceEventDto {
  return { id: e.id, fromGrit: e.fromGrit, fromPolished: e.fromPolished, toGrit: e.toGrit, toPolished: e.toPolished, at: e.at.toISOString(), byUserId: e.byUserId, note: e.note };
}

/** The attributes toBallDto reads: a model instance or a raw row of the same attributes. */
type BallRow = Pick<Ball, Exclude<keyof InferAttributes<Ball>, 'ownerId' | 'deletedAt'>> & { surfaceEvents?: SurfaceEvent[] };

export function toBallDto(b: BallRow): BallDto {
  return {
    id: b.id,
    ballModelId: b.ballModelId,
    maker: b.maker,
    name: b.name,
    nickname: b.nickname,
    weightLb: b.weightLb,
    rg: b.rg,
    differential: b.differential,
    intermediateDifferential: b.intermediateDifferential,
    coverType: b.coverType,
    coreType: b.coreType,
    hardnessD: b.hardnessD,
    approvalYear: b.approvalYear ?? null,
    surfaceGrit: b.surfaceGrit,
    polished: b.polished,
    layout: b.layout,
    gamesSinceResurface: b.gamesSinceResurface,
    status: b.status,
    hasPhoto: b.photoUploadId != null,
    version: b.version,
    createdAt: b.createdAt.toISOString(),
    updatedAt: b.updatedAt.toISOString(),
    ...(b.surfaceEvents ? { surfaceHistory: [...b.surfaceEvents].sort((x, y) => x.at.getTime() - y.at.getTime() || x.id - y.id).map(toSurfaceEventDto) } : {}),
  };
}

type BallCreation = CreationAttributes<Ball>;

export const arsenalRepository = {
  /** One page and the total in one query (COUNT(*) OVER ()), as plain rows: the arsenal list is the hottest read. */
  async list(ownerId: number, q: ArsenalQuery): Promise<{ rows: BallRow[]; count: number }> {
    const where: Record<string | symbol, unknown> = { ownerId };
    if (q.coverType) where.coverType = q.coverType;
    if (q.status) where.status = q.status;
    if (q.q) where[Op.or] = [{ name: { [Op.iLike]: likeText(q.q) } }, { nickname: { [Op.iLike]: likeText(q.q) } }, { maker: { [Op.iLike]: likeText(q.q) } }];
    const rows = (await Ball.findAll({
      where: where as WhereOptions<Ball>,
      attributes: { include: [[literal('COUNT(*) OVER ()'), 'fullCount']] },
      order: [[q.sort, q.order.toUpperCase()], ['id', 'ASC']],
      limit: q.pageSize,
      offset: (q.page - 1) * q.pageSize,
      raw: true,
    })) as unknown as (BallRow & { fullCount: string })[];
    // Past the last page there is no row to carry the total: count separately.
    const count = rows.length ? Number(rows[0].fullCount) : await Ball.count({ where: where as WhereOptions<Ball> });
    return { rows, count };
  },
  /** The owner's ball, or null (also for another owner's ball, so existence never leaks). */
  findOwned(ownerId: number, id: number, opts: { withHistory?: boolean; transaction?: Transaction; paranoid?: boolean } = {}): Promise<Ball | null> {
    return Ball.findOne({
      where: { id, ownerId },
      include: opts.withHistory ? [{ model: SurfaceEvent, as: 'surfaceEvents' }] : [],
      transaction: opts.transaction,
      paranoid: opts.paranoid ?? true,
    });
  },
  /** Locks a ball of the owner for the rest of the transaction, a removed one too (a shop's work on it still lands). */
  lockOwnedEvenRemoved(ownerId: number, id: number, transaction: Transaction): Promise<Ball | null> {
    return Ball.findOne({ where: { id, ownerId }, paranoid: false, transaction, lock: transaction.LOCK.UPDATE });
  },
  /** A stored upload (a ball's photo). */
  upload(id: number): Promise<Upload | null> {
    return Upload.findByPk(id);
  },
  createUpload(data: CreationAttributes<Upload>, transaction: Transaction): Promise<Upload> {
    return Upload.create(data, { transaction });
  },
  findOwnedMany(ownerId: number, ids?: number[]): Promise<Ball[]> {
    return Ball.findAll({ where: { ownerId, ...(ids ? { id: ids } : {}) }, order: [['id', 'ASC']] });
  },
  create(data: BallCreation, transaction?: Transaction): Promise<Ball> {
    return Ball.create(data, { transaction });
  },
  bulkCreate(rows: BallCreation[], transaction: Transaction): Promise<Ball[]> {
    return Ball.bulkCreate(rows, { transaction });
  },
  addSurfaceEvent(data: CreationAttributes<SurfaceEvent>, transaction?: Transaction): Promise<SurfaceEvent> {
    return SurfaceEvent.create(data, { transaction });
  },
};
