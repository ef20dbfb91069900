import { z } from 'zod';
import { isSafeName, UNSAFE_NAME_MESSAGE } from './text';
import type { Sweep } from '../engine/types';
import { PageQuerySchema } from './auth';

/**
 * One sweep as the pattern editor and the API accept it: boards 1–39, 0 ≤ startFt < endFt ≤ 60 (the engine spreads
 * oil only up to the headpin, 60 ft; USBC lane specifications: 60 ft from the foul line to the headpin).
 */
export const SweepSchema = z
  .object({
    direction: z.enum(['forward', 'reverse'], { error: 'Forward or reverse' }),
    fromBoard: z.number({ error: 'Board must be a number' }).int('Whole board').min(1, 'Board 1 to 39').max(39, 'Board 1 to 39'),
    toBoard: z.number({ error: 'Board must be a number' }).int('Whole board').min(1, 'Board 1 to 39').max(39, 'Board 1 to 39'),
    startFt: z.number({ error: 'Must be a number' }).min(0, 'At least 0 ft').max(60, 'Oil ends by the headpin, 60 ft'),
    endFt: z.number({ error: 'Must be a number' }).min(0, 'At least 0 ft').max(60, 'Oil ends by the headpin, 60 ft'),
    crossings: z.number({ error: 'Must be a number' }).int('Whole crossings').min(1, 'At least 1').max(50, 'At most 50'),
    microlitersPerBoard: z.number({ error: 'Must be a number' }).min(1, 'At least 1 µL').max(200, 'At most 200 µL per board'),
  })
  .strict()
  .refine((s) => s.endFt > s.startFt, { path: ['endFt'], message: 'End must be after start' }) satisfies z.ZodType<Sweep>;

/**
 * Who sees a pattern: `draft` its owner only; `shared` its owner and the staff of one center (`centerId`: its
 * proprietor); `published` every user. Admins see every pattern. A condition published on the lanes keeps its own
 * copy of the sweeps, so editing a pattern never changes what the lanes show.
 */
export const PATTERN_VISIBILITIES = ['draft', 'shared', 'published'] as const;
export const PatternVisibilitySchema = z.enum(PATTERN_VISIBILITIES, { error: 'Draft, shared or published' });
export type PatternVisibility = z.infer<typeof PatternVisibilitySchema>;

export const PatternInputSchema = z
  .object({
    name: z.string().trim().min(1, 'Name is required').max(80).refine(isSafeName, UNSAFE_NAME_MESSAGE),
    description: z.string().trim().max(1000).nullable().optional(),
    sweeps: z.array(SweepSchema).min(1, 'At least one sweep').max(200, 'At most 200 sweeps'),
    /** New patterns start as drafts. */
    visibility: PatternVisibilitySchema.optional(),
    /** The center whose staff see a shared pattern. */
    centerId: z.number({ error: 'Choose a center' }).int().positive().nullable().optional(),
  })
  .strict();
export type PatternInput = z.infer<typeof PatternInputSchema>;
export const PatternPatchSchema = PatternInputSchema.partial()
  .extend({ version: z.number().int().min(0) })
  .strict();

/** What an import does when you already have a pattern of the file's name. */
export const PatternImportConflictSchema = z.object({
  onConflict: z.enum(['rename', 'replace'], { error: 'Rename or replace' }).optional(),
});

export const PatternQuerySchema = PageQuerySchema.extend({
  q: z.string().trim().max(100).optional(),
  lengthClass: z.enum(['short', 'medium', 'long']).optional(),
  volumeClass: z.enum(['light', 'medium', 'heavy']).optional(),
  ratioClass: z.enum(['sport', 'challenge', 'recreation']).optional(),
  visibility: PatternVisibilitySchema.optional(),
  /** Only the caller's own patterns. */
  mine: z.enum(['true', 'false']).optional(),
  sort: z.enum(['name', 'createdAt', 'lengthFt', 'volumeMl']).default('name'),
  order: z.enum(['asc', 'desc']).default('asc'),
});
export type PatternQuery = z.infer<typeof PatternQuerySchema>;

/** The file format of a pattern download. */
export const PatternExportQuerySchema = z.object({ format: z.enum(['json', 'csv']).default('json') });

export const PatternSummarySchema = z.object({
  lengthFt: z.number(),
  volumeMl: z.number(),
  forwardMl: z.number(),
  reverseMl: z.number(),
  /** null when no oil reaches the outside boards (an unbounded ratio). */
  ratio: z.number().nullable(),
  lengthClass: z.enum(['short', 'medium', 'long']),
  volumeClass: z.enum(['light', 'medium', 'heavy']),
  ratioClass: z.enum(['sport', 'challenge', 'recreation']),
});
export type PatternSummary = z.infer<typeof PatternSummarySchema>;

export const PatternListItemSchema = z.object({
  id: z.number().int(),
  name: z.string(),
  description: z.string().nullable(),
  ownerId: z.number().int().nullable(),
  /** The owner's display name (null for the library's own patterns), so same-named patterns can be told apart. */
  ownerName: z.string().nullable(),
  visibility: PatternVisibilitySchema,
  centerId: z.number().int().nullable(),
  summary: PatternSummarySchema,
  version: z.number().int(),
  createdAt: z.string(),
});
export type PatternListItem = z.infer<typeof PatternListItemSchema>;

export const PatternDetailSchema = PatternListItemSchema.extend({
  sweeps: z.array(SweepSchema),
  grid: z.object({ boards: z.array(z.number()), ft: z.array(z.number()), values: z.array(z.array(z.number())) }),
});
export type PatternDetail = z.infer<typeof PatternDetailSchema>;
