import { computed, onBeforeUnmount, onMounted, ref, shallowRef } from 'vue';
import { useEventListener, useIntervalFn } from '@vueuse/core';
import type { ShotCreated, ShotInput } from '@/api/sessions';
import { queueStorageKey, useShotQueueStore, type QueuedShot, type SendOutcome } from '@/stores/shotQueue';

export { queueStorageKey, type QueuedShot, type SendOutcome } from '@/stores/shotQueue';

/** A shot the server refused (a 4xx other than a lost connection): the queue stops until the bowler decides. */
export interface RefusedShot {
  shot: QueuedShot;
  message: string;
  code: string;
}

export type QueueState = 'idle' | 'sending' | 'waiting' | 'blocked';

/** How often queued shots are retried while some wait (besides the browser's 'online' event). */
export const SYNC_INTERVAL_MS = 5000;

/** A random key per tapped shot: crypto.randomUUID where the page is a secure context, else 122 random bits. */
export function newIdempotencyKey(): string {
  const c = globalThis.crypto;
  if (typeof c?.randomUUID === 'function') return c.randomUUID();
  const bytes = new Uint8Array(16);
  c.getRandomValues(bytes);
  bytes[6] = (bytes[6] & 0x0f) | 0x40;
  bytes[8] = (bytes[8] & 0x3f) | 0x80;
  const hex = [...bytes].map((b) => b.toString(16).padStart(2, '0')).join('');
  return `${hex.slice(0, 8)}-${hex.slice(8, 12)}-${hex.slice(12, 16)}-${hex.slice(16, 20)}-${hex.slice(20)}`;
}

/** Sends one session's queued shots (joins a run under way). */
export function sendQueued(sessionId: number): Promise<SendOutcome> {
  return useShotQueueStore().send(sessionId);
}

/** Every session with shots waiting on this device. */
export function queuedSessions(): { sessionId: number; count: number }[] {
  return useShotQueueStore().queuedSessions();
}

/** Background sync from screens other than the session's own (e.g. the Sessions list): one session after another. */
export function sendAllQueued(): Promise<void> {
  return useShotQueueStore().sendAll();
}

export interface UseShotQueueOptions {
  sessionId: number;
  /** Called for every shot the server stored (201) or had already stored under the same key (200), in order. */
  onStored: (result: ShotCreated, shot: QueuedShot) => void;
}

/**
 * The offline shot queue of one session, as one screen sees it (the queue itself lives in the shot-queue store).
 * Every shot is put there first (persisted in localStorage under `lanewright.shotQueue.<sessionId>`), then sent in
 * order, one at a time, each with its own Idempotency-Key. A failed send leaves the shot (and every later one)
 * queued; the queue is retried on the browser's 'online' event and every few seconds. Re-sending a shot whose
 * answer was lost is harmless: the server answers the first result for the same key and stores nothing new.
 */
export function useShotQueue(options: UseShotQueueOptions) {
  const { sessionId } = options;
  const store = useShotQueueStore();
  store.read(sessionId);
  store.readUndo(sessionId);
  const items = computed<QueuedShot[]>(() => store.queues[sessionId] ?? []);
  /** Stored shots taken back with no connection, waiting to be deleted on the server. */
  const undoCount = computed(() => (store.undos[sessionId] ?? []).length);
  const state = ref<QueueState>(items.value.length || undoCount.value ? 'waiting' : 'idle');
  const refused = shallowRef<RefusedShot | null>(null);
  /** Why the last attempt did not get through (for the status line), or ''. */
  const lastError = ref('');
  const storageFailed = ref(false);

  const count = computed(() => items.value.length);

  function commit(next: QueuedShot[]): void {
    storageFailed.value = !store.write(sessionId, next);
  }

  /** Queue one shot (a fresh key is made for it) and try to send at once. */
  function enqueue(body: ShotInput): QueuedShot {
    const shot: QueuedShot = { key: newIdempotencyKey(), body, queuedAt: new Date().toISOString() };
    commit([...store.read(sessionId), shot]);
    if (state.value !== 'blocked') void flush();
    return shot;
  }

  /** Take a stored shot back with no connection: the delete waits here and is sent first. */
  function queueUndo(shotId: number): boolean {
    const ok = store.queueUndo(sessionId, shotId);
    storageFailed.value = !ok;
    state.value = 'waiting';
    return ok;
  }

  /** Take the last queued shot back (undo before it was sent); null while a send is under way. */
  function removeLast(): QueuedShot | null {
    if (store.isSending(sessionId)) return null;
    const current = store.read(sessionId);
    const last = current[current.length - 1] ?? null;
    if (!last) return null;
    commit(current.slice(0, -1));
    if (refused.value?.shot.key === last.key) {
      refused.value = null;
      state.value = current.length > 1 ? 'waiting' : 'idle';
    }
    return last;
  }

  /** Drop the refused shot and go on with the others. */
  function discardRefused(): void {
    const r = refused.value;
    if (!r) return;
    commit(store.read(sessionId).filter((s) => s.key !== r.shot.key));
    refused.value = null;
    state.value = items.value.length ? 'waiting' : 'idle';
    void flush();
  }

  /** Send what is queued, in order (joins a run already under way). */
  async function flush(): Promise<void> {
    if (state.value === 'blocked') return;
    state.value = 'sending';
    let outcome = await store.send(sessionId);
    // A shot queued just as a run finished: go again.
    while (outcome.kind === 'done' && store.read(sessionId).length > 0) outcome = await store.send(sessionId);
    store.read(sessionId);
    if (outcome.kind === 'refused') {
      refused.value = { shot: outcome.shot, message: outcome.message, code: outcome.code };
      state.value = 'blocked';
      lastError.value = outcome.message;
    } else {
      store.readUndo(sessionId);
      state.value = items.value.length || undoCount.value ? 'waiting' : 'idle';
      lastError.value = outcome.kind === 'waiting' ? outcome.message : '';
    }
  }

  let stopListening: (() => void) | undefined;
  onMounted(() => {
    stopListening = store.onStored(sessionId, options.onStored);
    if (items.value.length > 0 || undoCount.value > 0 || store.isSending(sessionId)) void flush();
  });
  onBeforeUnmount(() => stopListening?.());
  // The listeners and the timer below end with the component (vueuse removes them when its scope is disposed).
  useEventListener(window, 'online', () => void flush());
  /** Another tab changed this session's queue. */
  useEventListener(window, 'storage', (e: StorageEvent) => {
    if (e.key === queueStorageKey(sessionId) && !store.isSending(sessionId)) store.read(sessionId);
  });
  useIntervalFn(() => {
    if ((items.value.length > 0 || undoCount.value > 0) && state.value !== 'blocked') void flush();
  }, SYNC_INTERVAL_MS);

  return { items, count, undoCount, state, refused, lastError, storageFailed, enqueue, removeLast, queueUndo, discardRefused, flush };
}
