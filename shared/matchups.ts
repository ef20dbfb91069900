import { z } from 'zod';
import type { BowlerProfile, RankedBall } from '../engine/types';
import type { MissRoom } from '../engine/motion/missRoom';
import type { ShotPrediction } from '../engine/motion/shotPrediction';
import type { Calibration } from '../engine/shotlog/types';
import { engineValue } from './api';
import { BallSchema } from './balls';
import { LaneSurfaceSchema } from './centers';
import { PatternSummarySchema, SweepSchema } from './patterns';

const id = (label: string, what: string) =>
  z
    .number({ error: `${label} must be ${what} (a number)` })
    .int(`${label} must be a whole number`)
    .positive(`${label} must be positive`)
    .max(2147483647);

/**
 * A matchup: the arsenal (or the chosen balls) ranked for a plain pattern (`patternId`, on the lane surface `lane`,
 * default synthetic with medium friction) or for a center's published condition (`conditionId`: its pattern and its
 * lane surface). Exactly one of `patternId` and `conditionId`.
 */
export const MatchupRequestSchema = z
  .object({
    patternId: id('patternId', 'a pattern id').optional(),
    conditionId: id('conditionId', 'a published condition id').optional(),
    /** The lane surface for a plain pattern; a published condition names its own. */
    lane: LaneSurfaceSchema.optional(),
    ballIds: z.array(z.number().int().positive()).min(1).max(30).optional(),
    gamesBowled: z.number({ error: 'Must be a number' }).min(0, 'At least 0').max(30, 'At most 30 games').default(0),
    studentId: z.number().int().positive().optional(),
  })
  .strict()
  .superRefine((r, ctx) => {
    if (r.patternId === undefined && r.conditionId === undefined)
      ctx.addIssue({ code: 'custom', path: ['patternId'], message: 'Choose a pattern (patternId) or a published condition (conditionId)' });
    if (r.patternId !== undefined && r.conditionId !== undefined)
      ctx.addIssue({ code: 'custom', path: ['conditionId'], message: 'Give either a pattern or a published condition, not both' });
    if (r.conditionId !== undefined && r.lane !== undefined)
      ctx.addIssue({
        code: 'custom',
        path: ['lane'],
        message: 'A published condition names its own lane surface: send lane only with patternId',
      });
  });
export type MatchupRequest = z.infer<typeof MatchupRequestSchema>;

/** The ball's own fields a ranking carries for display. */
export const MatchupBallSchema = BallSchema.pick({
  id: true,
  name: true,
  nickname: true,
  maker: true,
  coverType: true,
  coreType: true,
  rg: true,
  differential: true,
  intermediateDifferential: true,
  surfaceGrit: true,
  polished: true,
  layout: true,
  weightLb: true,
  gamesSinceResurface: true,
});
export type MatchupBall = z.infer<typeof MatchupBallSchema>;

/**
 * One ranked ball of a matchup: the engine's RankedBall (score, standing, fit, reasons, suggestions, prediction,
 * miss room) with the ball's numeric id. A 'ball' suggestion's `change.ballId` is that other ball's numeric id.
 */
export type MatchupRanking = RankedBall & {
  ballId: number;
  ball: MatchupBall;
  prediction?: ShotPrediction | null;
  missRoom?: MissRoom | null;
  /** The calibrated friction multiplier the ball-motion model used; absent when uncalibrated. */
  frictionScale?: number;
};
export const MatchupRankingSchema = engineValue<MatchupRanking>(
  "The engine's ranked ball (score, standing, fit, reasons, suggestions, prediction, miss room) with ballId, the ball's fields and the friction scale used",
);

/** What a matchup says about the bowler's calibration, and the fit itself (the what-if passes it to the engine as the server did). */
export const MatchupCalibrationSchema = z.object({
  applied: z.boolean(),
  shots: z.number().int(),
  note: z.string(),
  /** fitCalibration's answer on this pattern and lane surface (null when it could not be computed); applied when `applied`. */
  fit: engineValue<Calibration>("The engine's calibration fit").nullable(),
});
export type MatchupCalibration = z.infer<typeof MatchupCalibrationSchema>;

/** The answer of POST /api/matchups: the engine's input as the server used it, and the ranking. */
export const MatchupResultSchema = z.object({
  /** The pattern ranked on (for a condition: its snapshot as published; `id` is the pattern it was published from, if it still exists). */
  pattern: z.object({ id: z.number().int().nullable(), name: z.string(), summary: PatternSummarySchema, sweeps: z.array(SweepSchema) }),
  /** The published condition, when the matchup was for one. */
  condition: z
    .object({
      id: z.number().int(),
      centerId: z.number().int(),
      centerName: z.string(),
      lanes: z.array(z.number().int()),
      validFrom: z.string(),
      validTo: z.string().nullable(),
    })
    .nullable(),
  lane: LaneSurfaceSchema,
  /** The lane surface in words: "Synthetic lanes, high friction". */
  laneText: z.string(),
  bowler: engineValue<BowlerProfile>("The engine's bowler profile the ranking used"),
  gamesBowled: z.number(),
  calibration: MatchupCalibrationSchema,
  /** Strike balls by score, then spare balls, then balls outside the USBC limits (standing 'illegal'). */
  rankings: z.array(MatchupRankingSchema),
});
export type MatchupResult = z.infer<typeof MatchupResultSchema>;
