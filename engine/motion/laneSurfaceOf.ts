import type { LaneSurface } from '../types';

/** The lane surface when a condition names none: a synthetic lane of medium friction (the most common today, common practice). */
export const DEFAULT_LANE_SURFACE: Readonly<LaneSurface> = Object.freeze({ kind: 'synthetic', friction: 'medium' });

/**
 * Checks a lane surface and fills the default (DEFAULT_LANE_SURFACE).
 * Units: none. Edge cases: undefined or null → the default; a wrong kind or friction → TypeError naming `fn`.
 * Example: `laneSurfaceOf('simulateShot', { kind: 'wood', friction: 'high' })`.
 */
export function laneSurfaceOf(fn: string, lane: unknown): LaneSurface {
  if (lane === undefined || lane === null) return DEFAULT_LANE_SURFACE;
  if (typeof lane !== 'object') throw new TypeError(`${fn}: lane must be an object, got ${String(lane)}`);
  const l = lane as Record<string, unknown>;
  const kind = l.kind ?? 'synthetic';
  const friction = l.friction ?? 'medium';
  if (kind !== 'wood' && kind !== 'synthetic') throw new TypeError(`${fn}: lane.kind must be wood or synthetic, got ${String(kind)}`);
  if (friction !== 'low' && friction !== 'medium' && friction !== 'high')
    throw new TypeError(`${fn}: lane.friction must be low, medium or high, got ${String(friction)}`);
  return { kind, friction };
}
