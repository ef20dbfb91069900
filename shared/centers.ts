import { z } from 'zod';
import { isSafeName, UNSAFE_NAME_MESSAGE } from './text';
import type { LaneSurface } from '../engine/types';
import { PatternSummarySchema, SweepSchema } from './patterns';

export type { LaneSurface };

export const LANE_KINDS = ['wood', 'synthetic'] as const satisfies readonly LaneSurface['kind'][];
export const LANE_FRICTIONS = ['low', 'medium', 'high'] as const satisfies readonly LaneSurface['friction'][];

/** The lane surface a condition is bowled on: its material and how much friction it has (the engine's LaneSurface). */
export const LaneSurfaceSchema = z
  .object(
    {
      kind: z.enum(LANE_KINDS, { error: 'The lanes are wood or synthetic' }),
      friction: z.enum(LANE_FRICTIONS, { error: 'Lane friction is low, medium or high' }),
    },
    { error: 'Give the lane surface as { kind, friction }' },
  )
  .strict();

/** The engine's default lane surface, and what a condition published before lane surfaces were recorded was bowled on. */
export const DEFAULT_LANE_SURFACE: LaneSurface = Object.freeze({ kind: 'synthetic', friction: 'medium' });

/** The lane surface in words a bowler reads: "Synthetic lanes, high friction". */
export function laneSurfaceText(lane: LaneSurface): string {
  return `${lane.kind === 'wood' ? 'Wood' : 'Synthetic'} lanes, ${lane.friction} friction`;
}

const isoDate = z.iso.date({ error: 'Use a date like 2026-12-01' });

/** An IANA time zone name the runtime knows (checked with Intl, so "Mars/Olympus" and "+05:00" are refused). */
export const TimeZoneSchema = z
  .string({ error: 'Choose a time zone' })
  .trim()
  .min(1, 'Choose a time zone')
  .max(64)
  .refine((tz) => {
    if (!/^[A-Za-z_]+(\/[A-Za-z0-9_+-]+)*$/.test(tz)) return false;
    try {
      new Intl.DateTimeFormat('en', { timeZone: tz });
      return true;
    } catch {
      return false;
    }
  }, 'Not a time zone name such as America/Denver');

/** ISO 8601 day numbers: 1 Monday … 7 Sunday. */
export const WEEKDAY_NAMES = ['Monday', 'Tuesday', 'Wednesday', 'Thursday', 'Friday', 'Saturday', 'Sunday'] as const;
export const WeekdaysSchema = z
  .array(
    z
      .number({ error: 'Days are numbers 1 (Monday) to 7 (Sunday)' })
      .int()
      .min(1, 'Days are 1 (Monday) to 7 (Sunday)')
      .max(7, 'Days are 1 (Monday) to 7 (Sunday)'),
    {
      error: 'Give the days as a list of numbers 1 (Monday) to 7 (Sunday)',
    },
  )
  .max(7, 'At most 7 days')
  .refine((d) => new Set(d).size === d.length, 'Each day once');

/** "Tuesdays and Thursdays" from [2, 4]; "" for every day. */
export function weekdaysText(days: readonly number[] | null | undefined): string {
  if (!days || days.length === 0 || days.length === 7) return '';
  const names = [...days].sort((a, b) => a - b).map((d) => `${WEEKDAY_NAMES[d - 1]}s`);
  return names.length === 1 ? names[0] : `${names.slice(0, -1).join(', ')} and ${names.at(-1)}`;
}

export const CenterInputSchema = z
  .object({
    name: z.string().trim().min(1, 'Name is required').max(80).refine(isSafeName, UNSAFE_NAME_MESSAGE),
    town: z.string().trim().min(1, 'Town is required').max(80).refine(isSafeName, UNSAFE_NAME_MESSAGE),
    laneCount: z.number({ error: 'Must be a number' }).int().min(1, 'At least 1 lane').max(120, 'At most 120 lanes'),
    ownerId: z.number().int().positive().nullable().optional(),
    /** The center's IANA time zone ("America/Denver"); its days are reckoned in it. Default UTC. */
    timeZone: TimeZoneSchema.optional(),
  })
  .strict();
export type CenterInput = z.infer<typeof CenterInputSchema>;
export const CenterPatchSchema = CenterInputSchema.partial().strict();

export const CenterSchema = z.object({
  id: z.number().int(),
  name: z.string(),
  town: z.string(),
  laneCount: z.number().int(),
  ownerId: z.number().int().nullable(),
  /** IANA time zone name. */
  timeZone: z.string(),
  following: z.boolean().optional(),
});
export type Center = z.infer<typeof CenterSchema>;

