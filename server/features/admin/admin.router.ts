import { Router, type Request, type Response } from 'express';
import { z } from 'zod';
import { IdParamSchema, PageQuerySchema, RoleChangeSchema, UserListQuerySchema, type RoleChange, type UserListQuery } from '../../../shared/auth';
import { currentUser, requireAuth, requireRole } from '../../middleware/auth';
import { validate } from '../../middleware/validate';
import { adminService } from './admin.service';

export const adminRouter = Router();

adminRouter.use(requireAuth, requireRole('admin'));

adminRouter.get('/users', validate({ query: UserListQuerySchema }), async (req: Request, res: Response) => {
  res.json(await adminService.listUsers(req.query as unknown as UserListQuery));
});
adminRouter.patch('/users/:id/role', validate({ params: IdParamSchema, body: RoleChangeSchema }), async (req: Request, res: Response) => {
  const { id } = req.params as unknown as { id: number };
  res.json({ user: await adminService.setRole(currentUser(req).id, id, (req.body as RoleChange).role) });
});
adminRouter.get('/audit', validate({ query: PageQuerySchema }), async (req: Request, res: Response) => {
  const { page, pageSize } = req.query as unknown as z.infer<typeof PageQuerySchema>;
  res.json(await adminService.listAudit(page, pageSize));
});
