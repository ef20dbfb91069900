import { z } from 'zod';

/**
 * A bowler's release parameters (the engine's BowlerProfile) plus display preferences.
 * Ranges: common practice for competitive bowlers, widened for beginners and power players.
 */
export const ProfileSchema = z.object({
  hand: z.enum(['right', 'left'], { error: 'Choose right or left' }),
  speedMph: z.number({ error: 'Must be a number' }).min(8, 'At least 8 mph').max(30, 'At most 30 mph'),
  revRpm: z.number({ error: 'Must be a number' }).int('Whole rpm').min(0, 'At least 0 rpm').max(700, 'At most 700 rpm'),
  axisRotationDeg: z.number({ error: 'Must be a number' }).min(0, 'At least 0°').max(90, 'At most 90°'),
  axisTiltDeg: z.number({ error: 'Must be a number' }).min(0, 'At least 0°').max(60, 'At most 60°'),
  papRightIn: z.number({ error: 'Must be a number' }).min(0, 'At least 0 in').max(8, 'At most 8 in').nullable(),
  papUpIn: z.number({ error: 'Must be a number' }).min(-3, 'At least −3 in').max(3, 'At most 3 in').nullable(),
  units: z.enum(['imperial', 'metric']),
});
export type Profile = z.infer<typeof ProfileSchema>;

export const ProfileUpdateSchema = ProfileSchema.partial().strict();
export type ProfileUpdate = z.infer<typeof ProfileUpdateSchema>;

/** Typical values a new profile starts from (common practice). */
export const DEFAULT_PROFILE: Profile = {
  hand: 'right',
  speedMph: 17,
  revRpm: 300,
  axisRotationDeg: 45,
  axisTiltDeg: 15,
  papRightIn: 5,
  papUpIn: 0.5,
  units: 'imperial',
};
