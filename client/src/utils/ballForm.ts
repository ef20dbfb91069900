import type { Ref } from 'vue';
import { z } from 'zod';
import { BALL_STATUSES, CoreSpecSchema, CoreTypeSchema, PinToPapTextSchema, SurfaceSchema, type Ball } from '@shared/balls';
import { inputConverter, type InputConverter } from './units';

/** The arsenal ball dialog's flat form (a ball entered by hand, added from the catalogue, or edited). */
export interface BallForm {
  name: string;
  nickname: string;
  weightLb: number | null;
  rg: number | null;
  differential: number | null;
  intermediateDifferential: number | null;
  coverType: Ball['coverType'] | '';
  coreType: Ball['coreType'];
  hardnessD: number | null;
  surfaceGrit: number | null;
  polished: boolean;
  /** Pin-to-PAP as typed: "4 3/8", "4-3/8", "4.375" (empty: undrilled). */
  pinToPapIn: string;
  drillingAngleDeg: number | null;
  valAngleDeg: number | null;
  gamesSinceResurface: number | null;
  status: Ball['status'];
}

export function emptyForm(): BallForm {
  return {
    name: '',
    nickname: '',
    weightLb: 15,
    rg: null,
    differential: null,
    intermediateDifferential: 0,
    coverType: '',
    coreType: 'symmetric',
    hardnessD: null,
    surfaceGrit: 2000,
    polished: false,
    pinToPapIn: '',
    drillingAngleDeg: null,
    valAngleDeg: null,
    gamesSinceResurface: 0,
    status: 'active',
  };
}

/** A ball's weight limits in pounds (the shared `BallCreate` rule: a ball over the USBC limit can be kept, up to 18 lb). */
const WEIGHT_LB = { min: 6, max: 18 } as const;

/**
 * The dialog's validation: the shared schemas' rules on the flat form. `basePin` is the stored pin-to-PAP and the text
 * it was shown as, saved unchanged while that text is not edited. The form keeps the weight in pounds; `weight` is the
 * bowler's weight field, whose unit the weight messages speak in ("At most 18 lb" or "At most 8.16 kg").
 */
export function ballFormSchemas(
  basePin: Ref<{ text: string; inches: number } | null>,
  weight: InputConverter = inputConverter('weight', 'imperial'),
) {
  const req = (label: string) => `${label} is required`;
  const shownWeight = weight.bounds(WEIGHT_LB.min, WEIGHT_LB.max);
  const layoutFields = {
    // Text as a pro shop writes it, read by the shared schema (the arsenal CSV reads it the same way); empty = undrilled.
    pinToPapIn: z.string().transform((text, ctx): number | null => {
      const t = text.trim();
      if (t === '') return null;
      if (basePin.value && t === basePin.value.text) return basePin.value.inches;
      const r = PinToPapTextSchema.safeParse(t);
      if (r.success) return r.data;
      for (const issue of r.error.issues) ctx.addIssue({ code: 'custom', message: issue.message });
      return z.NEVER;
    }),
    drillingAngleDeg: z.number().min(0, 'At least 0°').max(180, 'At most 180°').nullable(),
    valAngleDeg: z.number().min(0, 'At least 0°').max(180, 'At most 180°').nullable(),
  };
  const common = {
    nickname: z.string().trim().max(60, 'At most 60 characters'),
    weightLb: z
      .number({ error: req('Weight') })
      .min(WEIGHT_LB.min, `At least ${shownWeight.min} ${weight.unit}`)
      .max(WEIGHT_LB.max, `At most ${shownWeight.max} ${weight.unit}`),
    surfaceGrit: SurfaceSchema.shape.surfaceGrit,
    polished: z.boolean(),
    gamesSinceResurface: z
      .number({ error: req('Games') })
      .int('Whole games')
      .min(0, 'At least 0'),
    status: z.enum(BALL_STATUSES),
    ...layoutFields,
  };
  const specFields = {
    name: z.string().trim().min(1, 'Name is required').max(80, 'At most 80 characters'),
    ...CoreSpecSchema.shape,
    coreType: CoreTypeSchema,
  };

  const layoutRule = (
    v: { pinToPapIn: number | null; drillingAngleDeg: number | null; valAngleDeg: number | null },
    ctx: z.RefinementCtx,
  ) => {
    if (v.pinToPapIn === null && (v.drillingAngleDeg !== null || v.valAngleDeg !== null)) {
      ctx.addIssue({ code: 'custom', path: ['pinToPapIn'], message: 'Enter the pin-to-PAP distance to save a layout' });
    }
  };
  const CatalogueFormSchema = z.object(common).superRefine(layoutRule);
  const SpecFormSchema = z.object({ ...common, ...specFields }).superRefine(layoutRule);
  return { CatalogueFormSchema, SpecFormSchema };
}

export function layoutOf(v: { pinToPapIn: number | null; drillingAngleDeg: number | null; valAngleDeg: number | null }): Ball['layout'] {
  if (v.pinToPapIn === null) return null;
  return { pinToPapIn: v.pinToPapIn, drillingAngleDeg: v.drillingAngleDeg, valAngleDeg: v.valAngleDeg };
}
