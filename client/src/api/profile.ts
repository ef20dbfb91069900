import type { Profile } from '@shared/profile';
import { api } from './client';

export const profileApi = {
  get: () => api.get<{ profile: Profile }>('/profile'),
  update: (profile: Profile) => api.put<{ profile: Profile }>('/profile', profile),
};
