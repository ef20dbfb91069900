import type { CoverageResult, LayoutLabInput, LayoutLabResult, Trial, TrialCreate, TrialResult } from '@shared/decisions';
import { api } from './client';

export type { CoverageResult, LayoutLabResult, Trial, TrialResult };

export const decisionsApi = {
  trials: (studentId?: number, signal?: AbortSignal) =>
    api.get<{ items: Trial[] }>('/trials', { query: studentId ? { studentId } : {}, signal }),
  trial: (id: number, signal?: AbortSignal) => api.get<{ item: TrialResult }>(`/trials/${id}`, { signal }),
  createTrial: (body: TrialCreate) => api.post<{ item: Trial }>('/trials', body),
  deleteTrial: (id: number) => api.delete<void>(`/trials/${id}`),
  coverage: (studentId?: number, signal?: AbortSignal) =>
    api.get<{ item: CoverageResult }>('/coverage', { query: studentId ? { studentId } : {}, signal }),
  layoutLab: (body: LayoutLabInput) => api.post<{ item: LayoutLabResult }>('/layout-lab', body),
};
