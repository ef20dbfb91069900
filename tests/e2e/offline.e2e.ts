import { describe, expect, it } from 'vitest';
import type { Page } from 'playwright-core';
// The engine is the reference for scores (pure code, no I/O): the sheet's total must equal scoreGame of the same rolls.
import { scoreGame } from '../../engine/index';
import { DEMO, DESKTOP, MOBILE, eventually, hasHorizontalScroll, screenshot, signIn, startSession, useBrowser } from './browser';

/**
 * The installable app with no signal: the app is opened once (its service worker stores the shell), the connection
 * drops, the tab is closed and opened again, and the bowler opens the session, logs a whole game, takes one shot back
 * and writes a note, all offline. Back online, every shot is stored once and in order and the sheet's total is the
 * engine's score. Playwright's offline mode applies to the page and to the service worker's own fetches in Chromium.
 */
const { baseUrl, open } = useBrowser(MOBILE);

/** One delivery: the pins left standing (none = the Strike or Spare button) and the pins it scores. */
interface Throw {
  frame: number;
  delivery: number;
  standing: number[];
  pins: number;
}

/** X | 7 2 | 9 / | X | 8 1 | 6 / | X | 9 - | 8 / | X 9 / */
const GAME: Throw[] = [
  { frame: 1, delivery: 1, standing: [], pins: 10 },
  { frame: 2, delivery: 1, standing: [4, 7, 10], pins: 7 },
  { frame: 2, delivery: 2, standing: [10], pins: 2 },
  { frame: 3, delivery: 1, standing: [6], pins: 9 },
  { frame: 3, delivery: 2, standing: [], pins: 1 },
  { frame: 4, delivery: 1, standing: [], pins: 10 },
  { frame: 5, delivery: 1, standing: [2, 10], pins: 8 },
  { frame: 5, delivery: 2, standing: [10], pins: 1 },
  { frame: 6, delivery: 1, standing: [3, 6, 9, 10], pins: 6 },
  { frame: 6, delivery: 2, standing: [], pins: 4 },
  { frame: 7, delivery: 1, standing: [], pins: 10 },
  { frame: 8, delivery: 1, standing: [7], pins: 9 },
  { frame: 8, delivery: 2, standing: [7], pins: 0 },
  { frame: 9, delivery: 1, standing: [8, 10], pins: 8 },
  { frame: 9, delivery: 2, standing: [], pins: 2 },
  { frame: 10, delivery: 1, standing: [], pins: 10 },
  { frame: 10, delivery: 2, standing: [5], pins: 9 },
  { frame: 10, delivery: 3, standing: [], pins: 1 },
];

const deck = (page: Page) => page.getByRole('group', { name: 'Pins left standing' });
const entryHeading = (page: Page) => page.getByRole('heading', { level: 2, name: /^Game \d+/ });
const syncStatus = (page: Page) => page.locator('[data-sync-status]');
const connection = (page: Page) => page.locator('[data-connection-status]');

const headingOf = (t: Throw | undefined) =>
  t ? new RegExp(`^Game 1 · frame ${t.frame}, ball ${t.delivery}$`) : /^Game 2 · frame 1, ball 1$/;

/** Taps the pins left standing (or Strike/Spare) and records the delivery; waits for the next one to be asked. */
async function log(page: Page, i: number): Promise<void> {
  const t = GAME[i];
  await entryHeading(page)
    .filter({ hasText: headingOf(t) })
    .waitFor();
  if (t.standing.length === 0) {
    const fullRack = t.delivery === 1 || (t.frame === 10 && GAME[i - 1]?.standing.length === 0);
    await page.getByRole('button', { name: fullRack ? 'Strike' : 'Spare', exact: true }).click();
  } else {
    for (const pin of t.standing)
      await deck(page)
        .getByRole('button', { name: `Pin ${pin}`, exact: true })
        .click();
    await page.getByRole('button', { name: /^Record: / }).click();
  }
  await entryHeading(page)
    .filter({ hasText: headingOf(GAME[i + 1]) })
    .waitFor();
}

interface StoredShot {
  id: number;
  gameNumber: number;
  frame: number;
  delivery: number;
  standing: number[];
}

async function storedSession(token: string, id: number): Promise<{ notes: string | null; shots: StoredShot[] }> {
  const res = await fetch(`${baseUrl}/api/sessions/${id}`, { headers: { Authorization: `Bearer ${token}` } });
  expect(res.status).toBe(200);
  return ((await res.json()) as { item: { notes: string | null; shots: StoredShot[] } }).item;
}

