import type { HitKind } from '@engine/index';
import type { Page } from '@shared/auth';
import type { Annotation } from '@shared/coaching';
import { ApiErrorSchema } from '@shared/errors';
import {
  HIT_KINDS,
  SESSION_KINDS,
  type NumberedGame,
  type Session,
  type SessionCreate,
  type SessionDetail,
  type SessionKind,
  type SessionPatch,
  type Shot,
  type ShotCreate,
  type ShotCreated,
} from '@shared/sessions';
import { useAuthStore } from '@/stores/auth';
import { api, ApiRequestError } from './client';

export { HIT_KINDS, SESSION_KINDS };
export type { Annotation, HitKind, NumberedGame, Session, SessionCreate, SessionDetail, SessionKind, SessionPatch, Shot, ShotCreated };

/** The body of `POST /api/sessions/:id/shots` (sent with an `Idempotency-Key` header). */
export type ShotInput = ShotCreate;

export interface AnnotationInput {
  text: string;
  gameNumber?: number | null;
  frame?: number | null;
}

/**
 * `POST /api/sessions/:id/shots` needs an `Idempotency-Key` header, which `request()` in client.ts cannot
 * send (it has no headers option); this one call is made here with the same token and error shape.
 * A 401 is left to the next ordinary request (which applies the sign-in policy) so the shot stays queued.
 */
async function postShot(sessionId: number, key: string, body: ShotInput, signal?: AbortSignal): Promise<ShotCreated> {
  const token = useAuthStore().token;
  const headers: Record<string, string> = { Accept: 'application/json', 'Content-Type': 'application/json', 'Idempotency-Key': key };
  if (token) headers.Authorization = `Bearer ${token}`;
  let res: Response;
  try {
    res = await fetch(`/api/sessions/${sessionId}/shots`, { method: 'POST', headers, body: JSON.stringify(body), signal });
  } catch (err) {
    if (err instanceof DOMException && err.name === 'AbortError') throw err;
    throw new ApiRequestError(0, 'network_error', 'Lanewright could not be reached. Check your connection and try again.');
  }
  const text = await res.text().catch(() => '');
  let data: unknown = null;
  try {
    data = text ? (JSON.parse(text) as unknown) : null;
  } catch {
    data = null;
  }
  if (res.ok) return data as ShotCreated;
  const parsed = ApiErrorSchema.safeParse(data);
  throw parsed.success
    ? new ApiRequestError(res.status, parsed.data.error.code, parsed.data.error.message, parsed.data.error.fields)
    : new ApiRequestError(res.status, 'http_error', `The server answered ${res.status}. Please try again.`);
}

export const sessionsApi = {
  /** The signed-in bowler's sessions, newest first; `studentId` for a linked coach (else 404). */
  list: (params: { page?: number; pageSize?: number; studentId?: number } = {}, signal?: AbortSignal) =>
    api.get<Page<Session>>('/sessions', { query: { ...params }, signal }),
  get: (id: number, signal?: AbortSignal) => api.get<{ item: SessionDetail }>(`/sessions/${id}`, { signal }),
  create: (body: SessionCreate) => api.post<{ item: Session }>('/sessions', body),
  update: (id: number, body: SessionPatch) => api.patch<{ item: Session }>(`/sessions/${id}`, body),
  /** Soft delete (owner only). */
  remove: (id: number) => api.delete<null>(`/sessions/${id}`),
  /** Undo a delete. */
  restore: (id: number) => api.post<{ item: Session }>(`/sessions/${id}/restore`),
  /**
   * One shot. The same key again answers 200 with the first answer and stores nothing new, so a
   * retry after a lost answer is harmless.
   */
  addShot: (sessionId: number, key: string, body: ShotInput, signal?: AbortSignal) => postShot(sessionId, key, body, signal),
  /** Undo: only the last shot of its game (else 409). */
  removeShot: (sessionId: number, shotId: number) => api.delete<null>(`/sessions/${sessionId}/shots/${shotId}`),
  annotate: (sessionId: number, body: AnnotationInput) => api.post<{ item: Annotation }>(`/sessions/${sessionId}/annotations`, body),
};

export const KIND_LABELS: Record<SessionKind, string> = { practice: 'Practice', league: 'League', tournament: 'Tournament' };
export const HIT_LABELS: Record<HitKind, string> = { pocket: 'Pocket', high: 'High', light: 'Light', brooklyn: 'Brooklyn', miss: 'Miss' };
