import fs from 'node:fs';
import { beforeAll, describe, expect, it } from 'vitest';
import type { Page } from 'playwright-core';
import { DEMO, DESKTOP, devMailbox, MOBILE, eventually, hasHorizontalScroll, screenshot, signIn, useBrowser } from './browser';

/**
 * The condition publishing flow in the browser: the demo proprietor builds a pattern in the editor (numbers update as
 * sweeps are typed), saves it and publishes it for lanes 1–12 at Copperline Bowl; a visitor with no account
 * reads it on the public condition page; a follower sees it on Conditions and gets the e-mail.
 *
 * Expected numbers are worked out by hand from the lane-machine volume arithmetic (volume = boards covered × crossings × µL per board):
 *   sweep 1 forward boards 2–38 (37) × 2 × 60 µL = 4 440 µL
 *   sweep 2 forward boards 8–32 (25) × 4 × 60 µL = 6 000 µL
 *   sweep 3 forward boards 13–27 (15) × 6 × 60 µL = 5 400 µL
 *   sweep 4 reverse boards 16–24 (9) × 4 × 60 µL = 2 160 µL   → 18.00 mL (forward 15.84, reverse 2.16)
 * Ratio (boards 18–22 vs 3–7 and 33–37): middle boards get 120 + 240 + 360 + 240 = 960 µL, outside boards
 * only sweep 1's 120 µL → 8.00 : 1. Length: the largest end, 40 ft.
 */

const { baseUrl, open } = useBrowser(DESKTOP);

const PATTERN_NAME = `Tideline Trial ${Date.now() % 100000}`;
let centerId = 0;

/** The value shown for one of the editor's numbers (length, volume, ratio, …). */
async function numberOf(page: Page, key: string): Promise<string> {
  return (await page.locator(`[data-number="${key}"] .pattern-numbers__value`).first().innerText()).trim();
}

async function expectNumber(page: Page, key: string, value: string): Promise<void> {
  await page.locator(`[data-number="${key}"] .pattern-numbers__value`, { hasText: value }).first().waitFor();
  expect(await numberOf(page, key)).toBe(value);
}

async function fillSweep(
  page: Page,
  n: number,
  values: Partial<Record<'from board' | 'to board' | 'start (ft)' | 'end (ft)' | 'crossings' | 'oil per board (µL)', string>>,
): Promise<void> {
  for (const [label, value] of Object.entries(values)) {
    await page.getByLabel(`Sweep ${n} ${label}`, { exact: true }).fill(value);
  }
}

/** The id of a center of the demo seed, looked up by name through the public list, page by page. */
async function centerNamed(name: string): Promise<number> {
  for (let page = 1; ; page += 1) {
    const body = (await (await fetch(`${baseUrl}/api/centers?page=${page}&pageSize=100`)).json()) as {
      items: { id: number; name: string }[];
      total: number;
    };
    const hit = body.items.find((c) => c.name === name);
    if (hit || page * 100 >= body.total) return hit?.id ?? 0;
  }
}

beforeAll(async () => {
  centerId = await centerNamed('Copperline Bowl');
});

