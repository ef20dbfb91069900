import fs from 'node:fs';
import path from 'node:path';
import { chromium, type Browser, type BrowserContext, type Page } from 'playwright-core';

/** Debian's Chromium; the test setup installs it with apt when missing. No browser is downloaded. */
export const CHROMIUM_PATH = process.env.CHROMIUM_PATH ?? '/usr/bin/chromium';

export const MOBILE = { width: 375, height: 800 } as const;
export const DESKTOP = { width: 1280, height: 860 } as const;
export type Viewport = { readonly width: number; readonly height: number };

export const ARTIFACTS_DIR = path.resolve(import.meta.dirname, 'artifacts');

/** The demo accounts of the seed (all with the same password). */
export const DEMO_PASSWORD = 'lanewright-demo';
export const DEMO = {
  admin: 'admin@lanewright.example',
  proprietor: 'owner@copperline.example',
  coach: 'coach@copperline.example',
  dana: 'dana@copperline.example',
  lee: 'lee@copperline.example',
} as const;

export async function launchBrowser(): Promise<Browser> {
  if (!fs.existsSync(CHROMIUM_PATH)) {
    throw new Error(`Chromium not found at ${CHROMIUM_PATH}: install Debian's package (apt-get install chromium)`);
  }
  return chromium.launch({
    executablePath: CHROMIUM_PATH,
    args: [
      '--headless',
      '--no-sandbox',
      '--disable-gpu',
      '--disable-quic',
      '--no-first-run',
      '--disable-background-networking',
      '--disable-component-update',
      '--disable-sync',
    ],
  });
}

export interface Session {
  context: BrowserContext;
  page: Page;
  /** Console errors and failed page scripts seen so far (a test may assert there are none). */
  pageErrors: string[];
}

/** A fresh context (no cookies, no localStorage) and one page at the given viewport. */
export async function openSession(browser: Browser, baseURL: string, viewport: Viewport = DESKTOP): Promise<Session> {
  const context = await browser.newContext({ baseURL, viewport, deviceScaleFactor: 1, locale: 'en-US', timezoneId: 'UTC' });
  context.setDefaultTimeout(10000);
  const page = await context.newPage();
  const pageErrors: string[] = [];
  page.on('pageerror', (err) => pageErrors.push(err.message));
  return { context, page, pageErrors };
}

/** Saves a full-page screenshot to tests/e2e/artifacts/<name>.png and returns its path. */
export async function screenshot(page: Page, name: string): Promise<string> {
  fs.mkdirSync(ARTIFACTS_DIR, { recursive: true });
  const file = path.join(ARTIFACTS_DIR, `${name}.png`);
  // Let transitions (drawer, dialog, notifications) settle before the picture.
  await page.waitForTimeout(350);
  await page.screenshot({ path: file, fullPage: true });
  return file;
}

/** Signs in through the sign-in form and waits for Home. */
export async function signIn(page: Page, email: string, password = DEMO_PASSWORD): Promise<void> {
  await page.goto('/sign-in');
  await page.getByLabel('E-mail').fill(email);
  await page.getByLabel('Password').fill(password);
  await page.getByRole('button', { name: 'Sign in', exact: true }).click();
  await page.getByRole('heading', { level: 1, name: /^Welcome,/ }).waitFor();
}

/** True when the page is wider than the viewport (a horizontal scrollbar). */
export async function hasHorizontalScroll(page: Page): Promise<boolean> {
  return page.evaluate(() => document.documentElement.scrollWidth > document.documentElement.clientWidth);
}

let counter = 0;
export function uniqueEmail(tag: string): string {
  counter += 1;
  return `${tag}-${Date.now()}-${counter}@example.test`;
}

/** Signs in through the API and returns the bearer token. */
export async function apiToken(baseUrl: string, email: string, password = DEMO_PASSWORD): Promise<string> {
  const res = await fetch(`${baseUrl}/api/auth/login`, { method: 'POST', headers: { 'Content-Type': 'application/json' }, body: JSON.stringify({ email, password }) });
  if (res.status !== 200) throw new Error(`sign-in of ${email}: ${res.status}`);
  return ((await res.json()) as { token: string }).token;
}

/** The project's own mailbox (`/api/dev/mail`, admin only), read as the demo admin; newest first. */
export async function devMailbox(baseUrl: string): Promise<{ to: string[]; subject: string; text: string }[]> {
  const res = await fetch(`${baseUrl}/api/dev/mail`, { headers: { Authorization: `Bearer ${await apiToken(baseUrl, DEMO.admin)}` } });
  if (res.status !== 200) throw new Error(`dev mailbox: ${res.status}`);
  return ((await res.json()) as { items: { to: string[]; subject: string; text: string }[] }).items;
}

/** Waits for a link to `path` (e.g. '/verify-email') in a mail to `email` and returns the whole link. */
export async function mailedLink(baseUrl: string, email: string, path: string): Promise<string> {
  const re = new RegExp(`https?://\\S+${path.replace(/[/]/g, '\\/')}\\?token=[\\w-]+`);
  for (let attempt = 0; attempt < 50; attempt += 1) {
    const link = (await devMailbox(baseUrl)).filter((m) => m.to.includes(email)).map((m) => re.exec(m.text)?.[0]).find(Boolean);
    if (link) return link;
    await new Promise((r) => setTimeout(r, 100));
  }
  throw new Error(`no ${path} link mailed to ${email}`);
}

/** Confirms a newly registered address the way its owner would: the token of the mailed verification link. */
export async function verifyByMail(baseUrl: string, email: string): Promise<void> {
  const token = new URL(await mailedLink(baseUrl, email, '/verify-email')).searchParams.get('token');
  const res = await fetch(`${baseUrl}/api/auth/verify-email`, { method: 'POST', headers: { 'Content-Type': 'application/json' }, body: JSON.stringify({ token }) });
  if (res.status !== 200) throw new Error(`verifying ${email}: ${res.status}`);
}
