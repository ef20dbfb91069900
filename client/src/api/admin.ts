import type { Page, Role, User, UserListQuery } from '@shared/auth';
import { api } from './client';

export type UserListParams = Partial<UserListQuery>;

export const adminApi = {
  listUsers: (params: UserListParams, signal?: AbortSignal) => api.get<Page<User>>('/admin/users', { query: { ...params }, signal }),
  changeRole: (id: number, role: Role) => api.patch<{ user: User }>(`/admin/users/${id}/role`, { role }),
};
