import { z } from 'zod';
import type { LeagueSeason } from '../engine/league/leagueSeason';
import { engineValue } from './api';

const isoDate = z.iso.date({ error: 'Use a date like 2026-09-01' });
const pins = (label: string, min: number, max: number) =>
  z
    .number({ error: `${label} must be a number` })
    .int(`${label}: whole pins`)
    .min(min, `${label}: at least ${min}`)
    .max(max, `${label}: at most ${max}`);

export const WEEKDAYS = ['Sunday', 'Monday', 'Tuesday', 'Wednesday', 'Thursday', 'Friday', 'Saturday'] as const;

/** A league's handicap: a percentage of the difference between a basis score and the average (null rule: a scratch league). */
export const HandicapRuleSchema = z
  .object({
    basis: pins('Basis', 100, 300),
    percentage: z
      .number({ error: 'Percentage must be a number' })
      .int('Percentage: a whole number')
      .min(1, 'Percentage: 1 to 100')
      .max(100, 'Percentage: 1 to 100'),
    maxPerGame: pins('Most handicap a game', 0, 300).nullable().optional(),
  })
  .strict();
export type HandicapRuleInput = z.infer<typeof HandicapRuleSchema>;

const leagueFields = {
  name: z.string({ error: 'Name the league' }).trim().min(1, 'Name the league').max(80, 'At most 80 characters'),
  centerId: z.number({ error: 'centerId must be an id' }).int().positive().max(2147483647).nullable().optional(),
  weekday: z
    .number({ error: 'Choose the night' })
    .int('Choose the night')
    .min(0, 'Choose the night')
    .max(6, 'Choose the night')
    .nullable()
    .optional(),
  seasonStart: isoDate,
  seasonEnd: isoDate.nullable().optional(),
  gamesPerNight: z
    .number({ error: 'Games a night must be a number' })
    .int('Games a night: a whole number')
    .min(1, 'Games a night: 1 to 5')
    .max(5, 'Games a night: 1 to 5')
    .optional(),
  handicap: HandicapRuleSchema.nullable().optional(),
  enteringAverage: pins('Entering average', 0, 300).nullable().optional(),
};

const seasonOrder = (l: { seasonStart?: string; seasonEnd?: string | null }) =>
  !l.seasonStart || !l.seasonEnd || l.seasonEnd >= l.seasonStart;
const seasonOrderError = { path: ['seasonEnd'], message: 'The season ends before it starts' };

export const LeagueCreateSchema = z.object(leagueFields).strict().refine(seasonOrder, seasonOrderError);
export type LeagueCreate = z.infer<typeof LeagueCreateSchema>;

export const LeaguePatchSchema = z
  .object({ ...leagueFields, name: leagueFields.name.optional(), seasonStart: isoDate.optional() })
  .strict()
  .refine(seasonOrder, seasonOrderError);
export type LeaguePatch = z.infer<typeof LeaguePatchSchema>;

export const LeagueSchema = z.object({
  id: z.number().int(),
  userId: z.number().int(),
  name: z.string(),
  centerId: z.number().int().nullable(),
  centerName: z.string().nullable(),
  weekday: z.number().int().nullable(),
  seasonStart: z.string(),
  seasonEnd: z.string().nullable(),
  gamesPerNight: z.number().int(),
  handicap: z.object({ basis: z.number().int(), percentage: z.number().int(), maxPerGame: z.number().int().nullable() }).nullable(),
  enteringAverage: z.number().int().nullable(),
  /** League nights logged (sessions in this league). */
  nights: z.number().int(),
  createdAt: z.string(),
});
export type League = z.infer<typeof LeagueSchema>;

/** One league night as the standing shows it: the session, its lane pair, and games not yet complete. */
export const LeagueNightRowSchema = z.object({
  sessionId: z.number().int(),
  date: z.string(),
  lanePair: z.string().nullable(),
  /** Games of the session still incomplete: they count only once complete. */
  incompleteGames: z.number().int(),
});

/** A league's season: the engine's nights (average and handicap each was bowled on) and the sessions behind them. */
export const LeagueStandingSchema = z.object({
  league: LeagueSchema,
  season: engineValue<LeagueSeason>("The engine's league season: each night's series, average and handicap"),
  nights: z.array(LeagueNightRowSchema),
});
export type LeagueStanding = z.infer<typeof LeagueStandingSchema>;

/**
 * A lane pair: an odd lane and the even lane beside it ("13-14"), the way a center assigns pairs (common practice).
 */
export const LanePairSchema = z
  .string({ error: 'Write the pair like 13-14' })
  .trim()
  .regex(/^\d{1,3}-\d{1,3}$/, 'Write the pair like 13-14')
  .refine((s) => {
    const [a, b] = s.split('-').map(Number);
    return a >= 1 && a % 2 === 1 && b === a + 1;
  }, 'A pair is an odd lane and the next one, like 13-14');
