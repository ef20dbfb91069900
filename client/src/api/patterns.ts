import type { PatternDetail, PatternListItem, PatternQuery } from '@shared/patterns';
import { api } from './client';

export type PatternParams = Partial<PatternQuery>;

/** Oil patterns (every signed-in user reads them). */
export const patternsApi = {
  list: (params: PatternParams = {}, signal?: AbortSignal) =>
    api.get<{ items: PatternListItem[]; total: number }>('/patterns', { query: { pageSize: 100, ...params }, signal }),
  get: (id: number, signal?: AbortSignal) => api.get<{ item: PatternDetail }>(`/patterns/${id}`, { signal }),
};
