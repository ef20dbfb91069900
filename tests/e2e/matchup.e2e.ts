import { describe, expect, it } from 'vitest';
import type { Page } from 'playwright-core';
import { chooseOption, DEMO, DESKTOP, MOBILE, eventually, hasHorizontalScroll, screenshot, signIn, useBrowser } from './browser';

const { baseUrl, open } = useBrowser(DESKTOP);

/** Picks an option of an Element Plus select (see chooseOption: it waits for the select to be enabled); a pattern picks the first match. */
async function choose(page: Page, combobox: string, option: string | RegExp): Promise<void> {
  await chooseOption(page, page.getByRole('combobox', { name: combobox }), option, { first: typeof option !== 'string' });
}

async function rankOnLongHaul(page: Page): Promise<void> {
  await page.getByRole('heading', { level: 1, name: 'Matchup' }).waitFor();
  await choose(page, 'Condition', 'Long Haul 47');
  await page.getByText(/long, heavy/).waitFor();
  await page.getByRole('button', { name: 'Rank my arsenal' }).click();
  try {
    await page.getByRole('heading', { level: 2, name: 'Ranking for Long Haul 47, after 0 games' }).waitFor({ timeout: 60000 });
  } catch (e) {
    await screenshot(page, 'debug-matchup');
    throw e;
  }
}

/** Ball names of the ranking table, best first. */
async function rankingOrder(page: Page): Promise<string[]> {
  const names = await page.getByRole('table', { name: 'Ranking' }).locator('tbody .matchup-ranking-table__name').allTextContents();
  return names.map((n) => n.trim());
}

describe('matchup: the condition picker', () => {
  it('lists today’s condition at the centers the bowler follows as well as every pattern', async () => {
    const { page } = await open();
    await signIn(page, DEMO.dana);
    await page.goto(`${baseUrl}/matchup`);
    await page.getByRole('heading', { level: 1, name: 'Matchup' }).waitFor();
    await page.getByRole('combobox', { name: 'Condition' }).focus();
    await page.keyboard.press('Enter');
    await page.getByRole('option', { name: /^Copperline Bowl today — Copperline House 40, lanes / }).waitFor();
    await page.getByRole('option', { name: 'Long Haul 47', exact: true }).waitFor();
    await screenshot(page, 'matchup-condition-picker-desktop');
  });
});

