// Worker-thread entry for heavy engine calls (see enginePool.ts).
import { fitCalibration, rankArsenal } from '../../engine/index';
import type { Calibration } from '../../engine/shotlog/types';
import type { RankArsenalInput, RankedBall } from '../../engine/types';

export function rank(input: RankArsenalInput): RankedBall[] {
  return rankArsenal(input);
}

export function calibrate(input: Parameters<typeof fitCalibration>[0]): Calibration {
  return fitCalibration(input);
}
