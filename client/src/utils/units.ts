import { z } from 'zod';
import { formatEighths } from '@shared/balls';
import { ProfileSchema, type Profile } from '@shared/profile';

/**
 * Unit conversion at the edge of the UI. Profiles are stored in the trade's units (mph, inches);
 * a bowler who chooses metric sees and types km/h and centimetres.
 */
export const KMH_PER_MPH = 1.609344;
export const CM_PER_IN = 2.54;

export type Units = Profile['units'];

/** The profile as the form shows it: same keys as `Profile`, speed and PAP in the chosen units. */
export interface ProfileForm {
  hand: Profile['hand'];
  speedMph: number | null;
  revRpm: number | null;
  axisRotationDeg: number | null;
  axisTiltDeg: number | null;
  papRightIn: number | null;
  papUpIn: number | null;
  units: Units;
}

export const UNIT_LABELS: Readonly<Record<Units, { speed: string; length: string }>> = {
  imperial: { speed: 'mph', length: 'in' },
  metric: { speed: 'km/h', length: 'cm' },
};

function round(value: number, decimals: number): number {
  const f = 10 ** decimals;
  return Math.round(value * f) / f;
}

function convert(value: number | null, factor: number, decimals: number): number | null {
  return value === null ? null : round(value * factor, decimals);
}

/** Display value → stored value and back, for one of the converted fields. */
function factorFor(field: 'speed' | 'length', from: Units, to: Units): number {
  if (from === to) return 1;
  const k = field === 'speed' ? KMH_PER_MPH : CM_PER_IN;
  return from === 'imperial' ? k : 1 / k;
}

/** Decimals shown for PAP: eighths of an inch need three; a millimetre is one decimal of a centimetre. */
export const LENGTH_DECIMALS: Readonly<Record<Units, number>> = { imperial: 3, metric: 1 };

export function toForm(profile: Profile): ProfileForm {
  const f = (field: 'speed' | 'length') => factorFor(field, 'imperial', profile.units);
  const d = LENGTH_DECIMALS[profile.units];
  return {
    ...profile,
    speedMph: profile.units === 'imperial' ? profile.speedMph : convert(profile.speedMph, f('speed'), 1),
    papRightIn: profile.units === 'imperial' ? profile.papRightIn : convert(profile.papRightIn, f('length'), d),
    papUpIn: profile.units === 'imperial' ? profile.papUpIn : convert(profile.papUpIn, f('length'), d),
  };
}

/** Convert the displayed speed and PAP when the bowler switches units in the form. */
export function switchUnits(form: ProfileForm, from: Units, to: Units): void {
  const d = LENGTH_DECIMALS[to];
  form.speedMph = convert(form.speedMph, factorFor('speed', from, to), 1);
  form.papRightIn = convert(form.papRightIn, factorFor('length', from, to), d);
  form.papUpIn = convert(form.papUpIn, factorFor('length', from, to), d);
}

/** A validated form → the stored profile (trade units). */
export function fromForm(form: Profile): Profile {
  const f = (field: 'speed' | 'length') => factorFor(field, form.units, 'imperial');
  return {
    ...form,
    speedMph: form.units === 'imperial' ? form.speedMph : round(form.speedMph * f('speed'), 2),
    papRightIn: form.units === 'imperial' ? form.papRightIn : convert(form.papRightIn, f('length'), 3),
    papUpIn: form.units === 'imperial' ? form.papUpIn : convert(form.papUpIn, f('length'), 3),
  };
}

function bounds(schema: z.ZodNumber): { min: number; max: number } {
  return { min: schema.minValue ?? -Infinity, max: schema.maxValue ?? Infinity };
}

/** A number rule in display units whose limits are the shared schema's limits converted (kept inside them). */
function metricNumber(schema: z.ZodNumber, factor: number, unit: string) {
  const { min, max } = bounds(schema);
  const lo = Math.ceil(min * factor * 10) / 10;
  const hi = Math.floor(max * factor * 10) / 10;
  const fmt = (v: number) => String(v).replace('-', '−');
  return z
    .number({ error: 'Must be a number' })
    .min(lo, `At least ${fmt(lo)} ${unit}`)
    .max(hi, `At most ${fmt(hi)} ${unit}`);
}

