import type { Page } from '@shared/auth';
import type { Center, Condition, CurrentCondition, FollowedCenter, LaneGroups, PublishCondition, UnsubscribeInfo } from '@shared/centers';
import { api } from './client';

export type { FollowedCenter };

/**
 * Centers and their published conditions. The list, a center, its current condition, its PDF sheet and its
 * history are public (no sign-in); following needs sign-in; publishing is for the center's proprietor.
 */
export const centersApi = {
  list: (params: { page?: number; pageSize?: number } = {}, signal?: AbortSignal) =>
    api.get<{ items: Center[]; total: number }>('/centers', { query: { pageSize: 100, ...params }, signal }),
  get: (id: number, signal?: AbortSignal) => api.get<{ item: Center }>(`/centers/${id}`, { signal }),
  /** 404 with code `no_condition` when nothing is published. */
  current: (id: number, signal?: AbortSignal) => api.get<CurrentCondition>(`/centers/${id}/conditions/current`, { signal }),
  /** Every lane group with what is on it now and next, in the center's time zone (200 with no groups when nothing is published). */
  laneGroups: (id: number, signal?: AbortSignal) => api.get<LaneGroups>(`/centers/${id}/conditions/lane-groups`, { signal }),
  /** Newest first; a publication is never edited (corrections are new publications). */
  history: (id: number, params: { page?: number; pageSize?: number } = {}, signal?: AbortSignal) =>
    api.get<Page<Condition>>(`/centers/${id}/conditions`, { query: { ...params }, signal }),
  /** The printable sheet for the front desk (opened as a plain link). */
  sheetUrl: (id: number) => `/api/centers/${id}/conditions/current.pdf`,
  /** The center's proprietor only (403 for anyone else); followers get an e-mail. */
  publish: (id: number, body: PublishCondition) => api.post<{ item: Condition }>(`/centers/${id}/conditions`, body),
  follow: (id: number) => api.post<{ following: true }>(`/centers/${id}/follow`),
  unfollow: (id: number) => api.delete<{ following: false }>(`/centers/${id}/follow`),
  follows: (signal?: AbortSignal) => api.get<{ items: FollowedCenter[] }>('/follows', { signal }),
  /** The e-mail link's page: what the link is for (404 when it is not valid any more), confirm, undo. */
  unsubscribeInfo: (token: string, signal?: AbortSignal) => api.get<UnsubscribeInfo>('/unsubscribe/info', { query: { token }, signal }),
  unsubscribe: (token: string) => api.post<{ ok: true; center: string }>('/unsubscribe', { token }),
  undoUnsubscribe: (token: string) => api.post<{ ok: true; center: string }>('/unsubscribe/undo', { token }),
  /** A proprietor's own centers (admin: all). */
  mine: (signal?: AbortSignal) => api.get<{ items: Center[] }>('/centers/mine', { signal }),
};
