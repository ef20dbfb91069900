import { assertOilMap } from './assertState';
import type { LaneOilMap } from './laneOilMap';
import { PHYSICAL_CONSTANTS as C } from './physicalConstants';

/**
 * Total oil on lane boards 1–39 of an oil map, µL: Σ film ÷ 0.12139 µm per (µL per board-foot) ×
 * ftStep (each sample stands for one board × ftStep; film conversion: 1 mL on one board-foot is a 121 µm film).
 * Units: µL. Edge cases: the padding columns 0 and 40 are not counted. Example: a uniform 1.2139 µm
 * film (10 µL per board-foot) over 0–62 ft at 0.5 ft rows → 39 × 125 × 0.5 × 10 = 24 375 µL.
 */
export function oilVolumeUl(map: LaneOilMap): number {
  assertOilMap('oilVolumeUl', map);
  let sum = 0;
  for (let r = 0; r < map.rows; r++) for (let j = 1; j <= 39; j++) sum += map.filmUm[r * map.cols + j];
  return (sum * map.ftStep) / C.filmUmPerMicroliterBoardFt;
}
