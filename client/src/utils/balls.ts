import { checkLegality, type BallSpec, type CoverType, type LegalityResult } from '@engine/index';
import type { Ball } from '@shared/balls';
import { BALL_STATUSES, CORE_TYPES } from '@shared/balls';
import { unitFormatter, type UnitFormatter } from './units';

export const COVER_LABELS: Readonly<Record<CoverType, string>> = {
  plastic: 'Plastic',
  urethane: 'Urethane',
  'reactive-pearl': 'Reactive pearl',
  'reactive-hybrid': 'Reactive hybrid',
  'reactive-solid': 'Reactive solid',
};

export const CORE_LABELS: Readonly<Record<(typeof CORE_TYPES)[number], string>> = {
  symmetric: 'Symmetric',
  asymmetric: 'Asymmetric',
};

export const STATUS_LABELS: Readonly<Record<(typeof BALL_STATUSES)[number], string>> = {
  active: 'In the bag',
  retired: 'Retired',
  'in-shop': 'At the pro shop',
};

/** Readable names of the BallSpec fields the legality check reports. */
export const SPEC_FIELD_LABELS: Readonly<Record<string, string>> = {
  weightLb: 'Weight',
  diameterIn: 'Diameter',
  rg: 'RG',
  differential: 'Differential',
  intermediateDifferential: 'Intermediate differential',
  hardnessD: 'Hardness',
};

/** "2000 grit" or "4000 grit, polished". */
export function surfaceText(grit: number, polished: boolean): string {
  return `${grit} grit${polished ? ', polished' : ''}`;
}

/** Inches to three decimals, as spec sheets print RG and differentials. */
export function inches3(value: number): string {
  return value.toFixed(3);
}

/** A layout as the pro shop writes it: "4 1/2 in pin-to-PAP, 50° drilling angle, 40° VAL angle" (or "11.4 cm pin-to-PAP, …"). */
export function layoutText(layout: Ball['layout'], u: Pick<UnitFormatter, 'pinToPap'> = unitFormatter('imperial')): string {
  if (!layout) return 'Not drilled yet';
  const parts = [`${u.pinToPap(layout.pinToPapIn)} pin-to-PAP`];
  if (layout.drillingAngleDeg != null) parts.push(`${layout.drillingAngleDeg}° drilling angle`);
  if (layout.valAngleDeg != null) parts.push(`${layout.valAngleDeg}° VAL angle`);
  return parts.join(', ');
}

/** The engine's legality check, or null when the values are not a complete ball yet (a form being filled). */
export function legalityOf(spec: BallSpec): LegalityResult | null {
  try {
    return checkLegality(spec);
  } catch {
    return null;
  }
}
