import { QueryTypes, type Transaction } from 'sequelize';
import { MailOutbox, sequelize } from '../models/index';
import { config } from '../config/index';
import { sendJob, workQueue } from './jobs';
import { logger } from './logger';
import { sendMail } from './mailer';
import { publicUrl } from './publicUrl';

export interface OutgoingMail {
  to: string;
  subject: string;
  text: string;
  html?: string | null;
  kind: string;
  ref?: string | null;
}

const MAX_ATTEMPTS = 10;

/** Backoff after the n-th failed attempt: 5 s, 10 s, 20 s … capped at one hour (the `mail` queue retries on the same curve). */
export function backoffMs(attempts: number): number {
  return Math.min(60 * 60 * 1000, 5000 * 2 ** Math.max(0, attempts - 1));
}

/** A claim older than this is taken to belong to a worker that died (the `mail` queue's job expiry). */
const claimStaleSeconds = () => config.JOBS_EXPIRE_SECONDS ?? 60;

/**
 * Writes e-mails to the outbox and one `mail` job per message, inside the caller's transaction (so they exist
 * only if it commits); without one, in a transaction of their own. A worker delivers each after commit.
 */
export async function enqueueMail(mails: OutgoingMail[], transaction?: Transaction): Promise<void> {
  if (mails.length === 0) return;
  if (!transaction) return sequelize.transaction((t) => enqueueMail(mails, t));
  const now = new Date();
  const rows = await MailOutbox.bulkCreate(
    mails.map((m) => ({
      toAddress: m.to,
      subject: m.subject,
      text: m.text,
      html: m.html ?? null,
      kind: m.kind,
      ref: m.ref ?? null,
      nextAttemptAt: now,
      lastError: null,
      sentAt: null,
    })),
    { transaction, returning: ['id'] },
  );
  for (const r of rows) await sendJob('mail', String(r.id), { outboxId: Number(r.id) }, { transaction });
}

interface OutboxRow {
  id: string;
  to_address: string;
  subject: string;
  text: string;
  html: string | null;
  attempts: number;
}

/**
 * Delivers one outbox row: claim it (`sending`, committed on its own), send it with no transaction open, then
 * mark it sent. A row already sent, failed or claimed by a live worker is left alone. A claim left by a worker
 * that died is taken over once it is older than the job expiry. The Message-ID is derived from the row, so a
 * message sent twice after such a crash is recognisably the same message (RFC 5322 §3.6.4).
 */
export async function deliverOutboxRow(id: number): Promise<'sent' | 'skipped'> {
  const [row] = await sequelize.query<OutboxRow>(
    `UPDATE mail_outbox SET status = 'sending', claimed_at = now(), attempts = attempts + 1, updated_at = now()
      WHERE id = :id AND (status = 'pending' OR (status = 'sending' AND claimed_at < now() - make_interval(secs => :stale)))
      RETURNING id, to_address, subject, text, html, attempts`,
    { replacements: { id, stale: claimStaleSeconds() }, type: QueryTypes.SELECT },
  );
  if (!row) return 'skipped';
  try {
    const domain = new URL(publicUrl()).hostname || 'lanewright.invalid';
    await sendMail({ to: row.to_address, subject: row.subject, text: row.text, html: row.html, messageId: `<outbox-${row.id}@${domain}>` });
  } catch (err) {
    const message = (err instanceof Error ? err.message : String(err)).slice(0, 500);
    const failed = row.attempts >= MAX_ATTEMPTS;
    await sequelize.query(
      `UPDATE mail_outbox SET status = :status, last_error = :message, next_attempt_at = :next, claimed_at = NULL, updated_at = now() WHERE id = :id`,
      {
        replacements: { id, status: failed ? 'failed' : 'pending', message, next: new Date(Date.now() + backoffMs(row.attempts)) },
      },
    );
    logger.warn(
      { outboxId: row.id, attempts: row.attempts, err: message },
      failed ? 'mail delivery failed for good' : 'mail delivery failed; will retry',
    );
    if (failed) return 'skipped';
    throw err;
  }
  await sequelize.query(
    `UPDATE mail_outbox SET status = 'sent', sent_at = now(), last_error = NULL, claimed_at = NULL, updated_at = now() WHERE id = :id`,
    { replacements: { id } },
  );
  return 'sent';
}

/** Jobs for pending rows that have none (rows written before the queue existed, or whose job was lost): the job id dedupes. */
export async function requeuePendingMail(): Promise<number> {
  const rows = await sequelize.query<{ id: string }>(
    `SELECT id FROM mail_outbox WHERE status IN ('pending', 'sending') AND created_at < now() - interval '1 minute' ORDER BY id LIMIT 1000`,
    { type: QueryTypes.SELECT },
  );
  let n = 0;
  for (const r of rows) if (await sendJob('mail', String(r.id), { outboxId: Number(r.id) })) n += 1;
  return n;
}

let sweep: NodeJS.Timeout | null = null;

/** Works the `mail` queue in this process (4 at a time) and sweeps for orphaned rows every 5 minutes. */
export async function startMailSender(): Promise<void> {
  await workQueue('mail', 4, async (data) => deliverOutboxRow(Number(data.outboxId)));
  const run = () => void requeuePendingMail().catch((err: unknown) => logger.warn({ err }, 'outbox sweep failed'));
  run();
  sweep = setInterval(run, 5 * 60 * 1000);
  sweep.unref();
}

export function stopMailSender(): void {
  if (sweep) clearInterval(sweep);
  sweep = null;
}

/** What the health check reports of the outbox: mails waiting, mails given up on, and the age of the oldest waiting one. */
export async function outboxSummary(): Promise<{ pending: number; failed: number; oldestPendingSeconds: number | null }> {
  const [pending, failed, oldest] = await Promise.all([
    MailOutbox.count({ where: { status: 'pending' } }),
    MailOutbox.count({ where: { status: 'failed' } }),
    MailOutbox.min('createdAt', { where: { status: 'pending' } }),
  ]);
  return { pending, failed, oldestPendingSeconds: oldest ? Math.round((Date.now() - new Date(oldest as Date).getTime()) / 1000) : null };
}
