import { computed, ref, shallowRef } from 'vue';
import type { Ball } from '@shared/balls';
import type { PatternDetail, PatternListItem } from '@shared/patterns';
import { arsenalApi } from '@/api/arsenal';
import { errorMessage } from '@/api/client';
import { matchupsApi, type MatchupResult } from '@/api/matchups';
import { patternsApi } from '@/api/patterns';

/** One colour per ball in charts (distinct from the blue oil scale and the maple lane), with a legend. */
export const BALL_COLOURS = ['#c2410c', '#7c3aed', '#be123c', '#15803d', '#0f172a', '#a21caf', '#b45309', '#0e7490', '#4d7c0f', '#9f1239'] as const;

/**
 * The Matchup screen's state: the conditions to choose from, the chosen pattern (with its oil grid and
 * sweeps for the in-browser what-if), games bowled, the server's ranking, and the bowler's full ball
 * specs (the what-if re-ranks with the same engine in the browser).
 */
export function useMatchup() {
  const patterns = shallowRef<PatternListItem[]>([]);
  const patternsLoading = ref(false);
  const patternsError = ref('');

  const patternId = ref<number | null>(null);
  const pattern = shallowRef<PatternDetail | null>(null);
  const gamesBowled = ref(0);

  const result = shallowRef<MatchupResult | null>(null);
  const running = ref(false);
  const runError = ref('');

  /** The bowler's balls by id, with every spec (hardness included) for the what-if. */
  const balls = shallowRef<Map<number, Ball>>(new Map());

  async function loadPatterns(): Promise<void> {
    patternsLoading.value = true;
    patternsError.value = '';
    try {
      const res = await patternsApi.list({ sort: 'name', order: 'asc' });
      patterns.value = res.items;
    } catch (err) {
      patternsError.value = errorMessage(err, 'The conditions could not be loaded.');
    } finally {
      patternsLoading.value = false;
    }
  }

  let controller: AbortController | null = null;

  /** Runs the matchup for the chosen pattern and games bowled (the latest call wins). */
  async function run(): Promise<void> {
    if (patternId.value === null) {
      runError.value = 'Choose a condition first.';
      return;
    }
    controller?.abort();
    const current = new AbortController();
    controller = current;
    running.value = true;
    runError.value = '';
    const id = patternId.value;
    try {
      const needPattern = pattern.value?.id !== id;
      const [res, detail, arsenal] = await Promise.all([
        matchupsApi.run({ patternId: id, gamesBowled: gamesBowled.value }, current.signal),
        needPattern ? patternsApi.get(id, current.signal) : Promise.resolve(null),
        balls.value.size === 0 ? arsenalApi.list({ pageSize: 100, status: 'active' }, current.signal) : Promise.resolve(null),
      ]);
      if (controller !== current) return;
      if (detail) pattern.value = detail.item;
      if (arsenal) balls.value = new Map(arsenal.items.map((b) => [b.id, b]));
      result.value = res;
    } catch (err) {
      if (controller !== current || current.signal.aborted) return;
      runError.value = errorMessage(err, 'The matchup could not be run.');
    } finally {
      if (controller === current) running.value = false;
    }
  }

  /** A stable colour per ball: by id order, so a ball keeps its colour as the ranking changes. */
  const colours = computed<Record<number, string>>(() => {
    const ids = (result.value?.rankings ?? []).map((r) => r.ballId).sort((a, b) => a - b);
    return Object.fromEntries(ids.map((id, i) => [id, BALL_COLOURS[i % BALL_COLOURS.length]]));
  });

  return { patterns, patternsLoading, patternsError, loadPatterns, patternId, pattern, gamesBowled, result, running, runError, run, balls, colours };
}
