import AxeBuilder from '@axe-core/playwright';
import type { Page } from 'playwright-core';
import { describe, expect, it } from 'vitest';
import { DEMO, DESKTOP, MOBILE, chooseOption, eventually, signIn, useBrowser, type Viewport } from './browser';

/**
 * WCAG 2.1 A/AA (axe-core's wcag2a, wcag2aa, wcag21a and wcag21aa rules) on every screen of the router, for every role,
 * at 1280 and 375 px, with the main dialogs and drawers opened. The routes are read from the app's own router in the
 * page, so a new screen is checked without touching this file; a route with a parameter is visited through a link
 * the other screens show (skipped, and said so, when none does).
 *
 * Kept fast: one context per role, signed in once, client-side navigation, one page load per screen checked at both
 * widths by resizing the viewport, and waits for what the page shows (its requests answered, no loading mask).
 */
const { open } = useBrowser(DESKTOP);

const WCAG_TAGS = ['wcag2a', 'wcag2aa', 'wcag21a', 'wcag21aa'];
const WIDTHS: readonly Viewport[] = [DESKTOP, MOBILE];

interface AppRoute {
  name: string;
  path: string;
  roles: string[] | null;
  public: boolean;
  guestOnly: boolean;
}

/** Every named route of the app, read from its router (the app only through its URL: the router the page runs). */
async function appRoutes(page: Page): Promise<AppRoute[]> {
  return page.evaluate(() => {
    interface RouterLike {
      getRoutes(): { name?: unknown; path: string; meta: Record<string, unknown> }[];
    }
    const app = (document.querySelector('#app') as unknown as { __vue_app__: { config: { globalProperties: { $router: RouterLike } } } })
      .__vue_app__;
    return app.config.globalProperties.$router
      .getRoutes()
      .filter((r) => typeof r.name === 'string')
      .map((r) => ({
        name: r.name as string,
        path: r.path,
        roles: (r.meta.roles as string[] | undefined) ?? null,
        public: r.meta.public === true,
        guestOnly: r.meta.guestOnly === true,
      }));
  });
}

/** Client-side navigation through the app's router (no reload), as a link would. */
async function navigate(page: Page, path: string): Promise<void> {
  await page.evaluate(async (to) => {
    const app = (
      document.querySelector('#app') as unknown as {
        __vue_app__: { config: { globalProperties: { $router: { push(p: string): Promise<unknown> } } } };
      }
    ).__vue_app__;
    await app.config.globalProperties.$router.push(to);
  }, path);
}

/** Counts the page's API requests in flight, so a check waits until every answer has arrived. */
function trackRequests(page: Page): () => number {
  const pending = new Set<unknown>();
  page.on('request', (r) => {
    if (r.url().includes('/api/')) pending.add(r);
  });
  const done = (r: unknown) => pending.delete(r);
  page.on('requestfinished', done);
  page.on('requestfailed', done);
  return () => pending.size;
}

/** Waits until the page's data has arrived and it shows no loading state (mask, skeleton, busy region). */
async function settle(page: Page, inFlight: () => number): Promise<void> {
  await page.locator('h1').first().waitFor();
  await eventually(async () => inFlight()).toBe(0);
  await page.waitForFunction(() => {
    const busy = document.querySelectorAll('.el-loading-mask, .el-skeleton, [aria-busy="true"]');
    return [...busy].every((el) => !(el as HTMLElement).offsetParent && getComputedStyle(el).position !== 'fixed');
  });
  await eventually(async () => inFlight()).toBe(0);
  // opening and closing transitions (dialogs, drawers, menus) finished: colours are checked as they end up
  await page.waitForFunction(() =>
    document.getAnimations().every((a) => a.playState !== 'running' || a.effect?.getComputedTiming().iterations === Infinity),
  );
  // one frame for the last answer's render and the layout it causes
  await page.evaluate(() => new Promise((resolve) => requestAnimationFrame(() => requestAnimationFrame(resolve))));
}

/** axe's WCAG 2.1 A/AA violations of the page as it is now, one line per failing node. */
async function violations(page: Page): Promise<string[]> {
  // label-content-name-mismatch (WCAG 2.5.3, level A) is one of axe's experimental rules, off unless named.
  const result = await new AxeBuilder({ page })
    .options({ runOnly: { type: 'tag', values: WCAG_TAGS }, rules: { 'label-content-name-mismatch': { enabled: true } } })
    .analyze();
  return result.violations.flatMap((v) =>
    v.nodes.map((n) => `${v.id} (${v.impact}): ${n.target.join(' ')} — ${n.failureSummary?.split('\n')[1]?.trim() ?? ''}`),
  );
}

