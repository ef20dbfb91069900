import { describe, expect, it } from 'vitest';
import type { Page } from 'playwright-core';
import { apiToken, DEMO, DESKTOP, hasHorizontalScroll, MOBILE, screenshot, signIn, uniqueEmail, useBrowser, verifyByMail } from './browser';

const { baseUrl, open } = useBrowser(DESKTOP);

/** The API as a signed-in user (JSON in and out; fails loudly on an unexpected status). */
function client(token: string) {
  return async <T>(method: string, path: string, body?: unknown, expected = [200, 201]): Promise<T> => {
    const res = await fetch(`${baseUrl}/api${path}`, {
      method,
      headers: { Authorization: `Bearer ${token}`, 'Content-Type': 'application/json', 'Idempotency-Key': crypto.randomUUID() },
      body: body === undefined ? undefined : JSON.stringify(body),
    });
    if (!expected.includes(res.status)) throw new Error(`${method} ${path}: ${res.status} ${await res.text()}`);
    return (res.status === 204 ? undefined : await res.json()) as T;
  };
}

/** A new, confirmed bowler and their API client. */
async function newBowler(name: string) {
  const email = uniqueEmail('decide');
  const reg = await fetch(`${baseUrl}/api/auth/register`, {
    method: 'POST',
    headers: { 'Content-Type': 'application/json' },
    body: JSON.stringify({ email, password: 'a-long-password-1', displayName: name }),
  });
  expect(reg.status).toBe(201);
  await verifyByMail(baseUrl, email);
  return { email, call: client(await apiToken(baseUrl, email, 'a-long-password-1')) };
}

async function catalogueModel(call: ReturnType<typeof client>, coverType: string): Promise<{ id: number; name: string }> {
  const page = await call<{ items: { id: number; name: string }[] }>('GET', `/catalogue?coverType=${coverType}&pageSize=5`);
  expect(page.items.length).toBeGreaterThan(0);
  return page.items[0];
}

/** Picks an option of an Element Plus select; only the open list's options count (a closed select keeps its list in the page, hidden). */
async function choose(page: Page, name: string, option: RegExp): Promise<void> {
  const combobox = page.getByRole('combobox', { name, exact: true });
  await expect.poll(() => combobox.getAttribute('aria-disabled')).not.toBe('true');
  await combobox.focus();
  await page.keyboard.press('Enter');
  const item = page.getByRole('option', { name: option }).filter({ visible: true }).first();
  await item.waitFor();
  // The list opens with a CSS transition that, with another select's list closing, never settles for Playwright's
  // stability check: the transitions are run to their end instead (what a user waits for without noticing).
  await page.evaluate(() => document.getAnimations().forEach((a) => a.finish()));
  await item.click();
}

