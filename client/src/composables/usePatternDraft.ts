import { computed, ref, watch } from 'vue';
import { oilGrid, validatePattern, type OilGrid, type Sweep } from '@engine/index';
import { SweepSchema, type PatternDetail, type PatternInput } from '@shared/patterns';
import { isApiRequestError } from '@/api/client';
import { computePatternNumbers, type PatternNumbersInput } from '@/utils/patternNumbers';

/** The numeric columns of a sweep, in table order. */
export const SWEEP_NUMBER_FIELDS = ['fromBoard', 'toBoard', 'startFt', 'endFt', 'crossings', 'microlitersPerBoard'] as const;
export type SweepNumberField = (typeof SWEEP_NUMBER_FIELDS)[number];
export type SweepField = 'direction' | SweepNumberField;

/** One row of the sweeps table as typed: numbers stay text until they are valid. */
export interface SweepDraftRow {
  /** Stable key for the table (rows are reordered). */
  key: number;
  direction: Sweep['direction'];
  fromBoard: string;
  toBoard: string;
  startFt: string;
  endFt: string;
  crossings: string;
  microlitersPerBoard: string;
}

export type SweepRowErrors = Partial<Record<SweepField, string>>;

/** A new pattern starts with one full-width sweep, so the map and numbers show something at once. */
const NEW_SWEEP: Omit<SweepDraftRow, 'key'> = {
  direction: 'forward',
  fromBoard: '2',
  toBoard: '38',
  startFt: '0',
  endFt: '40',
  crossings: '2',
  microlitersPerBoard: '50',
};

const FIELD_NAMES = new Set<string>(['direction', ...SWEEP_NUMBER_FIELDS]);

function parseNumber(text: string): number | undefined {
  const t = text.trim().replace(',', '.');
  if (t === '') return undefined;
  const n = Number(t);
  return Number.isFinite(n) ? n : Number.NaN;
}

/** The row as the schema sees it (blank → missing, so the schema says "Must be a number"). */
function rowValue(row: SweepDraftRow): Record<string, unknown> {
  const out: Record<string, unknown> = { direction: row.direction };
  for (const f of SWEEP_NUMBER_FIELDS) out[f] = parseNumber(row[f]);
  return out;
}

export interface RowCheck {
  sweep: Sweep | null;
  errors: SweepRowErrors;
}

/**
 * Checks one row with the shared `SweepSchema` (what the API accepts), then with the engine's own
 * `validatePattern` (what `analyzePattern` accepts), so a row that would make the numbers fail is marked on its cell.
 */
export function checkSweepRow(row: SweepDraftRow): RowCheck {
  const parsed = SweepSchema.safeParse(rowValue(row));
  if (!parsed.success) {
    const errors: SweepRowErrors = {};
    for (const issue of parsed.error.issues) {
      const key = String(issue.path[0] ?? '');
      if (FIELD_NAMES.has(key) && !errors[key as SweepField]) errors[key as SweepField] = issue.message;
    }
    return { sweep: null, errors };
  }
  try {
    validatePattern({ name: 'row', sweeps: [parsed.data] });
  } catch (err) {
    const text = err instanceof Error ? err.message : String(err);
    const field = SWEEP_NUMBER_FIELDS.find((f) => text.includes(` ${f} `)) ?? 'endFt';
    const message = field === 'endFt' || field === 'startFt' ? 'The engine reads oil only up to 60 ft (the headpin)' : 'Out of range';
    return { sweep: null, errors: { [field]: message } };
  }
  return { sweep: parsed.data, errors: {} };
}

export function sweepToRow(sweep: Sweep, key: number): SweepDraftRow {
  return {
    key,
    direction: sweep.direction,
    fromBoard: String(sweep.fromBoard),
    toBoard: String(sweep.toBoard),
    startFt: String(sweep.startFt),
    endFt: String(sweep.endFt),
    crossings: String(sweep.crossings),
    microlitersPerBoard: String(sweep.microlitersPerBoard),
  };
}

/** The distances the oil map shows: the pattern's end plus 5 ft of dry lane (10–60 ft), as the server's grid. */
export function mapMaxFt(lengthFt: number): number {
  return Math.min(60, Math.max(10, Math.ceil(lengthFt) + 5));
}

/**
 * The pattern editor's state: name, description and the sweeps as typed; per-cell errors; and the numbers
 * and oil grid worked out as you type by the engine (`analyzePattern`, `oilGrid`), from the rows that are valid.
 */
