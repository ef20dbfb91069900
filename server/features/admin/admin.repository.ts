import { AuditEvent } from '../../models/index';
import { newestFirstPage } from '../../db/paging';

export const adminRepository = {
  /** The audit log, newest first. */
  auditPage(page: number, pageSize: number): Promise<{ rows: AuditEvent[]; count: number }> {
    return AuditEvent.findAndCountAll({
      ...newestFirstPage(page, pageSize),
    });
  },
};
