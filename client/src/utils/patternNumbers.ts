import { analyzePattern, LENGTH_CLASS_FT, RATIO_BOARDS, RATIO_CLASS, VOLUME_CLASS_ML } from '@engine/index';
import type { LengthClass, PatternAnalysis, RatioClass, Sweep, VolumeClass } from '@engine/index';
import type { UnitFormatter } from './units';

/**
 * The numbers of a pattern as the editor, the public condition page and the publish preview show them.
 * The numbers come from the engine's `analyzePattern`, the very function the server stores as `summary`;
 * this file only formats them. Lengths are in the bowler's units (ft or m, `u` from `useUnits()`, which every caller
 * passes); volumes in mL and ratios are the same for everyone.
 */

type DistanceFormatter = Pick<UnitFormatter, 'units' | 'distance'>;

/** A pattern's numbers with an unbounded ratio as `null` (the API's JSON-safe summary has the same shape). */
export interface PatternNumbersInput {
  lengthFt: number;
  volumeMl: number;
  forwardMl: number;
  reverseMl: number;
  ratio: number | null;
  lengthClass: LengthClass;
  volumeClass: VolumeClass;
  ratioClass: RatioClass;
}

/** analyzePattern over the given sweeps, with an unbounded ratio turned into null (as the server's summary). */
export function computePatternNumbers(sweeps: readonly Sweep[]): PatternNumbersInput {
  const a: PatternAnalysis = analyzePattern({ name: 'draft', sweeps: [...sweeps] });
  return { ...a, ratio: Number.isFinite(a.ratio) ? a.ratio : null };
}

/** "18–22", "3–7 and 33–37": consecutive boards collapsed into ranges. */
export function boardRanges(boards: readonly number[]): string {
  const sorted = [...boards].sort((a, b) => a - b);
  const parts: string[] = [];
  let start = sorted[0];
  let prev = sorted[0];
  for (let i = 1; i <= sorted.length; i += 1) {
    const b = sorted[i];
    if (b === prev + 1) {
      prev = b;
      continue;
    }
    if (start !== undefined) parts.push(start === prev ? `${start}` : `${start}–${prev}`);
    start = b;
    prev = b;
  }
  if (parts.length <= 1) return parts.join('');
  return `${parts.slice(0, -1).join(', ')} and ${parts[parts.length - 1]}`;
}

/** Which boards the ratio compares, in words (the convention varies, so it is always shown). */
export const RATIO_RULE = `mean oil per board on boards ${boardRanges(RATIO_BOARDS.middle)} ÷ boards ${boardRanges(RATIO_BOARDS.outside)}`;

/** A length class in words, its limits in the bowler's units: "Short (under 37 ft)" or "Short (under 11.3 m)". */
export function lengthClassLabel(cls: LengthClass, u: DistanceFormatter): string {
  const at = (ft: number) => u.distance(ft, u.units === 'metric' ? 1 : 0);
  const { shortBelowFt, longFromFt } = LENGTH_CLASS_FT;
  if (cls === 'short') return `Short (under ${at(shortBelowFt)})`;
  if (cls === 'medium') return `Medium (${at(shortBelowFt).replace(/ \S+$/, '')} to under ${at(longFromFt)})`;
  return `Long (${at(longFromFt)} and more)`;
}

export const VOLUME_CLASS_LABELS: Readonly<Record<VolumeClass, string>> = {
  light: `Light (under ${VOLUME_CLASS_ML.lightBelowMl} mL)`,
  medium: `Medium (${VOLUME_CLASS_ML.lightBelowMl}–${VOLUME_CLASS_ML.heavyAboveMl} mL)`,
  heavy: `Heavy (over ${VOLUME_CLASS_ML.heavyAboveMl} mL)`,
};

/**
 * Ratio classes in Lanewright's own words. "Sport" is the governing body's name for its 3:1 limit (USBC sport
 * bowling) and keeps it; the two classes above it are named for how much the pattern forgives a missed target.
 * The API's values (`challenge`, `recreation`) are unchanged.
 */
