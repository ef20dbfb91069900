import type { PatternDetail, PatternInput, PatternListItem, PatternQuery } from '@shared/patterns';
import { api } from './client';

export type PatternParams = Partial<PatternQuery>;

/** Lanewright's own pattern file formats for export and import. */
export type PatternFileFormat = 'json' | 'csv';

/** Oil patterns (every signed-in user reads them). */
export const patternsApi = {
  list: (params: PatternParams = {}, signal?: AbortSignal) =>
    api.get<{ items: PatternListItem[]; total: number }>('/patterns', { query: { pageSize: 100, ...params }, signal }),
  get: (id: number, signal?: AbortSignal) => api.get<{ item: PatternDetail }>(`/patterns/${id}`, { signal }),
  /** Coach, proprietor, admin. */
  create: (body: PatternInput) => api.post<{ item: PatternDetail }>('/patterns', body),
  /** `version` must be the one the editor read; a stale one answers 409 `stale_version`. */
  update: (id: number, body: Partial<PatternInput> & { version: number }) => api.patch<{ item: PatternDetail }>(`/patterns/${id}`, body),
  remove: (id: number) => api.delete<null>(`/patterns/${id}`),
  duplicate: (id: number) => api.post<{ item: PatternDetail }>(`/patterns/${id}/duplicate`),
  /** The pattern as a file in one of Lanewright's own formats. */
  exportFile: (id: number, format: PatternFileFormat) => api.get<Blob>(`/patterns/${id}/export`, { query: { format }, asBlob: true }),
  /** A .json or .csv file in Lanewright's formats; a bad file answers 400 with `fields` keyed `lines.<line>.<field>`. */
  importFile: (file: File, onConflict?: 'rename' | 'replace') => {
    const form = new FormData();
    form.append('file', file, file.name);
    return api.post<{ item: PatternDetail }>('/patterns/import', form, onConflict ? { query: { onConflict } } : undefined);
  },
};
