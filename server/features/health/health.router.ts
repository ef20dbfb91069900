import { Router } from 'express';
import nodemailer from 'nodemailer';
import { config } from '../../config/index';
import { mailCaptureEnabled } from '../../lib/mailer';
import { MailOutbox, sequelize } from '../../models/index';

export const healthRouter = Router();

const CHECK_TIMEOUT_MS = 3000;
/** The SMTP check opens a connection; its result is reused for a few seconds so polling health does not hammer the mail server. */
const MAIL_CHECK_TTL_MS = 2000;

function withTimeout<T>(p: Promise<T>, what: string): Promise<T> {
  return Promise.race([p, new Promise<never>((_, reject) => setTimeout(() => reject(new Error(`${what} timed out`)), CHECK_TIMEOUT_MS).unref())]);
}

let mailCheck: { at: number; result: Promise<'ok' | 'unreachable'> } | null = null;

/**
 * The mail server: with SMTP_URL, an SMTP connection and greeting (nodemailer's verify); in development
 * and tests the in-process capture server is always there ('ok', mode 'capture').
 */
function checkMail(): Promise<'ok' | 'unreachable'> {
  if (mailCaptureEnabled || !config.SMTP_URL) return Promise.resolve('ok');
  if (mailCheck && Date.now() - mailCheck.at < MAIL_CHECK_TTL_MS) return mailCheck.result;
  const t = nodemailer.createTransport({ url: config.SMTP_URL, connectionTimeout: CHECK_TIMEOUT_MS, greetingTimeout: CHECK_TIMEOUT_MS, socketTimeout: CHECK_TIMEOUT_MS } as Parameters<typeof nodemailer.createTransport>[0]);
  const result = withTimeout(t.verify(), 'mail check')
    .then(() => 'ok' as const)
    .catch(() => 'unreachable' as const)
    .finally(() => t.close());
  mailCheck = { at: Date.now(), result };
  return result;
}

/**
 * Liveness with its checks. `status` and `db` keep their meaning (an external monitor reads
 * `status: ok, db: ok`): 200 {status: ok, db: ok} or 503 {status: degraded, db: unreachable}. The mail
 * check is reported beside them and does not make the service degraded — mail waits in the outbox
 * (`outbox.pending`) and goes out when the mail server answers again.
 */
healthRouter.get('/', async (_req, res) => {
  const [db, mail] = await Promise.all([
    withTimeout(sequelize.query('SELECT 1'), 'database check').then(
      () => 'ok' as const,
      () => 'unreachable' as const,
    ),
    checkMail(),
  ]);
  const mailMode = mailCaptureEnabled || !config.SMTP_URL ? 'capture' : 'smtp';
  if (db !== 'ok') {
    res.status(503).json({ status: 'degraded', db: 'unreachable', mail, mailMode });
    return;
  }
  const outbox = await withTimeout(
    Promise.all([MailOutbox.count({ where: { status: 'pending' } }), MailOutbox.count({ where: { status: 'failed' } }), MailOutbox.min('createdAt', { where: { status: 'pending' } })]),
    'outbox check',
  ).then(
    ([pending, failed, oldest]) => ({ pending, failed, oldestPendingSeconds: oldest ? Math.round((Date.now() - new Date(oldest as Date).getTime()) / 1000) : null }),
    () => null,
  );
  res.json({ status: 'ok', db: 'ok', mail, mailMode, outbox });
});