export const RATIO_CLASS_LABELS: Readonly<Record<RatioClass, string>> = {
  sport: `Sport (${RATIO_CLASS.sportMax}:1 or less)`,
  challenge: `Demanding (over ${RATIO_CLASS.sportMax}:1, under ${RATIO_CLASS.recreationFrom}:1)`,
  recreation: `Forgiving (${RATIO_CLASS.recreationFrom}:1 or more)`,
};

/** What each class word measures, for the legend beside class names. */
export const CLASS_WORD_MEANINGS = {
  length: 'Length: how far down the lane the oil reaches from the foul line (short, medium, long).',
  volume: 'Volume: how much oil the whole pattern lays, in millilitres (light, medium, heavy).',
  ratio: `Ratio: oil in the middle of the lane against oil near the edges (${RATIO_RULE}). A low ratio punishes a missed target; a high one steers a stray ball back.`,
  sport: `Sport: ${RATIO_CLASS.sportMax}:1 or less, the limit the governing body (USBC) sets for its sport-bowling patterns.`,
  challenge: `Demanding: over ${RATIO_CLASS.sportMax}:1 and under ${RATIO_CLASS.recreationFrom}:1; some room for a miss, less than a typical league night.`,
  recreation: `Forgiving: ${RATIO_CLASS.recreationFrom}:1 or more; much more oil in the middle, so a ball missed outside comes back.`,
} as const;

/** Short class names for tables and tags. */
export const CLASS_SHORT: Readonly<Record<LengthClass | VolumeClass | RatioClass, string>> = {
  short: 'Short',
  medium: 'Medium',
  long: 'Long',
  light: 'Light',
  heavy: 'Heavy',
  sport: 'Sport',
  challenge: 'Demanding',
  recreation: 'Forgiving',
};

const fixed = (value: number, decimals: number): string => value.toFixed(decimals);

/** A pattern's length: "41.0 ft" or "12.5 m". */
export function formatLength(ft: number, u: DistanceFormatter): string {
  return u.distance(ft, 1);
}

export function formatVolume(ml: number): string {
  return `${fixed(ml, 2)} mL`;
}

/** "4.2 : 1"; an unbounded ratio (no oil on the outside boards) says so. */
export function formatRatio(ratio: number | null): string {
  return ratio === null ? 'unbounded (no oil outside)' : `${fixed(ratio, 2)} : 1`;
}

/** Share of the volume laid forward, "62 % forward / 38 % reverse". */
export function formatSplit(n: Pick<PatternNumbersInput, 'forwardMl' | 'reverseMl' | 'volumeMl'>): string {
  if (n.volumeMl <= 0) return 'no oil';
  const fwd = Math.round((n.forwardMl / n.volumeMl) * 100);
  return `${fwd} % forward / ${100 - fwd} % reverse`;
}

/** One line of the numbers list: a term, its value and a note. */
export interface PatternNumberLine {
  key: 'length' | 'volume' | 'forward' | 'reverse' | 'ratio' | 'lengthClass' | 'volumeClass' | 'ratioClass';
  term: string;
  value: string;
  note?: string;
}

/** Every number the editor shows, formatted; the same list feeds the public page and the publish preview. */
export function patternNumberLines(n: PatternNumbersInput, u: DistanceFormatter): PatternNumberLine[] {
  return [
    { key: 'length', term: 'Length', value: formatLength(n.lengthFt, u), note: 'where the applied oil ends' },
    { key: 'volume', term: 'Volume', value: formatVolume(n.volumeMl), note: formatSplit(n) },
    { key: 'forward', term: 'Forward', value: formatVolume(n.forwardMl) },
    { key: 'reverse', term: 'Reverse', value: formatVolume(n.reverseMl) },
    { key: 'ratio', term: 'Ratio', value: formatRatio(n.ratio), note: RATIO_RULE },
    { key: 'lengthClass', term: 'Length class', value: lengthClassLabel(n.lengthClass, u) },
    { key: 'volumeClass', term: 'Volume class', value: VOLUME_CLASS_LABELS[n.volumeClass] },
    { key: 'ratioClass', term: 'Ratio class', value: RATIO_CLASS_LABELS[n.ratioClass] },
  ];
}