describe('decide: trials, the layout lab and coverage', () => {
  it('at 375 px a bowler opens a trial of two layouts, logs shots with each, and reads the verdict', async () => {
    const { email, call } = await newBowler('Quinn Harrow');
    const model = await catalogueModel(call, 'reactive-solid');
    const up = await call<{ item: { id: number } }>('POST', '/arsenal', {
      ballModelId: model.id,
      weightLb: 15,
      nickname: 'Pin up',
      layout: { pinToPapIn: 4.5, drillingAngleDeg: 50 },
    });
    const down = await call<{ item: { id: number } }>('POST', '/arsenal', {
      ballModelId: model.id,
      weightLb: 15,
      nickname: 'Pin down',
      layout: { pinToPapIn: 2.5, drillingAngleDeg: 70 },
    });
    const session = await call<{ item: { id: number } }>('POST', '/sessions', {
      date: new Date().toISOString().slice(0, 10),
      kind: 'practice',
    });

    const { page } = await open(MOBILE);
    await signIn(page, email, 'a-long-password-1');
    await page.goto('/decide');
    await page.getByRole('heading', { level: 1, name: 'Decide' }).waitFor();
    await page.getByRole('button', { name: 'New trial' }).click();
    const dialog = page.getByRole('dialog', { name: 'New trial' });
    await dialog.getByLabel('Name').fill('Pin up or pin down');
    await choose(page, 'Ball 1', /Pin up/);
    await choose(page, 'Ball 2', /Pin down/);
    await dialog.getByRole('button', { name: 'Open the trial' }).click();
    await page.waitForURL(/\/decide\/trials\/\d+$/);
    const trialId = Number(/\/trials\/(\d+)$/.exec(page.url())![1]);
    await page.getByRole('heading', { level: 2, name: 'Not enough shots yet' }).waitFor();

    // Shots at the lanes: a strike with the pin-up ball and a 10-pin leave, spared, with the pin-down ball, on the session screen …
    await page.goto(`/sessions/${session.item.id}`);
    await choose(page, 'Ball', /Pin up/);
    await page.getByRole('button', { name: 'Strike', exact: true }).click();
    await page.getByRole('heading', { level: 2, name: /^Game 1 · frame 2, ball 1$/ }).waitFor();
    await choose(page, 'Ball', /Pin down/);
    await page.getByRole('group', { name: 'Pins left standing' }).getByRole('button', { name: 'Pin 10', exact: true }).click();
    await page.getByRole('button', { name: /^Record: / }).click();
    await page.getByRole('heading', { level: 2, name: /^Game 1 · frame 2, ball 2$/ }).waitFor();
    await page.getByRole('button', { name: 'Spare', exact: true }).click();
    await page.getByRole('heading', { level: 2, name: /^Game 1 · frame 3, ball 1$/ }).waitFor();
    // … and the rest of the evening's practice (two games a ball) through the API, as the shot queue would send it.
    for (const [game, ballId, strike] of [
      [2, up.item.id, true],
      [3, down.item.id, false],
      [4, up.item.id, true],
      [5, down.item.id, false],
    ] as const) {
      for (let frame = 1; frame <= 9; frame++) {
        if (strike)
          await call('POST', `/sessions/${session.item.id}/shots`, { gameNumber: game, frame, delivery: 1, ballId, standing: [] });
        else {
          await call('POST', `/sessions/${session.item.id}/shots`, { gameNumber: game, frame, delivery: 1, ballId, standing: [10] });
          await call('POST', `/sessions/${session.item.id}/shots`, { gameNumber: game, frame, delivery: 2, ballId, standing: [] });
        }
      }
    }

    await page.goto(`/decide/trials/${trialId}`);
    await page.getByRole('heading', { level: 2, name: /^Verdict: .*Pin up/ }).waitFor();
    const table = page.getByRole('table', { name: 'Each arm’s figures' });
    await expect
      .poll(() =>
        table
          .getByRole('row', { name: /Pin up/ })
          .getByRole('cell')
          .first()
          .textContent(),
      )
      .toBe('19 of 19');
    expect(
      await table
        .getByRole('row', { name: /Pin down/ })
        .getByRole('cell')
        .first()
        .textContent(),
    ).toBe('0 of 19');
    expect(
      await table
        .getByRole('row', { name: /Pin down/ })
        .getByRole('cell')
        .nth(4)
        .textContent(),
    ).toBe('10 pin: 19 of 19');
    expect(await hasHorizontalScroll(page)).toBe(false);
    await screenshot(page, 'decide-trial-mobile');
  });

  it('at 1280 px the layout lab draws two layouts of a ball with their flare rings and paths', async () => {
    const { page } = await open(DESKTOP);
    await signIn(page, DEMO.dana);
    await page.goto('/decide?tab=layouts');
    await choose(page, 'Ball', /Big Red/);
    await choose(page, 'Pattern', /./);
    await page.getByLabel('Layout 2 pin-to-PAP').fill('2');
    await page.getByLabel('Layout 2 pin-to-PAP').blur();
    await page.getByRole('button', { name: 'Compare layouts' }).click();
    const drawings = page.getByRole('img', { name: /track rings spreading/ });
    await expect.poll(() => drawings.count()).toBe(2);
    const names = await drawings.evaluateAll((els) => els.map((e) => e.getAttribute('aria-label') ?? ''));
    const flare = names.map((n) => Number(/spreading ([\d.]+) in/.exec(n)![1]));
    expect(names[0]).toMatch(/^As drilled: pin 4 1\/2 in from the PAP/);
    expect(flare[0]).toBeGreaterThan(flare[1]); // the pin at 2 in flares less than at 4 1/2 in
    await page.getByText('Drilling, plugging and fitting are work for a qualified pro-shop technician.').waitFor();
    await screenshot(page, 'decide-layout-lab-desktop');
  });

  it('at 1280 px coverage lists the planted gap (no ball for a followed center’s heavy lanes) with a catalogue suggestion', async () => {
    const { email, call } = await newBowler('Sage Whitlow');
    const pearl = await catalogueModel(call, 'reactive-pearl');
    await call('POST', '/arsenal', { ballModelId: pearl.id, weightLb: 15, surfaceGrit: 4000, polished: true });
    const admin = client(await apiToken(baseUrl, DEMO.admin));
    const owner = client(await apiToken(baseUrl, DEMO.proprietor));
    const ownerId = (await owner<{ user: { id: number } }>('GET', '/auth/me')).user.id;
    const center = await admin<{ item: { id: number } }>('POST', '/centers', {
      name: 'Fallow Reach Lanes',
      town: 'Marrow Bend',
      laneCount: 24,
      ownerId,
    });
    const sweep = (fromBoard: number, toBoard: number, endFt: number) => ({
      direction: 'forward',
      fromBoard,
      toBoard,
      startFt: 0,
      endFt,
      crossings: 4,
      microlitersPerBoard: 60,
    });
    const heavy = await owner<{ item: { id: number } }>('POST', '/patterns', {
      name: 'Fallow league heavy',
      sweeps: [sweep(2, 38, 44), sweep(8, 32, 42), sweep(14, 26, 40)],
    });
    await owner('POST', `/centers/${center.item.id}/conditions`, {
      patternId: heavy.item.id,
      lanes: [1, 2, 3, 4, 5, 6, 7, 8, 9, 10, 11, 12],
      validFrom: new Date().toISOString().slice(0, 10),
    });
    await call('POST', `/centers/${center.item.id}/follow`);

    const { page } = await open(DESKTOP);
    await signIn(page, email, 'a-long-password-1');
    await page.goto('/decide?tab=coverage');
    await page.getByRole('heading', { level: 2, name: 'Gaps' }).waitFor();
    const gap = page.getByRole('listitem').filter({ hasText: 'Fallow Reach Lanes, lanes 1–12: Fallow league heavy, fresh' });
    await gap.waitFor();
    expect(await gap.textContent()).toMatch(/more ball than any in the bag/);
    expect(await gap.textContent()).toMatch(/From the catalogue: .+ at \d+ grit/);
    await screenshot(page, 'decide-coverage-desktop');
  });
});
