import type { Page } from '@shared/auth';
import type { ArsenalImportResult, ArsenalQuery, Ball, BallCreate, BallPatch, SurfaceChange } from '@shared/balls';
import { api } from './client';

export type ArsenalParams = Partial<ArsenalQuery>;
export type { ArsenalImportResult };

/** The signed-in bowler's own balls. */
export const arsenalApi = {
  list: (params: ArsenalParams, signal?: AbortSignal) => api.get<Page<Ball>>('/arsenal', { query: { ...params }, signal }),
  get: (id: number, signal?: AbortSignal) => api.get<{ item: Ball }>(`/arsenal/${id}`, { signal }),
  create: (body: BallCreate) => api.post<{ item: Ball }>('/arsenal', body),
  /** `version` must be the one the editor read; a stale one answers 409 `stale_version`. */
  update: (id: number, body: BallPatch) => api.patch<{ item: Ball }>(`/arsenal/${id}`, body),
  /** Soft delete: `restore` undoes it. */
  remove: (id: number) => api.delete<null>(`/arsenal/${id}`),
  restore: (id: number) => api.post<{ item: Ball }>(`/arsenal/${id}/restore`),
  changeSurface: (id: number, body: SurfaceChange) => api.post<{ item: Ball }>(`/arsenal/${id}/surface`, body),
  /** The ball's photo (needs the bearer token, so it is fetched as a Blob for an object URL). */
  photo: (id: number, signal?: AbortSignal) => api.get<Blob>(`/arsenal/${id}/photo`, { asBlob: true, signal }),
  /** PNG, JPEG or WebP up to 2 MiB; replaces any earlier photo. */
  setPhoto: (id: number, file: File) => {
    const form = new FormData();
    form.append('file', file, file.name);
    return api.put<{ item: Ball }>(`/arsenal/${id}/photo`, form);
  },
  removePhoto: (id: number) => api.delete<{ item: Ball }>(`/arsenal/${id}/photo`),
  /** CSV upload (all or nothing); a bad file answers 400 `csv_invalid_rows` with `fields` keyed `rows.<line>.<column>`. */
  importCsv: (file: File) => {
    const form = new FormData();
    form.append('file', file, file.name);
    return api.post<ArsenalImportResult>('/arsenal/import', form);
  },
};

/** The name a bowler knows a ball by (shared with the server, which gives it to the engine for its texts). */
export { ballLabel } from '@shared/balls';
