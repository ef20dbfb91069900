import { z } from 'zod';
import { capturedMail, type CapturedMail } from '../../dev/mailCapture';
import { route, type RouteGroup } from '../../http/route';

/**
 * Development and tests only, for the admin: the mailbox of the project's own SMTP server. app.ts imports
 * this file on demand outside production (production never loads it); everyone else gets 401/403, since the
 * mailbox holds every user's reset and verification links.
 */
export const devRoutes: RouteGroup = {
  prefix: '/dev',
  devOnly: true,
  routes: [
    route({
      method: 'get',
      path: '/mail',
      summary: 'The mail the capture SMTP server received (development and tests)',
      access: ['admin'],
      response: z.object({
        items: z.array(
          z.custom<CapturedMail>(() => true).meta({ type: 'object', description: 'A captured message: envelope, headers, text and links' }),
        ),
        total: z.number().int(),
      }),
      handler: () => {
        const items = capturedMail();
        return { items, total: items.length };
      },
    }),
  ],
};
