import { Op, QueryTypes, type CreationAttributes, type InferAttributes, type Transaction } from 'sequelize';
import type { z } from 'zod';
import type { ArsenalQuery, Ball as BallDto, BallByHandSchema, SurfaceEvent as SurfaceEventDto } from '../../../shared/balls';
import { config } from '../../config/index';
import { ScopedCache } from '../../lib/changeFeed';
import { Ball, sequelize, SurfaceEvent, Upload, type BallModel } from '../../models/index';
import { likeText } from '../catalogue/catalogue.repository';

export function toSurfaceEventDto(e: SurfaceEvent): SurfaceEventDto {
  return {
    id: e.id,
    fromGrit: e.fromGrit,
    fromPolished: e.fromPolished,
    toGrit: e.toGrit,
    toPolished: e.toPolished,
    at: e.at.toISOString(),
    byUserId: e.byUserId,
    note: e.note,
  };
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
    ...(b.surfaceEvents
      ? { surfaceHistory: [...b.surfaceEvents].sort((x, y) => x.at.getTime() - y.at.getTime() || x.id - y.id).map(toSurfaceEventDto) }
      : {}),
  };
}

type BallCreation = CreationAttributes<Ball>;

/** A ball's specs as copied from a catalogue model (the owner's own choices — weight, surface, layout — come apart). */
export function catalogueSpecsOf(
  m: BallModel,
): Pick<
  BallCreation,
  | 'ballModelId'
  | 'name'
  | 'maker'
  | 'rg'
  | 'differential'
  | 'intermediateDifferential'
  | 'coverType'
  | 'coreType'
  | 'hardnessD'
  | 'approvalYear'
> {
  return {
    ballModelId: m.id,
    name: m.name,
    maker: m.maker,
    rg: m.rg,
    differential: m.differential,
    intermediateDifferential: m.intermediateDifferential,
    coverType: m.coverType,
    coreType: m.coreType,
    hardnessD: m.hardnessD,
    approvalYear: m.releaseYear,
  };
}

/** The row of a hand-entered ball (no catalogue model, no maker). */
export function handEnteredBall(ownerId: number, input: z.infer<typeof BallByHandSchema>): BallCreation {
  return {
    ownerId,
    ballModelId: null,
    name: input.name,
    maker: null,
    nickname: input.nickname ?? null,
    weightLb: input.weightLb,
    rg: input.rg,
    differential: input.differential,
    intermediateDifferential: input.intermediateDifferential,
    coverType: input.coverType,
    coreType: input.coreType,
    hardnessD: input.hardnessD ?? null,
    surfaceGrit: input.surfaceGrit,
    polished: input.polished,
    layout: input.layout ?? null,
    gamesSinceResurface: input.gamesSinceResurface,
    status: input.status,
  };
}

/** The columns toBallDto reads, named as the model's attributes. */
const BALL_COLUMNS = [
  'id',
  'ball_model_id AS "ballModelId"',
  'maker',
  'name',
  'nickname',
  'weight_lb AS "weightLb"',
  'rg',
  'differential',
  'intermediate_differential AS "intermediateDifferential"',
  'cover_type AS "coverType"',
  'core_type AS "coreType"',
  'hardness_d AS "hardnessD"',
  'approval_year AS "approvalYear"',
  'surface_grit AS "surfaceGrit"',
  'polished',
  'layout',
  'photo_upload_id AS "photoUploadId"',
  'games_since_resurface AS "gamesSinceResurface"',
  'status',
  'version',
  'created_at AS "createdAt"',
  'updated_at AS "updatedAt"',
].join(', ');

/** The sorts the arsenal list offers, as columns (each has an index led by owner_id). */
const ARSENAL_SORT: Record<ArsenalQuery['sort'], string> = {
  name: 'name',
  coverType: 'cover_type',
  rg: 'rg',
  differential: 'differential',
  surfaceGrit: 'surface_grit',
  gamesSinceResurface: 'games_since_resurface',
  createdAt: 'created_at',
};