describe('offline: the installable app opens and logs a game with no connection', () => {
  it('serves a manifest and a service worker that are never cached by HTTP, and the API never through the service worker', async () => {
    const manifest = await fetch(`${baseUrl}/manifest.webmanifest`);
    expect(manifest.status).toBe(200);
    expect(manifest.headers.get('cache-control')).toBe('no-cache');
    const body = (await manifest.json()) as {
      name: string;
      display: string;
      start_url: string;
      icons: { sizes: string; purpose?: string }[];
    };
    expect(body.name).toBe('Lanewright');
    expect(body.display).toBe('standalone');
    expect(body.icons.map((i) => i.sizes)).toEqual(expect.arrayContaining(['192x192', '512x512']));
    expect(body.icons.some((i) => i.purpose === 'maskable')).toBe(true);
    for (const icon of ['/icon-192.png', '/icon-512.png', '/icon-maskable-512.png']) {
      const res = await fetch(`${baseUrl}${icon}`);
      expect(res.status, icon).toBe(200);
      expect(res.headers.get('content-type')).toBe('image/png');
    }

    const sw = await fetch(`${baseUrl}/sw.js`);
    expect(sw.status).toBe(200);
    expect(sw.headers.get('cache-control')).toBe('no-cache');
    expect(sw.headers.get('content-type')).toMatch(/javascript/);
    const code = await sw.text();
    // The precache holds the shell, the fonts and the engine's worker; navigations fall back to the shell but /api/.
    expect(code).toContain('index.html');
    expect(code).toMatch(/\.woff2/);
    expect(code).toMatch(/engine\.worker[^"]*\.js/);
    expect(code).toContain('^\\/api\\/');
    const csp = (await fetch(`${baseUrl}/`)).headers.get('content-security-policy') ?? '';
    expect(csp).toContain("worker-src 'self'");
    expect(csp).toContain("manifest-src 'self'");
  });

  it('opens again with no connection, logs a whole game with an undo and a note, then syncs every shot once and in order', async () => {
    const { page, context } = await open(MOBILE, { serviceWorkers: true });
    await signIn(page, DEMO.dana);
    const sessionId = await startSession(page);
    await page.getByRole('heading', { level: 1, name: /^Practice · \d{4}-\d{2}-\d{2}$/ }).waitFor();
    // One shot is logged (and stored) while the signal holds; it is taken back offline below.
    await log(page, 0);
    await syncStatus(page).filter({ hasText: 'All shots saved.' }).waitFor();
    const first = (await storedSession(await page.evaluate(() => window.localStorage.getItem('lanewright.token')!), sessionId)).shots;
    expect(first).toHaveLength(1);
    // The reads a bowler needs later are seen once online: the arsenal, the sessions list, today's conditions (Home).
    await page.goto('/arsenal');
    await page.getByRole('heading', { level: 1, name: 'Arsenal' }).waitFor();
    await page.goto('/sessions');
    await page.locator(`a[href="/sessions/${sessionId}"]`).first().waitFor();
    await page.goto('/');
    await page.getByRole('heading', { level: 1, name: /^Welcome,/ }).waitFor();
    // The service worker is installed (its precache complete) and in control of the page.
    await eventually(() => page.evaluate(async () => (await navigator.serviceWorker.ready).active?.state)).toBe('activated');
    // A worker waiting for its first clients takes the next navigation (no clients.claim with an update prompt).
    await page.reload();
    await page.getByRole('heading', { level: 1, name: /^Welcome,/ }).waitFor();
    expect(await page.evaluate(() => navigator.serviceWorker.controller !== null)).toBe(true);
    const token = await page.evaluate(() => window.localStorage.getItem('lanewright.token'));
    expect(token).toBeTruthy();

    // No signal; the tab is closed and opened again.
    await context.setOffline(true);
    await page.close();
    const again = await context.newPage();
    const errors: string[] = [];
    again.on('pageerror', (err) => errors.push(err.message));
    await again.goto('/');
    await again.getByRole('heading', { level: 1, name: /^Welcome,/ }).waitFor();
    await connection(again).filter({ hasText: 'No connection.' }).waitFor();
    await screenshot(again, 'offline-home-mobile');
    expect(await hasHorizontalScroll(again)).toBe(false);

    // The sessions list as last seen, and the session from it.
    await again.goto('/sessions');
    await again.locator(`a[href="/sessions/${sessionId}"]`).first().click();
    await again.waitForURL(new RegExp(`/sessions/${sessionId}$`));
    await again.getByText('No connection: showing this session as it was last loaded.').waitFor();

    // The stored shot is taken back with no connection: the undo waits on this device.
    await entryHeading(again)
      .filter({ hasText: headingOf(GAME[1]) })
      .waitFor();
    await again.getByRole('button', { name: 'Undo last shot' }).click();
    await again.getByRole('dialog', { name: 'Undo the last shot?' }).getByRole('button', { name: 'Undo it' }).click();
    await syncStatus(again).filter({ hasText: '1 undo waiting to sync' }).waitFor();

    // A whole game, one queued shot taken back and logged again, all with no connection.
    for (let i = 0; i < GAME.length - 1; i++) await log(again, i);
    await again.getByRole('button', { name: 'Undo last shot' }).click();
    await again.getByRole('dialog', { name: 'Undo the last shot?' }).getByRole('button', { name: 'Undo it' }).click();
    await entryHeading(again)
      .filter({ hasText: headingOf(GAME[GAME.length - 2]) })
      .waitFor();
    await log(again, GAME.length - 2);
    await log(again, GAME.length - 1);
    await syncStatus(again)
      .filter({ hasText: `1 undo and ${GAME.length} shots waiting to sync` })
      .waitFor();

    // A note, kept on this device.
    const note = `Lanes tighter after the resurface, offline ${process.pid}`;
    await again.getByRole('button', { name: 'Edit notes' }).click();
    await again.getByLabel('Notes').fill(note);
    await again.getByRole('button', { name: 'Save notes' }).click();
    await again.getByText('Not sent yet: kept on this device').waitFor();
    await connection(again)
      .filter({ hasText: `Waiting to send: 1 undo, ${GAME.length} shots and 1 note.` })
      .waitFor();
    const queued = await again.evaluate(
      (id) => JSON.parse(window.localStorage.getItem(`lanewright.shotQueue.${id}`) ?? '[]') as { key: string }[],
      sessionId,
    );
    expect(queued).toHaveLength(GAME.length);
    expect(new Set(queued.map((q) => q.key)).size).toBe(GAME.length);
    const expected = scoreGame(GAME.map((t) => t.pins));
    const sheet = again.getByRole('region', { name: 'Game 1 frame sheet' });
    expect(Number(await sheet.locator('[data-game-total]').textContent())).toBe(expected.total);
    await screenshot(again, 'offline-session-mobile');
    expect(await hasHorizontalScroll(again)).toBe(false);
    // Nothing reached the server while offline: it still holds the first shot only.
    expect((await storedSession(token!, sessionId)).shots.map((s) => s.id)).toEqual(first.map((s) => s.id));

    // The signal returns: the shots go in order, then the note.
    await context.setOffline(false);
    await syncStatus(again).filter({ hasText: 'All shots saved.' }).waitFor({ timeout: 60000 });
    await connection(again).waitFor({ state: 'detached', timeout: 60000 });
    await again.getByText('Not sent yet: kept on this device').waitFor({ state: 'detached' });

    const stored = await storedSession(token!, sessionId);
    expect(stored.notes).toBe(note);
    expect(stored.shots).toHaveLength(GAME.length);
    // The undo went first (the first stored shot is gone), then every shot once, in the order logged.
    expect(stored.shots.some((s) => s.id === first[0].id)).toBe(false);
    const byId = [...stored.shots].sort((a, b) => a.id - b.id);
    expect(byId.map((s) => [s.gameNumber, s.frame, s.delivery, s.standing])).toEqual(GAME.map((t) => [1, t.frame, t.delivery, t.standing]));
    expect(Number(await sheet.locator('[data-game-total]').textContent())).toBe(expected.total);
    for (let f = 1; f <= 10; f++)
      await sheet.getByRole('listitem', { name: new RegExp(`^Frame ${f}: .*; total ${expected.frames[f - 1]}$`) }).waitFor();
    await eventually(() => again.evaluate((id) => window.localStorage.getItem(`lanewright.shotQueue.${id}`), sessionId)).toBeNull();
    expect(errors).toEqual([]);
    await again.close();
  });

  it('keeps no API answer for another user: signing out removes the offline copies', async () => {
    const { page } = await open(DESKTOP, { serviceWorkers: true });
    await signIn(page, DEMO.dana);
    await page.goto('/arsenal');
    await page.getByRole('heading', { level: 1, name: 'Arsenal' }).waitFor();
    const copies = () => page.evaluate(() => Object.keys(window.localStorage).filter((k) => k.startsWith('lanewright.offline.')));
    await eventually(async () => (await copies()).length).toBeGreaterThan(0);
    // Keys carry a hash of the token, never the token.
    const token = await page.evaluate(() => window.localStorage.getItem('lanewright.token'));
    expect((await copies()).some((k) => k.includes(token!))).toBe(false);
    // The service worker caches no API answer.
    const cachedApi = await page.evaluate(async () => {
      const urls: string[] = [];
      for (const name of await caches.keys()) for (const req of await (await caches.open(name)).keys()) urls.push(req.url);
      return urls.filter((u) => new URL(u).pathname.startsWith('/api/'));
    });
    expect(cachedApi).toEqual([]);

    await page.getByRole('button', { name: 'Account menu for Dana Holloway' }).click();
    await page.getByRole('menuitem', { name: 'Sign out' }).click();
    await page.waitForURL(/\/sign-in/);
    expect(await copies()).toEqual([]);
  });
});
