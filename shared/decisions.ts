import { z } from 'zod';
import type { ArsenalCoverage, LayoutLabEntry, TrialComparison } from '../engine/index';
import { LayoutSchema, PinToPapTextSchema } from './balls';

const id = (label: string) => z.number({ error: `${label} must be an id (a number)` }).int(`${label} must be a whole number`).positive(`${label} must be positive`).max(2147483647);
const queryId = z.coerce.number({ error: 'Must be a number' }).int('Must be a whole number').positive('Must be positive').max(2147483647);
const isoDate = z.iso.date({ error: 'Use a date like 2026-12-01' });

/** The most arms a trial compares (Lanewright's choice: more splits the shots too thin to say anything). */
export const TRIAL_MAX_ARMS = 4;

export const TrialArmSchema = z
  .object({
    ballId: id('ballId'),
    /** Only shots thrown on this surface ("2000 grit", "polished") count; any surface when left out. */
    surfaceKey: z.string().trim().min(1, 'Name a surface or leave it out').max(40, 'At most 40 characters').nullable().optional(),
  })
  .strict();

export const TrialCreateSchema = z
  .object({
    name: z.string({ error: 'Give the trial a name' }).trim().min(1, 'Give the trial a name').max(80, 'At most 80 characters'),
    arms: z
      .array(TrialArmSchema, { error: 'Choose the balls to compare' })
      .min(2, 'A trial compares at least two balls')
      .max(TRIAL_MAX_ARMS, `A trial compares at most ${TRIAL_MAX_ARMS} balls`)
      .refine((arms) => new Set(arms.map((a) => `${a.ballId}|${a.surfaceKey ?? ''}`)).size === arms.length, 'Each arm must be a different ball or surface'),
    /** Count only shots from sessions on this pattern (a condition's pattern); any pattern when left out. */
    patternId: id('patternId').nullable().optional(),
    startDate: isoDate.optional(),
    studentId: id('studentId').optional(),
  })
  .strict();
export type TrialCreate = z.infer<typeof TrialCreateSchema>;

export const TrialListQuerySchema = z.object({ studentId: queryId.optional() }).strict();
export type TrialListQuery = z.infer<typeof TrialListQuerySchema>;

export interface TrialArm {
  ballId: number;
  surfaceKey: string | null;
  label: string;
}

export interface Trial {
  id: number;
  userId: number;
  name: string;
  arms: TrialArm[];
  patternId: number | null;
  patternName: string | null;
  startDate: string;
  createdBy: number;
  createdAt: string;
}

/** A trial with its comparison (per-arm figures and the verdict). */
export interface TrialResult {
  trial: Trial;
  comparison: TrialComparison;
}

export const LayoutLabSchema = z
  .object({
    ballId: id('ballId'),
    patternId: id('patternId').optional(),
    conditionId: id('conditionId').optional(),
    layouts: z
      .array(
        z
          .object({
            label: z.string().trim().min(1, 'Name the layout').max(60, 'At most 60 characters'),
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
  .refine((v) => (v.patternId === undefined) !== (v.conditionId === undefined), { message: 'Choose a pattern or a published condition', path: ['patternId'] });
export type LayoutLabRequest = z.infer<typeof LayoutLabSchema>;
/** What a client sends (pin-to-PAP may be text as the pro shop writes it). */
export type LayoutLabInput = z.input<typeof LayoutLabSchema>;

export interface LayoutLabResult {
  ball: { id: number; label: string };
  /** The bowler's hand (the paths' boards count from that side's gutter). */
  hand: 'right' | 'left';
  condition: { name: string };
  items: LayoutLabEntry[];
}

export interface CoverageResult {
  balls: { id: string; label: string }[];
  conditions: { id: string; label: string; centerName: string; lanes: number[] }[];
  coverage: ArsenalCoverage;
}
