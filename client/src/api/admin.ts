import type { AuditEvent, AuditQuery, Page, Role, User, UserListQuery } from '@shared/auth';
import { api } from './client';

export type UserListParams = Partial<UserListQuery>;
export type AuditParams = Partial<AuditQuery>;

export const adminApi = {
  listUsers: (params: UserListParams, signal?: AbortSignal) => api.get<Page<User>>('/admin/users', { query: { ...params }, signal }),
  changeRole: (id: number, role: Role) => api.patch<{ user: User }>(`/admin/users/${id}/role`, { role }),
  setRoles: (id: number, roles: Role[]) => api.put<{ user: User }>(`/admin/users/${id}/roles`, { roles }),
  audit: (params: AuditParams, signal?: AbortSignal) => api.get<Page<AuditEvent>>('/admin/audit', { query: { ...params }, signal }),
  auditActions: (signal?: AbortSignal) => api.get<{ items: string[] }>('/admin/audit/actions', { signal }),
};
