import { z } from 'zod';
import type { Calibration, GameView, HitKind, Move, MoveFollowUp, ShotStats } from '../engine/shotlog/types';
import { engineValue } from './api';
import { PageQuerySchema } from './auth';
import { LANE_FRICTIONS, LANE_KINDS, LaneSurfaceSchema } from './centers';
import { AnnotationSchema } from './coaching';
import { LanePairSchema } from './leagues';

const isoDate = z.iso.date({ error: 'Use a date like 2026-12-01' });
const id = (label: string) =>
  z
    .number({ error: `${label} must be an id (a number)` })
    .int(`${label} must be a whole number`)
    .positive(`${label} must be positive`)
    .max(2147483647);
const queryId = z.coerce.number({ error: 'Must be a number' }).int('Must be a whole number').positive('Must be positive').max(2147483647);

export const SESSION_KINDS = ['practice', 'league', 'tournament'] as const;
export type SessionKind = (typeof SESSION_KINDS)[number];
export const SessionKindSchema = z.enum(SESSION_KINDS, { error: 'Choose practice, league or tournament' });

export const HIT_KINDS = ['pocket', 'high', 'light', 'brooklyn', 'miss'] as const satisfies readonly HitKind[];
export const HitKindSchema = z.enum(HIT_KINDS, { error: 'Choose pocket, high, light, brooklyn or miss' });

export const SessionCreateSchema = z
  .object({
    date: isoDate,
    kind: SessionKindSchema,
    centerId: id('centerId').nullable().optional(),
    /** A published condition; its center and pattern are used when not given. */
    conditionId: id('conditionId').nullable().optional(),
    patternId: id('patternId').nullable().optional(),
    /** The bowler's own league this session is a night of (kind 'league'). */
    leagueId: id('leagueId').nullable().optional(),
    lanePair: LanePairSchema.nullable().optional(),
    notes: z.string().trim().max(2000, 'At most 2000 characters').optional(),
  })
  .strict()
  .refine((s) => !s.leagueId || s.kind === 'league', { path: ['kind'], message: 'A league night is a league session' });
export type SessionCreate = z.infer<typeof SessionCreateSchema>;

export const SessionPatchSchema = z
  .object({
    notes: z.string().trim().max(2000, 'At most 2000 characters').optional(),
    kind: SessionKindSchema.optional(),
    date: isoDate.optional(),
    leagueId: id('leagueId').nullable().optional(),
    lanePair: LanePairSchema.nullable().optional(),
  })
  .strict();
export type SessionPatch = z.infer<typeof SessionPatchSchema>;

export const SessionListQuerySchema = PageQuerySchema.extend({
  /** A linked coach reads a student's sessions. */
  studentId: queryId.optional(),
  from: isoDate.optional(),
  to: isoDate.optional(),
});
export type SessionListQuery = z.infer<typeof SessionListQuerySchema>;

export const ShotParamsSchema = z.object({ id: queryId, shotId: queryId });

/** The Idempotency-Key header of POST /api/sessions/:id/shots: the client's id for this shot, reused on every retry. */
export const IdempotencyKeySchema = z
  .string({ error: 'Send an Idempotency-Key header (8–100 characters) that identifies this shot' })
  .min(8, 'The Idempotency-Key must be 8–100 characters')
  .max(100, 'The Idempotency-Key must be 8–100 characters')
  .regex(/^[\x21-\x7e]+$/, 'The Idempotency-Key may hold visible ASCII characters only');

/** Boards are counted 1–39 from the bowler's gutter side (the lane's usual numbering, common practice); half boards allowed. */
const board = (label: string) =>
  z
    .number({ error: `${label} must be a number` })
    .min(1, `${label}: boards run 1–39`)
    .max(39, `${label}: boards run 1–39`)
    .multipleOf(0.5, `${label}: whole or half boards`)
    .nullable()
    .optional();

