import { describe, expect, it } from 'vitest';
import type { Page } from 'playwright-core';
import { apiToken, chooseOption, DEMO, DESKTOP, eventually, screenshot, signIn, startSession, useBrowser } from './browser';

/**
 * The units preference reaches every screen: a bowler who chose metric on Profile sees km/h, kg, cm and m on the
 * Matchup, Ball, Session, Coach, Catalogue and pattern editor screens, and types a ball's weight in kg (the stored
 * values stay in the trade's units; the page converts them).
 * Expected figures are worked out here from the international definitions (NIST Handbook 44, appendix C):
 * 1 mile = 1.609344 km, 1 lb = 0.45359237 kg, 1 in = 2.54 cm, 1 ft = 0.3048 m.
 */
const { baseUrl, open } = useBrowser(DESKTOP);

const M_PER_FT = 0.3048;
const CM_PER_IN = 2.54;
const KG_PER_LB = 0.45359237;
/** An imperial unit written after a number ("17.0 mph", "15 lb", "4.500 in", "41.0 ft"). */
const IMPERIAL = /\d\s*(mph|lb|in|ft)\b/;

async function api<T>(method: string, path: string, token: string, body?: unknown): Promise<{ status: number; json: T }> {
  const res = await fetch(`${baseUrl}/api${path}`, {
    method,
    headers: { Authorization: `Bearer ${token}`, 'Content-Type': 'application/json' },
    body: body === undefined ? undefined : JSON.stringify(body),
  });
  return { status: res.status, json: (await res.json()) as T };
}

/** Saves the account's profile with `units` chosen, the rest as it is (what the Profile form does). */
async function chooseUnits(email: string, units: 'metric' | 'imperial'): Promise<{ speedMph: number }> {
  const token = await apiToken(baseUrl, email);
  const { json } = await api<{ profile: Record<string, unknown> & { speedMph: number } }>('GET', '/profile', token);
  const saved = await api<{ profile: { units: string; speedMph: number } }>('PUT', '/profile', token, { ...json.profile, units });
  expect(saved.status).toBe(200);
  expect(saved.json.profile.units).toBe(units);
  return saved.json.profile;
}

const text = async (page: Page, selector: string) =>
  ((await page.locator(selector).first().textContent()) ?? '').replace(/\s+/g, ' ').trim();

