import { saveFile } from '@/utils/saveFile';
import { ref, type Ref } from 'vue';
import { ElMessageBox, ElNotification } from 'element-plus';
import { errorMessage, isApiRequestError } from '@/api/client';
import { patternsApi, type PatternFileFormat } from '@/api/patterns';
import { routerPush } from '@/router';
import { importErrorLines, patternFileName } from '@/utils/patternFiles';

/**
 * The pattern editor's file actions: duplicate the saved pattern, export it as JSON or CSV, and import a pattern file
 * (its errors listed by line). Each reports its failure in `actionError`; `busy` names the action under way.
 */
export interface PatternFileHooks {
  /** Asked before an import replaces the page: false keeps the page and its edits (nothing is sent). */
  mayLeave?: () => Promise<boolean>;
  /** Opens the imported pattern (the page's own leave check is already answered). */
  open?: (id: number) => Promise<void>;
}

/** An import of a name you already use: import it under the free name, replace yours, or nothing (null). */
async function askNameConflict(message: string, suggested: string): Promise<'rename' | 'replace' | null> {
  try {
    await ElMessageBox.confirm(message, 'You already have a pattern of this name', {
      confirmButtonText: `Import as “${suggested}”`,
      cancelButtonText: 'Replace my pattern',
      distinguishCancelAndClose: true,
      type: 'warning',
    });
    return 'rename';
  } catch (action) {
    return action === 'cancel' ? 'replace' : null;
  }
}

export function usePatternFileActions(id: Readonly<Ref<number | null>>, name: Readonly<Ref<string>>, hooks: PatternFileHooks = {}) {
  const busy = ref<'' | 'duplicate' | 'export' | 'import'>('');
  const actionError = ref('');
  const importErrors = ref<{ line: number; text: string }[]>([]);
  const fileInput = ref<HTMLInputElement | null>(null);

  async function duplicate(): Promise<void> {
    if (id.value === null) return;
    busy.value = 'duplicate';
    actionError.value = '';
    try {
      const res = await patternsApi.duplicate(id.value);
      ElNotification({ type: 'success', title: 'Pattern duplicated', message: `${res.item.name} is ready to edit.` });
      await routerPush('pattern-edit', { params: { id: res.item.id } });
    } catch (err) {
      actionError.value = errorMessage(err, 'The pattern could not be duplicated.');
    } finally {
      busy.value = '';
    }
  }

  async function exportAs(format: PatternFileFormat): Promise<void> {
    if (id.value === null) return;
    busy.value = 'export';
    actionError.value = '';
    try {
      const blob = await patternsApi.exportFile(id.value, format);
      saveFile(blob, patternFileName(name.value, format));
    } catch (err) {
      actionError.value = errorMessage(err, 'The pattern could not be exported.');
    } finally {
      busy.value = '';
    }
  }

  function chooseFile(): void {
    fileInput.value?.click();
  }

  async function onFile(event: Event): Promise<void> {
    const input = event.target as HTMLInputElement;
    const file = input.files?.[0];
    input.value = '';
    if (!file) return;
    // Unsaved edits: ask before anything is sent, so "Stay" keeps them and imports nothing.
    if (hooks.mayLeave && !(await hooks.mayLeave())) return;
    busy.value = 'import';
    actionError.value = '';
    importErrors.value = [];
    try {
      let res;
      try {
        res = await patternsApi.importFile(file);
      } catch (err) {
        if (!(isApiRequestError(err) && err.code === 'name_taken' && err.fields.suggestedName)) throw err;
        const choice = await askNameConflict(err.message, err.fields.suggestedName);
        if (!choice) return;
        res = await patternsApi.importFile(file, choice);
      }
      ElNotification({
        type: 'success',
        title: 'Pattern imported',
        message: `${res.item.name} was ${res.item.id === id.value ? 'replaced' : 'created'} from ${file.name}.`,
      });
      if (hooks.open) await hooks.open(res.item.id);
      else await routerPush('pattern-edit', { params: { id: res.item.id } });
    } catch (err) {
      if (isApiRequestError(err) && Object.keys(err.fields).some((k) => k.startsWith('lines.'))) {
        importErrors.value = importErrorLines(err.fields);
        actionError.value = `${file.name} was not imported: ${err.message}`;
      } else {
        actionError.value = `${file.name} was not imported: ${errorMessage(err, 'the file could not be read.')}`;
      }
    } finally {
      busy.value = '';
    }
  }

  return { busy, actionError, importErrors, fileInput, duplicate, exportAs, chooseFile, onFile };
}
