import type { Request, Response } from 'express';
import type { LoginInput, RegisterInput } from '../../../shared/auth';
import { currentUser } from '../../middleware/auth';
import { authService } from './auth.service';

export const authController = {
  async register(req: Request, res: Response): Promise<void> {
    res.status(201).json(await authService.register(req.body as RegisterInput));
  },
  async login(req: Request, res: Response): Promise<void> {
    res.json(await authService.login(req.body as LoginInput));
  },
  async me(req: Request, res: Response): Promise<void> {
    res.json({ user: await authService.me(currentUser(req).id) });
  },
  async forgot(req: Request, res: Response): Promise<void> {
    await authService.forgot((req.body as { email: string }).email, `${req.protocol}://${req.get('host') ?? '127.0.0.1'}`);
    res.status(202).json({ ok: true });
  },
  async reset(req: Request, res: Response): Promise<void> {
    const { token, password } = req.body as { token: string; password: string };
    await authService.reset(token, password);
    res.json({ ok: true });
  },
};
