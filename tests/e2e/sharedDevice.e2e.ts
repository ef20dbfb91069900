import { describe, expect, it } from 'vitest';
import type { Page, Route } from 'playwright-core';
import { chooseOption, DEMO, DESKTOP, screenshot, signIn, startSession, useBrowser } from './browser';

/**
 * A shared device (a center's tablet, a family laptop): signing out leaves nothing of the bowler behind — no cached
 * arsenal or sessions in the page, no queued shots or session copies in localStorage — and the next bowler to sign in
 * on the same browser sees only their own.
 */
const { open } = useBrowser(DESKTOP);

/** Every localStorage key the app wrote (they all start with "lanewright."). */
const appKeys = (page: Page) =>
  page.evaluate(() =>
    Array.from({ length: window.localStorage.length }, (_, i) => window.localStorage.key(i) ?? '').filter((k) =>
      k.startsWith('lanewright.'),
    ),
  );

const refuseShots = async (route: Route) => (route.request().method() === 'POST' ? route.abort('internetdisconnected') : route.continue());

describe('shared device: signing out clears the user’s cached data and queued shots', () => {
  it('Dana signs out with a shot still queued; Lee signs in on the same browser and finds none of her sessions, balls or shots', async () => {
    const { page } = await open();
    await signIn(page, DEMO.dana);

    // Dana's data in the page: her arsenal (the session's ball list), a session with a shot that cannot reach the server.
    const sessionId = await startSession(page);
    await chooseOption(page, page.getByRole('combobox', { name: 'Ball' }), 'Big Red (Thunderhead Talon)');
    await page.route('**/api/sessions/*/shots', refuseShots);
    await page.getByRole('button', { name: 'Strike', exact: true }).click();
    await page.locator('[data-sync-status]').filter({ hasText: '1 shot waiting to sync' }).waitFor();
    const before = await appKeys(page);
    expect(before).toEqual(
      expect.arrayContaining(['lanewright.token', `lanewright.shotQueue.${sessionId}`, `lanewright.session.${sessionId}`]),
    );

    // Signing out names the unsent shot first, then removes everything.
    await page.getByRole('button', { name: 'Account menu for Dana Holloway' }).click();
    await page.getByRole('menuitem', { name: 'Sign out' }).click();
    const ask = page.getByRole('dialog', { name: 'Sign out and discard unsent shots?' });
    await ask.getByText('1 shot logged on this device has not been sent yet.').waitFor();
    await screenshot(page, 'shared-device-sign-out-desktop');
    await ask.getByRole('button', { name: 'Sign out anyway' }).click();
    await page.waitForURL(/\/sign-in/);
    expect(await appKeys(page)).toEqual([]);
    await page.unroute('**/api/sessions/*/shots', refuseShots);

    // Lee, on the same browser: none of Dana's sessions, balls or queued shots.
    await signIn(page, DEMO.lee);
    await page.goto('/sessions');
    await page.getByRole('heading', { level: 1, name: 'Sessions' }).waitFor();
    await page
      .getByRole('status')
      .filter({ hasText: /\d+ sessions?\.$/ })
      .waitFor();
    expect(await page.getByText('Shots waiting to sync on this device').count()).toBe(0);
    expect(await page.locator(`a[href="/sessions/${sessionId}"]`).count()).toBe(0);

    // Lee's own session: the ball list (the cached arsenal) is Lee's.
    await startSession(page);
    const ball = page.getByRole('combobox', { name: 'Ball' });
    await ball.focus();
    await page.keyboard.press('Enter');
    await page.getByRole('option', { name: 'Undertow Keel' }).waitFor();
    const options = (await page.getByRole('option').allTextContents()).map((s) => s.trim());
    expect(options).not.toContain('Big Red (Thunderhead Talon)');
    await page.keyboard.press('Escape');

    // Dana's session, asked for while the server cannot be reached: no copy of it is left to show.
    await page.route(`**/api/sessions/${sessionId}`, (route) => route.abort('internetdisconnected'));
    await page.goto(`/sessions/${sessionId}`);
    await page.getByRole('alert').filter({ hasText: 'Lanewright could not be reached' }).waitFor();
    expect(await page.getByText('Frame sheet').count()).toBe(0);
    const keys = await appKeys(page);
    expect(keys.filter((k) => k.endsWith(`.${sessionId}`))).toEqual([]);
    expect(keys).not.toContain(`lanewright.shotQueue.${sessionId}`);
    await screenshot(page, 'shared-device-next-user-desktop');
  });
});
