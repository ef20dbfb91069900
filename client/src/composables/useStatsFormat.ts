import type { Rate } from '@engine/index';

/** A percentage (0–100, as the engine's Rate gives it) with no decimals, or an en dash when there is nothing to divide. */
export function pct(v: number | null | undefined): string {
  return v === null || v === undefined || !Number.isFinite(v) ? '–' : `${Math.round(v)} %`;
}

/** A proportion (0–1) as a percentage. */
export function share(v: number | null | undefined): string {
  return v === null || v === undefined || !Number.isFinite(v) ? '–' : `${Math.round(v * 100)} %`;
}

/** "45 % (9 of 20)" */
export function rateText(r: Rate): string {
  if (r.n === 0) return 'no chances yet';
  return `${pct(r.pct)} (${r.hits} of ${r.n})`;
}

/** The Wilson 95 % interval (percent) as "25–66 %". */
export function intervalText(r: Rate): string {
  if (r.n === 0 || r.low === null || r.high === null) return '–';
  return `${Math.round(r.low)}–${Math.round(r.high)} %`;
}

export function num1(v: number | null | undefined): string {
  return v === null || v === undefined || !Number.isFinite(v) ? '–' : v.toFixed(1);
}
