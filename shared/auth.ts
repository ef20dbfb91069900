import { z } from 'zod';
import { isSafeName, UNSAFE_NAME_MESSAGE } from './text';

export const ROLES = ['bowler', 'coach', 'proprietor', 'admin'] as const;
export const RoleSchema = z.enum(ROLES);
export type Role = z.infer<typeof RoleSchema>;

/** Highest first: a user's `role` is the highest role they hold (the one existing screens and checks read). */
export const ROLE_RANK: readonly Role[] = ['admin', 'proprietor', 'coach', 'bowler'];

/** The highest role of a set (bowler for an empty one). */
export function primaryRole(roles: readonly Role[]): Role {
  return ROLE_RANK.find((r) => roles.includes(r)) ?? 'bowler';
}

/** Whether a user holds a role (any of their roles; `role` alone for a record without the set). */
export function holdsRole(user: { role: Role; roles?: readonly Role[] }, ...wanted: Role[]): boolean {
  const held = user.roles && user.roles.length ? user.roles : [user.role];
  return wanted.some((r) => held.includes(r));
}

/**
 * Which roles one account may hold together: a bowler, coach and proprietor may be any mix (a proprietor who bowls
 * in the league, a coach who owns a center); an admin account holds admin alone, so the power to change every
 * account is never mixed into a personal one (a second account bowls). Returns a message or null.
 */
export function roleSetProblem(roles: readonly Role[]): string | null {
  if (roles.length === 0) return 'Choose at least one role';
  if (new Set(roles).size !== roles.length) return 'A role is listed twice';
  if (roles.includes('admin') && roles.length > 1)
    return 'An admin account holds the admin role alone; use a second account to bowl, coach or run a center';
  return null;
}

/** PUT /api/admin/users/:id/roles: the whole set of roles the user holds after the change. */
export const RolesChangeSchema = z.object({
  roles: z
    .array(RoleSchema, { error: 'Roles must be a list' })
    .max(ROLES.length, `At most ${ROLES.length} roles`)
    .superRefine((roles, ctx) => {
      const problem = roleSetProblem(roles);
      if (problem) ctx.addIssue({ code: 'custom', message: problem });
    }),
});
export type RolesChange = z.infer<typeof RolesChangeSchema>;

export const PASSWORD_MIN_LENGTH = 10;

export const EmailSchema = z
  .string({ error: 'E-mail is required' })
  .trim()
  .toLowerCase()
  .max(254, 'E-mail is too long')
  .pipe(z.email({ error: 'Enter a valid e-mail address' }));

export const RegisterSchema = z.object({
  email: EmailSchema,
  password: z
    .string({ error: 'Password is required' })
    .min(PASSWORD_MIN_LENGTH, `Password must be at least ${PASSWORD_MIN_LENGTH} characters`)
    .max(128, 'Password must be at most 128 characters'),
  displayName: z
    .string({ error: 'Display name is required' })
    .trim()
    .min(1, 'Display name is required')
    .max(80, 'Display name must be at most 80 characters')
    .refine(isSafeName, UNSAFE_NAME_MESSAGE),
});
export type RegisterInput = z.infer<typeof RegisterSchema>;

export const LoginSchema = z.object({
  email: EmailSchema,
  password: z.string({ error: 'Password is required' }).min(1, 'Password is required').max(128),
});
export type LoginInput = z.infer<typeof LoginSchema>;

export const UserSchema = z.object({
  id: z.number().int(),
  email: z.string(),
  displayName: z.string(),
  role: RoleSchema,
  /** Every role the user holds (`role` is the highest of them). */
  roles: z.array(RoleSchema),
  /** Whether the user has followed the verification link mailed to their address. */
  emailVerified: z.boolean(),
  createdAt: z.string(),
});
export type User = z.infer<typeof UserSchema>;

export const AuthResponseSchema = z.object({ token: z.string(), user: UserSchema });
export type AuthResponse = z.infer<typeof AuthResponseSchema>;

/** The one answer to a sign-up, whether the address was new or already registered (nothing leaks): the next step is in the mail. */
export const RegisterResponseSchema = z.object({ ok: z.literal(true), message: z.string() });
export type RegisterResponse = z.infer<typeof RegisterResponseSchema>;

export const RoleChangeSchema = z.object({ role: RoleSchema });
export type RoleChange = z.infer<typeof RoleChangeSchema>;

export const IdParamSchema = z.object({
  id: z.coerce.number({ error: 'Must be a number' }).int('Must be a whole number').positive('Must be positive').max(2147483647),
});

export const PageQuerySchema = z.object({
  page: z.coerce.number().int().min(1).max(100000).default(1),
  pageSize: z.coerce.number().int().min(1).max(100).default(20),
});

export const UserListQuerySchema = PageQuerySchema.extend({
  q: z.string().trim().max(100).optional(),
  role: RoleSchema.optional(),
  sort: z.enum(['email', 'displayName', 'role', 'createdAt']).default('createdAt'),
  order: z.enum(['asc', 'desc']).default('asc'),
});
export type UserListQuery = z.infer<typeof UserListQuerySchema>;

export interface Page<T> {
  items: T[];
  total: number;
  page: number;
  pageSize: number;
}

/** An entry of the audit log. */
export const AuditEventSchema = z.object({
  id: z.number().int(),
  actorId: z.number().int().nullable(),
  /** The actor's display name (null for the system or a deleted user). */
  actorName: z.string().nullable(),
  /** A readable name of the subject where one is known (a user's or center's name, a ball's maker and name). */
  subjectName: z.string().nullable(),
  action: z.string(),
  subjectType: z.string(),
  subjectId: z.string(),
  details: z.record(z.string(), z.unknown()),
  createdAt: z.string(),
});
export type AuditEvent = z.infer<typeof AuditEventSchema>;

const isoDay = z.string().regex(/^\d{4}-\d{2}-\d{2}$/, 'A date as YYYY-MM-DD');

/** Filters of the audit log: who, which action, and days (inclusive, UTC). */
export const AuditQuerySchema = PageQuerySchema.extend({
  actorId: z.coerce.number({ error: 'Must be a number' }).int().positive().max(2147483647).optional(),
  action: z
    .string()
    .trim()
    .min(1)
    .max(64)
    .regex(/^[a-z_.]+$/, 'An action name such as user.roles_changed')
    .optional(),
  from: isoDay.optional(),
  to: isoDay.optional(),
}).refine((q) => !q.from || !q.to || q.from <= q.to, { path: ['to'], message: 'The end date must not be before the start date' });
export type AuditQuery = z.infer<typeof AuditQuerySchema>;

export const AuditActionsSchema = z.object({ items: z.array(z.string()) });

export const ForgotSchema = z.object({ email: EmailSchema });
export type ForgotInput = z.infer<typeof ForgotSchema>;

export const ResetSchema = z.object({
  token: z.string({ error: 'The reset token is missing' }).min(20, 'The reset token is not valid').max(200, 'The reset token is not valid'),
  password: RegisterSchema.shape.password,
});
export type ResetInput = z.infer<typeof ResetSchema>;

export const VerifyEmailSchema = z.object({
  token: z
    .string({ error: 'The verification token is missing' })
    .min(20, 'The verification token is not valid')
    .max(200, 'The verification token is not valid'),
});
export type VerifyEmailInput = z.infer<typeof VerifyEmailSchema>;
