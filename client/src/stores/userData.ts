import { watch } from 'vue';
import type { Pinia } from 'pinia';
import { forgetOfflineReads } from '@/api/offlineReads';
import { queryClient } from '@/api/queries';
import { useAuthStore } from './auth';
import { useProfileStore } from './profile';
import { NOTE_QUEUE_PREFIX, useNoteQueueStore } from './noteQueue';
import { SHOT_QUEUE_PREFIX, UNDO_QUEUE_PREFIX, useShotQueueStore } from './shotQueue';

/** The Session screen's copy of each session for a reload without a connection. */
export const SESSION_CACHE_PREFIX = 'lanewright.session.';
/** Whose queued shots and session copies this browser's storage holds (a user id). */
export const DEVICE_OWNER_KEY = 'lanewright.owner';

function removeKeys(prefixes: readonly string[]): void {
  try {
    const keys: string[] = [];
    for (let i = 0; i < window.localStorage.length; i++) {
      const key = window.localStorage.key(i);
      if (key && prefixes.some((p) => key.startsWith(p))) keys.push(key);
    }
    for (const key of keys) window.localStorage.removeItem(key);
  } catch {
    // storage unavailable: nothing kept there
  }
}

/** Forgets the answers held: the query cache, the profile and the offline copies of API answers. */
function forgetMemory(pinia?: Pinia): void {
  queryClient.clear();
  forgetOfflineReads();
  useProfileStore(pinia).$reset();
}

/**
 * Everything of the signed-in user this device holds, gone (signing out on a shared device): the query cache, the
 * profile, the offline copies of API answers, the shot and note queues and the session copies in localStorage. The token goes with `auth.signOut()`.
 */
export function clearUserData(pinia?: Pinia): void {
  forgetMemory(pinia);
  useShotQueueStore(pinia).clearAll();
  useNoteQueueStore(pinia).clearAll();
  removeKeys([SHOT_QUEUE_PREFIX, UNDO_QUEUE_PREFIX, NOTE_QUEUE_PREFIX, SESSION_CACHE_PREFIX, DEVICE_OWNER_KEY]);
}

/** Shots logged on this device and not yet sent (a sign-out asks before it removes them). */
export function unsentShots(pinia?: Pinia): number {
  return useShotQueueStore(pinia)
    .queuedSessions()
    .reduce((n, q) => n + q.count, 0);
}

/** Session notes saved on this device and not yet sent. */
export function unsentNotes(pinia?: Pinia): number {
  return useNoteQueueStore(pinia).refresh().length;
}

/**
 * Keeps one user's data away from the next on this browser. When the session ends in any way (signed out, or an
 * expired token) the cached answers go; when someone other than the last user signs in, the last user's queued
 * shots and session copies go too (an expired token keeps them for their owner to send after signing in again).
 */
export function guardUserData(pinia: Pinia): void {
  const auth = useAuthStore(pinia);
  watch(
    () => auth.user?.id ?? null,
    (id, before) => {
      if (id === null) {
        if (before != null) forgetMemory(pinia);
        return;
      }
      let owner: string | null = null;
      try {
        owner = window.localStorage.getItem(DEVICE_OWNER_KEY);
      } catch {
        // storage unavailable: nothing kept there
      }
      if (owner !== null && owner !== String(id)) clearUserData(pinia);
      try {
        window.localStorage.setItem(DEVICE_OWNER_KEY, String(id));
      } catch {
        // storage unavailable
      }
    },
    { immediate: true },
  );
}
