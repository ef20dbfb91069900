import fs from 'node:fs';
import path from 'node:path';
import { chromium, type Browser, type BrowserContext, type Locator, type Page } from 'playwright-core';
import { afterAll, afterEach, beforeAll, expect } from 'vitest';

/**
 * The address of this test file's own server (started on its own copy of the seeded demo database by
 * tests/helpers/e2eServer.ts before the file runs).
 */
export function appUrl(): string {
  const url = process.env.LW_E2E_BASE_URL;
  if (!url)
    throw new Error('no server for this browser test file: run it in the Vitest project "e2e" (tests/helpers/e2eServer.ts starts one)');
  return url;
}

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

/** How long a wait for something on the page may take at most (locators, navigation, `eventually`). */
export const WAIT_MS = 30000;

/**
 * Reads a value until it passes the assertion that follows (`await eventually(() => rows.count()).toBe(3)`), for
 * state the page reaches after an answer or a re-render: the same as waiting for a text, for counts and values.
 */
export function eventually<T>(read: () => Promise<T>, timeout = WAIT_MS) {
  return expect.poll(read, { timeout, interval: 100 });
}

/**
 * Picks `option` in an Element Plus select. The select keeps its combobox input visually hidden, so it is opened by
 * keyboard — once it is enabled: a select waiting for what it depends on (the order dialog's services wait for
 * the centers) is disabled, and Enter on it opens nothing. Options still loading appear in the open list.
 */
export async function chooseOption(
  page: Page,
  combobox: Locator,
  option: string | RegExp,
  opts: { exact?: boolean; first?: boolean } = {},
): Promise<void> {
  await eventually(() => combobox.getAttribute('aria-disabled')).not.toBe('true');
  await combobox.focus();
  await page.keyboard.press('Enter');
  const item = page.getByRole('option', { name: option, exact: opts.exact ?? typeof option === 'string' });
  await (opts.first ? item.first() : item).click();
}

export interface OpenOptions {
  /**
   * Let the app register its service worker (the installable, offline app: tests/e2e/offline.e2e.ts). Blocked
   * otherwise, so the other files see every request of the page and no context spends time precaching the app.
   */
  serviceWorkers?: boolean;
}

/** A fresh context (no cookies, no localStorage) and one page at the given viewport. */
export async function openSession(
  browser: Browser,
  baseURL: string,
  viewport: Viewport = DESKTOP,
  options: OpenOptions = {},
): Promise<Session> {
  const context = await browser.newContext({
    baseURL,
    viewport,
    deviceScaleFactor: 1,
    locale: 'en-US',
    timezoneId: 'UTC',
    serviceWorkers: options.serviceWorkers ? 'allow' : 'block',
  });
  // Upper bounds for waiting on what the page shows: a healthy run sees it in milliseconds, a loaded 2-core machine
  // (another test run, `npm start` beside it) may take many seconds. Nothing waits for a fixed time.
  context.setDefaultTimeout(WAIT_MS);
  context.setDefaultNavigationTimeout(2 * WAIT_MS);
  const page = await context.newPage();
  const pageErrors: string[] = [];
  page.on('pageerror', (err) => pageErrors.push(err.message));
  return { context, page, pageErrors };
}

/** What a browser test file works with: its server's address and fresh sessions (context + page) in one Chromium. */
export interface BrowserFixture {
  /** This file's own server (tests/helpers/e2eServer.ts). */
  baseUrl: string;
  /** A fresh context (no cookies, no localStorage) and page; closed after the test, its page errors checked. */
  open: (viewport?: Viewport, options?: OpenOptions) => Promise<Session>;
}

/**
 * The browser setup every e2e file shares: registers the file's hooks — Debian's Chromium launched once before the
 * file (playwright-core, no downloaded browser), every session opened in a test closed after it with the test
 * failing on any uncaught page error, the browser closed after the file. Call it once at the top of the file:
 * `const { baseUrl, open } = useBrowser(MOBILE);`
 */
export function useBrowser(defaultViewport: Viewport = DESKTOP): BrowserFixture {
  const baseUrl = appUrl();
  let browser: Browser | null = null;
  const sessions: Session[] = [];

  beforeAll(async () => {
    browser = await launchBrowser();
  });
  afterEach(async () => {
    const errors = sessions.flatMap((s) => s.pageErrors);
    for (const s of sessions.splice(0)) await s.context.close();
    expect(errors, 'uncaught errors in the page').toEqual([]);
  });
  afterAll(async () => {
    await browser?.close();
  });

  async function open(viewport: Viewport = defaultViewport, options: OpenOptions = {}): Promise<Session> {
    if (!browser) throw new Error('useBrowser(): open a session inside a test (the browser starts in beforeAll)');
    const s = await openSession(browser, baseUrl, viewport, options);
    sessions.push(s);
    return s;
  }
  return { baseUrl, open };
}

/** Saves a full-page screenshot to tests/e2e/artifacts/<name>.png and returns its path. */
export async function screenshot(page: Page, name: string): Promise<string> {
  fs.mkdirSync(ARTIFACTS_DIR, { recursive: true });
  const file = path.join(ARTIFACTS_DIR, `${name}.png`);
  // Transitions (drawer, dialog, notifications) are finished for the picture rather than waited out: Playwright
  // runs finite CSS animations and transitions to their end; the web fonts are loaded first.
  await page.evaluate(() => document.fonts.ready.then(() => undefined));
  await page.screenshot({ path: file, fullPage: true, animations: 'disabled' });
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

/** Starts a session from the Sessions screen with the New session dialog's defaults (today, practice) and returns its id. */
export async function startSession(page: Page): Promise<number> {
  await page.goto('/sessions');
  await page.getByRole('button', { name: 'New session' }).click();
  await page.getByRole('dialog', { name: 'New session' }).getByRole('button', { name: 'Start session' }).click();
  await page.waitForURL(/\/sessions\/\d+$/);
  return Number(/\/sessions\/(\d+)$/.exec(page.url())![1]);
}

/** True when the page is wider than the viewport (a horizontal scrollbar). */
export async function hasHorizontalScroll(page: Page): Promise<boolean> {
  return page.evaluate(() => document.documentElement.scrollWidth > document.documentElement.clientWidth);
}

let counter = 0;
export function uniqueEmail(tag: string): string {
  counter += 1;
  return `${tag}-${process.pid}-${Date.now()}-${counter}@example.test`;
}

/** Signs in through the API and returns the bearer token. */
export async function apiToken(baseUrl: string, email: string, password = DEMO_PASSWORD): Promise<string> {
  const res = await fetch(`${baseUrl}/api/auth/login`, {
    method: 'POST',
    headers: { 'Content-Type': 'application/json' },
    body: JSON.stringify({ email, password }),
  });
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
  const find = async () =>
    (await devMailbox(baseUrl))
      .filter((m) => m.to.includes(email))
      .map((m) => re.exec(m.text)?.[0])
      .find(Boolean);
  // the outbox sends within milliseconds normally, many seconds on a loaded machine: poll, never sleep a fixed time
  await eventually(find).toBeTruthy();
  return (await find())!;
}

/** Confirms a newly registered address the way its owner would: the token of the mailed verification link. */
export async function verifyByMail(baseUrl: string, email: string): Promise<void> {
  const token = new URL(await mailedLink(baseUrl, email, '/verify-email')).searchParams.get('token');
  const res = await fetch(`${baseUrl}/api/auth/verify-email`, {
    method: 'POST',
    headers: { 'Content-Type': 'application/json' },
    body: JSON.stringify({ token }),
  });
  if (res.status !== 200) throw new Error(`verifying ${email}: ${res.status}`);
}
