import { Op, type Transaction } from 'sequelize';
import { MailOutbox, sequelize } from '../models/index';
import { logger } from './logger';
import { sendMail } from './mailer';

export interface OutgoingMail {
  to: string;
  subject: string;
  text: string;
  html?: string | null;
  kind: string;
  ref?: string | null;
}

const MAX_ATTEMPTS = 10;
const BATCH = 50;

/** Backoff after the n-th failed attempt: 5 s, 10 s, 20 s … capped at one hour. */
export function backoffMs(attempts: number): number {
  return Math.min(60 * 60 * 1000, 5000 * 2 ** Math.max(0, attempts - 1));
}

/** Writes e-mails to the outbox inside the caller's transaction; the sender delivers them after commit. */
export async function enqueueMail(mails: OutgoingMail[], transaction?: Transaction): Promise<void> {
  if (mails.length === 0) return;
  const now = new Date();
  await MailOutbox.bulkCreate(
    mails.map((m) => ({ toAddress: m.to, subject: m.subject, text: m.text, html: m.html ?? null, kind: m.kind, ref: m.ref ?? null, nextAttemptAt: now, lastError: null, sentAt: null })),
    { transaction },
  );
  if (transaction) transaction.afterCommit(() => void kickMailSender());
  else kickMailSender();
}

let running: Promise<number> | null = null;
let again = false;

/** Sends every due message once (rows locked with SKIP LOCKED so several processes can share the outbox). Returns how many were sent. */
export async function deliverDue(): Promise<number> {
  let sent = 0;
  const due = await sequelize.transaction(async (transaction) => {
    const rows = await MailOutbox.findAll({
      where: { status: 'pending', nextAttemptAt: { [Op.lte]: new Date() } },
      order: [['id', 'ASC']],
      limit: BATCH,
      lock: transaction.LOCK.UPDATE,
      skipLocked: true,
      transaction,
    });
    for (const row of rows) {
      try {
        await sendMail({ to: row.toAddress, subject: row.subject, text: row.text, html: row.html });
        row.set({ status: 'sent', sentAt: new Date(), attempts: row.attempts + 1, lastError: null });
        sent += 1;
      } catch (err) {
        const attempts = row.attempts + 1;
        const message = err instanceof Error ? err.message : String(err);
        row.set({ attempts, lastError: message.slice(0, 500), status: attempts >= MAX_ATTEMPTS ? 'failed' : 'pending', nextAttemptAt: new Date(Date.now() + backoffMs(attempts)) });
        logger.warn({ outboxId: row.id, attempts, err: message }, 'mail delivery failed; will retry');
      }
      await row.save({ transaction });
    }
    return rows.length;
  });
  if (due === BATCH) again = true;
  return sent;
}

/** Starts a delivery run now (coalesced with one already running). */
export function kickMailSender(): Promise<number> {
  if (running) {
    again = true;
    return running;
  }
  running = deliverDue()
    .catch((err: unknown) => {
      logger.error({ err }, 'mail sender run failed');
      return 0;
    })
    .finally(() => {
      running = null;
      if (again) {
        again = false;
        void kickMailSender();
      }
    });
  return running;
}

let timer: NodeJS.Timeout | null = null;

/** Retries due messages every few seconds (started by the server process). */
export function startMailSender(intervalMs = 5000): void {
  if (timer) return;
  timer = setInterval(() => void kickMailSender(), intervalMs);
  timer.unref();
}

export async function stopMailSender(): Promise<void> {
  if (timer) clearInterval(timer);
  timer = null;
  if (running) await running;
}
