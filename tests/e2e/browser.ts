import fs from 'node:fs';
import path from 'node:path';
import { chromium, type Browser, type BrowserContext, type Page } from 'playwright-core';

/**
 * The address of this test file's own server (started on its own copy of the seeded demo database by
 * tests/helpers/e2eServer.ts before the file runs).
 */
export function appUrl(): string {
  const url = process.env.LW_E2E_BASE_URL;
  if (!url) throw new Error('no server for this browser test file: run it in the Vitest project "e2e" (tests/helpers/e2eServer.ts starts one)');
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
