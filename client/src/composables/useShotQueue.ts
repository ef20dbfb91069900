import { computed, onBeforeUnmount, onMounted, ref, shallowRef } from 'vue';
import { isApiRequestError } from '@/api/client';
import { sessionsApi, type ShotCreated, type ShotInput } from '@/api/sessions';

/** One shot waiting to be stored: its body and the Idempotency-Key it was given when it was tapped. */
export interface QueuedShot {
  key: string;
  body: ShotInput;
  queuedAt: string;
}

/** A shot the server refused (a 4xx other than a lost connection): the queue stops until the bowler decides. */
export interface RefusedShot {
  shot: QueuedShot;
  message: string;
  code: string;
}

export type QueueState = 'idle' | 'sending' | 'waiting' | 'blocked';

const STORAGE_PREFIX = 'lanewright.shotQueue.';
/** How often queued shots are retried while some wait (besides the browser's 'online' event). */
export const SYNC_INTERVAL_MS = 5000;

export function queueStorageKey(sessionId: number): string {
  return `${STORAGE_PREFIX}${sessionId}`;
}

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

function isQueuedShot(v: unknown): v is QueuedShot {
  if (!v || typeof v !== 'object') return false;
  const o = v as Record<string, unknown>;
  return typeof o.key === 'string' && !!o.body && typeof o.body === 'object' && typeof o.queuedAt === 'string';
}

function readStored(sessionId: number): QueuedShot[] {
  try {
    const raw = window.localStorage.getItem(queueStorageKey(sessionId));
    if (!raw) return [];
    const parsed = JSON.parse(raw) as unknown;
    return Array.isArray(parsed) ? parsed.filter(isQueuedShot) : [];
  } catch {
    return [];
  }
}

function writeStored(sessionId: number, items: readonly QueuedShot[]): boolean {
  try {
    if (items.length === 0) window.localStorage.removeItem(queueStorageKey(sessionId));
    else window.localStorage.setItem(queueStorageKey(sessionId), JSON.stringify(items));
    return true;
  } catch {
    return false;
  }
}

/** A lost connection, a server that is down or busy: keep the shot and try again later. */
function isTransient(err: unknown): boolean {
  if (!isApiRequestError(err)) return true;
  return err.status === 0 || err.status === 401 || err.status === 408 || err.status === 429 || err.status >= 500;
}

/** How one run through a session's queue ended. */
export type SendOutcome =
  | { kind: 'done' }
  | { kind: 'waiting'; message: string }
  | { kind: 'refused'; shot: QueuedShot; message: string; code: string };

interface QueueListener {
  onStored: (result: ShotCreated, shot: QueuedShot) => void;
  onChange: (items: QueuedShot[], sending: boolean) => void;
}

/** One run per session at a time, whoever starts it (the Session screen, or a list screen syncing in the background). */
const runs = new Map<number, Promise<SendOutcome>>();
const listeners = new Map<number, Set<QueueListener>>();

function emitChange(sessionId: number, items: QueuedShot[], sending: boolean): void {
  for (const l of listeners.get(sessionId) ?? []) l.onChange(items, sending);
}

/**
 * Sends a session's queued shots in order, one at a time, each with its own key; stops at the first
 * one that does not get through (kept queued) or that the server refuses (kept, reported).
 */
export function sendQueued(sessionId: number): Promise<SendOutcome> {
  const existing = runs.get(sessionId);
  if (existing) return existing;
  const run = (async (): Promise<SendOutcome> => {
    for (;;) {
      const queue = readStored(sessionId);
      emitChange(sessionId, queue, true);
      const first = queue[0];
      if (!first) return { kind: 'done' };
      let result: ShotCreated;
      try {
        result = await sessionsApi.addShot(sessionId, first.key, first.body);
      } catch (err) {
        if (isTransient(err)) return { kind: 'waiting', message: isApiRequestError(err) ? err.message : 'The shot could not be sent.' };
        const e = err as { message: string; code: string };
        return { kind: 'refused', shot: first, message: e.message, code: e.code };
      }
      writeStored(
        sessionId,
        readStored(sessionId).filter((q) => q.key !== first.key),
      );
      for (const l of listeners.get(sessionId) ?? []) l.onStored(result, first);
    }
  })().finally(() => {
    runs.delete(sessionId);
    emitChange(sessionId, readStored(sessionId), false);
  });
  runs.set(sessionId, run);
  return run;
}

/** Every session with shots waiting on this device. */
export function queuedSessions(): { sessionId: number; count: number }[] {
  const out: { sessionId: number; count: number }[] = [];
  try {
    for (let i = 0; i < window.localStorage.length; i++) {
      const key = window.localStorage.key(i);
      if (!key?.startsWith(STORAGE_PREFIX)) continue;
      const sessionId = Number(key.slice(STORAGE_PREFIX.length));
      if (!Number.isInteger(sessionId) || sessionId <= 0) continue;
      const count = readStored(sessionId).length;
      if (count > 0) out.push({ sessionId, count });
    }
  } catch {
    // storage unavailable: nothing queued here
  }
  return out.sort((a, b) => a.sessionId - b.sessionId);
}