describe('matchup: the demo bowler from catalogue to what-if', () => {
  it('adds a ball from the catalogue, ranks the arsenal on the long heavy pattern, sees the lane view, and a what-if surface change reorders the ranking', async () => {
    const { page } = await open();
    await signIn(page, DEMO.dana);

    // Catalogue → add a ball to the arsenal.
    await page.getByRole('navigation', { name: 'Main' }).getByRole('link', { name: 'Catalogue' }).click();
    await page.getByRole('heading', { level: 1, name: 'Catalogue' }).waitFor();
    await page.getByLabel('Search by maker or name').fill('Polar Grip');
    await page.getByRole('status').filter({ hasText: '1 ball found.' }).waitFor();
    await screenshot(page, 'catalogue-desktop');
    await page.getByRole('button', { name: 'Add Polar Grip to arsenal' }).click();
    const dialog = page.getByRole('dialog', { name: 'Add Polar Grip to your arsenal' });
    await dialog.waitFor();
    await dialog.getByText('Within USBC ball limits').waitFor();
    await dialog.getByLabel('Nickname (optional)').fill('Fresh Grip');
    await dialog.getByLabel('Pin-to-PAP (in)').fill('4.5');
    await dialog.getByLabel('Drilling angle (°)').fill('45');
    await screenshot(page, 'catalogue-add-dialog-desktop');
    await dialog.getByRole('button', { name: 'Add to arsenal' }).click();
    await page.getByText('Fresh Grip was added to your arsenal.').waitFor();

    // Matchup on the long heavy pattern.
    await page.getByRole('navigation', { name: 'Main' }).getByRole('link', { name: 'Matchup' }).click();
    await rankOnLongHaul(page);
    const order = await rankingOrder(page);
    expect(order.length).toBeGreaterThanOrEqual(8);
    expect(order).toContain('Fresh Grip (Polar Grip)');
    expect(order[order.length - 1]).toBe('Spare (Clear Sky Spare)');

    // The lane view: an image with a text alternative, paths for the top balls, a table of the same numbers.
    const lane = page.getByRole('img', { name: /^Lane view of Long Haul 47 from above/ });
    await lane.waitFor();
    await eventually(() => page.locator('svg path[data-ball]').count()).toBe(3);
    await page.getByText('The lane view as a table').click();
    await eventually(() => page.getByRole('row').filter({ hasText: order[0] }).count()).toBeGreaterThanOrEqual(2);

    // Toggle one more ball onto the lane from the table.
    await page.getByRole('checkbox', { name: `Show ${order[3]} on the lane` }).check();
    expect(await page.getByRole('checkbox', { name: `Show ${order[0]} on the lane` }).isChecked()).toBe(true);
    await page.waitForFunction(() => document.querySelectorAll('svg path[data-ball]').length === 4);

    // Reasons with their sources.
    await page.getByRole('button', { name: `Why: ${order[0]}` }).click();
    await page
      .getByText(/^Source: /)
      .first()
      .waitFor();
    await screenshot(page, 'matchup-desktop');

    // A suggestion can be tried in the what-if straight from the reasons.
    await page
      .getByRole('button', { name: /^Try in the what-if: / })
      .first()
      .click();
    await page
      .getByRole('status')
      .filter({ hasText: /^The order (changes|stays the same)/ })
      .waitFor();

    // What-if: Backend sanded to 500 grit moves up the order, worked out in the browser.
    await choose(page, 'What-if ball', 'Backend (Skylark Arc)');
    await page.getByText('Change the surface or the layout of a ball').waitFor();
    await choose(page, 'What-if grit', '500 grit');
    const verdict = page
      .getByRole('status')
      .filter({ hasText: /^The order changes: Backend \(Skylark Arc\) moves from \d+(st|nd|rd|th) to \d+(st|nd|rd|th)/ });
    await verdict.waitFor();
    const text = (await verdict.textContent()) ?? '';
    const [, from, to] = /moves from (\d+)\D+ to (\d+)/.exec(text) ?? [];
    expect(Number(to)).toBeLessThan(Number(from));
    const newOrder = (await page.getByRole('list', { name: 'Order with the change' }).getByRole('listitem').allTextContents()).map((s) =>
      s.trim(),
    );
    expect(newOrder).not.toEqual(order);
    expect(newOrder.indexOf('Backend (Skylark Arc) (changed)')).toBe(Number(to) - 1);
    // The what-if path is drawn dashed on the lane.
    await page.waitForFunction(() => document.querySelector('svg path[data-ball$="-what-if"]') !== null);
    await page.getByText('Resurfacing uses abrasives and solvents').first().waitFor();
    await screenshot(page, 'matchup-what-if-desktop');

    // Transition: more games bowled re-runs the matchup.
    await page.getByRole('slider', { name: 'Games already bowled' }).focus();
    for (let i = 0; i < 6; i += 1) await page.keyboard.press('ArrowRight');
    await page.getByRole('heading', { level: 2, name: 'Ranking for Long Haul 47, after 6 games' }).waitFor({ timeout: 60000 });
    await page.getByRole('status').filter({ hasText: 'Ranked 8 balls for Long Haul 47 after 6 games.' }).waitFor();
    await screenshot(page, 'matchup-transition-desktop');
  });

  it('at 375 px the matchup fits the phone: ranking, lane view and what-if without a horizontal scrollbar', async () => {
    const { page } = await open(MOBILE);
    await signIn(page, DEMO.dana);
    await page.goto('/matchup');
    await rankOnLongHaul(page);
    await page.getByRole('img', { name: /^Lane view of Long Haul 47/ }).waitFor();
    await page.getByRole('heading', { level: 2, name: 'What if…' }).waitFor();
    await screenshot(page, 'matchup-mobile');
    expect(await hasHorizontalScroll(page)).toBe(false);
  });
});

/**
 * The demo house condition as Copperline Bowl publishes it (its name in the picker ends with the lanes it still
 * governs: another test may publish a newer condition for some of them).
 */
const HOUSE = /^Copperline Bowl today — Copperline House 40, lanes /;
const BIG_RED = 'Big Red (Thunderhead Talon)';

