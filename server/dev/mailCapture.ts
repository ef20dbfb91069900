import { simpleParser } from 'mailparser';
import type { AddressInfo } from 'node:net';
import { SMTPServer } from 'smtp-server';
import { logger } from '../lib/logger';

/**
 * Development and tests only (server/lib/mailer.ts imports this file on demand when no SMTP_URL is set;
 * production never loads it): the project's own SMTP server on loopback. Every message the app sends
 * goes through real SMTP to it and is kept in memory for the admin's dev mailbox.
 */

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

/** Starts the capture server on 127.0.0.1 (port 0 = a free one); resolves to its port. */
export async function startCaptureServer(port: number): Promise<number> {
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
    server.listen(port, '127.0.0.1', () => resolve());
  });
  const bound = (server.server.address() as AddressInfo).port;
  logger.info({ port: bound }, 'development SMTP server listening');
  return bound;
}

/** Messages caught by the development SMTP server, newest first. */
export function capturedMail(): CapturedMail[] {
  return [...captured].reverse();
}

export async function stopCaptureServer(): Promise<void> {
  if (devServer) {
    const s = devServer;
    devServer = null;
    await new Promise<void>((resolve) => s.close(() => resolve()));
  }
}
