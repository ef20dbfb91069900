import type { Page } from '@shared/auth';
import type { Center, CenterInput } from '@shared/centers';
import { api } from './client';

/** Centers as the admin manages them: create, attach or detach the proprietor. */
export const adminCentersApi = {
  list: (params: { page: number; pageSize: number }, signal?: AbortSignal) =>
    api.get<Page<Center>>('/centers', { query: { ...params }, signal }),
  create: (input: CenterInput) => api.post<{ item: Center }>('/centers', input),
  setOwner: (id: number, ownerId: number | null) => api.patch<{ item: Center }>(`/centers/${id}`, { ownerId }),
};
