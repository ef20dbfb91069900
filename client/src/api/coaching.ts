import {
  PLAN_KINDS,
  type CoachLink,
  type Plan,
  type PlanCreate,
  type PlanKind,
  type PlanReplyCreate,
  type PersonRef,
  type StudentDetail,
  type StudentSummary,
} from '@shared/coaching';
import { api } from './client';

export { PLAN_KINDS };
export type { CoachLink, Plan, PlanKind, PersonRef, StudentDetail };
export type StudentRow = StudentSummary;
export type PlanInput = PlanCreate;

export const PLAN_KIND_LABELS: Record<PlanKind, string> = { surface: 'Surface', layout: 'Layout', line: 'Line' };

export const coachingApi = {
  /** Coach only; the invitee gets an e-mail. */
  invite: (email: string) => api.post<{ item: CoachLink }>('/coach/invitations', { email }),
  /** Every pending or active link where I am the coach or the student. */
  links: (signal?: AbortSignal) => api.get<{ items: CoachLink[] }>('/coach/links', { signal }),
  /** The invited student only. */
  accept: (id: number) => api.post<{ item: CoachLink }>(`/coach/links/${id}/accept`),
  /** Either side. */
  revoke: (id: number) => api.delete<null>(`/coach/links/${id}`),
  students: (signal?: AbortSignal) => api.get<{ items: StudentRow[] }>('/coach/students', { signal }),
  /** A linked coach only (else 404). */
  student: (studentId: number, signal?: AbortSignal) => api.get<{ item: StudentDetail }>(`/coach/students/${studentId}`, { signal }),
  studentPlans: (studentId: number, signal?: AbortSignal) => api.get<{ items: Plan[] }>(`/coach/students/${studentId}/plans`, { signal }),
  sendPlan: (studentId: number, body: PlanInput) => api.post<{ item: Plan }>(`/coach/students/${studentId}/plans`, body),
  /** My plans as a student, newest first. */
  myPlans: (signal?: AbortSignal) => api.get<{ items: Plan[] }>('/plans', { signal }),
  /** Answer a plan (its student or its coach). */
  replyToPlan: (planId: number, body: PlanReplyCreate) => api.post<{ item: Plan }>(`/plans/${planId}/replies`, body),
};