/**
 * The schema the form is checked with before saving: the shared `ProfileSchema` itself for imperial,
 * or the same rules with speed and PAP limits converted for metric.
 */
export function profileFormSchema(units: Units) {
  if (units === 'imperial') return ProfileSchema;
  const shape = ProfileSchema.shape;
  return ProfileSchema.extend({
    speedMph: metricNumber(shape.speedMph, KMH_PER_MPH, 'km/h'),
    papRightIn: metricNumber(shape.papRightIn.unwrap(), CM_PER_IN, 'cm').nullable(),
    papUpIn: metricNumber(shape.papUpIn.unwrap(), CM_PER_IN, 'cm').nullable(),
  });
}

/* ---- display formatting: every screen shows the stored trade units in the bowler's chosen units ------------------- */

export const KG_PER_LB = 0.45359237;
export const M_PER_FT = 0.3048;

/** The unit each kind of quantity is shown in. */
export const DISPLAY_UNITS: Readonly<Record<Units, { speed: string; weight: string; length: string; distance: string }>> = {
  imperial: { speed: 'mph', weight: 'lb', length: 'in', distance: 'ft' },
  metric: { speed: 'km/h', weight: 'kg', length: 'cm', distance: 'm' },
};

/** A ball speed stored in mph, in the chosen units (number only). */
export function speedValue(mph: number, units: Units): number {
  return units === 'metric' ? mph * KMH_PER_MPH : mph;
}
/** A weight stored in pounds, in the chosen units (number only). */
export function weightValue(lb: number, units: Units): number {
  return units === 'metric' ? lb * KG_PER_LB : lb;
}
/** A short length stored in inches (RG, pin-to-PAP), in the chosen units (number only). */
export function lengthValue(inches: number, units: Units): number {
  return units === 'metric' ? inches * CM_PER_IN : inches;
}
/** A distance down the lane stored in feet, in the chosen units (number only). */
export function distanceValue(ft: number, units: Units): number {
  return units === 'metric' ? ft * M_PER_FT : ft;
}

/** A number with a fixed count of decimals, the minus sign typographic. */
function fixed(value: number, decimals: number): string {
  const text = value.toFixed(decimals);
  return Number(text) === 0 ? (0).toFixed(decimals) : text.replace('-', '−');
}

/** A number followed by a lane distance, a speed or a weight in the trade's units, as the engine writes them. */
const TRADE_QUANTITY = /(\d+(?:\.\d+)?) (ft|mph|lb)\b/g;

/**
 * Formatters for one choice of units: `speed(17)` → "17.0 mph" or "27.4 km/h"; `weight(15)` → "15 lb" or "6.8 kg";
 * `length(2.5)` → "2.500 in" or "6.35 cm"; `distance(41)` → "41.0 ft" or "12.5 m". The number-only variants (`…Number`)
 * are for tables whose header names the unit.
 */
