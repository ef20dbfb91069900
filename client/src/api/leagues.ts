import type { League, LeagueCreate, LeaguePatch, LeagueStanding } from '@shared/leagues';
import { api } from './client';

export type { League, LeagueCreate, LeaguePatch, LeagueStanding };
export { WEEKDAYS } from '@shared/leagues';

export const leaguesApi = {
  list: (signal?: AbortSignal) => api.get<{ items: League[] }>('/leagues', { signal }),
  get: (id: number, signal?: AbortSignal) => api.get<{ item: League }>(`/leagues/${id}`, { signal }),
  create: (body: LeagueCreate) => api.post<{ item: League }>('/leagues', body),
  update: (id: number, body: LeaguePatch) => api.patch<{ item: League }>(`/leagues/${id}`, body),
  remove: (id: number) => api.delete<void>(`/leagues/${id}`),
  standing: (id: number, signal?: AbortSignal) => api.get<{ item: LeagueStanding }>(`/leagues/${id}/standing`, { signal }),
  seasonCsv: (id: number) => api.get<Blob>(`/leagues/${id}/season.csv`, { asBlob: true }),
};
