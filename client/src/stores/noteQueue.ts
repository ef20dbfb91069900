import { ref } from 'vue';
import { defineStore } from 'pinia';
import { isApiRequestError } from '@/api/client';
import { sessionsApi } from '@/api/sessions';

/** A session's notes saved on this device while the server could not be reached: the newest text wins. */
export interface QueuedNote {
  sessionId: number;
  notes: string;
  queuedAt: string;
}

export const NOTE_QUEUE_PREFIX = 'lanewright.noteQueue.';

function storageKey(sessionId: number): string {
  return `${NOTE_QUEUE_PREFIX}${sessionId}`;
}

function readAll(): QueuedNote[] {
  const out: QueuedNote[] = [];
  try {
    for (let i = 0; i < window.localStorage.length; i++) {
      const key = window.localStorage.key(i);
      if (!key?.startsWith(NOTE_QUEUE_PREFIX)) continue;
      const v = JSON.parse(window.localStorage.getItem(key) ?? 'null') as Partial<QueuedNote> | null;
      if (v && typeof v.sessionId === 'number' && typeof v.notes === 'string' && typeof v.queuedAt === 'string')
        out.push({ sessionId: v.sessionId, notes: v.notes, queuedAt: v.queuedAt });
    }
  } catch {
    // storage unavailable: nothing queued here
  }
  return out.sort((a, b) => a.queuedAt.localeCompare(b.queuedAt));
}

/** A lost connection, a server that is down or busy: keep the note and try again later. */
function isTransient(err: unknown): boolean {
  if (!isApiRequestError(err)) return true;
  return err.status === 0 || err.status === 401 || err.status === 408 || err.status === 429 || err.status >= 500;
}

/**
 * Session notes edited with no connection, one per session (a later edit replaces the earlier one), persisted in
 * localStorage under `lanewright.noteQueue.<sessionId>` and sent when the connection is back, oldest first, each
 * only after the session's queued shots went through (so the server sees the bowler's changes in the order made).
 * A note the server refuses (the session was deleted, the text is invalid) is dropped and reported.
 */
export const useNoteQueueStore = defineStore('noteQueue', () => {
  const items = ref<QueuedNote[]>(readAll());
  /** The last note the server refused, with its reason. */
  const refused = ref<{ note: QueuedNote; message: string } | null>(null);
  let run: Promise<void> | null = null;

  function refresh(): QueuedNote[] {
    items.value = readAll();
    return items.value;
  }

  /** Keeps a note to send later; false when the browser would not store it. */
  function put(sessionId: number, notes: string): boolean {
    const note: QueuedNote = { sessionId, notes, queuedAt: new Date().toISOString() };
    try {
      window.localStorage.setItem(storageKey(sessionId), JSON.stringify(note));
      refresh();
      return true;
    } catch {
      return false;
    }
  }

  function drop(sessionId: number): void {
    try {
      window.localStorage.removeItem(storageKey(sessionId));
    } catch {
      // storage unavailable
    }
    refresh();
  }

  function pendingFor(sessionId: number): QueuedNote | null {
    return items.value.find((n) => n.sessionId === sessionId) ?? null;
  }

  /**
   * Sends the queued notes, oldest first; `before(sessionId)` runs first for each (the session's queued shots) and
   * answers whether it is clear to go on. Stops at the first note that does not get through.
   */
  function send(before: (sessionId: number) => Promise<boolean>): Promise<void> {
    run ??= (async () => {
      for (const note of refresh()) {
        if (!(await before(note.sessionId))) return;
        try {
          await sessionsApi.update(note.sessionId, { notes: note.notes });
        } catch (err) {
          if (isTransient(err)) return;
          refused.value = { note, message: isApiRequestError(err) ? err.message : 'The notes could not be saved.' };
        }
        // Sent or refused: unless the bowler wrote again meanwhile, this note is done.
        if (readAll().find((n) => n.sessionId === note.sessionId)?.queuedAt === note.queuedAt) drop(note.sessionId);
      }
    })().finally(() => {
      run = null;
      refresh();
    });
    return run;
  }

  /** Forgets every queued note of this device (signing out). */
  function clearAll(): void {
    for (const n of readAll()) drop(n.sessionId);
    items.value = [];
    refused.value = null;
  }

  return { items, refused, refresh, put, drop, pendingFor, send, clearAll };
});
