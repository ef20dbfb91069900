import { z } from 'zod';
import { isSafeName, UNSAFE_NAME_MESSAGE } from './text';
import type { ArsenalBall, BallSpec, CoverType } from '../engine/types';
import { PageQuerySchema } from './auth';

export const COVER_TYPES = [
  'plastic',
  'urethane',
  'reactive-pearl',
  'reactive-hybrid',
  'reactive-solid',
] as const satisfies readonly CoverType[];
export const CoverTypeSchema = z.enum(COVER_TYPES, { error: 'Choose a cover type' });
export const CORE_TYPES = ['symmetric', 'asymmetric'] as const;
export const CoreTypeSchema = z.enum(CORE_TYPES, { error: 'Choose symmetric or asymmetric' });
/** The columns of a catalogue CSV import, in the order the server reads them (its template and the admin screen's). */
export const CATALOGUE_CSV_COLUMNS = [
  'maker',
  'name',
  'coverType',
  'coreType',
  'rg',
  'differential',
  'intermediateDifferential',
  'factoryGrit',
  'factoryPolished',
  'hardnessD',
  'releaseYear',
] as const;
export const BALL_STATUSES = ['active', 'retired', 'in-shop'] as const;

const num = (label: string) => z.number({ error: `${label} must be a number` });

/**
 * Field ranges the forms accept. They are wider than the legal limits (USBC equipment specifications) on purpose:
 * an illegal ball can be kept in an arsenal and is flagged by the engine's legality check.
 */
export const CoreSpecSchema = z.object({
  rg: num('RG').min(2.3, 'RG below 2.300 in is not a real ball').max(2.9, 'RG above 2.900 in is not a real ball'),
  differential: num('Differential').min(0, 'At least 0').max(0.1, 'At most 0.100 in'),
  intermediateDifferential: num('Intermediate differential').min(0, 'At least 0').max(0.05, 'At most 0.050 in'),
  coverType: CoverTypeSchema,
  hardnessD: num('Hardness').min(50, 'At least 50 D').max(100, 'At most 100 D').nullable().optional(),
});

export const SurfaceSchema = z.object({
  surfaceGrit: num('Grit').int('Whole grit').min(100, 'At least 100 grit').max(10000, 'At most 10000 grit'),
  polished: z.boolean({ error: 'Polished is yes or no' }),
});
export type Surface = z.infer<typeof SurfaceSchema>;

/**
 * Pin-to-PAP as a pro shop writes it: a decimal ("4.375"), a mixed fraction ("4 3/8", "4-3/8") or a bare fraction
 * ("3/4"), in inches; an optional trailing `in`, `"` or `″`. Returns the inches, or null when the text is not one
 * of those (or has a zero denominator). Common practice: layout sheets give distances to the nearest 1/8 or 1/16 in.
 */
