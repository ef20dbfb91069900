import { computed, toValue, type MaybeRefOrGetter } from 'vue';
import { QueryClient, useQuery } from '@tanstack/vue-query';
import { useAuthStore } from '@/stores/auth';
import { arsenalApi } from './arsenal';
import { centersApi } from './centers';
import { patternsApi } from './patterns';

/**
 * Server state shared by the screens: each list is fetched once and kept for STALE_MS; any write through the API
 * client marks every cached read out of date (main.ts wires `onWrite`), and signing out empties the cache.
 * Answers are never retried on their own: a screen shows the error and its "Try again" refetches.
 */
export const STALE_MS = 30_000;

export const queryClient = new QueryClient({
  defaultOptions: { queries: { staleTime: STALE_MS, retry: false, refetchOnWindowFocus: false } },
});

/** Cache keys carry the user's id, so one user's answers can never be read for another's. */
function useUserKey() {
  const auth = useAuthStore();
  return computed(() => auth.user?.id ?? null);
}

/**
 * The signed-in bowler's whole arsenal (up to 100 balls, every status): Session, Matchup, Shop order, Stats.
 * `when` holds it back (a coach reading a student's session has no arsenal of their own to load).
 */
export function useArsenalQuery(when: MaybeRefOrGetter<boolean> = true) {
  const user = useUserKey();
  return useQuery({
    queryKey: computed(() => ['arsenal', user.value] as const),
    queryFn: ({ signal }) => arsenalApi.list({ pageSize: 100 }, signal).then((r) => r.items),
    enabled: computed(() => user.value !== null && toValue(when)),
  });
}

/** Every pattern by name (the pickers of Matchup, Coach, Session, Stats and the publish dialog). */
export function usePatternsQuery() {
  const user = useUserKey();
  return useQuery({
    queryKey: computed(() => ['patterns', user.value] as const),
    queryFn: ({ signal }) => patternsApi.list({ pageSize: 100, sort: 'name', order: 'asc' }, signal).then((r) => r.items),
    enabled: computed(() => user.value !== null),
  });
}

/** One pattern with its sweeps (null: none chosen). */
export function usePatternQuery(id: MaybeRefOrGetter<number | null>) {
  const user = useUserKey();
  return useQuery({
    queryKey: computed(() => ['pattern', user.value, toValue(id)] as const),
    queryFn: ({ signal }) => patternsApi.get(toValue(id) as number, signal).then((r) => r.item),
    enabled: computed(() => user.value !== null && toValue(id) !== null),
  });
}

/** The centers the signed-in user follows, with the conditions in force today. */
export function useFollowsQuery() {
  const user = useUserKey();
  return useQuery({
    queryKey: computed(() => ['follows', user.value] as const),
    queryFn: ({ signal }) => centersApi.follows(signal).then((r) => r.items),
    enabled: computed(() => user.value !== null),
  });
}
