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
 * Cache keys carry the user's id, so one user's answers can never be read for another's.
 */
export const STALE_MS = 30_000;

export const queryClient = new QueryClient({
  defaultOptions: { queries: { staleTime: STALE_MS, retry: false, refetchOnWindowFocus: false } },
});

type UserId = number | null;

/** The signed-in bowler's whole arsenal (up to 100 balls, every status): Session, Matchup, Shop order, Stats. */
const arsenalQuery = (user: UserId) => ({
  queryKey: ['arsenal', user] as const,
  queryFn: ({ signal }: { signal: AbortSignal }) => arsenalApi.list({ pageSize: 100 }, signal).then((r) => r.items),
});
/** Every pattern by name (the pickers of Matchup, Coach, Session, Stats and the publish dialog). */
const patternsQuery = (user: UserId) => ({
  queryKey: ['patterns', user] as const,
  queryFn: ({ signal }: { signal: AbortSignal }) =>
    patternsApi.list({ pageSize: 100, sort: 'name', order: 'asc' }, signal).then((r) => r.items),
});
/** One pattern with its sweeps. */
const patternQuery = (user: UserId, id: number) => ({
  queryKey: ['pattern', user, id] as const,
  queryFn: ({ signal }: { signal: AbortSignal }) => patternsApi.get(id, signal).then((r) => r.item),
});
/** The centers the signed-in user follows, with the conditions in force today. */
const followsQuery = (user: UserId) => ({
  queryKey: ['follows', user] as const,
  queryFn: ({ signal }: { signal: AbortSignal }) => centersApi.follows(signal).then((r) => r.items),
});

function useUserId() {
  const auth = useAuthStore();
  return computed<UserId>(() => auth.user?.id ?? null);
}
const currentUserId = (): UserId => useAuthStore().user?.id ?? null;

/** The arsenal as a reactive query; `when` holds it back (a coach reading a student's session has no arsenal to load). */
export function useArsenalQuery(when: MaybeRefOrGetter<boolean> = true) {
  const user = useUserId();
  return useQuery(computed(() => ({ ...arsenalQuery(user.value), enabled: user.value !== null && toValue(when) })));
}
export function usePatternsQuery() {
  const user = useUserId();
  return useQuery(computed(() => ({ ...patternsQuery(user.value), enabled: user.value !== null })));
}
export function usePatternQuery(id: MaybeRefOrGetter<number | null>) {
  const user = useUserId();
  return useQuery(
    computed(() => ({ ...patternQuery(user.value, toValue(id) ?? 0), enabled: user.value !== null && toValue(id) !== null })),
  );
}
export function useFollowsQuery() {
  const user = useUserId();
  return useQuery(computed(() => ({ ...followsQuery(user.value), enabled: user.value !== null })));
}

/** The same answers awaited once, from the cache when fresh (screens that load step by step). */
export const fetchArsenal = () => queryClient.fetchQuery(arsenalQuery(currentUserId()));
export const fetchPatterns = () => queryClient.fetchQuery(patternsQuery(currentUserId()));
export const fetchPattern = (id: number) => queryClient.fetchQuery(patternQuery(currentUserId(), id));
export const fetchFollows = () => queryClient.fetchQuery(followsQuery(currentUserId()));
