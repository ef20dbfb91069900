import type { HitKind } from '@engine/index';
import type { Page } from '@shared/auth';
import type { Annotation, AnnotationCreate } from '@shared/coaching';
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
import { api } from './client';

export { HIT_KINDS, SESSION_KINDS };
export type { Annotation, HitKind, NumberedGame, Session, SessionCreate, SessionDetail, SessionKind, SessionPatch, Shot, ShotCreated };

/** The body of `POST /api/sessions/:id/shots` (sent with an `Idempotency-Key` header). */
export type ShotInput = ShotCreate;

/** The body of `POST /api/sessions/:id/annotations`. */
export type AnnotationInput = AnnotationCreate;

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
  addShot: (sessionId: number, key: string, body: ShotInput, signal?: AbortSignal) =>
    // skipAuthRedirect: a 401 is left to the next ordinary request (which applies the sign-in policy) so the shot stays queued.
    api.post<ShotCreated>(`/sessions/${sessionId}/shots`, body, { headers: { 'Idempotency-Key': key }, signal, skipAuthRedirect: true }),
  /** Undo: only the last shot of its game (else 409). */
  removeShot: (sessionId: number, shotId: number) => api.delete<null>(`/sessions/${sessionId}/shots/${shotId}`),
  annotate: (sessionId: number, body: AnnotationInput) => api.post<{ item: Annotation }>(`/sessions/${sessionId}/annotations`, body),
};

export const KIND_LABELS: Record<SessionKind, string> = { practice: 'Practice', league: 'League', tournament: 'Tournament' };
export const HIT_LABELS: Record<HitKind, string> = { pocket: 'Pocket', high: 'High', light: 'Light', brooklyn: 'Brooklyn', miss: 'Miss' };
