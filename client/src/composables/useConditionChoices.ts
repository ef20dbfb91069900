import { computed } from 'vue';
import type { Sweep } from '@engine/index';
import type { Condition, FollowedCenter, LaneSurface } from '@shared/centers';
import type { PatternListItem, PatternSummary } from '@shared/patterns';
import { errorMessage } from '@/api/client';
import { useFollowsQuery, usePatternsQuery } from '@/api/queries';
import { formatLaneRanges } from '@/utils/lanes';

/** A published condition in force today at a followed center: its pattern as published and its own lane surface. */
export interface ConditionChoice {
  key: string;
  kind: 'condition';
  conditionId: number;
  label: string;
  centerName: string;
  /** The lanes it still governs today. */
  lanes: number[];
  patternName: string;
  summary: PatternSummary;
  sweeps: Sweep[];
  lane: LaneSurface;
  laneText: string;
}

/** A plain pattern: the lane surface is chosen beside it. */
export interface PatternChoice {
  key: string;
  kind: 'pattern';
  patternId: number;
  label: string;
  summary: PatternSummary;
}

export type Choice = ConditionChoice | PatternChoice;

/** The picker's key of a published condition, and of a plain pattern. */
export const conditionKey = (id: number) => `condition-${id}`;
export const patternKey = (id: number) => `pattern-${id}`;

function conditionChoice(center: FollowedCenter['center'], c: Condition, lanes: number[]): ConditionChoice {
  return {
    key: conditionKey(c.id),
    kind: 'condition',
    conditionId: c.id,
    label: `${center.name} today — ${c.pattern.name}, lanes ${formatLaneRanges(lanes)}`,
    centerName: center.name,
    lanes,
    patternName: c.pattern.name,
    summary: c.pattern.summary,
    sweeps: c.pattern.sweeps,
    lane: c.lane,
    laneText: c.laneText,
  };
}

/**
 * What a matchup can be run on: today's published conditions at the centers the signed-in user follows (each with
 * the lanes it still governs and its own lane surface), then every pattern (its lane surface chosen beside it).
 * A failed follow list leaves the patterns; a failed pattern list is an error to show.
 */
export function useConditionChoices() {
  const followsQuery = useFollowsQuery();
  const patternsQuery = usePatternsQuery();
  // A failed follow list leaves the picker with every pattern.
  const follows = computed<FollowedCenter[]>(() => (followsQuery.isError.value ? [] : (followsQuery.data.value ?? [])));
  const patterns = computed<PatternListItem[]>(() => patternsQuery.data.value ?? []);
  const loading = computed(() => patternsQuery.isFetching.value || followsQuery.isFetching.value);
  const error = computed(() =>
    patternsQuery.isError.value ? errorMessage(patternsQuery.error.value, 'The conditions could not be loaded.') : '',
  );

  /** Waits for both lists (from the cache when fresh); after an error it asks the server again. */
  async function load(): Promise<void> {
    const settle = (q: typeof patternsQuery | typeof followsQuery) => (q.isError.value ? q.refetch() : q.suspense()).catch(() => undefined);
    await Promise.all([settle(patternsQuery), settle(followsQuery)]);
  }

  const conditions = computed<ConditionChoice[]>(() =>
    follows.value.flatMap((f) => (f.inForce ?? []).map((x) => conditionChoice(f.center, x.condition, x.lanes))),
  );
  const plain = computed<PatternChoice[]>(() =>
    patterns.value.map((p) => ({ key: patternKey(p.id), kind: 'pattern', patternId: p.id, label: p.name, summary: p.summary })),
  );
  const byKey = computed(() => new Map<string, Choice>([...conditions.value, ...plain.value].map((c) => [c.key, c])));

  return { conditions, patterns: plain, byKey, loading, error, load };
}
