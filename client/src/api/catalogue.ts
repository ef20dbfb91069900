import type { Page } from '@shared/auth';
import type { BallModel, BallModelInput, CatalogueQuery } from '@shared/balls';
import { api } from './client';

export type CatalogueParams = Partial<CatalogueQuery>;

/** The shared ball catalogue (read by every signed-in user; admins add, edit and import). */
export const catalogueApi = {
  list: (params: CatalogueParams, signal?: AbortSignal) => api.get<Page<BallModel>>('/catalogue', { query: { ...params }, signal }),
  get: (id: number, signal?: AbortSignal) => api.get<{ item: BallModel }>(`/catalogue/${id}`, { signal }),
  create: (input: BallModelInput) => api.post<{ item: BallModel }>('/catalogue', input),
  update: (id: number, patch: Partial<BallModelInput> & { version: number }) => api.patch<{ item: BallModel }>(`/catalogue/${id}`, patch),
  importCsv: (file: File) => {
    const form = new FormData();
    form.append('file', file, file.name);
    return api.post<{ imported: number; items: BallModel[] }>('/catalogue/import', form);
  },
};