export const PublishConditionSchema = z
  .object({
    patternId: z.number({ error: 'Choose a pattern' }).int().positive(),
    lanes: z
      .array(z.number({ error: 'Lane numbers are whole numbers' }).int('Lane numbers are whole numbers').min(1, 'Lanes start at 1'), {
        error: 'Choose the lanes',
      })
      .min(1, 'Choose at least one lane')
      .max(120),
    validFrom: isoDate,
    validTo: isoDate.nullable().optional(),
    notes: z.string().trim().max(2000, 'At most 2000 characters').nullable().optional(),
    /** The lane surface of the lanes published for; default synthetic, medium friction. */
    lane: LaneSurfaceSchema.default({ ...DEFAULT_LANE_SURFACE }),
    /**
     * Recurring days (1 Monday … 7 Sunday, ISO 8601) on which the publication is in force, such as league nights;
     * omitted or empty: every day between its dates. Dates and days are the center's own local days.
     */
    weekdays: WeekdaysSchema.nullable().optional(),
  })
  .strict()
  .refine((c) => !c.validTo || c.validTo >= c.validFrom, { path: ['validTo'], message: 'The end date is before the start date' });
export type PublishCondition = z.infer<typeof PublishConditionSchema>;

/** A published condition. The pattern's sweeps and numbers are a snapshot taken when it was published. */
const ConditionPatternSchema = z.object({
  id: z.number().int().nullable(),
  name: z.string(),
  sweeps: z.array(SweepSchema),
  summary: PatternSummarySchema,
});

export const ConditionSchema = z.object({
  id: z.number().int(),
  centerId: z.number().int(),
  lanes: z.array(z.number().int()),
  validFrom: z.string(),
  validTo: z.string().nullable(),
  notes: z.string().nullable(),
  publishedAt: z.string(),
  publishedBy: z.number().int().nullable(),
  /** Set when a later publication for overlapping lanes and dates replaced this one. */
  supersededBy: z.number().int().nullable(),
  pattern: ConditionPatternSchema,
  /** The lane surface the condition is bowled on. */
  lane: LaneSurfaceSchema,
  /** The same in words: "Synthetic lanes, high friction". */
  laneText: z.string(),
  /** Recurring days (1 Monday … 7 Sunday) it is in force on; null: every day between its dates. */
  weekdays: z.array(z.number().int()).nullable().optional(),
});
export type Condition = z.infer<typeof ConditionSchema>;

/**
 * Lanes that share what is on them: the publication in force now (null when none) and the one that follows it
 * (null when none is scheduled), in the center's own time zone. `from`/`to` are the lowest and highest lane;
 * `key` ("lanes-1-12") is the group's anchor on the public page.
 */
export const LaneGroupSchema = z.object({
  key: z.string(),
  lanes: z.array(z.number().int()),
  from: z.number().int(),
  to: z.number().int(),
  current: ConditionSchema.nullable(),
  /** The center's local day the current publication last applies before `next` (null: open-ended). */
  currentUntil: z.string().nullable(),
  next: z.object({ condition: ConditionSchema, from: z.string() }).nullable(),
});
export type LaneGroup = z.infer<typeof LaneGroupSchema>;

export const LaneGroupsSchema = z.object({
  center: CenterSchema,
  /** The center's IANA time zone and its local date at the instant asked about. */
  timeZone: z.string(),
  today: z.string(),
  at: z.string(),
  groups: z.array(LaneGroupSchema),
});
export type LaneGroups = z.infer<typeof LaneGroupsSchema>;

/** `?at=` an ISO instant ("2026-12-05T18:00:00Z"): what is in force at that instant (default: now). */
export const AtQuerySchema = z
  .object({ at: z.iso.datetime({ offset: true, error: 'Use an instant like 2026-12-05T18:00:00Z' }).optional() })
  .strict();

export const CurrentConditionSchema = z.object({
  center: CenterSchema,
  condition: ConditionSchema,
  /** Same as condition.pattern, at the top level for convenience. */
  pattern: ConditionPatternSchema,
  lanes: z.array(z.number().int()),
  validFrom: z.string(),
  validTo: z.string().nullable(),
  notes: z.string().nullable(),
  /** Same as condition.lane and condition.laneText. */
  lane: LaneSurfaceSchema,
  laneText: z.string(),
  /** The center's time zone and local date; every lane group with what is on it now and what comes next. */
  timeZone: z.string().optional(),
  today: z.string().optional(),
  groups: z.array(LaneGroupSchema).optional(),
});
export type CurrentCondition = z.infer<typeof CurrentConditionSchema>;

/**
 * A followed center and what is on its lanes today: `current` is the newest publication in force (null when
 * nothing is published); `inForce` lists every publication in force with the lanes it still governs (a newer
 * publication for some lanes leaves an older one in force on the others), newest first.
 */
export const FollowedCenterSchema = z.object({
  center: CenterSchema,
  current: ConditionSchema.nullable(),
  inForce: z.array(z.object({ condition: ConditionSchema, lanes: z.array(z.number().int()) })),
  /** Every lane group of the center (in its time zone), with what comes next. */
  groups: z.array(LaneGroupSchema).optional(),
});
export type FollowedCenter = z.infer<typeof FollowedCenterSchema>;

/** The e-mail link's token: confirm the unsubscribe, undo it, or look up what it is for. */
export const UnsubscribeTokenSchema = z.object({ token: z.string().min(10, 'The link is incomplete').max(100) }).strict();
export const UnsubscribeInfoSchema = z.object({ center: z.string(), subscribed: z.boolean() });
export type UnsubscribeInfo = z.infer<typeof UnsubscribeInfoSchema>;
