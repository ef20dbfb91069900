import { computed, nextTick, reactive, ref, watch } from 'vue';
import { ElMessageBox } from 'element-plus';
import type { z } from 'zod';
import type { BallSpec } from '@engine/index';
import { ballToSpec, formatEighths, parsePinToPapIn, type Ball, type BallModel, type BallPatch } from '@shared/balls';
import { arsenalApi } from '@/api/arsenal';
import { isApiRequestError } from '@/api/client';
import { useFormErrors } from '@/composables/useFormErrors';
import { useUnits } from '@/composables/useUnits';
import { ballFormSchemas, emptyForm, layoutOf, type BallForm } from '@/utils/ballForm';
import { legalityOf } from '@/utils/balls';

export interface BallDialogProps {
  readonly open: boolean;
  /** The ball being edited; null with `model` null = a ball entered by hand. */
  readonly ball: Ball | null;
  /** A catalogue model being added to the arsenal (its specs are copied). */
  readonly model: BallModel | null;
}

export interface BallDialogEvents {
  /** `created` is true for a new ball. */
  saved: (ball: Ball, created: boolean) => void;
  /** The ball was reloaded after a stale edit (the parent may refresh its copy). */
  reloaded: (ball: Ball) => void;
}

export type BallDialogMode = 'hand' | 'catalogue' | 'edit';

/**
 * The arsenal ball dialog's state: the flat form (kept in the stored units: pounds, inches), filled from the ball or
 * the catalogue model when the dialog opens; the live legality check; and the save (create, edit with its surface
 * change, or a reload after a stale edit).
 */