/**
 * Tables wider than their box at this width that show no visible cue that they scroll sideways (the shared
 * `data-scroll-cue` of v-scroll-region, or a visible hint that speaks of scrolling next to the table).
 */
async function tablesWithoutScrollCue(page: Page): Promise<string[]> {
  return page.evaluate(() => {
    const missing: string[] = [];
    for (const table of Array.from(document.querySelectorAll('table'))) {
      if (!table.checkVisibility()) continue; // not shown (a closed details, another tab)
      let box = table.parentElement;
      while (box && box !== document.body && !['auto', 'scroll', 'hidden'].includes(getComputedStyle(box).overflowX))
        box = box.parentElement;
      if (!box || box === document.body || box.scrollWidth - box.clientWidth <= 1) continue;
      const host = box.closest('[data-scroll-cue]');
      const cue = host ? getComputedStyle(host, '::after').content : 'none';
      const hint = Array.from(box.parentElement?.children ?? []).some(
        (el) => el !== box && (el as HTMLElement).offsetParent && /scroll/i.test(el.textContent ?? ''),
      );
      if (cue === 'none' && !hint) {
        const named = table.closest('[aria-label]')?.getAttribute('aria-label') ?? table.querySelector('caption')?.textContent?.trim();
        missing.push(named || box.className || 'a table');
      }
    }
    return missing;
  });
}

/** Turns a router path into a pattern for the links that lead to it (`/arsenal/:id(\\d+)` → /^\/arsenal\/(\d+)$/). */
function pathPattern(path: string): RegExp {
  const source = path
    .split('/')
    .map((part) => (part.startsWith(':') ? (/\((.*)\)/.exec(part)?.[1] ?? '[^/]+') : part.replace(/[.*+?^${}()|[\]\\]/g, '\\$&')))
    .join('/');
  return new RegExp(`^${source}$`);
}

/**
 * Dialogs, drawers and menus checked open, by the screen that opens them: the button (the first match, when it is
 * shown at that width) and what opens. Escape closes each again (no keyboard trap).
 */
const OPENERS: Record<string, { button: string | RegExp; opens: 'dialog' | 'menu' }[]> = {
  home: [
    { button: 'Open navigation', opens: 'dialog' },
    { button: /^Account menu for/, opens: 'menu' },
  ],
  sessions: [{ button: 'New session', opens: 'dialog' }],
  arsenal: [
    { button: 'Add by specs', opens: 'dialog' },
    { button: 'Import CSV', opens: 'dialog' },
  ],
  'admin-users': [{ button: /^Change role of/, opens: 'dialog' }],
};

interface ScanReport {
  checked: string[];
  skipped: string[];
  failures: string[];
}

/**
 * Visits every route the account may open (the routes it may not open are the Not allowed page, checked once), each at
 * both widths, collecting the links it shows so the routes with a parameter can be visited through one.
 */
