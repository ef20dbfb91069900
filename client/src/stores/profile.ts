import { computed, ref, shallowRef } from 'vue';
import { defineStore } from 'pinia';
import type { Profile } from '@shared/profile';
import { profileApi } from '@/api/profile';
import type { Units } from '@/utils/units';

/**
 * The signed-in bowler's profile (release and units preference), loaded once per sign-in and shared by every screen:
 * the units it names are applied everywhere through `useUnits()`. Profile saves hand the new profile to `set()`;
 * signing out calls `$reset()`.
 */
export const useProfileStore = defineStore('profile', () => {
  const profile = shallowRef<Profile | null>(null);
  /** False while the bowler never saved one (the profile then holds the typical defaults). */
  const saved = ref(false);
  const error = ref('');
  let pending: Promise<void> | null = null;

  const units = computed<Units>(() => profile.value?.units ?? 'imperial');

  function set(next: Profile, isSaved = true): void {
    profile.value = next;
    saved.value = isSaved;
    error.value = '';
  }

  /** Loads the profile unless it is loaded (or loading) already; a failure leaves the imperial default in place. */
  function ensureLoaded(): Promise<void> {
    if (profile.value) return Promise.resolve();
    pending ??= (async () => {
      try {
        const res = await profileApi.get();
        set(res.profile, res.saved);
      } catch (err) {
        error.value = err instanceof Error ? err.message : 'The profile could not be loaded.';
      } finally {
        pending = null;
      }
    })();
    return pending;
  }

  function $reset(): void {
    profile.value = null;
    saved.value = false;
    error.value = '';
    pending = null;
  }

  return { profile, saved, error, units, set, ensureLoaded, $reset };
});
