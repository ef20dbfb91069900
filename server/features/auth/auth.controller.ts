import type { Request, Response } from 'express';
import type { LoginInput, RegisterInput, VerifyEmailInput } from '../../../shared/auth';
import { runInBackground } from '../../lib/background';
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
  /** Answers at once, the same for every address; the lookup and the mail happen after the answer. */
  async forgot(req: Request, res: Response): Promise<void> {
    const { email } = req.body as { email: string };
    runInBackground('password reset mail', () => authService.sendReset(email));
    res.status(202).json({ ok: true });
  },
  async reset(req: Request, res: Response): Promise<void> {
    const { token, password } = req.body as { token: string; password: string };
    await authService.reset(token, password);
    res.json({ ok: true });
  },
  async verifyEmail(req: Request, res: Response): Promise<void> {
    res.json({ ok: true, user: await authService.verifyEmail((req.body as VerifyEmailInput).token) });
  },
  async resendVerification(req: Request, res: Response): Promise<void> {
    res.status(202).json(await authService.resendVerification(currentUser(req).id));
  },
};
