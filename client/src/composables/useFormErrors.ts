import { ref, watch, type Ref } from 'vue';
import type { ZodType } from 'zod';
import { isApiRequestError } from '@/api/client';

interface Issue {
  readonly path: readonly PropertyKey[];
  readonly message: string;
}

export interface FormErrors<Field extends string> {
  /** Field → message; bind each to `<el-form-item :error="errors.<field>">`. */
  errors: Ref<Partial<Record<Field, string>>>;
  /** A message for the form as a whole (shown in an inline alert), or ''. */
  formError: Ref<string>;
  clearErrors: () => void;
  setFieldError: (field: Field, message: string) => void;
  /** Validate `value` with a shared zod schema; on failure show every issue on its field and return null. */
  validate: <T>(schema: ZodType<T>, value: unknown) => T | null;
  /**
   * Map an API error onto the form: `fields` keyed `body.<name>` go to the form item with prop `<name>`;
   * anything else becomes the form-level message. Returns false if `err` is not an API error.
   */
  applyApiError: (err: unknown, fallback?: string) => boolean;
}

/**
 * Server and client validation errors → Element Plus form items.
 * Errors on a field clear as soon as that field's value changes.
 */
export function useFormErrors<Model extends object>(model: Model): FormErrors<Extract<keyof Model, string>> {
  type Field = Extract<keyof Model, string>;
  const fieldNames = new Set<string>(Object.keys(model));
  const errors = ref({}) as Ref<Partial<Record<Field, string>>>;
  const formError = ref('');

  function isField(name: string): name is Field {
    return fieldNames.has(name);
  }

  function clearErrors(): void {
    errors.value = {};
    formError.value = '';
  }

  function setFieldError(field: Field, message: string): void {
    errors.value = { ...errors.value, [field]: message };
  }

  function applyIssues(issues: readonly Issue[]): void {
    const next: Partial<Record<Field, string>> = {};
    const other: string[] = [];
    for (const issue of issues) {
      const key = String(issue.path[0] ?? '');
      if (isField(key)) {
        if (!next[key]) next[key] = issue.message;
      } else {
        other.push(issue.message);
      }
    }
    errors.value = next;
    formError.value = other.join(' ');
  }

  function validate<T>(schema: ZodType<T>, value: unknown): T | null {
    const result = schema.safeParse(value);
    if (result.success) {
      clearErrors();
      return result.data;
    }
    applyIssues(result.error.issues);
    return null;
  }

  function applyApiError(err: unknown, fallback = 'Something went wrong. Please try again.'): boolean {
    if (!isApiRequestError(err)) {
      clearErrors();
      formError.value = fallback;
      return false;
    }
    const next: Partial<Record<Field, string>> = {};
    const other: string[] = [];
    for (const [path, message] of Object.entries(err.fields)) {
      const name = path.startsWith('body.') ? path.slice('body.'.length).split('.')[0] : path;
      if (isField(name)) next[name] = message;
      else other.push(message);
    }
    errors.value = next;
    const mapped = Object.keys(next).length > 0;
    // Nothing landed on a field: the error's own message says what went wrong.
    formError.value = mapped ? other.join(' ') : err.message;
    return true;
  }

  watch(
    () => ({ ...model }),
    (now, before) => {
      for (const key of Object.keys(now) as Field[]) {
        if (now[key] !== before[key] && errors.value[key]) {
          const next = { ...errors.value };
          delete next[key];
          errors.value = next;
        }
      }
    },
  );

  return { errors, formError, clearErrors, setFieldError, validate, applyApiError };
}
