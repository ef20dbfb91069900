import { z } from 'zod';
import { LoginSchema, RegisterSchema, ForgotSchema, ResetSchema, VerifyEmailSchema, IdParamSchema, RoleChangeSchema, UserListQuerySchema, PageQuerySchema } from '../../../shared/auth';
import { ProfileUpdateSchema } from '../../../shared/profile';
import { ArsenalQuerySchema, BallCreateSchema, BallModelInputSchema, BallModelPatchSchema, BallPatchSchema, CatalogueQuerySchema, SurfaceChangeSchema } from '../../../shared/balls';
import { PatternInputSchema, PatternPatchSchema, PatternQuerySchema } from '../../../shared/patterns';
import { MatchupRequestSchema } from '../../../shared/matchups';
import { CenterInputSchema, CenterPatchSchema, PublishConditionSchema } from '../../../shared/centers';
import { CalibrationQuerySchema, SessionCreateSchema, SessionListQuerySchema, SessionPatchSchema, ShotCreateSchema, ShotParamsSchema, StatsQuerySchema } from '../../../shared/sessions';
import { AnnotationCreateSchema, CoachListQuerySchema, InvitationCreateSchema, PlanCreateSchema, StudentParamSchema } from '../../../shared/coaching';
import { LayoutLabSchema, TrialCreateSchema, TrialListQuerySchema } from '../../../shared/decisions';
import { CenterOrderQuerySchema, OrderCreateSchema, OrderListQuerySchema, OrderStatusChangeSchema, ServiceInputSchema, ServiceListQuerySchema, ServiceParamsSchema, ServicePatchSchema, TakingsQuerySchema } from '../../../shared/shop';

type Who = 'public' | 'metrics token' | 'signed-in' | 'coach, proprietor, admin' | 'admin' | 'coach' | 'owner or linked coach';

interface RouteDoc {
  method: 'get' | 'post' | 'put' | 'patch' | 'delete';
  path: string;
  summary: string;
  who: Who;
  params?: z.ZodObject;
  query?: z.ZodObject;
  body?: z.ZodType;
  upload?: boolean;
}

