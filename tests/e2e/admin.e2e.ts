import { describe, expect, it } from 'vitest';
import type { Page } from 'playwright-core';
import {
  DEMO,
  DESKTOP,
  MOBILE,
  chooseOption,
  eventually,
  hasHorizontalScroll,
  screenshot,
  signIn,
  useBrowser,
  type Viewport,
} from './browser';

const { open } = useBrowser(DESKTOP);

/** Opens the admin area the way the viewport offers it: the bar's Admin link at 1280 px, the drawer at 375 px. */
async function openAdmin(page: Page, viewport: Viewport): Promise<void> {
  if (viewport.width >= 768) {
    const link = page.getByRole('navigation', { name: 'Main' }).getByRole('link', { name: 'Admin', exact: true });
    await link.waitFor();
    // The link is on screen without scrolling the bar: the links that do not fit are in "More".
    const box = await link.boundingBox();
    expect(box).not.toBeNull();
    expect(box!.x + box!.width).toBeLessThanOrEqual(viewport.width);
    await link.click();
  } else {
    await page.getByRole('button', { name: 'Open navigation' }).click();
    await page.getByRole('dialog').getByRole('link', { name: 'Admin', exact: true }).click();
  }
  await page.getByRole('heading', { level: 1, name: 'Users and roles' }).waitFor();
}

const CSV_HEADER =
  'maker,name,coverType,coreType,rg,differential,intermediateDifferential,factoryGrit,factoryPolished,hardnessD,releaseYear';

describe.each([
  ['1280 px', DESKTOP, { person: 'Lee Marchetti', tag: 'desktop' }],
  ['375 px', MOBILE, { person: 'Dana Holloway', tag: 'mobile' }],
] as const)('admin screens at %s', (_label, viewport, story) => {
  it('the admin gives a bowler a second role after confirming; admin mixed with another role is refused', async () => {
    const { page } = await open(viewport);
    await signIn(page, DEMO.admin);
    await openAdmin(page, viewport);
    await page.getByLabel('Search by name or e-mail').fill(story.person.split(' ')[1]);
    await page.getByRole('button', { name: `Edit roles of ${story.person}` }).click();
    const dialog = page.getByRole('dialog', { name: `Roles: ${story.person}` });
    await dialog.waitFor();
    await dialog.getByText(`${story.person} (`).waitFor();
    const roles = dialog.getByRole('group', { name: 'Roles held' });
    await roles.getByText('Admin', { exact: true }).click();
    await dialog.getByRole('alert').filter({ hasText: 'holds the admin role alone' }).waitFor();
    expect(await dialog.getByRole('button', { name: 'Continue' }).isDisabled()).toBe(true);
    await roles.getByText('Admin', { exact: true }).click();
    await roles.getByText('Coach', { exact: true }).click();
    expect(await dialog.getByRole('checkbox', { name: /^Coach/ }).isChecked()).toBe(true);
    expect(await dialog.getByRole('checkbox', { name: /^Bowler/ }).isChecked()).toBe(true);
    await dialog.getByRole('button', { name: 'Continue' }).click();
    await dialog.getByText(`Give ${story.person} the roles Bowler, Coach instead of Bowler?`).waitFor();
    await screenshot(page, `admin-roles-confirm-${story.tag}`);
    await dialog.getByRole('button', { name: 'Yes, save the roles' }).click();
    await page.getByText(`${story.person} now holds: Bowler, Coach.`).waitFor();
    const row = page.getByRole('row', { name: new RegExp(story.person) });
    await row.getByText('Coach', { exact: true }).waitFor();
    await row.getByText('Bowler', { exact: true }).waitFor();
    expect(await hasHorizontalScroll(page)).toBe(false);
  });

  it('the admin reads the audit log with names, filtered by action', async () => {
    const { page } = await open(viewport);
    await signIn(page, DEMO.admin);
    await openAdmin(page, viewport);
    await page.getByRole('navigation', { name: 'Admin sections' }).getByRole('link', { name: 'Audit log' }).click();
    await page.getByRole('heading', { level: 1, name: 'Audit log' }).waitFor();
    await chooseOption(page, page.getByRole('combobox', { name: 'Action' }), 'Roles changed');
    const row = page.getByRole('row', { name: new RegExp(`${story.person} \\(user \\d+\\)`) });
    await row.waitFor();
    await row.getByText('Sam Okafor-Reyes').waitFor();
    await row.getByText('bowler → bowler, coach').waitFor();
    await eventually(() => page.getByRole('row', { name: /Catalogue ball added/ }).count()).toBe(0);
    await screenshot(page, `admin-audit-${story.tag}`);
    expect(await hasHorizontalScroll(page)).toBe(false);
  });

  it('the admin imports a catalogue CSV: a bad row is refused by line and field, nothing saved; the fixed file imports', async () => {
    const { page } = await open(viewport);
    await signIn(page, DEMO.admin);
    await page.goto('/admin/catalogue');
    await page.getByRole('heading', { level: 1, name: 'Catalogue admin' }).waitFor();
    const maker = `Proofline ${story.tag}`;
    const good1 = `${maker},Harbor One,reactive-solid,asymmetric,2.49,0.051,0.016,2000,false,75,2026`;
    const good2 = `${maker},Harbor Two,reactive-pearl,symmetric,2.55,0.035,0,3000,true,,`;
    const bad = `${maker},Harbor Bad,reactive-solid,symmetric,heavy,0.04,0,2000,false,,`;
    await page.getByRole('button', { name: 'Import CSV' }).click();
    const dialog = page.getByRole('dialog', { name: 'Import catalogue balls from a CSV file' });
    await dialog.getByText('All or nothing:').waitFor();
    await dialog.getByLabel('Catalogue CSV file').setInputFiles({
      name: 'catalogue.csv',
      mimeType: 'text/csv',
      buffer: Buffer.from([CSV_HEADER, good1, bad, good2].join('\n')),
    });
    await dialog.getByRole('button', { name: 'Import', exact: true }).click();
    const report = dialog.getByRole('table', { name: 'Refused lines' });
    await report.waitFor();
    await report.getByRole('row', { name: /^3 rg / }).waitFor();
    expect(await report.getByRole('row').count()).toBe(2); // the header and line 3
    await dialog.getByText('nothing was imported').waitFor();
    await screenshot(page, `admin-catalogue-import-refused-${story.tag}`);
    await dialog.getByRole('button', { name: 'Cancel' }).click();
    await page.getByLabel('Search by maker or name').fill(maker);
    await page.getByText('No ball matches this search.').waitFor();

    await page.getByRole('button', { name: 'Import CSV' }).click();
    await dialog.getByLabel('Catalogue CSV file').setInputFiles({
      name: 'catalogue.csv',
      mimeType: 'text/csv',
      buffer: Buffer.from([CSV_HEADER, good1, good2].join('\n')),
    });
    await dialog.getByRole('button', { name: 'Import', exact: true }).click();
    await page.getByText('2 balls added.').waitFor();
    await page.getByRole('cell', { name: 'Harbor One', exact: true }).waitFor();
    await page.getByRole('cell', { name: 'Harbor Two', exact: true }).waitFor();
    expect(await hasHorizontalScroll(page)).toBe(false);
  });
});
