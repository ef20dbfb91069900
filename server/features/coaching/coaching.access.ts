import type { Transaction } from 'sequelize';
import { holdsRole } from '../../../shared/auth';
import { AppError } from '../../lib/AppError';
import type { AuthUser } from '../../middleware/auth';
import { coachingRepository } from './coaching.repository';

/**
 * Who may read whose logs: a bowler their own; a coach a student whose invitation is accepted and not
 * revoked. Anyone else gets 404, so a student's existence never leaks.
 */
export async function isLinkedCoach(coach: AuthUser, studentId: number, transaction?: Transaction): Promise<boolean> {
  if (!holdsRole(coach, 'coach')) return false;
  const link = await coachingRepository.activeLink(coach.id, studentId, transaction);
  return link !== null;
}

/** The bowler whose data the request reads: the user, or `studentId` for their linked coach (else 404). */
export async function readableBowlerId(user: AuthUser, studentId: number | undefined): Promise<number> {
  if (studentId === undefined || studentId === user.id) return user.id;
  if (await isLinkedCoach(user, studentId)) return studentId;
  throw AppError.notFound('Student');
}
