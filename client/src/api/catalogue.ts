import type { Page } from '@shared/auth';
import type { BallModel, CatalogueQuery } from '@shared/balls';
import { api } from './client';

export type CatalogueParams = Partial<CatalogueQuery>;

/** The shared ball catalogue (read by every signed-in user). */
export const catalogueApi = {
  list: (params: CatalogueParams, signal?: AbortSignal) => api.get<Page<BallModel>>('/catalogue', { query: { ...params }, signal }),
  get: (id: number, signal?: AbortSignal) => api.get<{ item: BallModel }>(`/catalogue/${id}`, { signal }),
};
