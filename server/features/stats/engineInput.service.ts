import type { BowlerProfile, LaneSurface, OilPattern } from '../../../engine/types';
import { DEFAULT_LANE_SURFACE } from '../../../shared/centers';
import type { PatternSummary } from '../../../shared/patterns';
import { AppError } from '../../lib/AppError';
import type { AuthUser } from '../../middleware/auth';
import { centersRepository, laneOf } from '../centers/centers.repository';
import { patternsService } from '../patterns/patterns.service';
import { profileService } from '../profile/profile.service';

/** What the engine works on for a bowler: their release, and a pattern on a lane surface or a published condition. */

export async function bowlerOf(userId: number): Promise<BowlerProfile> {
  const { profile } = await profileService.get(userId);
  return {
    hand: profile.hand,
    speedMph: profile.speedMph,
    revRpm: profile.revRpm,
    axisRotationDeg: profile.axisRotationDeg,
    axisTiltDeg: profile.axisTiltDeg,
    ...(profile.papRightIn != null ? { papRightIn: profile.papRightIn } : {}),
    ...(profile.papUpIn != null ? { papUpIn: profile.papUpIn } : {}),
  };
}

/**
 * What a matchup or a calibration is worked out on: a plain pattern on a lane surface, or a published condition
 * (its pattern as published and its lane surface; the shots counted are those logged on the pattern it was
 * published from, none when that pattern is gone). 404 for an unknown pattern or condition.
 */
export async function engineCondition(ref: {
  patternId?: number;
  conditionId?: number;
  lane?: LaneSurface;
  /** Who asks: a plain pattern they may not see is 404 (conditions are public). */
  viewer?: AuthUser;
}): Promise<{
  patternId: number | null;
  name: string;
  pattern: OilPattern;
  summary: PatternSummary;
  lane: LaneSurface;
  condition: { id: number; centerId: number; centerName: string; lanes: number[]; validFrom: string; validTo: string | null } | null;
}> {
  if (ref.conditionId !== undefined) {
    const c = await centersRepository.findCondition(ref.conditionId);
    if (!c) throw AppError.notFound('Condition');
    return {
      patternId: c.patternId,
      name: c.patternName,
      pattern: { name: c.patternName, sweeps: c.sweeps },
      summary: c.summary,
      lane: laneOf(c),
      condition: { id: c.id, centerId: c.centerId, centerName: c.center.name, lanes: c.lanes, validFrom: c.validFrom, validTo: c.validTo },
    };
  }
  const { id, name, pattern, summary } = await patternsService.engineInput(ref.patternId!, ref.viewer);
  const lane = ref.lane ?? DEFAULT_LANE_SURFACE;
  return { patternId: id, name, pattern, summary, lane: { kind: lane.kind, friction: lane.friction }, condition: null };
}
