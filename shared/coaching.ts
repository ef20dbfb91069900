import { z } from 'zod';
import { isSafeName, UNSAFE_NAME_MESSAGE } from './text';
import { EmailSchema, PageQuerySchema } from './auth';
import { BallSchema } from './balls';
import { ProfileSchema } from './profile';

const queryId = z.coerce.number({ error: 'Must be a number' }).int('Must be a whole number').positive('Must be positive').max(2147483647);

export const InvitationCreateSchema = z.object({ email: EmailSchema }).strict();
export type InvitationCreate = z.infer<typeof InvitationCreateSchema>;

export const StudentParamSchema = z.object({ studentId: queryId });

export const PLAN_KINDS = ['surface', 'layout', 'line'] as const;
export type PlanKind = (typeof PLAN_KINDS)[number];

export const PlanCreateSchema = z
  .object({
    title: z
      .string({ error: 'A title is required' })
      .trim()
      .min(1, 'A title is required')
      .max(120, 'At most 120 characters')
      .refine(isSafeName, UNSAFE_NAME_MESSAGE),
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

export const COACH_LINK_STATUSES = ['pending', 'active', 'revoked'] as const;
export type CoachLinkStatus = (typeof COACH_LINK_STATUSES)[number];

export const PersonRefSchema = z.object({ id: z.number().int(), displayName: z.string(), email: z.string() });
export type PersonRef = z.infer<typeof PersonRefSchema>;

export const CoachLinkSchema = z.object({
  id: z.number().int(),
  coach: PersonRefSchema,
  /** null while the invited e-mail has no account yet. */
  student: PersonRefSchema.nullable(),
  email: z.string(),
  status: z.enum(COACH_LINK_STATUSES),
  createdAt: z.string(),
  acceptedAt: z.string().nullable(),
});
export type CoachLink = z.infer<typeof CoachLinkSchema>;

export const StudentSummarySchema = z.object({
  linkId: z.number().int(),
  student: PersonRefSchema,
  since: z.string(),
  sessions: z.number().int(),
  lastSessionDate: z.string().nullable(),
});
export type StudentSummary = z.infer<typeof StudentSummarySchema>;

export const StudentDetailSchema = z.object({ student: PersonRefSchema, profile: ProfileSchema, arsenal: z.array(BallSchema) });
export type StudentDetail = z.infer<typeof StudentDetailSchema>;

export const PlanSchema = z.object({
  id: z.number().int(),
  coachId: z.number().int(),
  coachName: z.string(),
  studentId: z.number().int(),
  title: z.string(),
  kind: z.enum(PLAN_KINDS),
  body: z.string(),
  ballId: z.number().int().nullable(),
  ballName: z.string().nullable(),
  createdAt: z.string(),
  /** The student's and the coach's answers, oldest first. */
  replies: z.array(
    z.object({ id: z.number().int(), authorId: z.number().int(), authorName: z.string(), text: z.string(), createdAt: z.string() }),
  ),
});
export type Plan = z.infer<typeof PlanSchema>;
export type PlanReply = Plan['replies'][number];

export const PlanReplyCreateSchema = z
  .object({ text: z.string({ error: 'Write your answer' }).trim().min(1, 'Write your answer').max(2000, 'At most 2000 characters') })
  .strict();
export type PlanReplyCreate = z.infer<typeof PlanReplyCreateSchema>;

export const AnnotationSchema = z.object({
  id: z.number().int(),
  sessionId: z.number().int(),
  authorId: z.number().int(),
  authorName: z.string(),
  gameNumber: z.number().int().nullable(),
  frame: z.number().int().nullable(),
  text: z.string(),
  createdAt: z.string(),
});
export type Annotation = z.infer<typeof AnnotationSchema>;
