import { z } from 'zod';
import type { ArsenalCoverage, LayoutLabEntry, TrialComparison } from '../engine/index';
import { engineValue } from './api';
import { LayoutSchema, PinToPapTextSchema } from './balls';
import { isSafeName, UNSAFE_NAME_MESSAGE } from './text';

const id = (label: string) =>
  z
    .number({ error: `${label} must be an id (a number)` })
    .int(`${label} must be a whole number`)
    .positive(`${label} must be positive`)
    .max(2147483647);
const queryId = z.coerce.number({ error: 'Must be a number' }).int('Must be a whole number').positive('Must be positive').max(2147483647);
const isoDate = z.iso.date({ error: 'Use a date like 2026-12-01' });

/** The most arms a trial compares (Lanewright's choice: more splits the shots too thin to say anything). */
export const TRIAL_MAX_ARMS = 4;

export const TrialArmInputSchema = z
  .object({
    ballId: id('ballId'),
    /** Only shots thrown on this surface ("2000 grit", "polished") count; any surface when left out. */
    surfaceKey: z
      .string()
      .trim()
      .min(1, 'Name a surface or leave it out')
      .max(40, 'At most 40 characters')
      .refine(isSafeName, UNSAFE_NAME_MESSAGE)
      .nullable()
      .optional(),
  })
  .strict();

export const TrialCreateSchema = z
  .object({
    name: z
      .string({ error: 'Give the trial a name' })
      .trim()
      .min(1, 'Give the trial a name')
      .max(80, 'At most 80 characters')
      .refine(isSafeName, UNSAFE_NAME_MESSAGE),
    arms: z
      .array(TrialArmInputSchema, { error: 'Choose the balls to compare' })
      .min(2, 'A trial compares at least two balls')
      .max(TRIAL_MAX_ARMS, `A trial compares at most ${TRIAL_MAX_ARMS} balls`)
      .refine(
        (arms) => new Set(arms.map((a) => `${a.ballId}|${a.surfaceKey ?? ''}`)).size === arms.length,
        'Each arm must be a different ball or surface',
      ),
    /** Count only shots from sessions on this pattern (a condition's pattern); any pattern when left out. */
    patternId: id('patternId').nullable().optional(),
    startDate: isoDate.optional(),
    studentId: id('studentId').optional(),
  })
  .strict();
export type TrialCreate = z.infer<typeof TrialCreateSchema>;

export const TrialListQuerySchema = z.object({ studentId: queryId.optional() }).strict();
export type TrialListQuery = z.infer<typeof TrialListQuerySchema>;

export const TrialArmSchema = z.object({
  ballId: z.number().int(),
  surfaceKey: z.string().nullable(),
  label: z.string(),
});
export type TrialArm = z.infer<typeof TrialArmSchema>;

export const TrialSchema = z.object({
  id: z.number().int(),
  userId: z.number().int(),
  name: z.string(),
  arms: z.array(TrialArmSchema),
  patternId: z.number().int().nullable(),
  patternName: z.string().nullable(),
  startDate: z.string(),
  createdBy: z.number().int(),
  createdAt: z.string(),
});
export type Trial = z.infer<typeof TrialSchema>;

/** A trial with its comparison (per-arm figures and the verdict, the engine's compareTrial). */
export const TrialResultSchema = z.object({
  trial: TrialSchema,
  comparison: engineValue<TrialComparison>("The engine's trial comparison: each arm's rates with intervals, and the verdict"),
});
export type TrialResult = z.infer<typeof TrialResultSchema>;

export const LayoutLabSchema = z
  .object({
    ballId: id('ballId'),
    patternId: id('patternId').optional(),
    conditionId: id('conditionId').optional(),
    layouts: z
      .array(
        z
          .object({
            label: z.string().trim().min(1, 'Name the layout').max(60, 'At most 60 characters').refine(isSafeName, UNSAFE_NAME_MESSAGE),
            pinToPapIn: PinToPapTextSchema,
            drillingAngleDeg: LayoutSchema.shape.drillingAngleDeg,
            valAngleDeg: LayoutSchema.shape.valAngleDeg,
          })
          .strict(),
        { error: 'Give the layouts to compare' },
      )
      .min(1, 'Give at least one layout')
      .max(4, 'At most 4 layouts side by side'),
  })
  .strict()
  .refine((v) => (v.patternId === undefined) !== (v.conditionId === undefined), {
    message: 'Choose a pattern or a published condition',
    path: ['patternId'],
  });
export type LayoutLabRequest = z.infer<typeof LayoutLabSchema>;
/** What a client sends (pin-to-PAP may be text as the pro shop writes it). */
export type LayoutLabInput = z.input<typeof LayoutLabSchema>;

export const LayoutLabResultSchema = z.object({
  ball: z.object({ id: z.number().int(), label: z.string() }),
  /** The bowler's hand (the paths' boards count from that side's gutter). */
  hand: z.enum(['right', 'left']),
  condition: z.object({ name: z.string() }),
  items: z.array(engineValue<LayoutLabEntry>("The engine's layout lab entry: the drawing's points, flare rings and the predicted path")),
});
export type LayoutLabResult = z.infer<typeof LayoutLabResultSchema>;

export const CoverageResultSchema = z.object({
  balls: z.array(z.object({ id: z.string(), label: z.string() })),
  conditions: z.array(z.object({ id: z.string(), label: z.string(), centerName: z.string(), lanes: z.array(z.number().int()) })),
  coverage: engineValue<ArsenalCoverage>("The engine's arsenal coverage: cells, gaps with catalogue suggestions, balls doing the same job"),
});
export type CoverageResult = z.infer<typeof CoverageResultSchema>;
