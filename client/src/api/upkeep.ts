import type { BallUpkeep, UpkeepPatch } from '@shared/upkeep';
import { api } from './client';

export type { BallUpkeep, UpkeepPatch };

export const upkeepApi = {
  list: (signal?: AbortSignal) => api.get<{ items: BallUpkeep[] }>('/upkeep', { signal }),
  update: (ballId: number, body: UpkeepPatch) => api.patch<{ item: BallUpkeep }>(`/upkeep/${ballId}`, body),
};