export function parsePinToPapIn(text: string): number | null {
  const t = text
    .trim()
    .replace(/\s*(in|inch|inches|"|″)$/i, '')
    .trim();
  if (/^\d+(\.\d+)?$|^\.\d+$/.test(t)) return Number(t);
  const m = /^(?:(\d+)(?:\s+|\s*-\s*))?(\d+)\s*\/\s*(\d+)$/.exec(t);
  if (!m) return null;
  const whole = m[1] === undefined ? 0 : Number(m[1]);
  const num = Number(m[2]);
  const den = Number(m[3]);
  if (den === 0) return null;
  return whole + num / den;
}

/**
 * Inches as a pro shop writes them, in eighths: 4.375 → "4 3/8", 3.5 → "3 1/2", 5 → "5", 0.25 → "1/4". A value that
 * is not a whole number of eighths is not rounded away: sixteenths ("4 5/16") when exact, else the decimal ("3.4").
 */
export function formatEighths(inches: number): string {
  for (const den of [8, 16]) {
    const n = Math.round(inches * den);
    if (Math.abs(inches * den - n) > 1e-6) continue;
    const whole = Math.floor(n / den);
    let num = n % den;
    let d = den;
    while (num > 0 && num % 2 === 0) {
      num /= 2;
      d /= 2;
    }
    if (num === 0) return `${whole}`;
    return whole > 0 ? `${whole} ${num}/${d}` : `${num}/${d}`;
  }
  return String(Math.round(inches * 1000) / 1000);
}

export const LayoutSchema = z.object({
  pinToPapIn: num('Pin-to-PAP').min(0, 'At least 0 in').max(6.7, 'At most 6.7 in (half the circumference)'),
  drillingAngleDeg: num('Drilling angle').min(0).max(180).nullable().optional(),
  valAngleDeg: num('VAL angle').min(0).max(180).nullable().optional(),
});
export type Layout = z.infer<typeof LayoutSchema>;

/**
 * Pin-to-PAP typed as text (the ball form, the arsenal CSV): "4 3/8", "4-3/8", "3 3/8" or a decimal, in inches; a
 * number passes as it is. The result has the ranges of LayoutSchema.
 */
export const PinToPapTextSchema = z
  .union([z.number(), z.string()], { error: 'Pin-to-PAP is inches: 4 3/8, 4-3/8 or 4.375' })
  .transform((v, ctx) => {
    const n = typeof v === 'number' ? v : parsePinToPapIn(v);
    if (n === null || !Number.isFinite(n)) {
      ctx.addIssue({ code: 'custom', message: `Pin-to-PAP "${String(v).slice(0, 20)}" is not inches: write 4 3/8, 4-3/8 or 4.375` });
      return z.NEVER;
    }
    return n;
  })
  .pipe(LayoutSchema.shape.pinToPapIn);

// ---- catalogue -------------------------------------------------------------------------------------

export const BallModelInputSchema = CoreSpecSchema.extend({
  maker: z.string().trim().min(1, 'Maker is required').max(60).refine(isSafeName, UNSAFE_NAME_MESSAGE),
  name: z.string().trim().min(1, 'Name is required').max(80).refine(isSafeName, UNSAFE_NAME_MESSAGE),
  coreType: CoreTypeSchema,
  factoryGrit: num('Factory grit').int().min(100).max(10000),
  factoryPolished: z.boolean(),
  releaseYear: num('Release year').int().min(1950).max(2100).nullable().optional(),
});
export type BallModelInput = z.infer<typeof BallModelInputSchema>;
export const BallModelPatchSchema = BallModelInputSchema.partial().extend({ version: z.number().int().min(0) });

/** A ball's core and cover as stored (catalogue and arsenal answers). */
const storedSpec = {
  rg: z.number(),
  differential: z.number(),
  intermediateDifferential: z.number(),
  coverType: CoverTypeSchema,
  coreType: CoreTypeSchema,
  hardnessD: z.number().nullable(),
};

/** A catalogue ball as the API answers it. */
export const BallModelSchema = z.object({
  id: z.number().int(),
  maker: z.string(),
  name: z.string(),
  ...storedSpec,
  factoryGrit: z.number().int(),
  factoryPolished: z.boolean(),
  releaseYear: z.number().int().nullable(),
  version: z.number().int(),
});
export type BallModel = z.infer<typeof BallModelSchema>;

/** The answer of a CSV import into the catalogue: every row or none. */
export const CatalogueImportResultSchema = z.object({ imported: z.number().int(), items: z.array(BallModelSchema) });

const rangeNum = z.coerce.number({ error: 'Must be a number' }).finite();
export const CatalogueQuerySchema = PageQuerySchema.extend({
  q: z.string().trim().max(100).optional(),
  coverType: CoverTypeSchema.optional(),
  coreType: CoreTypeSchema.optional(),
  rgMin: rangeNum.optional(),
  rgMax: rangeNum.optional(),
  diffMin: rangeNum.optional(),
  diffMax: rangeNum.optional(),
  sort: z.enum(['maker', 'name', 'rg', 'differential', 'releaseYear', 'coverType']).default('maker'),
  order: z.enum(['asc', 'desc']).default('asc'),
});
export type CatalogueQuery = z.infer<typeof CatalogueQuerySchema>;

// ---- arsenal ---------------------------------------------------------------------------------------

/** The columns of the arsenal CSV import (header row required, order free), in the order of the template the client offers. */
export const ARSENAL_CSV_COLUMNS = [
  'name',
  'nickname',
  'weightLb',
  'coverType',
  'coreType',
  'rg',
  'differential',
  'intermediateDifferential',
  'hardnessD',
  'surfaceGrit',
  'polished',
  'pinToPapIn',
  'drillingAngleDeg',
  'valAngleDeg',
  'gamesSinceResurface',
] as const;

const ballBase = {
  nickname: z.string().trim().max(60, 'At most 60 characters').refine(isSafeName, UNSAFE_NAME_MESSAGE).nullable().optional(),
  weightLb: num('Weight').min(6, 'At least 6 lb').max(18, 'At most 18 lb'),
  layout: LayoutSchema.nullable().optional(),
  gamesSinceResurface: num('Games').int('Whole games').min(0, 'At least 0').max(10000, 'At most 10000 games').default(0),
  status: z.enum(BALL_STATUSES).default('active'),
};

/** A ball added from the catalogue: specs copied from the model; surface defaults to the factory finish. */
export const BallFromModelSchema = z
  .object({
    ballModelId: z.number({ error: 'Choose a catalogue ball' }).int().positive(),
    ...ballBase,
    surfaceGrit: SurfaceSchema.shape.surfaceGrit.optional(),
    polished: z.boolean().optional(),
  })
  .strict();
/** A ball entered by hand. */
export const BallByHandSchema = CoreSpecSchema.extend({
  name: z.string().trim().min(1, 'Name is required').max(80).refine(isSafeName, UNSAFE_NAME_MESSAGE),
  coreType: CoreTypeSchema,
  ...ballBase,
  ...SurfaceSchema.shape,
}).strict();

/** Either kind of new ball; a body with `ballModelId` is checked as a catalogue ball, any other as hand-entered (so field errors are specific). */
export const BallCreateSchema = z.union([BallFromModelSchema, BallByHandSchema]);
/** Picks the schema that reports field errors for this body. */
export function ballCreateSchemaFor(body: unknown): typeof BallFromModelSchema | typeof BallByHandSchema {
  return typeof body === 'object' && body !== null && 'ballModelId' in body ? BallFromModelSchema : BallByHandSchema;
}
export type BallCreate = z.infer<typeof BallCreateSchema>;

export const BallPatchSchema = z
  .object({
    version: z.number({ error: 'The version you edited is required' }).int().min(0),
    nickname: ballBase.nickname,
    weightLb: ballBase.weightLb.optional(),
    layout: ballBase.layout,
    gamesSinceResurface: num('Games').int('Whole games').min(0, 'At least 0').max(10000, 'At most 10000 games').optional(),
    status: z.enum(BALL_STATUSES).optional(),
    name: z.string().trim().min(1).max(80).refine(isSafeName, UNSAFE_NAME_MESSAGE).optional(),
  })
  .extend(CoreSpecSchema.partial().shape)
  .strict();
export type BallPatch = z.infer<typeof BallPatchSchema>;

export const SurfaceChangeSchema = SurfaceSchema.extend({
  note: z.string().trim().max(500).nullable().optional(),
  at: z.iso.datetime({ error: 'Use an ISO date-time' }).optional(),
}).strict();
export type SurfaceChange = z.infer<typeof SurfaceChangeSchema>;

export const ArsenalQuerySchema = PageQuerySchema.extend({
  q: z.string().trim().max(100).optional(),
  coverType: CoverTypeSchema.optional(),
  status: z.enum(BALL_STATUSES).optional(),
  sort: z.enum(['name', 'coverType', 'rg', 'differential', 'surfaceGrit', 'gamesSinceResurface', 'createdAt']).default('createdAt'),
  order: z.enum(['asc', 'desc']).default('asc'),
  pageSize: z.coerce.number().int().min(1).max(100).default(50),
});
export type ArsenalQuery = z.infer<typeof ArsenalQuerySchema>;

export const SurfaceEventSchema = z.object({
  id: z.number().int(),
  fromGrit: z.number().int().nullable(),
  fromPolished: z.boolean().nullable(),
  toGrit: z.number().int(),
  toPolished: z.boolean(),
  at: z.string(),
  byUserId: z.number().int().nullable(),
  note: z.string().nullable(),
});
export type SurfaceEvent = z.infer<typeof SurfaceEventSchema>;

/** A ball of an arsenal as the API answers it. */
export const BallSchema = z.object({
  id: z.number().int(),
  ballModelId: z.number().int().nullable(),
  maker: z.string().nullable(),
  name: z.string(),
  nickname: z.string().nullable(),
  weightLb: z.number(),
  ...storedSpec,
  /** Year the ball model was approved: the catalogue model's release year (null for a ball entered by hand). */
  approvalYear: z.number().int().nullable(),
  surfaceGrit: z.number().int(),
  polished: z.boolean(),
  layout: z
    .object({ pinToPapIn: z.number(), drillingAngleDeg: z.number().nullable().optional(), valAngleDeg: z.number().nullable().optional() })
    .nullable(),
  gamesSinceResurface: z.number().int(),
  status: z.enum(BALL_STATUSES),
  /** True when the owner uploaded a photo: GET /api/arsenal/:id/photo (with the bearer token). */
  hasPhoto: z.boolean(),
  version: z.number().int(),
  createdAt: z.string(),
  updatedAt: z.string(),
  surfaceHistory: z.array(SurfaceEventSchema).optional(),
});
export type Ball = z.infer<typeof BallSchema>;

/** The answer of a CSV import of an arsenal: every row or none. */
export const ArsenalImportResultSchema = z.object({ imported: z.number().int(), items: z.array(BallSchema) });
export type ArsenalImportResult = z.infer<typeof ArsenalImportResultSchema>;

/** The fields of a stored ball the engine reads. */
export type BallSpecSource = Pick<
  Ball,
  | 'weightLb'
  | 'rg'
  | 'differential'
  | 'intermediateDifferential'
  | 'coverType'
  | 'surfaceGrit'
  | 'polished'
  | 'hardnessD'
  | 'layout'
  | 'gamesSinceResurface'
  | 'approvalYear'
>;

/**
 * The engine's view of a stored ball: its specs, surface, layout, the games since its last resurface (the cover
 * dulls with use) and its approval year (the hardness limit depends on it). Every screen and the server build
 * the engine's input with this one function, so they see the same ball.
 */
export function ballToSpec(b: BallSpecSource): BallSpec {
  return {
    weightLb: b.weightLb,
    rg: b.rg,
    differential: b.differential,
    intermediateDifferential: b.intermediateDifferential,
    coverType: b.coverType,
    surfaceGrit: b.surfaceGrit,
    polished: b.polished,
    ...(b.hardnessD != null ? { hardnessD: b.hardnessD } : {}),
    // The engine takes 0–10000 games; a cover's wear has long levelled off by then.
    gamesSinceResurface: Math.min(b.gamesSinceResurface, 10000),
    ...(b.approvalYear != null ? { approvalYear: b.approvalYear } : {}),
    ...(b.layout
      ? {
          layout: {
            pinToPapIn: b.layout.pinToPapIn,
            ...(b.layout.drillingAngleDeg != null ? { drillingAngleDeg: b.layout.drillingAngleDeg } : {}),
            ...(b.layout.valAngleDeg != null ? { valAngleDeg: b.layout.valAngleDeg } : {}),
          },
        }
      : {}),
  };
}

/** The name a bowler knows a ball by: "Nickname (Model)", else the model name. */
export function ballLabel(ball: Pick<Ball, 'name' | 'nickname'>): string {
  return ball.nickname ? `${ball.nickname} (${ball.name})` : ball.name;
}

/** A stored ball as one ball of rankArsenal's input: its id as a string, its label (for the engine's texts) and ballToSpec. */
export function ballToArsenalBall(b: BallSpecSource & Pick<Ball, 'id' | 'name' | 'nickname'>): ArsenalBall & { label: string } {
  return { id: String(b.id), label: ballLabel(b), ...ballToSpec(b) };
}
