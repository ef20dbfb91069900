import { ref } from 'vue';
import { registerSW } from 'virtual:pwa-register';

/** How often an open app asks the server whether a new version was deployed (the service worker file is no-cache). */
export const UPDATE_CHECK_MS = 60 * 60 * 1000;

/** A new version is installed and waiting: the bowler is offered it, never moved to it unasked. */
const needRefresh = ref(false);
let updateSW: ((reloadPage?: boolean) => Promise<void>) | null = null;

/**
 * Registers the service worker once (main.ts). Its registration type is 'prompt': a new version installs in the
 * background and waits; it takes over only when the bowler chooses "Load the new version" (a reload, which keeps the
 * queued shots and notes: they live in localStorage), so nothing changes under a bowler mid-game.
 */
export function startAppUpdates(): void {
  if (updateSW || typeof navigator === 'undefined' || !('serviceWorker' in navigator)) return;
  updateSW = registerSW({
    immediate: true,
    onNeedRefresh: () => {
      needRefresh.value = true;
    },
    onRegisteredSW: (_url, registration) => {
      if (!registration) return;
      setInterval(() => {
        if (navigator.onLine) void registration.update().catch(() => undefined);
      }, UPDATE_CHECK_MS);
    },
  });
}

export function useAppUpdate() {
  return {
    needRefresh,
    /** Moves to the waiting version (the page reloads). */
    update: () => updateSW?.(true),
    /** Not now: the offer comes back with the next version found or the next visit. */
    later: () => {
      needRefresh.value = false;
    },
  };
}
