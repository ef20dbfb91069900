import type { AuditEvent as AuditEventDto, AuditQuery, Page, Role, User as UserDto, UserListQuery } from '../../../shared/auth';
import { roleSetProblem } from '../../../shared/auth';
import { AppError } from '../../lib/AppError';
import { audit } from '../../lib/audit';
import { sequelize } from '../../models/index';
import { adminRepository } from './admin.repository';
import { toUserDto, userRepository } from '../auth/user.repository';

export const adminService = {
  async listUsers(q: UserListQuery): Promise<Page<UserDto>> {
    const { rows, count } = await userRepository.list(q);
    return { items: rows.map(toUserDto), total: count, page: q.page, pageSize: q.pageSize };
  },

  /** Grants a role; an admin cannot demote themselves (the last way back in would be lost). Audited. */
  async setRole(actorId: number, userId: number, role: Role): Promise<UserDto> {
    return sequelize.transaction(async (transaction) => {
      const user = await userRepository.findById(userId);
      if (!user) throw AppError.notFound('User');
      if (user.id === actorId && role !== 'admin') throw new AppError(409, 'self_demotion', 'You cannot remove your own admin role');
      const from = user.role;
      if (from !== role) {
        await userRepository.setRole(user, role, transaction);
        await audit(
          { actorId, action: 'user.role_changed', subjectType: 'user', subjectId: user.id, details: { from, to: role } },
          transaction,
        );
      }
      return toUserDto(user);
    });
  },

  /**
   * Replaces the set of roles a user holds (see `roleSetProblem` for the sets allowed). An admin cannot take the
   * admin role from themselves. Audited with the sets before and after.
   */
  async setRoles(actorId: number, userId: number, roles: Role[]): Promise<UserDto> {
    const problem = roleSetProblem(roles);
    if (problem) throw AppError.badRequest(problem, { 'body.roles': problem });
    return sequelize.transaction(async (transaction) => {
      const user = await userRepository.findById(userId, transaction, true);
      if (!user) throw AppError.notFound('User');
      if (user.id === actorId && !roles.includes('admin'))
        throw new AppError(409, 'self_demotion', 'You cannot remove your own admin role', { 'body.roles': 'Keep your admin role' });
      const from = [...user.roles].sort();
      const to = [...roles].sort();
      if (from.join() !== to.join()) {
        await userRepository.setRoles(user, to, transaction);
        await audit({ actorId, action: 'user.roles_changed', subjectType: 'user', subjectId: user.id, details: { from, to } }, transaction);
      }
      return toUserDto(user);
    });
  },

  async listAudit(q: AuditQuery): Promise<Page<AuditEventDto>> {
    const { rows, count } = await adminRepository.auditPage(q);
    const actorIds = [...new Set(rows.map((e) => e.actorId).filter((id): id is number => id !== null))];
    const [actors, subjects] = await Promise.all([
      userRepository.namesByIds(actorIds),
      adminRepository.subjectNames(rows.map((e) => ({ type: e.subjectType, id: e.subjectId }))),
    ]);
    return {
      items: rows.map((e) => ({
        id: Number(e.id),
        actorId: e.actorId,
        actorName: e.actorId === null ? null : (actors.get(e.actorId) ?? null),
        action: e.action,
        subjectType: e.subjectType,
        subjectId: e.subjectId,
        subjectName: subjects.get(`${e.subjectType}:${e.subjectId}`) ?? null,
        details: e.details,
        createdAt: e.createdAt.toISOString(),
      })),
      total: count,
      page: q.page,
      pageSize: q.pageSize,
    };
  },

  auditActions(): Promise<string[]> {
    return adminRepository.auditActions();
  },
};