/** Background sync from screens other than the session's own (e.g. the Sessions list): one session after another. */
export async function sendAllQueued(): Promise<void> {
  for (const { sessionId } of queuedSessions()) await sendQueued(sessionId);
}

export interface UseShotQueueOptions {
  sessionId: number;
  /** Called for every shot the server stored (201) or had already stored under the same key (200), in order. */
  onStored: (result: ShotCreated, shot: QueuedShot) => void;
}

/**
 * The offline shot queue of one session. Every shot is put here first (persisted in localStorage under
 * `lanewright.shotQueue.<sessionId>`), then sent in order, one at a time, each with its own
 * Idempotency-Key. A failed send leaves the shot (and every later one) queued; the queue is retried on
 * the browser's 'online' event and every few seconds. Re-sending a shot whose answer was lost is
 * harmless: the server answers the first result for the same key and stores nothing new.
 */
export function useShotQueue(options: UseShotQueueOptions) {
  const { sessionId } = options;
  const items = shallowRef<QueuedShot[]>(readStored(sessionId));
  const state = ref<QueueState>(items.value.length ? 'waiting' : 'idle');
  const refused = shallowRef<RefusedShot | null>(null);
  /** Why the last attempt did not get through (for the status line), or ''. */
  const lastError = ref('');
  const storageFailed = ref(false);
  let timer: ReturnType<typeof setInterval> | undefined;

  const count = computed(() => items.value.length);

  function commit(next: QueuedShot[]): void {
    items.value = next;
    storageFailed.value = !writeStored(sessionId, next);
  }

  /** Queue one shot (a fresh key is made for it) and try to send at once. */
  function enqueue(body: ShotInput): QueuedShot {
    const shot: QueuedShot = { key: newIdempotencyKey(), body, queuedAt: new Date().toISOString() };
    commit([...readStored(sessionId), shot]);
    if (state.value !== 'blocked') void flush();
    return shot;
  }

  /** Take the last queued shot back (undo before it was sent); null while a send is under way. */
  function removeLast(): QueuedShot | null {
    if (runs.has(sessionId)) return null;
    const current = readStored(sessionId);
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
    commit(readStored(sessionId).filter((s) => s.key !== r.shot.key));
    refused.value = null;
    state.value = items.value.length ? 'waiting' : 'idle';
    void flush();
  }

  /** Send what is queued, in order (joins a run already under way). */
  async function flush(): Promise<void> {
    if (state.value === 'blocked') return;
    state.value = 'sending';
    let outcome = await sendQueued(sessionId);
    // A shot queued just as a run finished: go again.
    while (outcome.kind === 'done' && readStored(sessionId).length > 0) outcome = await sendQueued(sessionId);
    items.value = readStored(sessionId);
    if (outcome.kind === 'refused') {
      refused.value = { shot: outcome.shot, message: outcome.message, code: outcome.code };
      state.value = 'blocked';
      lastError.value = outcome.message;
    } else if (outcome.kind === 'waiting') {
      state.value = items.value.length ? 'waiting' : 'idle';
      lastError.value = outcome.message;
    } else {
      state.value = items.value.length ? 'waiting' : 'idle';
      lastError.value = '';
    }
  }

  const listener: QueueListener = {
    onStored: (result, shot) => options.onStored(result, shot),
    onChange: (queue) => {
      items.value = queue;
    },
  };

  function onOnline(): void {
    void flush();
  }
  /** Another tab changed this session's queue. */
  function onStorage(e: StorageEvent): void {
    if (e.key === queueStorageKey(sessionId) && !runs.has(sessionId)) items.value = readStored(sessionId);
  }

  onMounted(() => {
    let set = listeners.get(sessionId);
    if (!set) listeners.set(sessionId, (set = new Set()));
    set.add(listener);
    window.addEventListener('online', onOnline);
    window.addEventListener('storage', onStorage);
    timer = setInterval(() => {
      if (items.value.length > 0 && state.value !== 'blocked') void flush();
    }, SYNC_INTERVAL_MS);
    if (items.value.length > 0 || runs.has(sessionId)) void flush();
  });
  onBeforeUnmount(() => {
    listeners.get(sessionId)?.delete(listener);
    window.removeEventListener('online', onOnline);
    window.removeEventListener('storage', onStorage);
    clearInterval(timer);
  });

  return { items, count, state, refused, lastError, storageFailed, enqueue, removeLast, discardRefused, flush };
}
