import { AuditEvent } from '../../models/index';

export const adminRepository = {
  /** The audit log, newest first. */
  auditPage(page: number, pageSize: number): Promise<{ rows: AuditEvent[]; count: number }> {
    return AuditEvent.findAndCountAll({
      order: [
        ['createdAt', 'DESC'],
        ['id', 'DESC'],
      ],
      limit: pageSize,
      offset: (page - 1) * pageSize,
    });
  },
};
