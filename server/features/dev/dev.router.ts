import { Router } from 'express';
import { capturedMail } from '../../lib/mailer';

/** Development and test only: the mailbox of the project's own SMTP server. */
export const devRouter = Router();

devRouter.get('/mail', (_req, res) => {
  const items = capturedMail();
  res.json({ items, total: items.length });
});
