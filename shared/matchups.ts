import { z } from 'zod';

export const MatchupRequestSchema = z
  .object({
    patternId: z.number({ error: 'patternId must be a pattern id (a number)' }).int().positive(),
    ballIds: z.array(z.number().int().positive()).min(1).max(30).optional(),
    gamesBowled: z.number({ error: 'Must be a number' }).min(0, 'At least 0').max(30, 'At most 30 games').default(0),
    studentId: z.number().int().positive().optional(),
  })
  .strict();
export type MatchupRequest = z.infer<typeof MatchupRequestSchema>;
