import { computed } from 'vue';
import { useAuthStore } from '@/stores/auth';
import { useProfileStore } from '@/stores/profile';
import { unitFormatter } from '@/utils/units';

/**
 * The one formatting layer for physical quantities: the signed-in bowler's units preference applied to speeds,
 * weights, lengths and distances on every screen. `const u = useUnits()` then `u.value.speed(17)` in script, or
 * `u.speed(17)` in a template (refs unwrap). Loads the profile once if nobody has yet.
 */
export function useUnits() {
  const auth = useAuthStore();
  const store = useProfileStore();
  if (auth.token) void store.ensureLoaded();
  return computed(() => unitFormatter(store.units));
}