/** Every documented route, with the zod schemas that validate it (the single source of truth). */
export const ROUTES: RouteDoc[] = [
  { method: 'get', path: '/api/health', summary: 'Liveness and database reachability', who: 'public' },
  { method: 'get', path: '/api/health/live', summary: 'Liveness: the process answers (no dependency checked)', who: 'public' },
  { method: 'get', path: '/api/health/ready', summary: 'Readiness: the primary database answers and the process is not stopping (503 otherwise)', who: 'public' },
  { method: 'get', path: '/api/health/metrics', summary: 'Prometheus metrics (text format); only with METRICS_TOKEN configured, for that bearer token', who: 'metrics token' },
  { method: 'post', path: '/api/auth/register', summary: 'Create a bowler account and mail a verification link (the same answer whether the address is new or taken; the mail says which)', who: 'public', body: RegisterSchema },
  { method: 'post', path: '/api/auth/login', summary: 'Sign in: a bearer token and the user', who: 'public', body: LoginSchema },
  { method: 'get', path: '/api/auth/me', summary: 'The signed-in user with their role', who: 'signed-in' },
  { method: 'post', path: '/api/auth/forgot', summary: 'Mail a password-reset link (answers at once and the same for unknown e-mails; a new link closes the older one)', who: 'public', body: ForgotSchema },
  { method: 'post', path: '/api/auth/reset', summary: 'Set a new password from a reset token (every reset link and session of the user ends)', who: 'public', body: ResetSchema },
  { method: 'post', path: '/api/auth/verify-email', summary: 'Confirm the e-mail address from the mailed verification token', who: 'public', body: VerifyEmailSchema },
  { method: 'post', path: '/api/auth/verify-email/send', summary: 'Mail a new verification link to the signed-in user (the older one stops working)', who: 'signed-in' },
  { method: 'get', path: '/api/profile', summary: 'The bowler profile (typical values when never saved)', who: 'signed-in' },
  { method: 'put', path: '/api/profile', summary: 'Save bowler parameters (any subset)', who: 'signed-in', body: ProfileUpdateSchema },
  { method: 'get', path: '/api/admin/users', summary: 'Users, paged, searchable, filterable by role', who: 'admin', query: UserListQuerySchema },
  { method: 'patch', path: '/api/admin/users/{id}/role', summary: 'Grant a role (audited)', who: 'admin', params: IdParamSchema, body: RoleChangeSchema },
  { method: 'get', path: '/api/admin/audit', summary: 'The audit log, newest first', who: 'admin', query: PageQuerySchema },
  { method: 'get', path: '/api/catalogue', summary: 'The shared ball catalogue, searchable and filterable', who: 'signed-in', query: CatalogueQuerySchema },
  { method: 'get', path: '/api/catalogue/{id}', summary: 'One catalogue ball', who: 'signed-in', params: IdParamSchema },
  { method: 'post', path: '/api/catalogue', summary: 'Add a catalogue ball', who: 'admin', body: BallModelInputSchema },
  { method: 'patch', path: '/api/catalogue/{id}', summary: 'Edit a catalogue ball (version required)', who: 'admin', params: IdParamSchema, body: BallModelPatchSchema },
  { method: 'post', path: '/api/catalogue/import', summary: 'Import catalogue balls from CSV (all rows or none)', who: 'admin', upload: true },
  { method: 'get', path: '/api/arsenal', summary: 'Your balls', who: 'signed-in', query: ArsenalQuerySchema },
  { method: 'post', path: '/api/arsenal', summary: 'Add a ball from the catalogue or by hand', who: 'signed-in', body: BallCreateSchema },
  { method: 'get', path: '/api/arsenal/{id}', summary: 'One of your balls with its surface history', who: 'signed-in', params: IdParamSchema },
  { method: 'patch', path: '/api/arsenal/{id}', summary: 'Edit a ball (stale version → 409)', who: 'signed-in', params: IdParamSchema, body: BallPatchSchema },
  { method: 'delete', path: '/api/arsenal/{id}', summary: 'Remove a ball (restorable)', who: 'signed-in', params: IdParamSchema },
  { method: 'post', path: '/api/arsenal/{id}/restore', summary: 'Undo a removal', who: 'signed-in', params: IdParamSchema },
  { method: 'post', path: '/api/arsenal/{id}/surface', summary: 'Record a new surface; resets games since resurface', who: 'signed-in', params: IdParamSchema, body: SurfaceChangeSchema },
  { method: 'put', path: '/api/arsenal/{id}/photo', summary: 'Set the ball’s photo (PNG, JPEG or WebP, ≤ 2 MiB)', who: 'signed-in', params: IdParamSchema, upload: true },
  { method: 'get', path: '/api/arsenal/{id}/photo', summary: 'The ball’s photo', who: 'signed-in', params: IdParamSchema },
  { method: 'delete', path: '/api/arsenal/{id}/photo', summary: 'Remove the ball’s photo', who: 'signed-in', params: IdParamSchema },
  { method: 'post', path: '/api/arsenal/import', summary: 'Import hand-entered balls from CSV (all rows or none)', who: 'signed-in', upload: true },
  { method: 'get', path: '/api/patterns', summary: 'Oil patterns with their computed summary', who: 'signed-in', query: PatternQuerySchema },
  { method: 'get', path: '/api/patterns/{id}', summary: 'A pattern: sweeps, summary and oil grid', who: 'signed-in', params: IdParamSchema },
  { method: 'post', path: '/api/patterns', summary: 'Create a pattern', who: 'coach, proprietor, admin', body: PatternInputSchema },
  { method: 'patch', path: '/api/patterns/{id}', summary: 'Edit your pattern (version required)', who: 'coach, proprietor, admin', params: IdParamSchema, body: PatternPatchSchema },
  { method: 'delete', path: '/api/patterns/{id}', summary: 'Delete your pattern', who: 'coach, proprietor, admin', params: IdParamSchema },
  { method: 'post', path: '/api/matchups', summary: 'Rank your arsenal for a pattern on a lane surface, or for a published condition (its pattern and lane surface); illegal balls are listed apart', who: 'signed-in', body: MatchupRequestSchema },
  { method: 'post', path: '/api/patterns/{id}/duplicate', summary: 'Copy a pattern as your own', who: 'coach, proprietor, admin', params: IdParamSchema },
  { method: 'get', path: '/api/patterns/{id}/export', summary: 'Download a pattern in Lanewright JSON or CSV (?format=json|csv)', who: 'signed-in', params: IdParamSchema },
  { method: 'post', path: '/api/patterns/import', summary: 'Create a pattern from a Lanewright JSON or CSV file (errors by line)', who: 'coach, proprietor, admin', upload: true },
  { method: 'get', path: '/api/centers', summary: 'Centers (with `following` when signed in)', who: 'public', query: PageQuerySchema },
  { method: 'get', path: '/api/centers/mine', summary: 'The centers you operate (admin: all)', who: 'coach, proprietor, admin' },
  { method: 'post', path: '/api/centers', summary: 'Create a center and assign its proprietor', who: 'admin', body: CenterInputSchema },
  { method: 'get', path: '/api/centers/{id}', summary: 'One center', who: 'public', params: IdParamSchema },
  { method: 'patch', path: '/api/centers/{id}', summary: 'Edit a center (owner: name and town; admin: all)', who: 'coach, proprietor, admin', params: IdParamSchema, body: CenterPatchSchema },
  { method: 'get', path: '/api/centers/{id}/conditions/current', summary: 'The condition in force today', who: 'public', params: IdParamSchema },
  { method: 'get', path: '/api/centers/{id}/conditions/current.pdf', summary: 'The printable sheet of the condition in force', who: 'public', params: IdParamSchema },
  { method: 'get', path: '/api/centers/{id}/conditions', summary: 'Publication history, newest first', who: 'public', params: IdParamSchema, query: PageQuerySchema },
  { method: 'post', path: '/api/centers/{id}/conditions', summary: 'Publish a condition (the center’s proprietor only); followers are e-mailed', who: 'coach, proprietor, admin', params: IdParamSchema, body: PublishConditionSchema },
  { method: 'post', path: '/api/centers/{id}/follow', summary: 'Follow a center', who: 'signed-in', params: IdParamSchema },
  { method: 'delete', path: '/api/centers/{id}/follow', summary: 'Stop following a center', who: 'signed-in', params: IdParamSchema },
  { method: 'get', path: '/api/follows', summary: 'Centers you follow with their current condition', who: 'signed-in' },
  { method: 'get', path: '/api/unsubscribe', summary: 'Unsubscribe link of a follower e-mail (no sign-in)', who: 'public' },
  { method: 'post', path: '/api/unsubscribe', summary: 'One-click unsubscribe of a follower e-mail (RFC 8058; no sign-in)', who: 'public', body: z.object({ token: z.string().min(10).max(100) }).strict() },
  { method: 'post', path: '/api/sessions', summary: 'Start a session (center, condition or pattern, date, kind)', who: 'signed-in', body: SessionCreateSchema },
  { method: 'get', path: '/api/sessions', summary: 'My sessions, newest first (a linked coach: ?studentId)', who: 'owner or linked coach', query: SessionListQuerySchema },
  { method: 'get', path: '/api/sessions/{id}', summary: 'A session: frame sheets scored by scoreGame, shots, stats, moves, annotations', who: 'owner or linked coach', params: IdParamSchema },
  { method: 'patch', path: '/api/sessions/{id}', summary: 'Edit a session’s notes, kind or date', who: 'signed-in', params: IdParamSchema, body: SessionPatchSchema },
  { method: 'delete', path: '/api/sessions/{id}', summary: 'Remove a session (restorable)', who: 'signed-in', params: IdParamSchema },
  { method: 'post', path: '/api/sessions/{id}/restore', summary: 'Undo a session’s removal', who: 'signed-in', params: IdParamSchema },
  { method: 'post', path: '/api/sessions/{id}/shots', summary: 'Log a delivery (header Idempotency-Key, 8–100 chars: a retry returns the first answer, 200)', who: 'signed-in', params: IdParamSchema, body: ShotCreateSchema },
  { method: 'delete', path: '/api/sessions/{id}/shots/{shotId}', summary: 'Undo a game’s last delivery (any other → 409)', who: 'signed-in', params: ShotParamsSchema },
  { method: 'post', path: '/api/sessions/{id}/annotations', summary: 'Annotate a session', who: 'owner or linked coach', params: IdParamSchema, body: AnnotationCreateSchema },
  { method: 'get', path: '/api/stats', summary: 'Shot statistics overall, per ball, per surface and per session, with moves and the calibration', who: 'owner or linked coach', query: StatsQuerySchema },
  { method: 'get', path: '/api/calibration', summary: 'The ball-motion calibration from my logged shots on a pattern and lane surface, or on a published condition', who: 'owner or linked coach', query: CalibrationQuerySchema },
  { method: 'post', path: '/api/coach/invitations', summary: 'Invite a student by e-mail (mailed; audited)', who: 'coach', body: InvitationCreateSchema },
  { method: 'get', path: '/api/coach/links', summary: 'Pending and active links where I am coach or student', who: 'signed-in', query: CoachListQuerySchema },
  { method: 'post', path: '/api/coach/links/{id}/accept', summary: 'Accept an invitation (the invited student only; audited)', who: 'signed-in', params: IdParamSchema },
  { method: 'delete', path: '/api/coach/links/{id}', summary: 'End a link or withdraw/decline an invitation (either side; audited)', who: 'signed-in', params: IdParamSchema },
  { method: 'get', path: '/api/coach/students', summary: 'My students with their session counts', who: 'coach', query: CoachListQuerySchema },
  { method: 'get', path: '/api/coach/students/{studentId}', summary: 'A student’s profile and arsenal (linked coach only; else 404)', who: 'coach', params: StudentParamSchema },
  { method: 'get', path: '/api/coach/students/{studentId}/plans', summary: 'The plans I sent a student', who: 'coach', params: StudentParamSchema, query: CoachListQuerySchema },
  { method: 'post', path: '/api/coach/students/{studentId}/plans', summary: 'Send a student a surface, layout or line plan (mailed; audited)', who: 'coach', params: StudentParamSchema, body: PlanCreateSchema },
  { method: 'get', path: '/api/plans', summary: 'My coaches’ plans for me, newest first', who: 'signed-in', query: CoachListQuerySchema },
  { method: 'get', path: '/api/trials', summary: 'My equipment trials (or a linked coach’s student’s with studentId), newest first', who: 'signed-in', query: TrialListQuerySchema },
  { method: 'post', path: '/api/trials', summary: 'Open an equipment trial of two to four balls or surfaces (a linked coach for a student with studentId)', who: 'signed-in', body: TrialCreateSchema },
  { method: 'get', path: '/api/trials/{id}', summary: 'A trial with each arm’s figures and the verdict', who: 'owner or linked coach', params: IdParamSchema },
  { method: 'delete', path: '/api/trials/{id}', summary: 'Delete a trial (the shots stay in their sessions)', who: 'owner or linked coach', params: IdParamSchema },
  { method: 'get', path: '/api/coverage', summary: 'Arsenal coverage across the followed centers’ lane groups: gaps, twins and catalogue suggestions', who: 'signed-in', query: TrialListQuerySchema },
  { method: 'post', path: '/api/layout-lab', summary: 'Candidate layouts of one of my balls, drawn with their flare rings and simulated on a condition', who: 'signed-in', body: LayoutLabSchema },
  { method: 'get', path: '/api/centers/{id}/services', summary: 'A center’s pro-shop price list (active entries; its proprietor sees inactive ones too with ?all=1)', who: 'signed-in', params: IdParamSchema, query: ServiceListQuerySchema },
  { method: 'post', path: '/api/centers/{id}/services', summary: 'Add a price-list entry (the center’s proprietor; integer cents)', who: 'signed-in', params: IdParamSchema, body: ServiceInputSchema },
  { method: 'patch', path: '/api/centers/{id}/services/{serviceId}', summary: 'Edit or retire a price-list entry (the center’s proprietor; stale version → 409)', who: 'signed-in', params: ServiceParamsSchema, body: ServicePatchSchema },
  { method: 'get', path: '/api/centers/{id}/orders', summary: 'The center’s pro-shop orders, newest first, by status and day (its proprietor only)', who: 'signed-in', params: IdParamSchema, query: CenterOrderQuerySchema },
  { method: 'get', path: '/api/centers/{id}/takings', summary: 'The day’s card takings: paid, refunded, net, by service (its proprietor only)', who: 'signed-in', params: IdParamSchema, query: TakingsQuerySchema },
  { method: 'post', path: '/api/orders', summary: 'Order a pro-shop service for a ball of your arsenal; the price comes from the price list (any amount field → 400; expectedAmountCents ≠ price → 400 price_mismatch)', who: 'signed-in', body: OrderCreateSchema },
  { method: 'get', path: '/api/orders', summary: 'Your orders, newest first', who: 'signed-in', query: OrderListQuerySchema },
  { method: 'get', path: '/api/orders/{id}', summary: 'An order with its history (yours, or your center’s as its proprietor; else 404)', who: 'signed-in', params: IdParamSchema },
  { method: 'post', path: '/api/orders/{id}/checkout', summary: 'Start the card payment of your unpaid order: { url, checkoutSessionId } of the hosted payment page', who: 'signed-in', params: IdParamSchema },
  { method: 'post', path: '/api/orders/{id}/cancel', summary: 'Cancel your unpaid order', who: 'signed-in', params: IdParamSchema },
  { method: 'patch', path: '/api/orders/{id}/status', summary: 'The shop moves a paid order forward (in_progress, ready, collected); ready on a surface service updates the ball’s surface', who: 'signed-in', params: IdParamSchema, body: OrderStatusChangeSchema },
  { method: 'post', path: '/api/orders/{id}/refund', summary: 'The shop refunds a paid order through the payment service', who: 'signed-in', params: IdParamSchema },
  { method: 'post', path: '/api/payments/webhook', summary: 'Payment-service events (raw body, Stripe-Signature verified; each event id processed once)', who: 'public' },
];

