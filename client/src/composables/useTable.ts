import { reactive, ref, shallowRef, type Ref } from 'vue';
import type { Page } from '@shared/auth';
import { errorMessage } from '@/api/client';

export type SortOrder = 'asc' | 'desc';

/** One column of a list page; the view renders `<el-table-column>` from an array of these. */
export interface TableColumn<Row> {
  prop: Extract<keyof Row, string>;
  label: string;
  sortable?: boolean;
  minWidth?: number;
  width?: number;
  align?: 'left' | 'center' | 'right';
  /** Text to show for the cell; defaults to the raw value. */
  format?: (row: Row) => string;
  /** Numbers: right-aligned, tabular figures. */
  numeric?: boolean;
}

export interface TableQuery<Filters, SortKey extends string> {
  page: number;
  pageSize: number;
  sort: SortKey;
  order: SortOrder;
  filters: Filters;
  signal: AbortSignal;
}

export interface UseTableOptions<Row, Filters, SortKey extends string> {
  fetchPage: (query: TableQuery<Filters, SortKey>) => Promise<Page<Row>>;
  initialFilters: Filters;
  sortKeys: readonly SortKey[];
  defaultSort: SortKey;
  defaultOrder?: SortOrder;
  pageSize?: number;
  pageSizes?: readonly number[];
}

/** Element Plus `sort-change` payload. */
export interface SortChange {
  prop: string | null;
  order: 'ascending' | 'descending' | null;
}

/**
 * Paging, sorting and filtering for a server-side list. Stale answers are dropped (only the latest
 * request may update rows), errors land in `error` for the page to show inline.
 */
export function useTable<Row, Filters extends object, SortKey extends string>(options: UseTableOptions<Row, Filters, SortKey>) {
  const rows = shallowRef<Row[]>([]) as Ref<Row[]>;
  const total = ref(0);
  const page = ref(1);
  const pageSize = ref(options.pageSize ?? 20);
  const pageSizes = options.pageSizes ?? [10, 20, 50, 100];
  const sort = ref(options.defaultSort) as Ref<SortKey>;
  const order = ref<SortOrder>(options.defaultOrder ?? 'asc');
  const filters = reactive({ ...options.initialFilters }) as Filters;
  const loading = ref(false);
  const loaded = ref(false);
  const error = ref('');
  let controller: AbortController | null = null;

  async function load(): Promise<void> {
    controller?.abort();
    const current = new AbortController();
    controller = current;
    loading.value = true;
    error.value = '';
    try {
      const result = await options.fetchPage({
        page: page.value,
        pageSize: pageSize.value,
        sort: sort.value,
        order: order.value,
        filters: { ...filters },
        signal: current.signal,
      });
      if (controller !== current) return;
      rows.value = result.items;
      total.value = result.total;
      loaded.value = true;
    } catch (err) {
      if (controller !== current || current.signal.aborted) return;
      error.value = errorMessage(err, 'The list could not be loaded.');
    } finally {
      if (controller === current) loading.value = false;
    }
  }

  /** Filters changed: back to page 1 and reload. */
  function applyFilters(): Promise<void> {
    page.value = 1;
    return load();
  }

  function onPageChange(next: number): Promise<void> {
    page.value = next;
    return load();
  }

  function onPageSizeChange(next: number): Promise<void> {
    pageSize.value = next;
    page.value = 1;
    return load();
  }

  function onSortChange(change: SortChange): Promise<void> {
    const key = options.sortKeys.find((k) => k === change.prop);
    if (key && change.order) {
      sort.value = key;
      order.value = change.order === 'descending' ? 'desc' : 'asc';
    } else {
      sort.value = options.defaultSort;
      order.value = options.defaultOrder ?? 'asc';
    }
    page.value = 1;
    return load();
  }

  /** Replace one row in place (e.g. after an edit) without reloading. */
  function replaceRow(match: (row: Row) => boolean, next: Row): void {
    rows.value = rows.value.map((row) => (match(row) ? next : row));
  }

  return {
    rows,
    total,
    page,
    pageSize,
    pageSizes,
    sort,
    order,
    filters,
    loading,
    loaded,
    error,
    load,
    applyFilters,
    onPageChange,
    onPageSizeChange,
    onSortChange,
    replaceRow,
  };
}
