import { z } from 'zod';
import { isSafeName, UNSAFE_NAME_MESSAGE } from './text';
import { EmailSchema, PageQuerySchema } from './auth';
import type { Ball } from './balls';
import type { Profile } from './profile';

const queryId = z.coerce.number({ error: 'Must be a number' }).int('Must be a whole number').positive('Must be positive').max(2147483647);

export const InvitationCreateSchema = z.object({ email: EmailSchema }).strict();
export type InvitationCreate = z.infer<typeof InvitationCreateSchema>;

export const StudentParamSchema = z.object({ studentId: queryId });

export const PLAN_KINDS = ['surface', 'layout', 'line'] as const;
export type PlanKind = (typeof PLAN_KINDS)[number];

export const PlanCreateSchema = z
  .object({
    title: z.string({ error: 'A title is required' }).trim().min(1, 'A title is required').max(120, 'At most 120 characters').refine(isSafeName, UNSAFE_NAME_MESSAGE),
    kind: z.enum(PLAN_KINDS, { error: 'Choose surface, layout or line' }),
    body: z.string({ error: 'Write the plan' }).trim().min(1, 'Write the plan').max(5000, 'At most 5000 characters'),
    ballId: z.number({ error: 'ballId must be an id (a number)' }).int().positive().max(2147483647).nullable().optional(),
  })
  .strict();
export type PlanCreate = z.infer<typeof PlanCreateSchema>;

export const AnnotationCreateSchema = z
  .object({
    text: z.string({ error: 'Write the note' }).trim().min(1, 'Write the note').max(2000, 'At most 2000 characters'),
    gameNumber: z.number({ error: 'gameNumber must be a number' }).int().min(1).max(50).nullable().optional(),
    frame: z.number({ error: 'frame must be a number' }).int().min(1, 'Frames are 1–10').max(10, 'Frames are 1–10').nullable().optional(),
  })
  .strict();
export type AnnotationCreate = z.infer<typeof AnnotationCreateSchema>;

export const CoachListQuerySchema = PageQuerySchema.extend({ pageSize: z.coerce.number().int().min(1).max(100).default(50) });

export type CoachLinkStatus = 'pending' | 'active' | 'revoked';

export interface PersonRef {
  id: number;
  displayName: string;
  email: string;
}

export interface CoachLink {
  id: number;
  coach: PersonRef;
  /** null while the invited e-mail has no account yet. */
  student: PersonRef | null;
  email: string;
  status: CoachLinkStatus;
  createdAt: string;
  acceptedAt: string | null;
}

export interface StudentSummary {
  linkId: number;
  student: PersonRef;
  since: string;
  sessions: number;
  lastSessionDate: string | null;
}

export interface StudentDetail {
  student: PersonRef;
  profile: Profile;
  arsenal: Ball[];
}

export interface Plan {
  id: number;
  coachId: number;
  coachName: string;
  studentId: number;
  title: string;
  kind: PlanKind;
  body: string;
  ballId: number | null;
  ballName: string | null;
  createdAt: string;
}

export interface Annotation {
  id: number;
  sessionId: number;
  authorId: number;
  authorName: string;
  gameNumber: number | null;
  frame: number | null;
  text: string;
  createdAt: string;
}
