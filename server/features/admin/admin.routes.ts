import {
  AuditActionsSchema,
  AuditEventSchema,
  AuditQuerySchema,
  IdParamSchema,
  RoleChangeSchema,
  RolesChangeSchema,
  UserListQuerySchema,
  UserSchema,
} from '../../../shared/auth';
import { pageOf } from '../../../shared/api';
import { z } from 'zod';
import { requireAuth, requireRole } from '../../middleware/auth';
import { route, type RouteGroup } from '../../http/route';
import { adminService } from './admin.service';

const admin = ['admin'] as const;

/** Users, roles and the audit log: admins only. */
export const adminRoutes: RouteGroup = {
  prefix: '/admin',
  guard: [requireAuth, requireRole('admin')],
  routes: [
    route({
      method: 'get',
      path: '/users',
      summary: 'Users, paged, searchable, filterable by role',
      access: admin,
      query: UserListQuerySchema,
      response: pageOf(UserSchema),
      handler: ({ query }) => adminService.listUsers(query),
    }),
    route({
      method: 'patch',
      path: '/users/:id/role',
      summary: 'Grant a role (audited)',
      access: admin,
      params: IdParamSchema,
      body: RoleChangeSchema,
      response: z.object({ user: UserSchema }),
      handler: async ({ user, params, body }) => ({ user: await adminService.setRole(user.id, params.id, body.role) }),
    }),
    route({
      method: 'put',
      path: '/users/:id/roles',
      summary: 'Set every role a user holds (audited; admin is held alone)',
      access: admin,
      params: IdParamSchema,
      body: RolesChangeSchema,
      response: z.object({ user: UserSchema }),
      handler: async ({ user, params, body }) => ({ user: await adminService.setRoles(user.id, params.id, body.roles) }),
    }),
    route({
      method: 'get',
      path: '/audit/actions',
      summary: 'The action names the audit log holds (for its filter)',
      access: admin,
      response: AuditActionsSchema,
      handler: async () => ({ items: await adminService.auditActions() }),
    }),
    route({
      method: 'get',
      path: '/audit',
      summary: 'The audit log, newest first, with names; filter by actor, action and days (UTC)',
      access: admin,
      query: AuditQuerySchema,
      response: pageOf(AuditEventSchema),
      handler: ({ query }) => adminService.listAudit(query),
    }),
  ],
};
