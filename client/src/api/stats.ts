import type { Calibration } from '@engine/index';
import type { StatsQuery, StatsResult, StatsTrendPoint } from '@shared/sessions';
import { api } from './client';

export type { StatsQuery, StatsResult };
export type TrendPoint = StatsTrendPoint;

export const statsApi = {
  get: (query: StatsQuery = {}, signal?: AbortSignal) => api.get<{ item: StatsResult }>('/stats', { query: { ...query }, signal }),
  calibration: (query: { patternId?: number; studentId?: number } = {}, signal?: AbortSignal) =>
    api.get<{ item: Calibration }>('/calibration', { query: { ...query }, signal }),
};
