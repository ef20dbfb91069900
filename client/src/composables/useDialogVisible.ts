import { computed } from 'vue';

/**
 * The `v-model` of an `el-dialog` whose parent opens it with an `open` prop: the dialog is shown while `open` is true,
 * and closing it (the × button, Escape) asks the parent to close it through `close`.
 */
export function useDialogVisible(props: { readonly open: boolean }, close: () => void) {
  return computed({
    get: () => props.open,
    set: (value: boolean) => {
      if (!value) close();
    },
  });
}
