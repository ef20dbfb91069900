import { z } from 'zod';
import { ProfileSchema, ProfileUpdateSchema } from '../../../shared/profile';
import { requireAuth } from '../../middleware/auth';
import { route, type RouteGroup } from '../../http/route';
import { profileService } from './profile.service';

/** The signed-in bowler's release parameters and preferences. */
export const profileRoutes: RouteGroup = {
  prefix: '/profile',
  guard: [requireAuth],
  routes: [
    route({
      method: 'get',
      path: '/',
      summary: 'The bowler profile (typical values when never saved)',
      access: 'signed-in',
      response: z.object({ profile: ProfileSchema, saved: z.boolean() }),
      handler: ({ user }) => profileService.get(user.id),
    }),
    route({
      method: 'put',
      path: '/',
      summary: 'Save bowler parameters (any subset)',
      access: 'signed-in',
      body: ProfileUpdateSchema,
      response: z.object({ profile: ProfileSchema, saved: z.literal(true) }),
      handler: async ({ user, body }) => ({ profile: await profileService.update(user.id, body), saved: true as const }),
    }),
  ],
};