export const ShotCreateSchema = z
  .object({
    gameNumber: z
      .number({ error: 'gameNumber must be a number' })
      .int('Whole games')
      .min(1, 'Games start at 1')
      .max(50, 'At most 50 games in a session'),
    frame: z
      .number({ error: 'frame must be a number' })
      .int('Whole frames')
      .min(1, 'A game has frames 1–10')
      .max(10, 'A game has frames 1–10'),
    delivery: z
      .number({ error: 'delivery must be a number' })
      .int('Whole deliveries')
      .min(1, 'Deliveries start at 1')
      .max(3, 'A frame has at most 3 deliveries (3 only in frame 10)'),
    ballId: id('ballId'),
    feetBoard: board('Feet board'),
    targetBoard: board('Target board'),
    breakpointBoard: board('Breakpoint board'),
    standing: z
      .array(
        z
          .number({ error: 'Pins are numbers 1–10' })
          .int('Pins are numbers 1–10')
          .min(1, 'Pins are numbers 1–10')
          .max(10, 'Pins are numbers 1–10'),
        {
          error: 'List the pins standing after the delivery (an empty list for none)',
        },
      )
      .max(10, 'At most 10 pins')
      .refine((a) => new Set(a).size === a.length, 'A pin is listed twice'),
    foul: z.boolean({ error: 'Foul is yes or no' }).optional(),
    hit: HitKindSchema.nullable().optional(),
    note: z.string().trim().max(500, 'At most 500 characters').optional(),
  })
  .strict();
export type ShotCreate = z.infer<typeof ShotCreateSchema>;

export const SessionSchema = z.object({
  id: z.number().int(),
  userId: z.number().int(),
  date: z.string(),
  kind: z.enum(SESSION_KINDS),
  centerId: z.number().int().nullable(),
  centerName: z.string().nullable(),
  conditionId: z.number().int().nullable(),
  patternId: z.number().int().nullable(),
  patternName: z.string().nullable(),
  leagueId: z.number().int().nullable(),
  leagueName: z.string().nullable(),
  lanePair: z.string().nullable(),
  notes: z.string(),
  /** How many games have at least one shot. */
  games: z.number().int(),
  shots: z.number().int(),
  createdAt: z.string(),
});
export type Session = z.infer<typeof SessionSchema>;

export const ShotSchema = z.object({
  id: z.number().int(),
  sessionId: z.number().int(),
  gameNumber: z.number().int(),
  frame: z.number().int(),
  delivery: z.number().int(),
  ballId: z.number().int(),
  ballName: z.string(),
  /** The ball's surface when the shot was thrown, e.g. "2000 grit" or "3000 grit polished". */
  surfaceKey: z.string(),
  feetBoard: z.number().nullable(),
  targetBoard: z.number().nullable(),
  breakpointBoard: z.number().nullable(),
  standing: z.array(z.number().int()),
  foul: z.boolean(),
  hit: z.enum(HIT_KINDS).nullable(),
  note: z.string(),
  createdAt: z.string(),
});
export type Shot = z.infer<typeof ShotSchema>;

export type NumberedGame = GameView & { number: number };
const NumberedGameSchema = engineValue<NumberedGame>("A game's frame sheet as the engine scores it, with its number");

/** The answer of POST /api/sessions/:id/shots (also returned verbatim for a retried request). */
export const ShotCreatedSchema = z.object({ item: ShotSchema, game: NumberedGameSchema });
export type ShotCreated = z.infer<typeof ShotCreatedSchema>;

const ShotStatsSchema = engineValue<ShotStats>("The engine's shot statistics");
const MoveSchema = engineValue<Move>('A move the engine suggests from the logged shots');
const CalibrationSchema = engineValue<Calibration>("The engine's ball-motion calibration");
const FollowUpSchema = engineValue<MoveFollowUp>("A move the bowler made, with the shots before and after it (the engine's moveFollowUp)");

