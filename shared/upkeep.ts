import { z } from 'zod';
import type { UpkeepItem } from '../engine/upkeep/upkeepDue';
import { engineValue } from './api';

const interval = (label: string) =>
  z
    .number({ error: `${label} must be a number of games` })
    .int(`${label}: whole games`)
    .min(5, `${label}: 5 to 500 games`)
    .max(500, `${label}: 5 to 500 games`)
    .nullable()
    .optional();

/** A ball's upkeep settings: its own intervals (null: the defaults) and an upkeep done by hand. */
export const UpkeepPatchSchema = z
  .object({
    resurfaceGames: interval('Resurface every'),
    extractionGames: interval('Oil extraction every'),
    /** An oil extraction done (at home or at a shop not in Lanewright): the count starts again at 0. */
    extractionDone: z.literal(true, { error: 'extractionDone can only be true' }).optional(),
  })
  .strict();
export type UpkeepPatch = z.infer<typeof UpkeepPatchSchema>;

const UpkeepItemSchema = engineValue<UpkeepItem>("The engine's upkeep state: games since, interval, games left, ok/soon/due");

/** One ball's upkeep. */
export const BallUpkeepSchema = z.object({
  ballId: z.number().int(),
  name: z.string(),
  surfaceGrit: z.number().int(),
  polished: z.boolean(),
  resurface: UpkeepItemSchema,
  extraction: UpkeepItemSchema,
  /** Whether the intervals are the bowler's own for this ball (else the defaults). */
  ownIntervals: z.boolean(),
});
export type BallUpkeep = z.infer<typeof BallUpkeepSchema>;
