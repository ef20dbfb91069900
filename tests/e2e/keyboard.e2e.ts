import type { Locator, Page } from 'playwright-core';
import { describe, expect, it } from 'vitest';
import { DEMO, DEMO_PASSWORD, DESKTOP, eventually, useBrowser } from './browser';

/**
 * Keyboard only: no mouse click anywhere. Every control is reached with Tab (so it is in the tab order, in a sensible
 * place) and used with Enter, Space, digits or the arrow keys, as someone without a pointer would.
 */
const { open } = useBrowser(DESKTOP);

/** True when focus is on the element or inside it. */
async function hasFocus(target: Locator): Promise<boolean> {
  return target.evaluate((el) => el === document.activeElement || el.contains(document.activeElement));
}

/** Presses Tab until `target` has focus; fails when it is not reached within `max` presses (not in the tab order). */
async function tabTo(page: Page, target: Locator, max = 120): Promise<void> {
  await target.waitFor();
  for (let i = 0; i < max; i++) {
    if (await hasFocus(target)) return;
    await page.keyboard.press('Tab');
  }
  throw new Error(`not reached with ${max} presses of Tab: ${target.toString()}`);
}

/** The name of the option an open Element Plus select marks as the one Enter would pick. */
async function hoveredOption(page: Page): Promise<string> {
  return ((await page.locator('.el-select-dropdown__item.is-hovering').first().textContent()) ?? '').trim();
}

async function signInByKeyboard(page: Page, email: string): Promise<void> {
  await page.goto('/sign-in');
  await tabTo(page, page.getByLabel('E-mail'));
  await page.keyboard.type(email);
  await tabTo(page, page.getByLabel('Password'));
  await page.keyboard.type(DEMO_PASSWORD);
  await page.keyboard.press('Enter');
  await page.getByRole('heading', { level: 1, name: /^Welcome,/ }).waitFor();
}

const deck = (page: Page) => page.getByRole('group', { name: 'Pins left standing' });
const entryHeading = (page: Page) => page.getByRole('heading', { level: 2, name: /^Game \d+/ });

describe('keyboard only', () => {
  it('a bowler starts a session and logs a whole frame on the pin deck (the deck announces each pin’s state)', async () => {
    const { page } = await open();
    await signInByKeyboard(page, DEMO.dana);

    await page.goto('/sessions');
    await page.getByRole('heading', { level: 1, name: 'Sessions' }).waitFor();
    await tabTo(page, page.getByRole('button', { name: 'New session' }));
    await page.keyboard.press('Enter');
    const dialog = page.getByRole('dialog', { name: 'New session' });
    await dialog.waitFor();
    await tabTo(page, dialog.getByRole('button', { name: 'Start session' }));
    await page.keyboard.press('Enter');
    await page.waitForURL(/\/sessions\/\d+$/);
    await entryHeading(page)
      .filter({ hasText: /^Game 1 · frame 1, ball 1$/ })
      .waitFor();

    // The target board's Left button (a higher board for Dana, a right-hander), pressed with Enter: the new board is announced (focus stays on the button).
    await tabTo(page, page.getByRole('button', { name: 'Target board: left one board' }));
    await page.keyboard.press('Enter');
    const target = await page.getByLabel('Target board', { exact: true }).inputValue();
    expect(target).toMatch(/^\d+$/);
    await page
      .getByRole('status')
      .filter({ hasText: `Target board: board ${target}` })
      .waitFor({ state: 'attached' });

    // Ball 1: the 7 and the 10 left standing. Space toggles the focused pin, a digit toggles that pin.
    const pin7 = deck(page).getByRole('button', { name: 'Pin 7', exact: true });
    const pin10 = deck(page).getByRole('button', { name: 'Pin 10', exact: true });
    await tabTo(page, pin7);
    await page.keyboard.press('Space');
    expect(await pin7.getAttribute('aria-pressed')).toBe('true');
    await page.keyboard.press('0');
    expect(await pin10.getAttribute('aria-pressed')).toBe('true');
    // the deck's live summary says what a screen reader hears
    await deck(page).getByText('2 pins marked standing: 7, 10.').waitFor();
    await tabTo(page, page.getByRole('button', { name: 'Record: 8 down, 2 left' }));
    await page.keyboard.press('Enter');

    // Ball 2: both picked up — the spare.
    await entryHeading(page)
      .filter({ hasText: /^Game 1 · frame 1, ball 2$/ })
      .waitFor();
    expect(await deck(page).getByRole('button', { name: 'Pin 1, already down' }).isDisabled()).toBe(true);
    await tabTo(page, page.getByRole('button', { name: 'Spare', exact: true }));
    await page.keyboard.press('Enter');
    await entryHeading(page)
      .filter({ hasText: /^Game 1 · frame 2, ball 1$/ })
      .waitFor();
  });

  it('a bowler picks a condition and ranks the arsenal, then reads the result', async () => {
    const { page } = await open();
    await signInByKeyboard(page, DEMO.dana);
    await page.goto('/matchup');
    await page.getByRole('heading', { level: 1, name: 'Matchup' }).waitFor();

    const condition = page.getByRole('combobox', { name: 'Condition' });
    await eventually(() => condition.getAttribute('aria-disabled')).not.toBe('true');
    await tabTo(page, condition);
    await page.keyboard.press('Enter');
    await page.getByRole('option', { name: 'Long Haul 47', exact: true }).waitFor();
    let found = false;
    for (let i = 0; i < 60 && !found; i++) {
      await page.keyboard.press('ArrowDown');
      found = (await hoveredOption(page)) === 'Long Haul 47';
    }
    expect(found, 'Long Haul 47 reached with the arrow keys').toBe(true);
    await page.keyboard.press('Enter');
    await page.getByText(/long, heavy/).waitFor();

    await tabTo(page, page.getByRole('button', { name: 'Rank my arsenal' }));
    await page.keyboard.press('Enter');
    await page.getByRole('heading', { level: 2, name: 'Ranking for Long Haul 47, after 0 games' }).waitFor({ timeout: 60000 });
    const ranking = page.getByRole('table', { name: 'Ranking' });
    const balls = (await ranking.locator('tbody .matchup-ranking-table__name').allTextContents()).map((s) => s.trim()).filter(Boolean);
    expect(balls.length).toBeGreaterThanOrEqual(2);
    // the result can be reached from the keyboard too: the first ball's explanation opens with Enter
    const why = page.getByRole('button', { name: `Why: ${balls[0]}` });
    await tabTo(page, why);
    await page.keyboard.press('Enter');
    await eventually(() => why.getAttribute('aria-expanded')).toBe('true');
  });
});
