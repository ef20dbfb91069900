import type { Calibration } from '@engine/index';
import type { CalibrationQuery, StatsQuery, StatsResult, StatsTrendPoint } from '@shared/sessions';
import { api } from './client';

export type { StatsQuery, StatsResult };
export type TrendPoint = StatsTrendPoint;

export const statsApi = {
  get: (query: StatsQuery = {}, signal?: AbortSignal) => api.get<{ item: StatsResult }>('/stats', { query: { ...query }, signal }),
  /** The calibration a matchup on this pattern and lane surface (or this published condition) applies. */
  calibration: (query: CalibrationQuery, signal?: AbortSignal) =>
    api.get<{ item: Calibration }>('/calibration', { query: { ...query }, signal }),
};