export function usePatternDraft() {
  let nextKey = 1;
  const id = ref<number | null>(null);
  const version = ref<number | null>(null);
  const name = ref('');
  const description = ref('');
  const rows = ref<SweepDraftRow[]>([]);
  /** Errors the server reported on a cell (`body.sweeps.<i>.<field>`), by row key; cleared when the row changes. */
  const serverRowErrors = ref<Record<number, SweepRowErrors>>({});
  const nameError = ref('');
  const savedSnapshot = ref('');

  function snapshot(): string {
    return JSON.stringify({ name: name.value, description: description.value, rows: rows.value.map(({ key: _key, ...rest }) => rest) });
  }

  function markSaved(): void {
    savedSnapshot.value = snapshot();
  }

  function reset(): void {
    id.value = null;
    version.value = null;
    name.value = '';
    description.value = '';
    rows.value = [{ key: nextKey++, ...NEW_SWEEP }];
    serverRowErrors.value = {};
    nameError.value = '';
    markSaved();
  }

  function load(detail: Pick<PatternDetail, 'id' | 'version' | 'name' | 'description' | 'sweeps'>): void {
    id.value = detail.id;
    version.value = detail.version;
    name.value = detail.name;
    description.value = detail.description ?? '';
    rows.value = detail.sweeps.map((s) => sweepToRow(s, nextKey++));
    serverRowErrors.value = {};
    nameError.value = '';
    markSaved();
  }

  function addRow(): void {
    const last = rows.value[rows.value.length - 1];
    rows.value = [...rows.value, { ...(last ?? NEW_SWEEP), key: nextKey++ }];
  }

  function removeRow(index: number): void {
    rows.value = rows.value.filter((_, i) => i !== index);
  }

  function moveRow(index: number, delta: -1 | 1): void {
    const target = index + delta;
    if (target < 0 || target >= rows.value.length) return;
    const next = [...rows.value];
    [next[index], next[target]] = [next[target], next[index]];
    rows.value = next;
  }

  const checks = computed(() => rows.value.map(checkSweepRow));

  const rowErrors = computed<SweepRowErrors[]>(() =>
    rows.value.map((row, i) => ({ ...(serverRowErrors.value[row.key] ?? {}), ...checks.value[i].errors })),
  );

  const validSweeps = computed<Sweep[]>(() => checks.value.flatMap((c) => (c.sweep ? [c.sweep] : [])));
  const invalidCount = computed(() => checks.value.length - validSweeps.value.length);

  /** The numbers of the valid rows, from the engine (exactly the server's computation). */
  const numbers = computed<PatternNumbersInput>(() => computePatternNumbers(validSweeps.value));
  const grid = computed<OilGrid>(() =>
    oilGrid({ name: 'draft', sweeps: validSweeps.value }, { boardStep: 1, ftStep: 1, maxFt: mapMaxFt(numbers.value.lengthFt) }),
  );

  const dirty = computed(() => snapshot() !== savedSnapshot.value);

  /** Each row as it was when the server's errors arrived (to tell which rows were edited since). */
  const lastSeen = new Map<number, string>();
  // A server error on a cell goes away once that row is edited.
  watch(
    rows,
    (now) => {
      const keep: Record<number, SweepRowErrors> = {};
      for (const row of now) {
        const before = serverRowErrors.value[row.key];
        if (before && JSON.stringify(row) === lastSeen.get(row.key)) keep[row.key] = before;
      }
      serverRowErrors.value = keep;
      lastSeen.clear();
      for (const row of now) lastSeen.set(row.key, JSON.stringify(row));
    },
    { deep: true },
  );
  watch(name, () => (nameError.value = ''));

  /** Client-side check before saving; returns the body to send, or null (errors are then on their cells). */
  function toInput(): PatternInput | null {
    const trimmed = name.value.trim();
    nameError.value = trimmed ? '' : 'Name is required';
    if (!trimmed || invalidCount.value > 0 || validSweeps.value.length === 0) return null;
    return { name: trimmed, description: description.value.trim() || null, sweeps: validSweeps.value };
  }

  /**
   * Puts an API error's fields on the cells (`body.sweeps.<i>.<field>`) and the name (`body.name`);
   * returns what is left for a message above the form.
   */
  function applyApiError(err: unknown): string[] {
    if (!isApiRequestError(err)) return ['The pattern could not be saved.'];
    const left: string[] = [];
    const byRow: Record<number, SweepRowErrors> = {};
    for (const [path, message] of Object.entries(err.fields)) {
      const m = /^body\.sweeps\.(\d+)\.(\w+)$/.exec(path);
      const row = m ? rows.value[Number(m[1])] : undefined;
      if (m && row && FIELD_NAMES.has(m[2])) {
        byRow[row.key] = { ...(byRow[row.key] ?? {}), [m[2]]: message };
      } else if (path === 'body.name') {
        nameError.value = message;
      } else {
        left.push(message);
      }
    }
    serverRowErrors.value = byRow;
    for (const row of rows.value) lastSeen.set(row.key, JSON.stringify(row));
    if (left.length === 0 && Object.keys(byRow).length === 0 && !nameError.value) left.push(err.message);
    return left;
  }

  reset();

  return {
    id,
    version,
    name,
    description,
    rows,
    nameError,
    rowErrors,
    validSweeps,
    invalidCount,
    numbers,
    grid,
    dirty,
    reset,
    load,
    markSaved,
    addRow,
    removeRow,
    moveRow,
    toInput,
    applyApiError,
  };
}

export type PatternDraft = ReturnType<typeof usePatternDraft>;
