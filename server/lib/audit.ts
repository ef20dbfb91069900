import type { Transaction } from 'sequelize';
import { AuditEvent } from '../models/index';

/** Records an audit event (role changes, publications, orders, refunds). */
export async function audit(
  entry: { actorId: number | null; action: string; subjectType: string; subjectId: string | number; details?: Record<string, unknown> },
  transaction?: Transaction,
): Promise<void> {
  await AuditEvent.create(
    {
      actorId: entry.actorId,
      action: entry.action,
      subjectType: entry.subjectType,
      subjectId: String(entry.subjectId),
      details: entry.details ?? {},
    },
    { transaction },
  );
}