/**
 * Each owner's arsenal pages as answered (server/lib/changeFeed.ts: dropped when any of the owner's balls changes,
 * in this process when the change commits, in the others by the database's change feed).
 */
export const arsenalPages = new ScopedCache<{ rows: BallRow[]; count: number }>('balls', { ttlMs: config.CACHE_TTL_MS, maxIds: 5_000 });

// Every saved, deleted or restored ball drops its owner's pages when the change commits.
const forgetOwner = (b: Ball, options: { transaction?: Transaction | null }) => {
  arsenalPages.invalidate(b.ownerId);
  options.transaction?.afterCommit(() => arsenalPages.invalidate(b.ownerId));
};
for (const hook of ['afterSave', 'afterDestroy', 'afterRestore'] as const) Ball.addHook(hook, forgetOwner);
Ball.addHook('afterBulkCreate', (balls: Ball[], options: { transaction?: Transaction | null }) => {
  for (const b of balls) forgetOwner(b, options);
});

export const arsenalRepository = {
  /**
   * One page of the owner's arsenal and the total, as plain rows (no model instances: building them cost more than the
   * query). The page reads only its rows in sort order (an index per sort, migration 20261222-0010); the total is
   * counted apart from it.
   */
  async list(ownerId: number, q: ArsenalQuery): Promise<{ rows: BallRow[]; count: number }> {
    const conds = ['owner_id = :ownerId', 'deleted_at IS NULL'];
    if (q.coverType) conds.push('cover_type = :coverType');
    if (q.status) conds.push('status = :status');
    if (q.q) conds.push('(name ILIKE :like OR nickname ILIKE :like OR maker ILIKE :like)');
    const where = conds.join(' AND ');
    const replacements = {
      ownerId,
      coverType: q.coverType ?? null,
      status: q.status ?? null,
      like: q.q ? likeText(q.q) : null,
      limit: q.pageSize,
      offset: (q.page - 1) * q.pageSize,
    };
    const [rows, counted] = await Promise.all([
      sequelize.query<BallRow>(
        `SELECT ${BALL_COLUMNS} FROM balls WHERE ${where} ORDER BY ${ARSENAL_SORT[q.sort]} ${q.order === 'desc' ? 'DESC' : 'ASC'}, id ASC LIMIT :limit OFFSET :offset`,
        { replacements, type: QueryTypes.SELECT },
      ),
      sequelize.query<{ n: number }>(`SELECT count(*)::int AS n FROM balls WHERE ${where}`, { replacements, type: QueryTypes.SELECT }),
    ]);
    return { rows, count: counted[0]?.n ?? 0 };
  },
  /** The owner's ball, or null (also for another owner's ball, so existence never leaks). */
  findOwned(
    ownerId: number,
    id: number,
    opts: { withHistory?: boolean; transaction?: Transaction; paranoid?: boolean } = {},
  ): Promise<Ball | null> {
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
  /** Adds a ball with its first surface event, which records the surface it starts on. */
  async createWithFirstSurface(data: BallCreation, note: string | null, transaction?: Transaction): Promise<Ball> {
    const ball = await Ball.create(data, { transaction });
    await SurfaceEvent.create(
      {
        ballId: ball.id,
        fromGrit: null,
        fromPolished: null,
        toGrit: ball.surfaceGrit,
        toPolished: ball.polished,
        at: new Date(),
        byUserId: data.ownerId,
        note,
      },
      { transaction },
    );
    return ball;
  },
  /** The owner's balls of these ids, removed ones too (a logged shot or a trial still names them). */
  findOwnedManyEvenRemoved(ownerId: number, ids: number[]): Promise<Ball[]> {
    return Ball.findAll({ where: { ownerId, id: { [Op.in]: ids } }, paranoid: false });
  },
};
