import { Router, type Request, type Response } from 'express';
import { ProfileUpdateSchema, type ProfileUpdate } from '../../../shared/profile';
import { currentUser, requireAuth } from '../../middleware/auth';
import { validate } from '../../middleware/validate';
import { profileService } from './profile.service';

export const profileRouter = Router();

profileRouter.use(requireAuth);
profileRouter.get('/', async (req: Request, res: Response) => {
  res.json(await profileService.get(currentUser(req).id));
});
profileRouter.put('/', validate({ body: ProfileUpdateSchema }), async (req: Request, res: Response) => {
  res.json({ profile: await profileService.update(currentUser(req).id, req.body as ProfileUpdate), saved: true });
});
