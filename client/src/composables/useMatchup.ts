import { computed, ref, shallowRef } from 'vue';
import { oilGrid, type LaneSurface, type OilGrid } from '@engine/index';
import type { Ball } from '@shared/balls';
import { DEFAULT_LANE_SURFACE } from '@shared/centers';
import { errorMessage } from '@/api/client';
import { matchupsApi, type MatchupResult } from '@/api/matchups';
import { useArsenalQuery } from '@/api/queries';
import { mapMaxFt } from '@/composables/usePatternDraft';
import { useConditionChoices } from '@/composables/useConditionChoices';

/** One colour per ball in charts (distinct from the blue oil scale and the maple lane), with a legend. */
export const BALL_COLOURS = [
  '#c2410c',
  '#7c3aed',
  '#be123c',
  '#15803d',
  '#0f172a',
  '#a21caf',
  '#b45309',
  '#0e7490',
  '#4d7c0f',
  '#9f1239',
] as const;

/**
 * The Matchup screen's state: the conditions to choose from (today's publications at followed centers, and
 * every pattern with a lane surface chosen beside it), games bowled, the server's ranking with the engine input
 * it used (pattern sweeps, lane, bowler, calibration), and the bowler's full ball specs (the what-if re-ranks
 * one ball with the same engine in the browser).
 */
export function useMatchup() {
  const choices = useConditionChoices();
  /** The chosen condition or pattern (useConditionChoices keys). */
  const choiceKey = ref<string | null>(null);
  const choice = computed(() => (choiceKey.value === null ? null : (choices.byKey.value.get(choiceKey.value) ?? null)));
  /** The lane surface for a plain pattern (a published condition names its own). */
  const lane = ref<LaneSurface>({ ...DEFAULT_LANE_SURFACE });
  const gamesBowled = ref(0);

  const result = shallowRef<MatchupResult | null>(null);
  const running = ref(false);
  const runError = ref('');

  /** The bowler's balls in the bag by id, with every spec (hardness, wear, approval year) for the what-if. */
  const arsenal = useArsenalQuery();
  const balls = computed(
    () => new Map<number, Ball>((arsenal.data.value ?? []).filter((b) => b.status === 'active').map((b) => [b.id, b])),
  );

  let controller: AbortController | null = null;

  /** Runs the matchup for the chosen condition and games bowled (the latest call wins). */
  async function run(): Promise<void> {
    const c = choice.value;
    if (c === null) {
      runError.value = 'Choose a condition first.';
      return;
    }
    controller?.abort();
    const current = new AbortController();
    controller = current;
    running.value = true;
    runError.value = '';
    try {
      const body = c.kind === 'condition' ? { conditionId: c.conditionId } : { patternId: c.patternId, lane: { ...lane.value } };
      const [res] = await Promise.all([matchupsApi.run({ ...body, gamesBowled: gamesBowled.value }, current.signal), arsenal.suspense()]);
      if (controller !== current) return;
      result.value = res;
    } catch (err) {
      if (controller !== current || current.signal.aborted) return;
      runError.value = errorMessage(err, 'The matchup could not be run.');
    } finally {
      if (controller === current) running.value = false;
    }
  }

  /** The oil on the lane the ranking was worked out for (the pattern's sweeps as the server used them). */
  const grid = computed<OilGrid | null>(() => {
    const p = result.value?.pattern;
    return p ? oilGrid({ name: p.name, sweeps: p.sweeps }, { boardStep: 1, ftStep: 1, maxFt: mapMaxFt(p.summary.lengthFt) }) : null;
  });

  /** A stable colour per ball: by id order, so a ball keeps its colour as the ranking changes. */
  const colours = computed<Record<number, string>>(() => {
    const ids = (result.value?.rankings ?? []).map((r) => r.ballId).sort((a, b) => a - b);
    return Object.fromEntries(ids.map((id, i) => [id, BALL_COLOURS[i % BALL_COLOURS.length]]));
  });

  return { choices, choiceKey, choice, lane, gamesBowled, result, running, runError, run, balls, grid, colours };
}