describe('matchup: the demo house condition, its lane surface, and the same numbers on every screen', () => {
  it('Dana sees Big Red too strong with a smoother surface to try; the what-if of that change moves the breakpoint exactly as the coach’s side by side does', async () => {
    const dana = await open();
    await signIn(dana.page, DEMO.dana);
    const page = dana.page;
    await page.goto(`${baseUrl}/matchup`);
    await page.getByRole('heading', { level: 1, name: 'Matchup' }).waitFor();
    await choose(page, 'Condition', HOUSE);
    // A published condition brings its own lane surface: no lane picker, its words instead.
    await page
      .getByTestId('matchup-lane-surface')
      .filter({ hasText: 'Synthetic lanes, high friction, as Copperline Bowl publishes it.' })
      .waitFor();
    expect(await page.getByRole('radiogroup', { name: 'Lane friction' }).count()).toBe(0);
    await page.getByRole('button', { name: 'Rank my arsenal' }).click();
    await page.getByRole('heading', { level: 2, name: 'Ranking for Copperline House 40, after 0 games' }).waitFor({ timeout: 30000 });
    await expect
      .poll(async () =>
        (
          (await page
            .getByRole('region', { name: /^Ranking for / })
            .locator('p')
            .first()
            .textContent()) ?? ''
        )
          .replace(/\s+/g, ' ')
          .trim(),
      )
      .toMatch(/^Copperline Bowl, lanes [\d–, ]+: Synthetic lanes, high friction\.$/);

    // Big Red, the strong solid at 2000 grit: too strong for this condition, in words, with its strength against the demand.
    const row = page.getByRole('table', { name: 'Ranking' }).locator('tbody tr[data-ball-id]').filter({ hasText: BIG_RED });
    const fit = row.locator('.matchup-ranking-table__fit');
    await expect
      .poll(async () => (await fit.textContent())?.replace(/\s+/g, ' ').trim())
      .toMatch(/^too strong by \d+\.\d, strength \d+\.\d vs demand \d+\.\d$/);
    const serverBreakpoint = ((await row.locator('td').nth(4).textContent()) ?? '').trim(); // rank, score, fit, skid, breakpoint
    expect(serverBreakpoint).toMatch(/^\d+\.\d at \d+\.\d ft$/);

    // Why: each reason with its effect and source; what to change: go smoother, with the surface caution.
    await page.getByRole('button', { name: `Why: ${BIG_RED}` }).click();
    const reasons = page.getByRole('list', { name: `Reasons for ${BIG_RED}` });
    await reasons
      .getByText(/^Source: /)
      .first()
      .waitFor();
    expect(await reasons.getByRole('listitem').count()).toBeGreaterThan(5);
    const changes = page.getByRole('list', { name: `What to change: ${BIG_RED}` });
    const smoother = changes.getByRole('listitem').filter({ hasText: /Surface: Go smoother — / });
    await smoother.waitFor();
    expect(await smoother.textContent()).toMatch(/sand wet with eye and dust protection, or have the pro shop do it/);
    await page
      .getByTestId('matchup-calibration')
      .getByText(/^Calibrated to your \d+ logged shots on these lanes\./)
      .waitFor();
    await screenshot(page, 'matchup-house-too-strong-desktop');

    // The what-if: the suggested smoother surface, tried straight from the suggestion, worked out in the browser with the
    // ranking's own inputs. (Another test may have resurfaced Big Red: the suggestion is read, not assumed.)
    const [, grit, polish] = /Go smoother — (\d+) grit( and polish)?/.exec((await smoother.textContent()) ?? '') ?? [];
    expect(Number(grit)).toBeGreaterThan(0);
    await smoother.getByRole('button', { name: /^Try in the what-if: / }).click();
    const whatIf = page.getByTestId('what-if-breakpoint-change');
    await whatIf.waitFor();
    const whatIfText = ((await whatIf.textContent()) ?? '').trim();
    // The change starts from the ranking's own breakpoint for Big Red.
    const [board, ft] = serverBreakpoint.split(' at ');
    expect(whatIfText).toMatch(/^Breakpoint .+: board \d+\.\d at \d+\.\d ft → board \d+\.\d at \d+\.\d ft\.$/);
    expect(whatIfText).toContain(`: board ${board} at ${ft} → board `);
    expect(whatIfText).toMatch(/ft later/); // smoother goes longer (common practice)
    await screenshot(page, 'matchup-house-what-if-desktop');

    // The coach's side by side: the same ball, the same condition, as it is (A) and with the suggested surface (B).
    const coach = await open();
    await signIn(coach.page, DEMO.coach);
    const cp = coach.page;
    await cp.goto(`${baseUrl}/coach`);
    await cp.getByRole('button', { name: 'Open Dana Holloway' }).click();
    await cp.getByRole('heading', { level: 3, name: 'Side by side: two balls, or two versions of one' }).waitFor();
    await choose(cp, 'Ball to compare', BIG_RED);
    await choose(cp, 'Condition to compare on', HOUSE);
    await choose(cp, 'Version B grit', `${grit} grit`);
    const polishB = cp.getByRole('switch', { name: 'Version B polished' });
    if ((await polishB.getAttribute('aria-checked')) !== String(Boolean(polish)))
      await cp.locator('.el-switch').filter({ has: polishB }).click();
    expect(await polishB.getAttribute('aria-checked')).toBe(String(Boolean(polish)));
    await cp
      .getByTestId('coach-calibration')
      .getByText(/^Calibrated to Dana Holloway's \d+ logged shots on these lanes/)
      .waitFor({ timeout: 30000 });
    const verdict = cp.getByRole('status').filter({ hasText: /^From A to B: Breakpoint / });
    await verdict.waitFor({ timeout: 30000 });
    // The side by side recomputes (on the engine thread) as the grit, polish and calibration arrive: its settled text is compared.
    await eventually(async () => ((await verdict.textContent()) ?? '').trim().startsWith(`From A to B: ${whatIfText} Entry angle `)).toBe(
      true,
    );
    await screenshot(cp, 'coach-what-if-house-desktop');
  });
});

describe('matchup: the what-if keeps the page answering while it works', () => {
  it('while the what-if recomputes after a ball change, the main thread’s longest task stays under 50 ms', async () => {
    const { page } = await open();
    await signIn(page, DEMO.dana);
    await page.getByRole('navigation', { name: 'Main' }).getByRole('link', { name: 'Matchup' }).click();
    await rankOnLongHaul(page);
    await choose(page, 'What-if ball', 'Backend (Skylark Arc)');
    await page.getByText('Change the surface or the layout of a ball').waitFor();

    // From here on every task of the page's main thread longer than 50 ms is recorded (the Long Tasks API).
    expect(await page.evaluate(() => PerformanceObserver.supportedEntryTypes.includes('longtask'))).toBe(true);
    await page.evaluate(() => {
      const w = window as unknown as { longTasks: number[] };
      w.longTasks = [];
      new PerformanceObserver((list) => {
        for (const e of list.getEntries()) w.longTasks.push(e.duration);
      }).observe({ type: 'longtask' });
    });
    const longTasks = () => page.evaluate(() => [...(window as unknown as { longTasks: number[] }).longTasks]);

    // Three changes to the ball, each worked out by the engine (in its worker) while the page stays free.
    await choose(page, 'What-if grit', '500 grit');
    await page
      .getByRole('status')
      .filter({ hasText: /^The order changes: Backend \(Skylark Arc\)/ })
      .waitFor({ timeout: 60000 });
    await page
      .locator('.el-switch')
      .filter({ has: page.getByRole('switch', { name: 'What-if polished' }) })
      .click();
    await page
      .getByRole('status')
      .filter({ hasText: /^The order (changes|stays the same)/ })
      .waitFor({ timeout: 60000 });
    await choose(page, 'What-if grit', '4000 grit');
    await page
      .getByRole('status')
      .filter({ hasText: /^The order (changes|stays the same)/ })
      .waitFor({ timeout: 60000 });
    const during = await longTasks();
    const longest = Math.max(0, ...during);
    expect(longest, `long tasks while the what-if worked: ${during.map((d) => d.toFixed(0)).join(', ') || 'none'}`).toBeLessThan(50);

    // The measurement sees a long task when there is one: 120 ms of work in one of the page's own tasks is reported.
    await page.evaluate(() => {
      setTimeout(() => {
        const start = performance.now();
        while (performance.now() - start < 120) {
          /* busy on purpose */
        }
      }, 0);
    });
    await eventually(async () => Math.max(0, ...(await longTasks()))).toBeGreaterThanOrEqual(100);
  });
});
