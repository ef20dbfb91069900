import type { AuditEvent as AuditEventDto, Page, Role, User as UserDto, UserListQuery } from '../../../shared/auth';
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

  async listAudit(page: number, pageSize: number): Promise<Page<AuditEventDto>> {
    const { rows, count } = await adminRepository.auditPage(page, pageSize);
    return {
      items: rows.map((e) => ({
        id: Number(e.id),
        actorId: e.actorId,
        action: e.action,
        subjectType: e.subjectType,
        subjectId: e.subjectId,
        details: e.details,
        createdAt: e.createdAt.toISOString(),
      })),
      total: count,
      page,
      pageSize,
    };
  },
};