async function scanRoutes(page: Page, who: string, role: string | null, inFlight: () => number): Promise<ScanReport> {
  const report: ScanReport = { checked: [], skipped: [], failures: [] };
  const routes = await appRoutes(page);
  const seen = new Set<string>();
  const plain = routes.filter((r) => !r.path.includes(':'));
  const withParams = routes.filter((r) => r.path.includes(':'));

  async function check(label: string, path: string): Promise<void> {
    await page.setViewportSize(DESKTOP);
    await navigate(page, path);
    await settle(page, inFlight);
    for (const vp of WIDTHS) {
      await page.setViewportSize(vp);
      await settle(page, inFlight);
      for (const href of await page.locator('a[href^="/"]').evaluateAll((as) => as.map((a) => a.getAttribute('href') ?? '')))
        seen.add(href.split(/[?#]/)[0]!);
      for (const line of await violations(page)) report.failures.push(`${who} ${label} @${vp.width}px: ${line}`);
      for (const table of await tablesWithoutScrollCue(page))
        report.failures.push(`${who} ${label} @${vp.width}px: "${table}" scrolls sideways with no visible cue`);
      report.checked.push(`${label}@${vp.width}`);
      // every other tab of the screen's tab bars, checked at this width too
      const tabNames = await page.getByRole('tab', { selected: false }).allTextContents();
      for (const name of tabNames.map((t) => t.trim())) {
        await page.getByRole('tab', { name, exact: true }).click();
        await settle(page, inFlight);
        for (const line of await violations(page)) report.failures.push(`${who} ${label} [${name}] @${vp.width}px: ${line}`);
        report.checked.push(`${label}[${name}]@${vp.width}`);
      }
      if (tabNames.length) await navigate(page, path); // back to the screen's first tab
      for (const opener of OPENERS[label] ?? []) {
        const button = page.getByRole('button', { name: opener.button }).first();
        if (!(await button.isVisible())) continue;
        await button.click();
        const opened = page.getByRole(opener.opens).last();
        await opened.waitFor();
        await settle(page, inFlight);
        for (const line of await violations(page))
          report.failures.push(`${who} ${label} [${String(opener.button)} open] @${vp.width}px: ${line}`);
        report.checked.push(`${label}[${String(opener.button)}]@${vp.width}`);
        await page.keyboard.press('Escape');
        await opened.waitFor({ state: 'hidden' });
      }
      await settle(page, inFlight);
    }
  }

  for (const r of plain) {
    if (role === null ? !r.public : r.guestOnly) continue; // a guest-only page sends a signed-in user Home (checked as guest)
    if (role !== null && r.roles && !r.roles.includes(role)) continue; // answered by the Not allowed page (checked itself)
    await check(r.name, r.path);
  }
  for (const r of withParams) {
    if (role === null && !r.public) continue;
    if (role !== null && r.roles && !r.roles.includes(role)) continue;
    if (r.path.includes('pathMatch')) {
      await check(r.name, '/no-such-page-here');
      continue;
    }
    const re = pathPattern(r.path);
    const href = [...seen].find((h) => re.test(h));
    if (!href) {
      report.skipped.push(`${r.name} (no link to it on the screens this account sees)`);
      continue;
    }
    await check(r.name, href);
  }
  return report;
}

/**
 * The demo has no equipment trial: the bowler opens one first (two balls of the arsenal), so the trial screen is
 * reached through its link like every other screen.
 */
async function openTrial(page: Page): Promise<void> {
  await page.goto('/decide');
  await page.getByRole('button', { name: 'New trial' }).click();
  const dialog = page.getByRole('dialog', { name: 'New trial' });
  await dialog.getByLabel('Name').fill('Which of two');
  await chooseOption(page, page.getByRole('combobox', { name: 'Ball 1' }), /./, { first: true });
  // the second arm takes another ball: the second option of its list
  const ball2 = page.getByRole('combobox', { name: 'Ball 2' });
  await ball2.focus();
  await page.keyboard.press('Enter');
  const list = page.locator(`[id="${await ball2.getAttribute('aria-controls')}"]`);
  await list.getByRole('option').nth(1).click();
  await dialog.getByRole('button', { name: 'Open the trial' }).click();
  await page.waitForURL(/\/decide\/trials\/\d+$/);
}

const ROLES: { who: string; email: string; role: string; prepare?: (page: Page) => Promise<void> }[] = [
  { who: 'admin', email: DEMO.admin, role: 'admin' },
  { who: 'proprietor', email: DEMO.proprietor, role: 'proprietor' },
  { who: 'coach', email: DEMO.coach, role: 'coach' },
  { who: 'bowler', email: DEMO.dana, role: 'bowler', prepare: openTrial },
];

describe('accessibility: WCAG 2.1 A/AA with axe-core on every screen, every role, 1280 and 375 px', () => {
  it('guest: the public screens', async () => {
    const { page } = await open(DESKTOP);
    const inFlight = trackRequests(page);
    await page.goto('/sign-in');
    await settle(page, inFlight);
    const report = await scanRoutes(page, 'guest', null, inFlight);
    console.log(`guest: ${report.checked.length} page views checked; skipped: ${report.skipped.join('; ') || 'none'}`);
    expect(report.failures.join('\n')).toBe('');
    expect(report.checked.length).toBeGreaterThanOrEqual(8);
  });

  for (const account of ROLES) {
    it(`${account.who}: every screen the role may open`, async () => {
      const { page } = await open(DESKTOP);
      const inFlight = trackRequests(page);
      await signIn(page, account.email);
      await account.prepare?.(page);
      const report = await scanRoutes(page, account.who, account.role, inFlight);
      console.log(`${account.who}: ${report.checked.length} page views checked; skipped: ${report.skipped.join('; ') || 'none'}`);
      expect(report.failures.join('\n')).toBe('');
      expect(report.checked.length).toBeGreaterThanOrEqual(30);
    });
  }
});