export function useBallDialog(props: BallDialogProps, on: BallDialogEvents) {
  const u = useUnits();
  const mode = computed<BallDialogMode>(() => (props.ball ? 'edit' : props.model ? 'catalogue' : 'hand'));

  const form = reactive<BallForm>(emptyForm());
  const { errors, formError, validate, applyApiError, clearErrors } = useFormErrors(form);
  const saving = ref(false);
  const staleNotice = ref('');
  /** The version the edit is based on (refreshed when the record is reloaded). */
  const baseVersion = ref(0);
  const baseSurface = ref<{ grit: number; polished: boolean } | null>(null);
  /** The stored pin-to-PAP and the text it was shown as: saved unchanged while the text is not edited. */
  const basePin = ref<{ text: string; inches: number } | null>(null);

  function fillFrom(ball: Ball): void {
    Object.assign(form, {
      name: ball.name,
      nickname: ball.nickname ?? '',
      weightLb: ball.weightLb,
      rg: ball.rg,
      differential: ball.differential,
      intermediateDifferential: ball.intermediateDifferential,
      coverType: ball.coverType,
      coreType: ball.coreType,
      hardnessD: ball.hardnessD,
      surfaceGrit: ball.surfaceGrit,
      polished: ball.polished,
      pinToPapIn: ball.layout ? formatEighths(ball.layout.pinToPapIn) : '',
      drillingAngleDeg: ball.layout?.drillingAngleDeg ?? null,
      valAngleDeg: ball.layout?.valAngleDeg ?? null,
      gamesSinceResurface: ball.gamesSinceResurface,
      status: ball.status,
    } satisfies BallForm);
    baseVersion.value = ball.version;
    baseSurface.value = { grit: ball.surfaceGrit, polished: ball.polished };
    basePin.value = ball.layout ? { text: formatEighths(ball.layout.pinToPapIn), inches: ball.layout.pinToPapIn } : null;
  }

  function fillFromModel(model: BallModel): void {
    Object.assign(form, emptyForm(), {
      name: model.name,
      rg: model.rg,
      differential: model.differential,
      intermediateDifferential: model.intermediateDifferential,
      coverType: model.coverType,
      coreType: model.coreType,
      hardnessD: model.hardnessD,
      surfaceGrit: model.factoryGrit,
      polished: model.factoryPolished,
    });
  }

  // Refill when the dialog opens or switches to another ball (not when the parent refreshes the same ball after a stale edit).
  watch(
    [() => props.open, () => props.ball?.id, () => props.model?.id],
    ([open]) => {
      if (!open) return;
      staleNotice.value = '';
      if (props.ball) fillFrom(props.ball);
      else if (props.model) fillFromModel(props.model);
      else Object.assign(form, emptyForm());
      clearErrors();
    },
    { immediate: true },
  );

  const title = computed(() => {
    if (mode.value === 'edit') return `Edit ${props.ball?.nickname || props.ball?.name || 'ball'}`;
    if (mode.value === 'catalogue') return `Add ${props.model?.name ?? 'ball'} to your arsenal`;
    return 'Add a ball by its specs';
  });

  /** The form's rules, the weight messages in the bowler's unit. */
  const schemas = computed(() => ballFormSchemas(basePin, u.value.weightInput));

  /* ---- live legality ---------------------------------------------------------------------------------- */

  /** The typed pin-to-PAP in inches, or null while it is empty or not readable. */
  const pinInches = computed(() => (form.pinToPapIn.trim() === '' ? null : parsePinToPapIn(form.pinToPapIn)));

  const liveSpec = computed<BallSpec | null>(() => {
    const f = form;
    if (
      f.weightLb === null ||
      f.rg === null ||
      f.differential === null ||
      f.intermediateDifferential === null ||
      !f.coverType ||
      f.surfaceGrit === null
    )
      return null;
    return ballToSpec({
      weightLb: f.weightLb,
      rg: f.rg,
      differential: f.differential,
      intermediateDifferential: f.intermediateDifferential,
      coverType: f.coverType,
      surfaceGrit: f.surfaceGrit,
      polished: f.polished,
      hardnessD: f.hardnessD,
      layout:
        pinInches.value === null ? null : { pinToPapIn: pinInches.value, drillingAngleDeg: f.drillingAngleDeg, valAngleDeg: f.valAngleDeg },
      gamesSinceResurface: f.gamesSinceResurface ?? 0,
      // The hardness limit depends on the approval year: the ball's own, or the catalogue model's release year.
      approvalYear: props.ball?.approvalYear ?? props.model?.releaseYear ?? null,
    });
  });
  const legality = computed(() => (liveSpec.value ? legalityOf(liveSpec.value) : null));

  const surfaceChanged = computed(
    () =>
      mode.value === 'edit' &&
      baseSurface.value !== null &&
      (baseSurface.value.grit !== form.surfaceGrit || baseSurface.value.polished !== form.polished),
  );

  /* ---- save ------------------------------------------------------------------------------------------- */

  async function reloadAfterStale(id: number): Promise<void> {
    try {
      const res = await arsenalApi.get(id);
      fillFrom(res.item);
      on.reloaded(res.item);
      staleNotice.value =
        'This ball was changed somewhere else (another tab or device) after you opened it. The form now shows the saved values: make your change again and save.';
    } catch (err) {
      applyApiError(err, 'This ball was changed elsewhere and could not be reloaded. Close the dialog and open it again.');
    }
  }

  type SpecValues = z.output<ReturnType<typeof ballFormSchemas>['SpecFormSchema']>;

  /** The hand-entered specs every create and edit of a ball by its specs sends. */
  function specsOf(s: SpecValues) {
    return {
      name: s.name,
      nickname: s.nickname || null,
      weightLb: s.weightLb,
      rg: s.rg,
      differential: s.differential,
      intermediateDifferential: s.intermediateDifferential,
      coverType: s.coverType,
      hardnessD: s.hardnessD ?? null,
      layout: layoutOf(s),
      gamesSinceResurface: s.gamesSinceResurface,
      status: s.status,
    };
  }

  async function save(): Promise<void> {
    staleNotice.value = '';
    const { CatalogueFormSchema, SpecFormSchema } = schemas.value;
    const v = validate(mode.value === 'catalogue' ? CatalogueFormSchema : SpecFormSchema, { ...form, nickname: form.nickname });
    if (!v) {
      await showFirstError();
      return;
    }
    if (mode.value !== 'edit' && !(await confirmNotDuplicate(mode.value === 'catalogue' && props.model ? props.model.name : form.name)))
      return;
    saving.value = true;
    try {
      if (mode.value === 'catalogue' && props.model) {
        const res = await arsenalApi.create({
          ballModelId: props.model.id,
          nickname: v.nickname || null,
          weightLb: v.weightLb,
          layout: layoutOf(v),
          surfaceGrit: v.surfaceGrit,
          polished: v.polished,
          gamesSinceResurface: v.gamesSinceResurface,
          status: v.status,
        });
        on.saved(res.item, true);
      } else if (mode.value === 'hand') {
        const s = v as SpecValues;
        const res = await arsenalApi.create({ ...specsOf(s), coreType: s.coreType, surfaceGrit: s.surfaceGrit, polished: s.polished });
        on.saved(res.item, true);
      } else if (props.ball) {
        const s = v as SpecValues;
        const patch: BallPatch = { version: baseVersion.value, ...specsOf(s) };
        let res = await arsenalApi.update(props.ball.id, patch);
        if (surfaceChanged.value)
          res = await arsenalApi.changeSurface(props.ball.id, { surfaceGrit: s.surfaceGrit, polished: s.polished, note: null });
        on.saved(res.item, false);
      }
    } catch (err) {
      if (isApiRequestError(err) && err.status === 409 && props.ball) await reloadAfterStale(props.ball.id);
      else applyApiError(err, 'The ball could not be saved. Please try again.');
      await showFirstError();
    } finally {
      saving.value = false;
    }
  }

  /** The first field with an error (or the form's message) scrolled into view: a long dialog may be scrolled far from it. */
  async function showFirstError(): Promise<void> {
    await nextTick();
    const el = document.querySelector('.el-dialog .el-form-item.is-error, .el-dialog .el-alert--error');
    el?.scrollIntoView({ block: 'center', behavior: 'smooth' });
    el?.querySelector<HTMLElement>('input, textarea, select')?.focus({ preventScroll: true });
  }

  /** Adding a ball the bag already holds (same name, not retired) asks first: a second copy is allowed, by intent only. */
  async function confirmNotDuplicate(name: string | undefined): Promise<boolean> {
    const wanted = (name ?? '').trim().toLowerCase();
    if (!wanted) return true;
    let same: Ball | undefined;
    try {
      same = (await arsenalApi.list({ q: name, pageSize: 50 })).items.find(
        (b) => b.name.trim().toLowerCase() === wanted && b.status !== 'retired',
      );
    } catch {
      return true; // the server still stores the ball; the check is a courtesy
    }
    if (!same) return true;
    try {
      await ElMessageBox.confirm(
        `${same.nickname ? `${same.nickname} (${same.name})` : same.name} is already in your bag. Add another one?`,
        'Add this ball again?',
        { confirmButtonText: 'Add another', cancelButtonText: 'Don’t add', type: 'warning' },
      );
      return true;
    } catch {
      return false;
    }
  }

  return { mode, form, errors, formError, saving, staleNotice, title, pinInches, legality, surfaceChanged, save };
}
