import { computed } from 'vue';
import { useEventListener, useIntervalFn, useOnline } from '@vueuse/core';
import { offlineCopyShown } from '@/api/offlineReads';
import { useNoteQueueStore } from '@/stores/noteQueue';
import { useShotQueueStore } from '@/stores/shotQueue';

/** How often what waits on this device is retried while some waits (besides the browser's 'online' event). */
export const OFFLINE_SYNC_MS = 5000;

/**
 * The connection and what waits on this device, for the layout's status line; and the background sync from any
 * screen: each session's queued shots in order (each with its Idempotency-Key), then the queued notes, oldest first,
 * each after its session's shots.
 */
export function useOfflineSync() {
  const online = useOnline();
  const shots = useShotQueueStore();
  const notes = useNoteQueueStore();
  shots.queuedSessions();

  shots.undoSessions();

  const waitingShots = computed(() => Object.values(shots.queues).reduce((n, q) => n + q.length, 0));
  const waitingUndos = computed(() => Object.values(shots.undos).reduce((n, q) => n + q.length, 0));
  const waitingNotes = computed(() => notes.items.length);
  const sending = computed(() => Object.values(shots.sending).some(Boolean));

  let syncing: Promise<void> | null = null;
  function sync(): Promise<void> {
    syncing ??= (async () => {
      await shots.sendAll();
      await notes.send(async (sessionId) => (await shots.send(sessionId)).kind === 'done');
    })().finally(() => {
      syncing = null;
      shots.queuedSessions();
      shots.undoSessions();
    });
    return syncing;
  }

  useEventListener(window, 'online', () => void sync());
  useEventListener(window, 'storage', (e: StorageEvent) => {
    if (e.key === null || e.key.startsWith('lanewright.')) {
      shots.queuedSessions();
      shots.undoSessions();
      notes.refresh();
    }
  });
  useIntervalFn(() => {
    if (online.value && (waitingShots.value > 0 || waitingUndos.value > 0 || waitingNotes.value > 0)) void sync();
  }, OFFLINE_SYNC_MS);

  return { online, waitingShots, waitingUndos, waitingNotes, sending, offlineCopyShown, refusedNote: computed(() => notes.refused), sync };
}