describe('conditions: build a pattern, publish it, read it publicly and as a follower', () => {
  it('the demo proprietor builds a pattern in the editor, sees its numbers follow the typing, saves it and publishes it for lanes 1–12', async () => {
    expect(centerId, 'Copperline Bowl is in the demo seed').toBeGreaterThan(0);
    const { page } = await open();
    await signIn(page, DEMO.proprietor);

    await page.getByRole('navigation', { name: 'Main' }).getByRole('link', { name: 'Patterns', exact: true }).click();
    await page.getByRole('heading', { level: 1, name: 'Patterns' }).waitFor();
    await page.getByRole('link', { name: 'New pattern' }).click();
    await page.getByRole('heading', { level: 1, name: 'New pattern' }).waitFor();

    await page.getByLabel('Pattern name').fill(PATTERN_NAME);
    // The new pattern starts with one sweep (2–38, 0–40 ft, 2 × 50 µL = 3.70 mL).
    await expectNumber(page, 'volume', '3.70 mL');
    await fillSweep(page, 1, { 'oil per board (µL)': '60' });
    await expectNumber(page, 'volume', '4.44 mL');

    await page.getByRole('button', { name: 'Add sweep' }).click();
    await fillSweep(page, 2, { 'from board': '8', 'to board': '32', 'end (ft)': '38', crossings: '4' });
    await expectNumber(page, 'volume', '10.44 mL');

    // A bad cell is marked where it is and left out of the numbers until it is fixed.
    await page.getByRole('button', { name: 'Add sweep' }).click();
    await fillSweep(page, 3, { 'to board': '41' });
    await page.getByText('Board 1 to 39').waitFor();
    await eventually(() => page.getByLabel('Sweep 3 to board', { exact: true }).getAttribute('aria-invalid')).toBe('true');
    await page.getByText('One sweep with errors is left out of the map and the numbers.').waitFor();
    await expectNumber(page, 'volume', '10.44 mL');
    await fillSweep(page, 3, { 'from board': '13', 'to board': '27', 'end (ft)': '36', crossings: '6' });
    await expectNumber(page, 'volume', '15.84 mL');

    await page.getByRole('button', { name: 'Add sweep' }).click();
    await page.getByLabel('Sweep 4 direction').selectOption('reverse');
    await fillSweep(page, 4, { 'from board': '16', 'to board': '24', 'end (ft)': '32', crossings: '4' });
    await expectNumber(page, 'volume', '18.00 mL');
    await expectNumber(page, 'forward', '15.84 mL');
    await expectNumber(page, 'reverse', '2.16 mL');
    await expectNumber(page, 'ratio', '8.00 : 1');
    await expectNumber(page, 'length', '40.0 ft');
    await page.getByText('mean oil per board on boards 18–22 ÷ boards 3–7 and 33–37').first().waitFor();
    await page.getByRole('img', { name: `Oil map of ${PATTERN_NAME}` }).waitFor();
    await screenshot(page, 'pattern-editor-desktop');

    // Leaving with unsaved changes asks first; staying keeps every sweep.
    await page.getByRole('navigation', { name: 'Main' }).getByRole('link', { name: 'Patterns', exact: true }).click();
    const leave = page.getByRole('dialog', { name: 'Leave without saving?' });
    await leave.waitFor();
    await leave.getByRole('button', { name: 'Stay on this page' }).click();
    await leave.waitFor({ state: 'hidden' });
    expect(new URL(page.url()).pathname).toBe('/patterns/new');
    await expectNumber(page, 'volume', '18.00 mL');

    await page.getByRole('button', { name: 'Save pattern' }).click();
    await page.getByText(`${PATTERN_NAME} was created.`).waitFor();
    await page.waitForURL(/\/patterns\/\d+\/edit$/);
    await page.getByRole('button', { name: 'Save changes' }).waitFor();
    await expectNumber(page, 'volume', '18.00 mL');

    await page.setViewportSize(MOBILE);
    await page.getByRole('heading', { level: 1, name: 'Edit pattern' }).waitFor();
    expect(await hasHorizontalScroll(page), 'the editor fits 375 px (the sweeps table scrolls in its own frame)').toBe(false);
    await screenshot(page, 'pattern-editor-mobile');
    await page.setViewportSize(DESKTOP);

    // Publish it for lanes 1–12 at Copperline Bowl: form → preview → confirm.
    await page.getByRole('navigation', { name: 'Main' }).getByRole('link', { name: 'Center admin' }).click();
    await page.getByRole('heading', { level: 1, name: 'Center admin' }).waitFor();
    await page.getByRole('button', { name: 'Publish a condition' }).click();
    const dialog = page.getByRole('dialog');
    await dialog.getByText('Publish a condition at Copperline Bowl').waitFor();
    await dialog.getByLabel('Pattern', { exact: true }).click();
    await page.getByRole('option', { name: new RegExp(PATTERN_NAME) }).click();
    await dialog.getByLabel('Lanes', { exact: true }).fill('1-12');
    await dialog.getByText('12 of 24 chosen').waitFor();
    expect(await dialog.getByRole('button', { name: 'Lane 12', exact: true }).getAttribute('aria-pressed')).toBe('true');
    expect(await dialog.getByRole('button', { name: 'Lane 13', exact: true }).getAttribute('aria-pressed')).toBe('false');
    // The lane surface of those lanes (default synthetic, medium friction): wood with low friction.
    expect(await dialog.getByRole('radiogroup', { name: 'Lane material' }).getByRole('radio', { name: 'Synthetic' }).isChecked()).toBe(
      true,
    );
    await dialog.getByRole('radiogroup', { name: 'Lane material' }).getByText('Wood', { exact: true }).click();
    await dialog.getByRole('radiogroup', { name: 'Lane friction' }).getByText('Low', { exact: true }).click();
    await dialog.getByLabel('Notes for bowlers (optional)').fill('Fresh oil on lanes 1–12 for the Tuesday trio league.');
    await screenshot(page, 'center-publish-form-desktop');
    await dialog.getByRole('button', { name: 'Preview' }).click();

    const preview = dialog.getByRole('region', { name: 'Preview of the public page' });
    await preview.getByText(PATTERN_NAME).first().waitFor();
    await preview.getByText('Lanes 1–12', { exact: true }).waitFor();
    await preview.getByText('18.00 mL').first().waitFor();
    await preview.getByText('Wood lanes, low friction', { exact: true }).waitFor();
    await screenshot(page, 'center-publish-preview-desktop');
    await dialog.getByRole('button', { name: 'Publish for lanes 1–12' }).click();

    await page.getByText('Condition published', { exact: true }).waitFor();
    await page.getByRole('heading', { name: 'Copperline Bowl today' }).waitFor();
    await page.locator('.center-admin__current').getByText(PATTERN_NAME).waitFor();
    await page.getByRole('table').filter({ hasText: PATTERN_NAME }).first().waitFor();
    await screenshot(page, 'center-admin-desktop');
  });

  it('a visitor with no account opens the public condition page and sees the pattern, its volume, the lanes and the cautions', async () => {
    for (const [viewport, tag] of [
      [DESKTOP, 'desktop'],
      [MOBILE, 'mobile'],
    ] as const) {
      const { page } = await open(viewport);
      await page.goto(`/centers/${centerId}/condition`);
      await page.getByRole('heading', { level: 1, name: 'Lane condition at Copperline Bowl' }).waitFor();
      expect(new URL(page.url()).pathname, 'no sign-in redirect').toBe(`/centers/${centerId}/condition`);
      await page.getByTestId('condition-pattern-name').filter({ hasText: PATTERN_NAME }).waitFor();
      await page.getByText('Lanes 1–12').first().waitFor();
      await page.locator('[data-number="volume"]').getByText('18.00 mL').waitFor();
      await page.getByText('Fresh oil on lanes 1–12 for the Tuesday trio league.').waitFor();
      await page.getByTestId('condition-lane-surface').filter({ hasText: 'Wood lanes, low friction' }).waitFor();
      await page.getByText(/shoe soles makes them slippery and causes falls/).waitFor();
      await page.getByRole('img', { name: `Oil map of ${PATTERN_NAME}` }).waitFor();
      const sheet = page.getByRole('link', { name: 'Printable sheet (PDF)' });
      expect(await sheet.getAttribute('href')).toBe(`/api/centers/${centerId}/conditions/current.pdf`);
      await page.getByRole('link', { name: 'Sign in', exact: true }).first().waitFor();
      if (tag === 'mobile') expect(await hasHorizontalScroll(page), 'the public page fits 375 px').toBe(false);
      await screenshot(page, `condition-public-${tag}`);
    }
  });

  it('a bowler who follows Copperline Bowl sees the new condition on Conditions, the best fit on the public page and the e-mail', async () => {
    const { page } = await open();
    await signIn(page, DEMO.dana);
    await page.getByRole('navigation', { name: 'Main' }).getByRole('link', { name: 'Conditions' }).click();
    await page.getByRole('heading', { level: 1, name: 'Conditions' }).waitFor();
    const row = page.getByRole('row').filter({ hasText: 'Copperline Bowl' });
    await row.getByText(PATTERN_NAME).waitFor();
    await row.getByText('Lanes 1–12').waitFor();
    expect(await row.getByRole('button', { name: 'Follow Copperline Bowl' }).getAttribute('aria-pressed')).toBe('true');
    await screenshot(page, 'conditions-follower-desktop');

    await row.getByRole('link', { name: 'Copperline Bowl' }).click();
    await page.getByRole('heading', { level: 1, name: 'Lane condition at Copperline Bowl' }).waitFor();
    await page.getByTestId('condition-pattern-name').filter({ hasText: PATTERN_NAME }).waitFor();
    const bestFit = page.getByRole('region', { name: 'Best fit from your arsenal' });
    await bestFit.getByText('Working out the matchup…').waitFor({ state: 'detached' });
    await screenshot(page, 'condition-public-bowler-desktop');
    expect(await bestFit.getByRole('listitem').count(), 'Dana has demo balls, so the matchup ranks some').toBeGreaterThan(0);

    // The dev mailbox is the admin's (it holds everyone's links): a bowler is turned away, the admin reads it.
    await page.goto('/dev/mail');
    await page.getByRole('heading', { level: 1, name: 'Not allowed' }).waitFor();
    await page.evaluate(() => window.localStorage.clear());
    await signIn(page, DEMO.admin);
    await page.goto('/dev/mail');
    await page.getByRole('heading', { level: 1, name: 'Dev mailbox' }).waitFor();
    await page.getByLabel('Filter by recipient or subject').fill(DEMO.dana);
    // The outbox sender delivers after the publication commits (and retries every few seconds): wait until the
    // message is in the mailbox, then refresh the page once and find it there.
    const subjectText = `Copperline Bowl: new lane condition — ${PATTERN_NAME}`;
    const delivered = async () => {
      const box = await devMailbox(baseUrl);
      return box.some((m) => m.subject === subjectText && m.to.includes(DEMO.dana));
    };
    await eventually(delivered, 60000).toBe(true);
    await page.getByRole('button', { name: 'Refresh' }).click();
    await page.getByText(subjectText).waitFor();
    await screenshot(page, 'dev-mail-desktop');

    await page.setViewportSize(MOBILE);
    await page.goto('/conditions');
    await page.getByRole('row').filter({ hasText: 'Copperline Bowl' }).getByText(PATTERN_NAME).waitFor();
    expect(await hasHorizontalScroll(page), 'Conditions fits 375 px').toBe(false);
    await screenshot(page, 'conditions-follower-mobile');
  });

  it('an admin finds the Dev mailbox and the condition screens in the navigation, and the patterns list links to the editor', async () => {
    const { page } = await open();
    await signIn(page, DEMO.admin);
    const nav = page.getByRole('navigation', { name: 'Main' });
    for (const name of ['Patterns', 'Conditions', 'Center admin', 'Dev mailbox'])
      await nav.getByRole('link', { name, exact: true }).waitFor();
    await screenshot(page, 'nav-admin-desktop');
    await nav.getByRole('link', { name: 'Patterns', exact: true }).click();
    await page.getByRole('heading', { level: 1, name: 'Patterns' }).waitFor();
    await page
      .getByRole('link', { name: `Edit ${PATTERN_NAME}` })
      .first()
      .waitFor();
    await screenshot(page, 'patterns-admin-desktop');
    await nav.getByRole('link', { name: 'Dev mailbox' }).click();
    await page.getByRole('heading', { level: 1, name: 'Dev mailbox' }).waitFor();
  });

  it('the editor exports the pattern as CSV, rejects a bad file with line-numbered errors and nothing saved, imports a good one and duplicates', async () => {
    const { page } = await open();
    await signIn(page, DEMO.proprietor);

    // Center admin and its publish dialog at 375 px.
    await page.setViewportSize(MOBILE);
    await page.goto('/center-admin');
    await page.getByRole('heading', { level: 1, name: 'Center admin' }).waitFor();
    await page.getByRole('table').filter({ hasText: PATTERN_NAME }).first().waitFor();
    expect(await hasHorizontalScroll(page), 'Center admin fits 375 px').toBe(false);
    await screenshot(page, 'center-admin-mobile');
    await page.getByRole('button', { name: 'Publish a condition' }).click();
    await page.getByRole('dialog').getByRole('button', { name: 'Lane 24', exact: true }).waitFor();
    await screenshot(page, 'center-publish-form-mobile');
    await page.getByRole('dialog').getByRole('button', { name: 'Cancel' }).click();
    await page.setViewportSize(DESKTOP);

    await page.goto('/patterns');
    await page
      .getByRole('link', { name: `Edit ${PATTERN_NAME}` })
      .first()
      .click();
    await page.getByRole('heading', { level: 1, name: 'Edit pattern' }).waitFor();
    await expectNumber(page, 'volume', '18.00 mL');
    const editUrl = page.url();

    const [download] = await Promise.all([page.waitForEvent('download'), page.getByRole('button', { name: 'Export CSV' }).click()]);
    const csv = fs.readFileSync(await download.path(), 'utf8');
    expect(download.suggestedFilename()).toMatch(/\.lanewright\.csv$/);
    expect(csv).toContain(`# name: ${PATTERN_NAME}`);
    expect(
      csv
        .trim()
        .split('\n')
        .filter((l) => /^(forward|reverse),/.test(l)),
    ).toHaveLength(4);

    const bad = [
      '# lanewright-pattern v1',
      '# name: Broken Upload',
      'direction,fromBoard,toBoard,startFt,endFt,crossings,microlitersPerBoard',
      'forward,2,38,0,40,2,60',
      'sideways,2,41,0,40,2,60',
    ].join('\n');
    await page.getByLabel('Pattern file to import').setInputFiles({ name: 'broken.csv', mimeType: 'text/csv', buffer: Buffer.from(bad) });
    const errors = page.getByRole('list', { name: 'Errors in the file' });
    await errors.waitFor();
    await errors.getByText('Line 5:').first().waitFor();
    await page.getByText('Nothing was saved. Fix the file and import it again.').waitFor();
    expect(page.url(), 'a rejected file does not leave the page').toBe(editUrl);
    await screenshot(page, 'pattern-import-errors-desktop');

    await page.getByLabel('Pattern file to import').setInputFiles({ name: 'tideline.csv', mimeType: 'text/csv', buffer: Buffer.from(csv) });
    // Names are unique per owner: the import of a name in use asks to rename or replace.
    const conflict = page.getByRole('dialog', { name: 'You already have a pattern of this name' });
    await conflict.waitFor();
    await conflict.getByRole('button', { name: `Import as “${PATTERN_NAME} (2)”` }).click();
    await page.getByText(`${PATTERN_NAME} (2) was created from tideline.csv.`).waitFor();
    await page.waitForURL((url) => /\/patterns\/\d+\/edit$/.test(url.pathname) && url.href !== editUrl);
    await expectNumber(page, 'volume', '18.00 mL');

    await page.getByRole('button', { name: 'Duplicate' }).click();
    await page.getByText('Pattern duplicated', { exact: true }).waitFor();
    // The editor has loaded the copy (its sweeps replace the rows) before the rows are reordered.
    await eventually(() => page.getByLabel('Pattern name').inputValue()).toBe(`${PATTERN_NAME} (2) (copy)`);
    await expectNumber(page, 'volume', '18.00 mL');

    // Reordering with the keyboard: the moved row keeps the focus; the order does not change the numbers.
    await page.getByRole('button', { name: 'Move sweep 4 up' }).focus();
    await page.keyboard.press('Enter');
    await eventually(() => page.getByLabel('Sweep 3 direction').inputValue()).toBe('reverse');
    await eventually(() => page.evaluate(() => document.activeElement?.getAttribute('aria-label'))).toBe('Move sweep 3 up');
    await expectNumber(page, 'volume', '18.00 mL');
    await page.getByText('Unsaved changes').waitFor();

    // An import over unsaved edits asks first; "Stay" keeps the edits and imports nothing.
    const copyUrl = page.url();
    await page.getByLabel('Pattern file to import').setInputFiles({ name: 'tideline.csv', mimeType: 'text/csv', buffer: Buffer.from(csv) });
    const ask = page.getByRole('dialog', { name: 'Import and drop your changes?' });
    await ask.getByRole('button', { name: 'Stay on this page' }).click();
    await ask.waitFor({ state: 'hidden' });
    expect(page.url()).toBe(copyUrl);
    await page.getByText('Unsaved changes').waitFor();
    expect(await page.getByLabel('Sweep 3 direction').inputValue()).toBe('reverse');
    expect(await page.getByRole('dialog', { name: 'You already have a pattern of this name' }).count()).toBe(0);
  });
});
