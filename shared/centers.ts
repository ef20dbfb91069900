import { z } from 'zod';
import { isSafeName, UNSAFE_NAME_MESSAGE } from './text';
import type { Sweep } from '../engine/types';
import type { PatternSummary } from './patterns';

const isoDate = z.iso.date({ error: 'Use a date like 2026-12-01' });

export const CenterInputSchema = z
  .object({
    name: z.string().trim().min(1, 'Name is required').max(80).refine(isSafeName, UNSAFE_NAME_MESSAGE),
    town: z.string().trim().min(1, 'Town is required').max(80).refine(isSafeName, UNSAFE_NAME_MESSAGE),
    laneCount: z.number({ error: 'Must be a number' }).int().min(1, 'At least 1 lane').max(120, 'At most 120 lanes'),
    ownerId: z.number().int().positive().nullable().optional(),
  })
  .strict();
export type CenterInput = z.infer<typeof CenterInputSchema>;
export const CenterPatchSchema = CenterInputSchema.partial().strict();

export interface Center {
  id: number;
  name: string;
  town: string;
  laneCount: number;
  ownerId: number | null;
  following?: boolean;
}

export const PublishConditionSchema = z
  .object({
    patternId: z.number({ error: 'Choose a pattern' }).int().positive(),
    lanes: z
      .array(z.number({ error: 'Lane numbers are whole numbers' }).int('Lane numbers are whole numbers').min(1, 'Lanes start at 1'), { error: 'Choose the lanes' })
      .min(1, 'Choose at least one lane')
      .max(120),
    validFrom: isoDate,
    validTo: isoDate.nullable().optional(),
    notes: z.string().trim().max(2000, 'At most 2000 characters').nullable().optional(),
  })
  .strict()
  .refine((c) => !c.validTo || c.validTo >= c.validFrom, { path: ['validTo'], message: 'The end date is before the start date' });
export type PublishCondition = z.infer<typeof PublishConditionSchema>;

/** A published condition. The pattern's sweeps and numbers are a snapshot taken when it was published. */
export interface Condition {
  id: number;
  centerId: number;
  lanes: number[];
  validFrom: string;
  validTo: string | null;
  notes: string | null;
  publishedAt: string;
  publishedBy: number | null;
  /** Set when a later publication for overlapping lanes and dates replaced this one. */
  supersededBy: number | null;
  pattern: { id: number | null; name: string; sweeps: Sweep[]; summary: PatternSummary };
}

export interface CurrentCondition {
  center: Center;
  condition: Condition;
  /** Same as condition.pattern, at the top level for convenience. */
  pattern: Condition['pattern'];
  lanes: number[];
  validFrom: string;
  validTo: string | null;
  notes: string | null;
}
