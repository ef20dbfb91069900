import { simpleParser } from 'mailparser';
import nodemailer, { type Transporter } from 'nodemailer';
import { SMTPServer } from 'smtp-server';
import type { AddressInfo } from 'node:net';
import { config } from '../config/index';
import { logger } from './logger';

/** A message caught by the development SMTP server. */
export interface CapturedMail {
  id: number;
  from: string;
  to: string[];
  subject: string;
  text: string;
  html: string | null;
  date: string;
}

const captured: CapturedMail[] = [];
const MAX_CAPTURED = 500;
let nextId = 1;
let devServer: SMTPServer | null = null;
let transporter: Transporter | null = null;

/**
 * Starts the project's own SMTP server on loopback (development and tests only): every message the
 * app sends goes through real SMTP to it and is kept in memory for the dev mailbox.
 */
async function startDevSmtp(): Promise<number> {
  devServer = new SMTPServer({
    authOptional: true,
    disabledCommands: ['STARTTLS'],
    logger: false,
    onData(stream, session, callback) {
      simpleParser(stream)
        .then((mail) => {
          const to = session.envelope.rcptTo.map((r) => r.address);
          captured.push({
            id: nextId++,
            from: session.envelope.mailFrom ? session.envelope.mailFrom.address : '',
            to,
            subject: mail.subject ?? '',
            text: mail.text ?? '',
            html: typeof mail.html === 'string' ? mail.html : null,
            date: new Date().toISOString(),
          });
          if (captured.length > MAX_CAPTURED) captured.shift();
          callback();
        })
        .catch((err: Error) => callback(err));
    },
  });
  const server = devServer;
  await new Promise<void>((resolve, reject) => {
    server.once('error', reject);
    server.listen(config.DEV_SMTP_PORT, '127.0.0.1', () => resolve());
  });
  const { port } = server.server.address() as AddressInfo;
  logger.info({ port }, 'development SMTP server listening');
  return port;
}

async function getTransport(): Promise<Transporter> {
  if (transporter) return transporter;
  if (config.SMTP_URL) {
    transporter = nodemailer.createTransport(config.SMTP_URL);
  } else {
    const port = await startDevSmtp();
    transporter = nodemailer.createTransport({ host: '127.0.0.1', port, secure: false, ignoreTLS: true });
  }
  return transporter;
}

/** Sends one e-mail through SMTP now (callers normally go through the outbox: enqueueMail). */
export async function sendMail(msg: { to: string; subject: string; text: string; html?: string | null; headers?: Record<string, string> }): Promise<void> {
  const t = await getTransport();
  await t.sendMail({ from: config.MAIL_FROM, to: msg.to, subject: msg.subject, text: msg.text, ...(msg.html ? { html: msg.html } : {}), ...(msg.headers ? { headers: msg.headers } : {}) });
}

/** Messages caught by the development SMTP server, newest first. */
export function capturedMail(): CapturedMail[] {
  return [...captured].reverse();
}

export const mailCaptureEnabled = !config.SMTP_URL && config.NODE_ENV !== 'production';

export async function closeMailer(): Promise<void> {
  transporter?.close();
  transporter = null;
  if (devServer) {
    const s = devServer;
    devServer = null;
    await new Promise<void>((resolve) => s.close(() => resolve()));
  }
}
