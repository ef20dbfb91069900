import type { Profile } from '@shared/profile';
import { api } from './client';

export const profileApi = {
  /** `saved: false` = the bowler never saved one; `profile` then holds the typical defaults. */
  get: () => api.get<{ profile: Profile; saved: boolean }>('/profile'),
  update: (profile: Profile) => api.put<{ profile: Profile; saved: boolean }>('/profile', profile),
};
