import { capturedMail, type CapturedMail } from '../../server/dev/mailCapture';

/** Waits for a message to `to` (and with a subject matching `subject`) in the development SMTP server's mailbox (milliseconds normally; up to 20 s on a loaded machine). */
export async function waitForMail(to: string, timeoutMs = 20000, subject?: RegExp): Promise<CapturedMail> {
  const deadline = Date.now() + timeoutMs;
  while (Date.now() < deadline) {
    const m = capturedMail().find((x) => x.to.includes(to) && (!subject || subject.test(x.subject)));
    if (m) return m;
    await new Promise((r) => setTimeout(r, 50));
  }
  throw new Error(`no mail to ${to} within ${timeoutMs} ms`);
}

/** The token of the newest link to `path` (e.g. '/verify-email') mailed to `to`. */
export async function mailedToken(to: string, path: string, subject: RegExp, timeoutMs = 5000): Promise<string> {
  const m = await waitForMail(to, timeoutMs, subject);
  const token = new RegExp(`${path.replace(/[/]/g, '\\/')}\\?token=([\\w-]+)`).exec(m.text)?.[1];
  if (!token) throw new Error(`no ${path} link in the mail to ${to}: ${m.text}`);
  return token;
}
