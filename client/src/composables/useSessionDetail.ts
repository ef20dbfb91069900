import { computed, ref, shallowRef } from 'vue';
import { errorMessage, isApiRequestError } from '@/api/client';
import { sessionsApi, type Annotation, type SessionDetail, type Shot } from '@/api/sessions';
import { useAuthStore } from '@/stores/auth';
import { useShotQueueStore } from '@/stores/shotQueue';
import { SESSION_CACHE_PREFIX } from '@/stores/userData';

/**
 * One session as the Session screen loads it: the detail, the shots the server has stored (the detail's, plus each
 * one the queue gets through), the annotations, and a copy in localStorage for a reload without a connection.
 */
export function useSessionDetail(sessionId: number) {
  const auth = useAuthStore();
  const queue = useShotQueueStore();
  const detail = shallowRef<SessionDetail | null>(null);
  const stored = shallowRef<Shot[]>([]);
  const annotations = shallowRef<Annotation[]>([]);
  const loading = ref(true);
  const loadError = ref('');
  const fromCache = ref(false);

  function cache(d: SessionDetail): void {
    try {
      window.localStorage.setItem(SESSION_CACHE_PREFIX + d.id, JSON.stringify(d));
    } catch {
      // storage full or unavailable: the screen still works while it stays open
    }
  }
  function cached(): SessionDetail | null {
    try {
      const raw = window.localStorage.getItem(SESSION_CACHE_PREFIX + sessionId);
      return raw ? (JSON.parse(raw) as SessionDetail) : null;
    } catch {
      return null;
    }
  }

  function apply(d: SessionDetail): void {
    detail.value = d;
    // Shots taken back on this device whose delete has not reached the server yet are not shown.
    const undone = new Set(queue.readUndo(sessionId));
    stored.value = d.shots.filter((s) => !undone.has(s.id));
    annotations.value = [...d.annotations];
  }

  async function load(): Promise<void> {
    loading.value = true;
    loadError.value = '';
    try {
      const res = await sessionsApi.get(sessionId);
      apply(res.item);
      fromCache.value = false;
      cache(res.item);
    } catch (err) {
      const old = isApiRequestError(err) && err.status === 0 ? cached() : null;
      if (old) {
        apply(old);
        fromCache.value = true;
      } else {
        loadError.value =
          isApiRequestError(err) && err.status === 404
            ? 'This session does not exist or is not yours to see.'
            : errorMessage(err, 'The session could not be loaded.');
      }
    } finally {
      loading.value = false;
    }
  }

  /** A shot the queue got through (shown once, however often it was sent); the copy is kept up to date. */
  function addStored(shot: Shot): void {
    if (!stored.value.some((s) => s.id === shot.id)) stored.value = [...stored.value, shot];
    if (detail.value) cache({ ...detail.value, shots: stored.value });
  }

  function removeStored(shotId: number): void {
    stored.value = stored.value.filter((s) => s.id !== shotId);
    if (detail.value) cache({ ...detail.value, shots: stored.value });
  }

  /** The detail after an edit (the notes), kept in the copy too. */
  function update(next: SessionDetail): void {
    detail.value = next;
    cache(next);
  }

  function addAnnotation(a: Annotation): void {
    annotations.value = [...annotations.value, a];
  }

  const isOwner = computed(() => !!detail.value && !!auth.user && detail.value.userId === auth.user.id);

  return { detail, stored, annotations, loading, loadError, fromCache, load, addStored, removeStored, update, addAnnotation, isOwner };
}
