import { PDFParse } from 'pdf-parse';
import { beforeAll, describe, expect, it } from 'vitest';
import type { Page } from 'playwright-core';
import { DEMO, DESKTOP, devMailbox, MOBILE, eventually, hasHorizontalScroll, screenshot, signIn, useBrowser } from './browser';

/**
 * A center's condition as lane groups, in the browser: the demo proprietor publishes league lanes 1–12 and open play
 * 13–24 at Copperline Bowl (the publish button stays disabled while the lane box has an error); a visitor sees both
 * groups on the public page and on the printed sheet (the PDF read back as text) at 1280 and 375 px; a follower's
 * e-mail opens the page at its own lane group, and its unsubscribe link asks first and can be undone.
 */

const { baseUrl, open } = useBrowser(DESKTOP);

const LEAGUE = 'Short Sprint 34';
const OPEN_PLAY = 'Level Field 41';
let centerId = 0;

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

/** Publishes one demo pattern for some lanes through the publish dialog of Center admin. */
async function publish(page: Page, pattern: string, lanes: string, notes: string, label: string): Promise<void> {
  await page.getByRole('button', { name: 'Publish a condition' }).click();
  const dialog = page.getByRole('dialog');
  await dialog.getByText('Publish a condition at Copperline Bowl').waitFor();
  await dialog.getByLabel('Pattern', { exact: true }).click();
  await page.getByRole('option', { name: new RegExp(`^${pattern}`) }).click();
  await dialog.getByLabel('Lanes', { exact: true }).fill(lanes);
  await dialog.getByLabel('Notes for bowlers (optional)').fill(notes);
  await dialog.getByRole('button', { name: 'Preview' }).click();
  await dialog.getByRole('region', { name: 'Preview of the public page' }).getByText(pattern).first().waitFor();
  await dialog.getByRole('button', { name: `Publish for lanes ${label}` }).click();
  await page.getByText('Condition published', { exact: true }).first().waitFor();
  await dialog.waitFor({ state: 'hidden' });
}

beforeAll(async () => {
  centerId = await centerNamed('Copperline Bowl');
});

