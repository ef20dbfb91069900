import type { DeliveryResult } from './integrateDelivery';
import type { ShotPrediction } from './shotPrediction';

/**
 * The public ShotPrediction of one integration on a line: the per-foot samples as `path` objects and
 * the reported events (definitions in integrateDelivery; our reporting definitions).
 * Units: boards from the hand-side gutter, ft, mph, degrees, s. Edge cases: a gutter ball's path ends at
 * the gutter point. Example: `toShotPrediction(prepareShot(input).run(20, 12), 20, 12).entryAngleDeg`.
 */
export function toShotPrediction(r: DeliveryResult, laydownBoard: number, targetBoard: number): ShotPrediction {
  const path: ShotPrediction['path'] = [];
  for (let i = 0; i < r.sampleCount; i++) path.push({ ft: r.sampleFt[i], board: r.sampleBoard[i], speedMph: r.sampleSpeedMph[i] });
  return {
    path,
    rollStartFt: r.rollStartFt,
    skidFt: r.skidFt,
    breakpoint: { ft: r.breakpointFt, board: r.breakpointBoard },
    entryBoard: r.entryBoard,
    entryAngleDeg: r.entryAngleDeg,
    timeToPinsS: r.timeToPinsS,
    speedAtPinsMph: r.speedAtPinsMph,
    gutter: r.gutter,
    flareIn: r.flareIn,
    laydownBoard,
    targetBoard,
  };
}