const ErrorSchema = {
  type: 'object',
  required: ['error'],
  properties: {
    error: {
      type: 'object',
      required: ['code', 'message'],
      properties: { code: { type: 'string' }, message: { type: 'string' }, fields: { type: 'object', additionalProperties: { type: 'string' } } },
    },
  },
};

const json = (s: z.ZodType) => z.toJSONSchema(s, { io: 'input', unrepresentable: 'any' });

/** The OpenAPI 3.1 document, generated from the zod schemas. */
export function openApiDocument(): Record<string, unknown> {
  const paths: Record<string, Record<string, unknown>> = {};
  for (const r of ROUTES) {
    const parameters: unknown[] = [];
    for (const [where, schema] of [['path', r.params], ['query', r.query]] as const) {
      if (!schema) continue;
      const js = json(schema) as { properties?: Record<string, unknown>; required?: string[] };
      for (const [name, s] of Object.entries(js.properties ?? {})) parameters.push({ name, in: where, required: where === 'path' || (js.required ?? []).includes(name), schema: s });
    }
    const op: Record<string, unknown> = {
      summary: r.summary,
      description: `Who: ${r.who}.`,
      ...(r.who === 'public' ? {} : { security: [{ bearer: [] }] }),
      ...(parameters.length ? { parameters } : {}),
      responses: {
        '200': { description: 'OK' },
        '400': { description: 'Invalid input, every bad field listed', content: { 'application/json': { schema: ErrorSchema } } },
        ...(r.who === 'public' ? {} : { '401': { description: 'Not signed in' }, '403': { description: 'Role not allowed' } }),
      },
    };
    if (r.body) op.requestBody = { required: true, content: { 'application/json': { schema: json(r.body) } } };
    if (r.upload)
      op.requestBody = { required: true, content: { 'multipart/form-data': { schema: { type: 'object', properties: { file: { type: 'string', format: 'binary' } }, required: ['file'] } } } };
    (paths[r.path] ??= {})[r.method] = op;
  }
  return {
    openapi: '3.1.0',
    info: { title: 'Lanewright API', version: '0.1.0', description: 'Lane-condition and ball-matchup advice. Errors: { error: { code, message, fields? } }.' },
    components: { securitySchemes: { bearer: { type: 'http', scheme: 'bearer', bearerFormat: 'JWT' } }, schemas: { Error: ErrorSchema } },
    paths,
  };
}
