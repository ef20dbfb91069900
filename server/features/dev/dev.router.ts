import { Router } from 'express';
import { capturedMail } from '../../dev/mailCapture';
import { requireAuth, requireRole } from '../../middleware/auth';

/**
 * Development and tests only, for the admin: the mailbox of the project's own SMTP server. app.ts imports
 * this file on demand outside production (production never loads it); everyone else gets 401/403, since the
 * mailbox holds every user's reset and verification links.
 */
export const devRouter = Router();

devRouter.get('/mail', requireAuth, requireRole('admin'), (_req, res) => {
  const items = capturedMail();
  res.json({ items, total: items.length });
});