describe('units: a metric bowler sees km/h, kg, cm and m on Matchup, Ball, Session, Coach, Catalogue and the pattern editor', () => {
  it('Matchup: the pattern, the ranking, the lane view and the what-if in metric units', async () => {
    await chooseUnits(DEMO.dana, 'metric');
    const { page } = await open();
    await signIn(page, DEMO.dana);
    await page.goto('/matchup');
    await page.getByRole('heading', { level: 1, name: 'Matchup' }).waitFor();
    await chooseOption(page, page.getByRole('combobox', { name: 'Condition' }), 'Long Haul 47');
    // 47 ft of oil = 14.3 m
    await page
      .locator('.matchup__pattern')
      .filter({ hasText: `${(47 * M_PER_FT).toFixed(1)} m · ` })
      .waitFor();
    await page.getByRole('button', { name: 'Rank my arsenal' }).click();
    await page.getByRole('heading', { level: 2, name: 'Ranking for Long Haul 47, after 0 games' }).waitFor({ timeout: 60000 });

    const table = page.getByRole('table', { name: 'Ranking' });
    expect(await text(page, 'table[aria-label="Ranking"] thead')).toContain('board at m');
    const firstRow = table.locator('tbody tr[data-ball-id]').first();
    const cells = (await firstRow.locator('td.matchup-ranking-table__pred').allTextContents()).map((s) => s.trim());
    expect(cells[0]).toMatch(/^\d+\.\d m$/); // skid
    expect(cells[1]).toMatch(/^\d+\.\d at \d+\.\d m$/); // breakpoint
    for (const c of cells) expect(c).not.toMatch(IMPERIAL);

    // Why: the line used, the speed at the pins in km/h.
    const name = ((await firstRow.locator('.matchup-ranking-table__name').textContent()) ?? '').trim();
    await page.getByRole('button', { name: `Why: ${name}` }).click();
    const line = page.locator('.matchup-ranking-table__line').first();
    await line.waitFor();
    expect(((await line.textContent()) ?? '').replace(/\s+/g, ' ').trim()).toMatch(/ s at \d+\.\d km\/h\.$/);
    // The engine's reasons and suggestions (written in feet, mph and pounds) read in metres, km/h and kg.
    expect(await text(page, '.matchup-ranking-table__why')).not.toMatch(/\d\s*(mph|lb|ft)\b/);

    // The lane view's scale and table.
    const note = await text(page, '.matchup-lane-view__note');
    expect(note).toContain(
      `Arrows at ${(15 * M_PER_FT).toFixed(1)} m, dots at ${(7 * M_PER_FT).toFixed(1)} m, headpin at ${(60 * M_PER_FT).toFixed(1)} m.`,
    );
    expect(note).not.toMatch(IMPERIAL);

    // The what-if: Big Red (4 1/2 in pin-to-PAP = 11.4 cm), its pin-to-PAP field in centimetres, the breakpoint in metres.
    await chooseOption(page, page.getByRole('combobox', { name: 'What-if ball' }), 'Big Red (Thunderhead Talon)');
    await page
      .locator('.matchup-what-if__now')
      .filter({ hasText: `${(4.5 * CM_PER_IN).toFixed(1)} cm pin-to-PAP` })
      .waitFor();
    await page.getByText('Pin-to-PAP (cm)').waitFor();
    expect(await page.getByLabel('What-if pin-to-PAP').inputValue()).toBe((4.5 * CM_PER_IN).toFixed(1));
    await chooseOption(page, page.getByRole('combobox', { name: 'What-if grit' }), '4000 grit');
    const change = page.getByTestId('what-if-breakpoint-change');
    await change.waitFor({ timeout: 60000 });
    const changeText = ((await change.textContent()) ?? '').trim();
    expect(changeText).toMatch(/board \d+\.\d at \d+\.\d m → board \d+\.\d at \d+\.\d m\.$/);
    expect(changeText).not.toMatch(IMPERIAL);
    await screenshot(page, 'units-matchup-metric-desktop');
  });

  it('Ball: the specs, the weight and the layout in metric units', async () => {
    await chooseUnits(DEMO.dana, 'metric');
    const { page } = await open();
    await signIn(page, DEMO.dana);
    await page.goto('/arsenal');
    await page.getByRole('link', { name: 'Big Red', exact: true }).click();
    await page.getByRole('heading', { level: 1, name: 'Big Red' }).waitFor();
    const spec = (term: string) => page.locator('dt', { hasText: new RegExp(`^${term}$`) }).locator('xpath=following-sibling::dd[1]');
    await eventually(async () => ((await spec('Weight').textContent()) ?? '').trim()).toBe(`${(15 * KG_PER_LB).toFixed(1)} kg`);
    expect(((await spec('RG').textContent()) ?? '').trim()).toMatch(/^\d+\.\d\d cm$/);
    expect(((await spec('Differential').textContent()) ?? '').trim()).toMatch(/^\d\.\d\d\d? cm$/);
    await page.getByText(`${(4.5 * CM_PER_IN).toFixed(1)} cm pin-to-PAP, 50° drilling angle, 40° VAL angle`).waitFor();
    expect(await text(page, '.ball-view__specs')).not.toMatch(IMPERIAL);
    await screenshot(page, 'units-ball-metric-desktop');
  });

  it('Session: the chosen ball’s weight and layout in metric units', async () => {
    await chooseUnits(DEMO.dana, 'metric');
    const { page } = await open();
    await signIn(page, DEMO.dana);
    await startSession(page);
    await chooseOption(page, page.getByRole('combobox', { name: 'Ball' }), 'Big Red (Thunderhead Talon)');
    const specs = page.locator('[data-ball-specs]');
    await specs.filter({ hasText: `${(15 * KG_PER_LB).toFixed(1)} kg · ${(4.5 * CM_PER_IN).toFixed(1)} cm pin-to-PAP` }).waitFor();
    expect(((await specs.textContent()) ?? '').trim()).not.toMatch(IMPERIAL);
    await screenshot(page, 'units-session-metric-desktop');
  });

  it('Coach: the student’s release speed and the side by side in metric units', async () => {
    await chooseUnits(DEMO.coach, 'metric');
    const dana = await chooseUnits(DEMO.dana, 'imperial'); // the student's own choice does not matter to the coach
    const { page } = await open();
    await signIn(page, DEMO.coach);
    await page.goto('/coach');
    await page.getByRole('button', { name: 'Open Dana Holloway' }).click();
    const kmh = `${(dana.speedMph * 1.609344).toFixed(1)} km/h`;
    await page.getByText(new RegExp(`-handed, ${kmh.replace('/', '\\/')}, \\d+ rpm`)).waitFor();
    await page.getByRole('heading', { level: 3, name: 'Side by side: two balls, or two versions of one' }).waitFor();
    await page.locator('.coach-what-if').getByText(`release: ${kmh},`, { exact: false }).waitFor();
    await page.getByText('Pin-to-PAP (cm)').first().waitFor();
    expect(await page.getByText(/\d\s*mph\b/).count()).toBe(0);
    await screenshot(page, 'units-coach-metric-desktop');
  });

  it('Catalogue: the ball dialog takes the weight in kg and saves the same pounds; RG and differentials stay in inches', async () => {
    await chooseUnits(DEMO.dana, 'metric');
    const token = await apiToken(baseUrl, DEMO.dana);
    const { page } = await open();
    await signIn(page, DEMO.dana);
    await page.goto('/catalogue');
    await page.getByRole('heading', { level: 1, name: 'Catalogue' }).waitFor();
    await page
      .getByTestId('catalogue-units')
      .filter({ hasText: `${CM_PER_IN.toFixed(2)} cm to the inch` })
      .waitFor();
    expect(await text(page, '.catalogue__table thead')).toContain('RG (in)');

    await page
      .getByRole('button', { name: /^Add .+ to arsenal$/ })
      .first()
      .click();
    const dialog = page.getByRole('dialog', { name: /to your arsenal$/ });
    const weight = dialog.getByLabel('Weight (kg)');
    // A new ball starts at 15 lb: 6.80 kg.
    await eventually(() => weight.inputValue()).toBe((15 * KG_PER_LB).toFixed(2));
    // The 18 lb limit in kg, kept inside the stored rule.
    await weight.fill('9');
    await dialog.getByRole('button', { name: 'Add to arsenal' }).click();
    await dialog.getByText(`At most ${Math.floor(18 * KG_PER_LB * 100) / 100} kg`).waitFor();
    // 16 lb typed as 7.26 kg.
    await weight.fill('7.26');
    await weight.press('Tab');
    await dialog.getByLabel('Pin-to-PAP (in)').fill('4 1/2');
    await dialog.getByLabel('Pin-to-PAP (in)').press('Tab');
    await dialog
      .getByTestId('pin-to-pap-metric')
      .filter({ hasText: `${(4.5 * CM_PER_IN).toFixed(1)} cm` })
      .waitFor();
    const nickname = `Metric ${Date.now().toString(36)}`;
    await dialog.getByLabel('Nickname (optional)').fill(nickname);
    await screenshot(page, 'units-catalogue-dialog-metric-desktop');
    await dialog.getByRole('button', { name: 'Add to arsenal' }).click();
    // A model already in the bag asks first (the duplicate warning): a second copy is added on purpose here.
    const again = page.getByRole('dialog', { name: 'Add this ball again?' });
    const added = page.getByText(`${nickname} is in your arsenal.`).first();
    await Promise.race([added.waitFor(), again.waitFor().then(() => again.getByRole('button', { name: 'Add another' }).click())]);
    await added.waitFor();

    const { json } = await api<{ items: { id: number; nickname: string; weightLb: number }[] }>(
      'GET',
      `/arsenal?q=${encodeURIComponent(nickname)}`,
      token,
    );
    const saved = json.items.find((b) => b.nickname === nickname);
    expect(saved, 'the ball added in kg').toBeDefined();
    // 7.26 kg is 16.006 lb: stored to 0.01 lb, within the field's 10 g of 16 lb.
    expect(Math.abs(saved!.weightLb - 7.26 / KG_PER_LB)).toBeLessThanOrEqual(0.005 + 1e-9);
    expect(Math.abs(saved!.weightLb - 16)).toBeLessThanOrEqual(0.005 / KG_PER_LB + 0.005);

    // Opened again, the field shows the same kilograms.
    await page.goto(`/arsenal/${saved!.id}`);
    await page.getByRole('button', { name: 'Edit ball' }).click();
    const edit = page.getByRole('dialog', { name: new RegExp(`^Edit ${nickname}$`) });
    await eventually(() => edit.getByLabel('Weight (kg)').inputValue()).toBe('7.26');
  });

  it('Pattern editor: the length, the length class and the oil map in metres; boards stay boards', async () => {
    await chooseUnits(DEMO.coach, 'metric');
    const { page } = await open();
    await signIn(page, DEMO.coach);
    await page.goto('/patterns/new');
    await page.getByRole('heading', { level: 1, name: 'New pattern' }).waitFor();
    // The new pattern's one sweep runs 0–40 ft: 12.2 m of oil.
    await page.locator('[data-number="length"] .pattern-numbers__value', { hasText: `${(40 * M_PER_FT).toFixed(1)} m` }).waitFor();
    expect(await text(page, '[data-number="lengthClass"] .pattern-numbers__value')).toMatch(/^\w+ \(.*\d+\.\d m.*\)$/);
    await page
      .getByTestId('sweep-1-endFt-metres')
      .filter({ hasText: `= ${(40 * M_PER_FT).toFixed(2)} m` })
      .waitFor();

    const map = page.locator('.lane-oil-map');
    expect(await text(page, '.lane-oil-map__note.lw-muted')).toContain(
      `Arrows at ${(15 * M_PER_FT).toFixed(1)} m, dots at ${(7 * M_PER_FT).toFixed(1)} m.`,
    );
    expect(await text(page, '.lane-oil-map__note:not(.lw-muted)')).toMatch(
      new RegExp(`^Oil from the foul line to about ${(40 * M_PER_FT).toFixed(1)} m\\. .* on board \\d+ at \\d+\\.\\d m\\.$`),
    );
    await map.getByText('Oil map as a table').click();
    const rowHeads = (await map.locator('tbody th[scope="row"]').allTextContents()).map((t) => t.trim());
    expect(rowHeads[1]).toBe(`${(5 * M_PER_FT).toFixed(1)} m`);
    expect(await text(page, '.lane-oil-map__table thead')).toContain('Board 20');
    expect(await text(page, '.pattern-numbers')).not.toMatch(/\d\s*ft\b/);
    await screenshot(page, 'units-pattern-editor-metric-desktop');
  });
});