describe('lane groups: publish two groups, read both, follow the e-mail to the right one', () => {
  it('the proprietor cannot go on while the lane box has an error, then publishes league lanes 1–12 and open play 13–24', async () => {
    expect(centerId, 'Copperline Bowl is in the demo seed').toBeGreaterThan(0);
    const { page } = await open();
    await signIn(page, DEMO.proprietor);
    await page.goto('/center-admin');
    await page.getByRole('heading', { level: 1, name: 'Center admin' }).waitFor();

    // A typo in the lane box: an error, and no way on with the last lanes that could be read.
    await page.getByRole('button', { name: 'Publish a condition' }).click();
    const dialog = page.getByRole('dialog');
    await dialog.getByLabel('Pattern', { exact: true }).click();
    await page.getByRole('option', { name: new RegExp(`^${LEAGUE}`) }).click();
    await dialog.getByLabel('Lanes', { exact: true }).fill('1-12, 3O');
    await dialog.getByRole('alert').filter({ hasText: '“3O” is not a lane or a range like 1–12' }).waitFor();
    await eventually(() => dialog.getByRole('button', { name: 'Preview' }).isDisabled()).toBe(true);
    expect(await dialog.getByLabel('Lanes', { exact: true }).getAttribute('aria-invalid')).toBe('true');
    await screenshot(page, 'lane-groups-publish-error-desktop');
    await dialog.getByLabel('Lanes', { exact: true }).fill('1-12');
    await eventually(() => dialog.getByRole('button', { name: 'Preview' }).isDisabled()).toBe(false);
    await dialog.getByRole('button', { name: 'Cancel' }).click();
    await dialog.waitFor({ state: 'hidden' });

    // The same at 375 px.
    await page.setViewportSize(MOBILE);
    await page.getByRole('button', { name: 'Publish a condition' }).click();
    await dialog.getByLabel('Lanes', { exact: true }).fill('13-24, x');
    await eventually(() => dialog.getByRole('button', { name: 'Preview' }).isDisabled()).toBe(true);
    await screenshot(page, 'lane-groups-publish-error-mobile');
    await dialog.getByRole('button', { name: 'Cancel' }).click();
    await dialog.waitFor({ state: 'hidden' });
    await page.setViewportSize(DESKTOP);

    await publish(page, LEAGUE, '1-12', 'League lanes: Tuesday and Thursday leagues.', '1–12');
    await publish(page, OPEN_PLAY, '13-24', 'Open play lanes.', '13–24');
  });

  it('a visitor sees both lane groups on the public page at 1280 and 375 px, picks a lane pair, and the sheet carries both', async () => {
    for (const [viewport, tag] of [
      [DESKTOP, 'desktop'],
      [MOBILE, 'mobile'],
    ] as const) {
      const { page } = await open(viewport);
      await page.goto(`/centers/${centerId}/condition`);
      await page.getByRole('heading', { level: 1, name: 'Lane condition at Copperline Bowl' }).waitFor();
      const league = page.locator('#lanes-1-12');
      const openPlay = page.locator('#lanes-13-24');
      await league.getByRole('heading', { level: 2, name: 'Lanes 1–12' }).waitFor();
      await league.getByTestId('condition-pattern-name').filter({ hasText: LEAGUE }).waitFor();
      await league.getByText('League lanes: Tuesday and Thursday leagues.').waitFor();
      await openPlay.getByTestId('condition-pattern-name').filter({ hasText: OPEN_PLAY }).waitFor();
      await openPlay.getByText('Open play lanes.').waitFor();
      await eventually(() => page.getByTestId('lane-group').count()).toBe(2);
      await page.getByText('America/Denver').first().waitFor();

      await page.getByLabel('Your lanes').selectOption({ label: 'Lanes 15–16' });
      await page
        .getByRole('status')
        .filter({ hasText: `You are on lanes 13–24: ${OPEN_PLAY}.` })
        .waitFor();
      await page.waitForURL((u) => u.hash === '#lanes-13-24');
      await openPlay.getByText('your lanes', { exact: true }).waitFor();
      if (tag === 'mobile') expect(await hasHorizontalScroll(page), 'the public page fits 375 px').toBe(false);
      await screenshot(page, `lane-groups-public-${tag}`);

      const href = await page.getByRole('link', { name: 'Printable sheet (PDF)' }).getAttribute('href');
      const res = await page.request.get(`${baseUrl}${href}`);
      expect(res.status()).toBe(200);
      expect(res.headers()['content-type']).toBe('application/pdf');
      const parser = new PDFParse({ data: new Uint8Array(await res.body()) });
      const { text } = await parser.getText();
      await parser.destroy();
      const flat = text.replace(/\s+/g, ' ');
      expect(flat).toContain(`Lanes 1–12: ${LEAGUE}`);
      expect(flat).toContain(`Lanes 13–24: ${OPEN_PLAY}`);
      expect(flat).toContain('Legend');
    }
  });

  it('a follower’s e-mail opens the page at its lane group; its unsubscribe link asks first, and the undo keeps the e-mails', async () => {
    const subject = `Copperline Bowl: new lane condition — ${OPEN_PLAY}`;
    const find = async () => (await devMailbox(baseUrl)).find((m) => m.subject === subject && m.to.includes(DEMO.dana));
    await eventually(async () => Boolean(await find()), 60000).toBe(true);
    const mail = (await find())!;
    const pageLink = /https?:\/\/\S+\/centers\/\d+\/condition#lanes-\d+-\d+/.exec(mail.text)?.[0];
    expect(pageLink).toBeDefined();
    const pageUrl = new URL(pageLink!);
    expect(pageUrl.hash).toBe('#lanes-13-24');

    const { page } = await open();
    await signIn(page, DEMO.dana);
    await page.goto(`${pageUrl.pathname}${pageUrl.hash}`);
    const group = page.locator('#lanes-13-24');
    await group.getByText('your lanes', { exact: true }).waitFor();
    await group.getByTestId('condition-pattern-name').filter({ hasText: OPEN_PLAY }).waitFor();
    // The best fit is worked out for that group's condition.
    await page.getByRole('region', { name: 'Best fit from your arsenal' }).waitFor();
    await screenshot(page, 'lane-groups-from-mail-desktop');

    const unsubscribe = /https?:\/\/\S+\/unsubscribe\?token=[\w-]+/.exec(mail.text)?.[0];
    expect(unsubscribe).toBeDefined();
    const un = new URL(unsubscribe!);
    for (const viewport of [MOBILE, DESKTOP]) {
      const visitor = (await open(viewport)).page;
      await visitor.goto(`${un.pathname}${un.search}`);
      await visitor.getByText('Stop these e-mails?', { exact: false }).waitFor();
      if (viewport === MOBILE) {
        expect(await hasHorizontalScroll(visitor), 'the unsubscribe page fits 375 px').toBe(false);
        await screenshot(visitor, 'unsubscribe-ask-mobile');
        continue; // opening the page changed nothing: the desktop visit below still asks
      }
      await visitor.getByRole('button', { name: 'Stop e-mails from Copperline Bowl' }).click();
      await visitor.getByText('You will no longer get condition e-mails from Copperline Bowl.').waitFor();
      await screenshot(visitor, 'unsubscribe-done-desktop');
      await visitor.getByRole('button', { name: 'Undo: keep e-mails from Copperline Bowl' }).click();
      await visitor.getByText('You follow Copperline Bowl again.').waitFor();
    }

    // Dana still follows Copperline Bowl: Home lists both lane groups, and the Matchup picker offers each under the center.
    await page.goto(`/centers/${centerId}/condition`);
    await page.getByText('You follow this center').waitFor();
    await page.goto('/');
    const today = page.getByRole('region', { name: "Today's condition" });
    await today.getByText(`Lanes 1–12 — ${LEAGUE}`).waitFor();
    await today.getByText(`Lanes 13–24 — ${OPEN_PLAY}`).waitFor();
    await screenshot(page, 'lane-groups-home-desktop');
    await page.goto('/matchup');
    await page.getByRole('heading', { level: 1, name: 'Matchup' }).waitFor();
    await page.getByRole('combobox', { name: 'Condition' }).focus();
    await page.keyboard.press('Enter');
    await page.getByText('Copperline Bowl today, by lane group', { exact: true }).waitFor();
    await page.getByRole('option', { name: `Copperline Bowl today — ${LEAGUE}, lanes 1–12` }).waitFor();
    await page.getByRole('option', { name: `Copperline Bowl today — ${OPEN_PLAY}, lanes 13–24` }).waitFor();
    await screenshot(page, 'lane-groups-matchup-picker-desktop');

    // A link that is not valid says so in words, not in JSON.
    const bad = (await open(MOBILE)).page;
    await bad.goto('/unsubscribe?token=not-a-real-link-token-0000');
    await bad.getByText('This link is not valid any more.', { exact: false }).waitFor();
    expect(await bad.locator('body').innerText()).not.toContain('{');
  });
});
