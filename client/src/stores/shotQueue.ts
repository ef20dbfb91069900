import { ref } from 'vue';
import { defineStore } from 'pinia';
import { isApiRequestError } from '@/api/client';
import { sessionsApi, type ShotCreated, type ShotInput } from '@/api/sessions';

/** One shot waiting to be stored: its body and the Idempotency-Key it was given when it was tapped. */
export interface QueuedShot {
  key: string;
  body: ShotInput;
  queuedAt: string;
}

/** How one run through a session's queue ended. */
export type SendOutcome =
  { kind: 'done' } | { kind: 'waiting'; message: string } | { kind: 'refused'; shot: QueuedShot; message: string; code: string };

/** Told about every shot the server stored (201, or 200 for a key it had stored before), in order. */
export type StoredListener = (result: ShotCreated, shot: QueuedShot) => void;

export const SHOT_QUEUE_PREFIX = 'lanewright.shotQueue.';
/** Stored shots taken back (undo) with no connection, per session: their ids, sent before the session's queued shots. */
export const UNDO_QUEUE_PREFIX = 'lanewright.undoQueue.';

export function queueStorageKey(sessionId: number): string {
  return `${SHOT_QUEUE_PREFIX}${sessionId}`;
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

function readUndos(sessionId: number): number[] {
  try {
    const parsed = JSON.parse(window.localStorage.getItem(UNDO_QUEUE_PREFIX + sessionId) ?? '[]') as unknown;
    return Array.isArray(parsed) ? parsed.filter((x): x is number => Number.isInteger(x) && x > 0) : [];
  } catch {
    return [];
  }
}

function writeUndos(sessionId: number, ids: readonly number[]): boolean {
  try {
    if (ids.length === 0) window.localStorage.removeItem(UNDO_QUEUE_PREFIX + sessionId);
    else window.localStorage.setItem(UNDO_QUEUE_PREFIX + sessionId, JSON.stringify(ids));
    return true;
  } catch {
    return false;
  }
}

/** Every session id with a queue (shots, or undos of stored shots) in this browser's storage. */
function storedSessionIds(prefixes: readonly string[] = [SHOT_QUEUE_PREFIX, UNDO_QUEUE_PREFIX]): number[] {
  const ids = new Set<number>();
  try {
    for (let i = 0; i < window.localStorage.length; i++) {
      const key = window.localStorage.key(i);
      const prefix = prefixes.find((p) => key?.startsWith(p));
      if (!key || !prefix) continue;
      const id = Number(key.slice(prefix.length));
      if (Number.isInteger(id) && id > 0) ids.add(id);
    }
  } catch {
    // storage unavailable: nothing queued here
  }
  return [...ids];
}

/** A lost connection, a server that is down or busy: keep the shot and try again later. */
function isTransient(err: unknown): boolean {
  if (!isApiRequestError(err)) return true;
  return err.status === 0 || err.status === 401 || err.status === 408 || err.status === 429 || err.status >= 500;
}

/**
 * The offline shot queues of this device, one per session, persisted in localStorage under
 * `lanewright.shotQueue.<sessionId>` (so they survive a reload or a lost connection) and mirrored in `queues`.
 * One run per session at a time, whoever starts it (the Session screen, or a list screen syncing in the background).
 * `clearAll()` (signing out) forgets every queue of the device.
 */
export const useShotQueueStore = defineStore('shotQueue', () => {
  /** The queued shots per session, as last read from or written to storage. */
  const queues = ref<Record<number, QueuedShot[]>>({});
  /** Stored shots taken back with no connection, per session (their ids), as last read from or written to storage. */
  const undos = ref<Record<number, number[]>>({});
  /** Why the last queued undo was refused (the shot was no longer the last of its game), or ''. */
  const undoRefused = ref('');
  /** Sessions whose queue is being sent right now. */
  const sending = ref<Record<number, boolean>>({});
  const runs = new Map<number, Promise<SendOutcome>>();
  const listeners = new Map<number, Set<StoredListener>>();

  /** Re-reads a session's queue from storage (another tab may have changed it) and returns it. */
  function read(sessionId: number): QueuedShot[] {
    const items = readStored(sessionId);
    queues.value = { ...queues.value, [sessionId]: items };
    return items;
  }

  /** Replaces a session's queue; false when the browser would not store it (it is then kept in memory only). */
  function write(sessionId: number, items: QueuedShot[]): boolean {
    queues.value = { ...queues.value, [sessionId]: items };
    return writeStored(sessionId, items);
  }

  function readUndo(sessionId: number): number[] {
    const ids = readUndos(sessionId);
    undos.value = { ...undos.value, [sessionId]: ids };
    return ids;
  }

  /**
   * Takes back a stored shot with no connection: its delete waits on this device and is sent before the session's
   * queued shots (an undo of a stored shot is only offered while nothing of the session is queued, so this keeps the
   * order the bowler made). False when the browser would not store it.
   */
  function queueUndo(sessionId: number, shotId: number): boolean {
    const ids = [...readUndo(sessionId).filter((x) => x !== shotId), shotId];
    undos.value = { ...undos.value, [sessionId]: ids };
    return writeUndos(sessionId, ids);
  }

  function isSending(sessionId: number): boolean {
    return runs.has(sessionId);
  }

  function onStored(sessionId: number, listener: StoredListener): () => void {
    let set = listeners.get(sessionId);
    if (!set) listeners.set(sessionId, (set = new Set()));
    set.add(listener);
    return () => listeners.get(sessionId)?.delete(listener);
  }

  /**
   * Sends a session's queued shots in order, one at a time, each with its own key; stops at the first
   * one that does not get through (kept queued) or that the server refuses (kept, reported).
   */
  function send(sessionId: number): Promise<SendOutcome> {
    const existing = runs.get(sessionId);
    if (existing) return existing;
    sending.value = { ...sending.value, [sessionId]: true };
    const run = (async (): Promise<SendOutcome> => {
      // Undos of stored shots first, in the order made; a delete whose shot is gone already (404) is done.
      for (;;) {
        const shotId = readUndo(sessionId)[0];
        if (shotId === undefined) break;
        try {
          await sessionsApi.removeShot(sessionId, shotId);
        } catch (err) {
          if (isTransient(err)) return { kind: 'waiting', message: isApiRequestError(err) ? err.message : 'The undo could not be sent.' };
          if (!isApiRequestError(err) || err.status !== 404) undoRefused.value = (err as Error).message;
        }
        writeUndos(
          sessionId,
          readUndos(sessionId).filter((x) => x !== shotId),
        );
        readUndo(sessionId);
      }
      for (;;) {
        const first = read(sessionId)[0];
        if (!first) return { kind: 'done' };
        let result: ShotCreated;
        try {
          result = await sessionsApi.addShot(sessionId, first.key, first.body);
        } catch (err) {
          if (isTransient(err)) return { kind: 'waiting', message: isApiRequestError(err) ? err.message : 'The shot could not be sent.' };
          const e = err as { message: string; code: string };
          return { kind: 'refused', shot: first, message: e.message, code: e.code };
        }
        write(
          sessionId,
          readStored(sessionId).filter((q) => q.key !== first.key),
        );
        for (const l of listeners.get(sessionId) ?? []) l(result, first);
      }
    })().finally(() => {
      runs.delete(sessionId);
      sending.value = { ...sending.value, [sessionId]: false };
      read(sessionId);
    });
    runs.set(sessionId, run);
    return run;
  }

  /** Every session with shots waiting on this device. */
  function queuedSessions(): { sessionId: number; count: number }[] {
    return storedSessionIds([SHOT_QUEUE_PREFIX])
      .map((sessionId) => ({ sessionId, count: read(sessionId).length }))
      .filter((q) => q.count > 0)
      .sort((a, b) => a.sessionId - b.sessionId);
  }

  /** Every session with undos of stored shots waiting on this device. */
  function undoSessions(): { sessionId: number; count: number }[] {
    return storedSessionIds([UNDO_QUEUE_PREFIX])
      .map((sessionId) => ({ sessionId, count: readUndo(sessionId).length }))
      .filter((q) => q.count > 0);
  }

  /** Background sync from screens other than the session's own (e.g. the Sessions list): one session after another. */
  async function sendAll(): Promise<void> {
    for (const sessionId of storedSessionIds().sort((a, b) => a - b)) await send(sessionId);
  }

  /** Forgets every queue of this device (signing out on a shared device): storage and memory. */
  function clearAll(): void {
    for (const id of storedSessionIds()) {
      writeStored(id, []);
      writeUndos(id, []);
    }
    queues.value = {};
    undos.value = {};
    undoRefused.value = '';
  }

  return {
    queues,
    undos,
    undoRefused,
    sending,
    read,
    write,
    readUndo,
    queueUndo,
    isSending,
    onStored,
    send,
    queuedSessions,
    undoSessions,
    sendAll,
    clearAll,
  };
});