/** A session with everything on it. `shots` is the list here (the count is `shotCount`); `games` stays the count, the frame sheets are `gameViews`. */
export const SessionDetailSchema = SessionSchema.omit({ shots: true }).extend({
  shotCount: z.number().int(),
  gameViews: z.array(NumberedGameSchema),
  shots: z.array(ShotSchema),
  stats: ShotStatsSchema,
  moves: z.array(MoveSchema),
  /** Every move made in this session, followed up: did the pocket and strike rates improve? */
  followUps: z.array(FollowUpSchema),
  annotations: z.array(AnnotationSchema),
  owner: z.object({ id: z.number().int(), displayName: z.string() }),
});
export type SessionDetail = z.infer<typeof SessionDetailSchema>;

export const StatsQuerySchema = z
  .object({
    from: isoDate.optional(),
    to: isoDate.optional(),
    ballId: queryId.optional(),
    patternId: queryId.optional(),
    studentId: queryId.optional(),
  })
  .refine((q) => !q.from || !q.to || q.to >= q.from, { path: ['to'], message: 'The end date is before the start date' });
export type StatsQuery = z.infer<typeof StatsQuerySchema>;

export const StatsTrendPointSchema = z.object({
  sessionId: z.number().int(),
  date: z.string(),
  games: z.number().int(),
  average: z.number().nullable(),
  strikePct: z.number().nullable(),
  sparePct: z.number().nullable(),
});
export type StatsTrendPoint = z.infer<typeof StatsTrendPointSchema>;

export const StatsResultSchema = z.object({
  overall: ShotStatsSchema,
  byBall: z.array(z.object({ ballId: z.number().int(), name: z.string(), stats: ShotStatsSchema })),
  bySurface: z.array(z.object({ ballId: z.number().int(), name: z.string(), surfaceKey: z.string(), stats: ShotStatsSchema })),
  trend: z.array(StatsTrendPointSchema),
  moves: z.array(MoveSchema),
  calibration: CalibrationSchema.nullable(),
  /** The pattern the calibration is for (the patternId filter, else the latest session's pattern). */
  calibrationPatternId: z.number().int().nullable().optional(),
  /** The lane surface it is fitted on: the published condition's of the latest session on that pattern, else synthetic with medium friction. */
  calibrationLane: LaneSurfaceSchema.nullable().optional(),
});
export type StatsResult = z.infer<typeof StatsResultSchema>;
export { CalibrationSchema };

/**
 * The calibration on a plain pattern (`patternId`, on the lane surface `laneKind`/`laneFriction`, default synthetic
 * with medium friction) or on a published condition (`conditionId`: its pattern and lane surface), as a matchup
 * computes it.
 */
export const CalibrationQuerySchema = z
  .object({
    patternId: queryId.optional(),
    conditionId: queryId.optional(),
    laneKind: z.enum(LANE_KINDS, { error: 'The lanes are wood or synthetic' }).optional(),
    laneFriction: z.enum(LANE_FRICTIONS, { error: 'Lane friction is low, medium or high' }).optional(),
    studentId: queryId.optional(),
  })
  .superRefine((q, ctx) => {
    if (q.patternId === undefined && q.conditionId === undefined)
      ctx.addIssue({ code: 'custom', path: ['patternId'], message: 'Choose a pattern or a published condition' });
    if (q.patternId !== undefined && q.conditionId !== undefined)
      ctx.addIssue({ code: 'custom', path: ['conditionId'], message: 'Give either a pattern or a published condition, not both' });
    if (q.conditionId !== undefined && (q.laneKind !== undefined || q.laneFriction !== undefined))
      ctx.addIssue({ code: 'custom', path: ['laneKind'], message: 'A published condition names its own lane surface' });
  });
export type CalibrationQuery = z.infer<typeof CalibrationQuerySchema>;

export type { MatchupCalibration } from './matchups';
