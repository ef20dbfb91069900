import { computed, ref, shallowRef, watch, type Ref } from 'vue';
import type { Calibration, LaneSurface } from '@engine/index';
import { statsApi } from '@/api/stats';
import type { Choice } from '@/composables/useConditionChoices';

export type CalibrationState = 'none' | 'loading' | 'applied' | 'not-enough' | 'failed';

/**
 * A student's calibration on the chosen condition (its own lanes) or pattern (on the lanes chosen), as the
 * student's own matchup applies it: reloaded when the choice or the lanes change, the latest answer wins. A
 * calibration that cannot be loaded leaves the paths uncalibrated, and the words say so.
 */
export function useStudentCalibration(options: {
  choice: Ref<Choice | null>;
  lane: Ref<LaneSurface>;
  studentId: () => number;
  studentName: () => string;
}) {
  const { choice, lane } = options;
  const calibration = shallowRef<Calibration | null>(null);
  const calibrationState = ref<CalibrationState>('none');
  let calibrationCall = 0;
  watch([choice, () => lane.value.kind, () => lane.value.friction], async () => {
    const c = choice.value;
    const call = ++calibrationCall;
    calibration.value = null;
    if (!c) {
      calibrationState.value = 'none';
      return;
    }
    calibrationState.value = 'loading';
    try {
      const studentId = options.studentId();
      const query =
        c.kind === 'condition'
          ? { conditionId: c.conditionId, studentId }
          : { patternId: c.patternId, laneKind: lane.value.kind, laneFriction: lane.value.friction, studentId };
      const res = await statsApi.calibration(query);
      if (call !== calibrationCall) return;
      calibration.value = res.item;
      calibrationState.value = res.item.enough ? 'applied' : 'not-enough';
    } catch {
      if (call !== calibrationCall) return;
      calibrationState.value = 'failed'; // the paths are worked out uncalibrated, and the panel says so
    }
  });

  const calibrationWords = computed(() => {
    const who = options.studentName();
    switch (calibrationState.value) {
      case 'applied':
        return `Calibrated to ${who}'s ${calibration.value?.shots ?? 0} logged shots on these lanes, as ${who}'s matchups are.`;
      case 'not-enough':
        return `Not calibrated: ${who} has ${calibration.value?.shots ?? 0} of the ${calibration.value?.minShots ?? 12} logged shots a calibration needs here.`;
      case 'failed':
        return `${who}'s calibration could not be loaded: the paths use the uncalibrated model.`;
      default:
        return '';
    }
  });

  return { calibration, calibrationState, calibrationWords };
}
