import { Op, type WhereOptions } from 'sequelize';
import type { AuditQuery } from '../../../shared/auth';
import { AuditEvent, BallModel, Center, sequelize, User } from '../../models/index';
import { newestFirstPage } from '../../db/paging';

/** The day after an ISO date (YYYY-MM-DD), as the exclusive end of a day range in UTC. */
function dayAfter(day: string): Date {
  const d = new Date(`${day}T00:00:00.000Z`);
  d.setUTCDate(d.getUTCDate() + 1);
  return d;
}

export const adminRepository = {
  /** The audit log, newest first, filtered by actor, action and days (UTC, both ends included). */
  auditPage(q: AuditQuery): Promise<{ rows: AuditEvent[]; count: number }> {
    const where: Record<string | symbol, unknown> = {};
    if (q.actorId !== undefined) where.actorId = q.actorId;
    if (q.action) where.action = q.action;
    if (q.from || q.to)
      where.createdAt = {
        ...(q.from ? { [Op.gte]: new Date(`${q.from}T00:00:00.000Z`) } : {}),
        ...(q.to ? { [Op.lt]: dayAfter(q.to) } : {}),
      };
    return AuditEvent.findAndCountAll({ where: where as WhereOptions<AuditEvent>, ...newestFirstPage(q.page, q.pageSize) });
  },
  /** Every action name the log holds, alphabetically (the filter's choices). */
  async auditActions(): Promise<string[]> {
    const rows = await AuditEvent.findAll({
      attributes: [[sequelize.fn('DISTINCT', sequelize.col('action')), 'action']],
      order: [['action', 'ASC']],
      raw: true,
    });
    return rows.map((r) => r.action);
  },
  /** Readable names of the subjects a page of the log mentions, keyed `type:id`. */
  async subjectNames(subjects: { type: string; id: string }[]): Promise<Map<string, string>> {
    const ids = (type: string) => [...new Set(subjects.filter((s) => s.type === type && /^\d+$/.test(s.id)).map((s) => Number(s.id)))];
    const out = new Map<string, string>();
    const userIds = ids('user');
    if (userIds.length)
      for (const u of await User.findAll({ where: { id: userIds }, attributes: ['id', 'displayName'] }))
        out.set(`user:${u.id}`, u.displayName);
    const centerIds = ids('center');
    if (centerIds.length)
      for (const c of await Center.findAll({ where: { id: centerIds }, attributes: ['id', 'name'] })) out.set(`center:${c.id}`, c.name);
    const ballIds = ids('ball_model');
    if (ballIds.length)
      for (const b of await BallModel.findAll({ where: { id: ballIds }, attributes: ['id', 'maker', 'name'] }))
        out.set(`ball_model:${b.id}`, `${b.maker} ${b.name}`);
    return out;
  },
};