export function unitFormatter(units: Units) {
  const u = DISPLAY_UNITS[units];
  const metric = units === 'metric';
  const speedNumber = (mph: number, decimals = 1) => fixed(speedValue(mph, units), decimals);
  const weightNumber = (lb: number) => (metric ? fixed(weightValue(lb, units), 1) : String(Math.round(lb * 100) / 100));
  /** Inches keep the spec sheet's three decimals; centimetres two. */
  const lengthNumber = (inches: number, decimals = metric ? 2 : 3) => fixed(lengthValue(inches, units), decimals);
  const distanceNumber = (ft: number, decimals = 1) => fixed(distanceValue(ft, units), decimals);
  return {
    units,
    labels: u,
    speedNumber,
    weightNumber,
    lengthNumber,
    distanceNumber,
    speed: (mph: number, decimals = 1) => `${speedNumber(mph, decimals)} ${u.speed}`,
    weight: (lb: number) => `${weightNumber(lb)} ${u.weight}`,
    length: (inches: number, decimals?: number) => `${lengthNumber(inches, decimals)} ${u.length}`,
    /** Pin-to-PAP: eighths of an inch as the pro shop writes them ("4 1/2 in"), or centimetres to one decimal. */
    pinToPap: (inches: number) => (metric ? `${fixed(inches * CM_PER_IN, 1)} cm` : `${formatEighths(inches)} in`),
    distance: (ft: number, decimals = 1) => `${distanceNumber(ft, decimals)} ${u.distance}`,
    /** An input's value in display units and back (pin-to-PAP fields): inches ↔ centimetres. */
    lengthIn: (inches: number | null) => (inches === null ? null : metric ? Math.round(inches * CM_PER_IN * 10) / 10 : inches),
    lengthOut: (shown: number | null) => (shown === null ? null : metric ? Math.round((shown / CM_PER_IN) * 1000) / 1000 : shown),
    /** Weight fields (a ball's weight): pounds ↔ kilograms. */
    weightInput: inputConverter('weight', units),
    /**
     * The engine's sentences (reasons, suggestions, legality) in these units: each "<number> ft|mph|lb" becomes metres,
     * km/h or kg with at least one decimal. Inches stay: RG, differential and pin-to-PAP are stated in inches by the
     * trade and the USBC specifications, and the metric bowler's own length fields say so.
     */
    text: (sentence: string) =>
      metric
        ? sentence.replace(TRADE_QUANTITY, (_m, n: string, unit: 'ft' | 'mph' | 'lb') => {
            const decimals = Math.max(1, n.split('.')[1]?.length ?? 0);
            const v = Number(n);
            if (unit === 'ft') return `${distanceNumber(v, decimals)} ${u.distance}`;
            if (unit === 'mph') return `${speedNumber(v, decimals)} ${u.speed}`;
            return `${fixed(weightValue(v, units), decimals)} ${u.weight}`;
          })
        : sentence,
  };
}

export type UnitFormatter = ReturnType<typeof unitFormatter>;

/* ---- input fields: a field shows and takes the bowler's unit, the form keeps the stored trade unit ---------------- */

/** Decimals a field shows: 0.01 lb or 0.01 kg (10 g) for a weight, 0.01 ft or 0.01 m for a distance down the lane. */
export const INPUT_DECIMALS = 2;

/** Stored value → the number a field shows (rounded to the field's decimals, so the field never rewrites it). */
function toShown(value: number | null, factor: number): number | null {
  return value === null ? null : round(value * factor, INPUT_DECIMALS);
}
/** The number a field holds → the stored value (two decimals of the stored unit, as the API stores a typed value). */
function fromShown(shown: number | null | undefined, factor: number): number | null {
  return shown === null || shown === undefined || !Number.isFinite(shown) ? null : round(shown / factor, INPUT_DECIMALS);
}

/**
 * The converters of one kind of quantity for input fields: `in(stored)` → shown, `out(shown)` → stored, and
 * `bounds(min, max)`, a stored range as the field's limits kept inside it (so a shown limit never converts to a value
 * the stored rule refuses).
 */
export function inputConverter(kind: 'weight' | 'distance', units: Units) {
  const factor = units === 'imperial' ? 1 : kind === 'weight' ? KG_PER_LB : M_PER_FT;
  const unit = DISPLAY_UNITS[units][kind];
  const f = 10 ** INPUT_DECIMALS;
  return {
    unit,
    in: (stored: number | null) => toShown(stored, factor),
    out: (shown: number | null | undefined) => fromShown(shown, factor),
    bounds: (min: number, max: number) => ({ min: Math.ceil(min * factor * f) / f, max: Math.floor(max * factor * f) / f }),
  };
}

export type InputConverter = ReturnType<typeof inputConverter>;
