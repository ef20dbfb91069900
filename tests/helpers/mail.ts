import { capturedMail, type CapturedMail } from '../../server/lib/mailer';

/** Waits for a message to `to` in the development SMTP server's mailbox (milliseconds normally; up to 20 s on a loaded machine). */
export async function waitForMail(to: string, timeoutMs = 20000): Promise<CapturedMail> {
  const deadline = Date.now() + timeoutMs;
  while (Date.now() < deadline) {
    const m = capturedMail().find((x) => x.to.includes(to));
    if (m) return m;
    await new Promise((r) => setTimeout(r, 50));
  }
  throw new Error(`no mail to ${to} within ${timeoutMs} ms`);
}
