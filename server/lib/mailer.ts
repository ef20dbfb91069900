import nodemailer, { type Transporter } from 'nodemailer';
import { config } from '../config/index';

let transporter: Transporter | null = null;
let captureStarted = false;

/** Whether mail goes to the project's own capture server (development and tests without SMTP_URL; never production). */
export const mailCaptureEnabled = !config.SMTP_URL && config.NODE_ENV !== 'production';

async function getTransport(): Promise<Transporter> {
  if (transporter) return transporter;
  if (config.SMTP_URL) {
    transporter = nodemailer.createTransport(config.SMTP_URL);
  } else if (mailCaptureEnabled) {
    // Imported on demand: production never loads the capture server's code.
    const { startCaptureServer } = await import('../dev/mailCapture');
    const port = await startCaptureServer(config.DEV_SMTP_PORT);
    captureStarted = true;
    transporter = nodemailer.createTransport({ host: '127.0.0.1', port, secure: false, ignoreTLS: true });
  } else {
    throw new Error('no SMTP server is configured (SMTP_URL)');
  }
  return transporter;
}

/** Sends one e-mail through SMTP now (callers normally go through the outbox: enqueueMail). */
export async function sendMail(msg: {
  to: string;
  subject: string;
  text: string;
  html?: string | null;
  headers?: Record<string, string>;
  messageId?: string;
}): Promise<void> {
  const t = await getTransport();
  await t.sendMail({
    from: config.MAIL_FROM,
    to: msg.to,
    subject: msg.subject,
    text: msg.text,
    ...(msg.html ? { html: msg.html } : {}),
    ...(msg.headers ? { headers: msg.headers } : {}),
    ...(msg.messageId ? { messageId: msg.messageId } : {}),
  });
}

export async function closeMailer(): Promise<void> {
  transporter?.close();
  transporter = null;
  if (captureStarted) {
    captureStarted = false;
    const { stopCaptureServer } = await import('../dev/mailCapture');
    await stopCaptureServer();
  }
}
