import { Op, type CreationAttributes, type Transaction } from 'sequelize';
import { laneSurfaceText, type Center as CenterDto, type Condition as ConditionDto, type LaneSurface } from '../../../shared/centers';
import { Center, Condition, Follow, Lane, User } from '../../models/index';

export function toCenterDto(c: Center, following?: boolean): CenterDto {
  return {
    id: c.id,
    name: c.name,
    town: c.town,
    laneCount: c.laneCount,
    ownerId: c.ownerId,
    timeZone: c.timeZone,
    ...(following === undefined ? {} : { following }),
  };
}

/** The lane surface a publication names. */
export function laneOf(c: Pick<Condition, 'laneKind' | 'laneFriction'>): LaneSurface {
  return { kind: c.laneKind, friction: c.laneFriction };
}

export function toConditionDto(c: Condition, supersededBy: number | null = null): ConditionDto {
  const lane = laneOf(c);
  return {
    id: c.id,
    centerId: c.centerId,
    lanes: c.lanes,
    validFrom: c.validFrom,
    validTo: c.validTo,
    notes: c.notes,
    publishedAt: c.publishedAt.toISOString(),
    publishedBy: c.publishedBy,
    supersededBy,
    pattern: { id: c.patternId, name: c.patternName, sweeps: c.sweeps, summary: c.summary },
    lane,
    laneText: laneSurfaceText(lane),
    weekdays: c.weekdays && c.weekdays.length ? [...c.weekdays].sort((a, b) => a - b) : null,
  };
}

type FollowWith<K extends string, T> = Follow & Record<K, T>;

export const centersRepository = {
  create(data: CreationAttributes<Center>, transaction: Transaction): Promise<Center> {
    return Center.create(data, { transaction });
  },
  /** The center's lanes, numbered 1 to its lane count (replacing any there were). */
  async replaceLanes(c: Center, transaction: Transaction): Promise<void> {
    await Lane.destroy({ where: { centerId: c.id }, transaction });
    await Lane.bulkCreate(
      Array.from({ length: c.laneCount }, (_, i) => ({ centerId: c.id, number: i + 1, notes: null })),
      { transaction },
    );
  },
  createCondition(data: CreationAttributes<Condition>, transaction: Transaction): Promise<Condition> {
    return Condition.create(data, { transaction });
  },
  /** The center's followers with their address and name (the publication e-mails). */
  followersOf(centerId: number, transaction: Transaction): Promise<FollowWith<'user', User>[]> {
    return Follow.findAll({
      where: { centerId },
      include: [{ model: User, as: 'user', attributes: ['email', 'displayName'] }],
      transaction,
    }) as Promise<FollowWith<'user', User>[]>;
  },
  /** Follows a center; a follow ended by an e-mail unsubscribe comes back (with its link). */
  async follow(userId: number, centerId: number, unsubscribeToken: string): Promise<void> {
    const old = await Follow.findOne({ where: { userId, centerId }, paranoid: false });
    if (old?.deletedAt) await old.restore();
    else if (!old) await Follow.findOrCreate({ where: { userId, centerId }, defaults: { userId, centerId, unsubscribeToken } });
  },
  /** Unfollowing in the app removes the follow and its link for good. */
  async unfollow(userId: number, centerId: number): Promise<void> {
    await Follow.destroy({ where: { userId, centerId }, force: true });
  },
  /** The user's follows with their centers, in the order followed. */
  followsOf(userId: number): Promise<FollowWith<'center', Center>[]> {
    return Follow.findAll({ where: { userId }, include: [{ model: Center, as: 'center' }], order: [['id', 'ASC']] }) as Promise<
      FollowWith<'center', Center>[]
    >;
  },
  /** The follow behind an e-mail link, also when that link already unsubscribed it (`deletedAt` set). */
  followByToken(token: string, transaction?: Transaction): Promise<FollowWith<'center', Center> | null> {
    return Follow.findOne({
      where: { unsubscribeToken: token },
      include: [{ model: Center, as: 'center' }],
      paranoid: false,
      transaction,
    }) as Promise<FollowWith<'center', Center> | null>;
  },
  list(opts: { ownerId?: number; limit: number; offset: number }): Promise<{ rows: Center[]; count: number }> {
    return Center.findAndCountAll({
      where: opts.ownerId ? { ownerId: opts.ownerId } : {},
      order: [
        ['name', 'ASC'],
        ['id', 'ASC'],
      ],
      limit: opts.limit,
      offset: opts.offset,
    });
  },
  findById(id: number, transaction?: Transaction): Promise<Center | null> {
    return Center.findByPk(id, { transaction });
  },
  /** A publication with its center, or null. */
  findConditionById(id: number): Promise<Condition | null> {
    return Condition.findByPk(id);
  },
  findCondition(id: number): Promise<(Condition & { center: Center }) | null> {
    return Condition.findByPk(id, { include: [{ model: Center, as: 'center' }] }) as Promise<(Condition & { center: Center }) | null>;
  },
  /**
   * The publications of one center or several that may still be in force on or after `fromDay` (open-ended, or
   * ending on or after it), oldest first.
   */
  scheduledFrom(centerId: number | number[], fromDay: string): Promise<Condition[]> {
    return Condition.findAll({
      where: { centerId, [Op.or]: [{ validTo: null }, { validTo: { [Op.gte]: fromDay } }] },
      order: [
        ['publishedAt', 'ASC'],
        ['id', 'ASC'],
      ],
    });
  },
  history(centerId: number, limit: number, offset: number): Promise<{ rows: Condition[]; count: number }> {
    return Condition.findAndCountAll({
      where: { centerId },
      order: [
        ['publishedAt', 'DESC'],
        ['id', 'DESC'],
      ],
      limit,
      offset,
    });
  },
  /** Later publications of the center (for working out which ones replaced an earlier one). */
  publishedAfter(centerId: number, after: Date): Promise<Condition[]> {
    return Condition.findAll({
      where: { centerId, publishedAt: { [Op.gt]: after } },
      order: [
        ['publishedAt', 'ASC'],
        ['id', 'ASC'],
      ],
    });
  },
  followedIds(userId: number): Promise<Set<number>> {
    return Follow.findAll({ where: { userId }, attributes: ['centerId'] }).then((rows) => new Set(rows.map((r) => r.centerId)));
  },
};
