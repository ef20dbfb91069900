import { randomUUID } from 'node:crypto';
import { describe, expect, it } from 'vitest';
// The engine is the reference for scores (pure code, no I/O).
import { scoreGame } from '../../engine/index';
import { apiToken, DEMO, hasHorizontalScroll, MOBILE, screenshot, signIn, useBrowser } from './browser';

const { baseUrl, open } = useBrowser(MOBILE);

interface Throw {
  frame: number;
  delivery: number;
  standing: number[];
  pins: number;
  feetBoard: number;
  targetBoard: number;
  hit?: string;
}

/**
 * Game 1: five 9-spares with high hits on feet 20 / target 10, then the bowler moves 2 and 1 boards inward (22 / 11)
 * and strikes out on pocket hits: 4 × 19 + 20 + 5 × 30 = 246.
 */
const GAME1: Throw[] = [
  ...[1, 2, 3, 4, 5].flatMap((frame) => [
    { frame, delivery: 1, standing: [10], pins: 9, feetBoard: 20, targetBoard: 10, hit: 'high' },
    { frame, delivery: 2, standing: [], pins: 1, feetBoard: 20, targetBoard: 10 },
  ]),
  ...[6, 7, 8, 9].map((frame) => ({ frame, delivery: 1, standing: [], pins: 10, feetBoard: 22, targetBoard: 11, hit: 'pocket' })),
  ...[1, 2, 3].map((delivery) => ({ frame: 10, delivery, standing: [], pins: 10, feetBoard: 22, targetBoard: 11, hit: 'pocket' })),
];
/** Game 2 on the new line: ten different leaves (the 7-10 last, left open): 8 × 19 + 18 + 9 = 179. */
const LEAVES = [[10], [7], [4], [6], [9], [8], [2], [3], [5]];
const GAME2: Throw[] = [
  ...LEAVES.flatMap((leave, i) => [
    { frame: i + 1, delivery: 1, standing: leave, pins: 9, feetBoard: 22, targetBoard: 11 },
    { frame: i + 1, delivery: 2, standing: [], pins: 1, feetBoard: 22, targetBoard: 11 },
  ]),
  { frame: 10, delivery: 1, standing: [7, 10], pins: 8, feetBoard: 22, targetBoard: 11 },
  { frame: 10, delivery: 2, standing: [7], pins: 1, feetBoard: 22, targetBoard: 11 },
];

async function call(token: string, method: string, url: string, body?: unknown, headers: Record<string, string> = {}) {
  const res = await fetch(`${baseUrl}${url}`, {
    method,
    headers: { Authorization: `Bearer ${token}`, 'Content-Type': 'application/json', ...headers },
    body: body === undefined ? undefined : JSON.stringify(body),
  });
  const json = (await res.json()) as { item: { id: number } };
  if (res.status >= 300) throw new Error(`${method} ${url}: ${res.status} ${JSON.stringify(json)}`);
  return json;
}

describe('a league night on a lane pair, followed up (375 px)', () => {
  it('the session shows a left-hander’s move 2 right and its follow-up, every leave, and the league standing', async () => {
    const token = await apiToken(baseUrl, DEMO.lee);
    const balls = (await (await fetch(`${baseUrl}/api/arsenal`, { headers: { Authorization: `Bearer ${token}` } })).json()) as {
      items: { id: number; status: string }[];
    };
    const ballId = balls.items.find((b) => b.status === 'active')!.id;
    const league = await call(token, 'POST', '/api/leagues', {
      name: 'Thursday Night Rollers',
      weekday: 4,
      seasonStart: '2026-09-03',
      handicap: { basis: 220, percentage: 90 },
    });
    const session = await call(token, 'POST', '/api/sessions', {
      date: '2026-09-03',
      kind: 'league',
      leagueId: league.item.id,
      lanePair: '13-14',
    });
    const sid = session.item.id;
    for (const [gameNumber, game] of [GAME1, GAME2].entries()) {
      for (const t of game) {
        const { pins: _pins, ...shot } = t;
        await call(
          token,
          'POST',
          `/api/sessions/${sid}/shots`,
          { gameNumber: gameNumber + 1, ballId, ...shot },
          { 'Idempotency-Key': randomUUID() },
        );
      }
    }
    const totals = [GAME1, GAME2].map((g) => scoreGame(g.map((t) => t.pins)).total);
    expect(totals).toEqual([246, 179]);

    const { page } = await open(MOBILE);
    await signIn(page, DEMO.lee);
    await page.goto(`/sessions/${sid}`);
    await page.getByText('lanes 13-14').first().waitFor();

    // the steppers in the bowler's own sense: for Lee, a left-hander, Left is toward the hand-side gutter (a lower board)
    const feet = page.getByLabel('Feet board', { exact: true });
    await expect.poll(() => feet.inputValue()).toBe('22');
    await page.getByRole('button', { name: 'Feet board: left one board' }).click();
    await expect.poll(() => feet.inputValue()).toBe('21');
    await page.getByRole('button', { name: 'Feet board: right one board' }).click();
    await expect.poll(() => feet.inputValue()).toBe('22');

    // the follow-up: 0 of 5 pocket before the move, 7 of 7 after (the 2 of game 2 record no hit)
    const followUp = page.getByRole('region', { name: 'Did the move work?' }).or(page.locator('section.follow-up'));
    await followUp.getByRole('heading', { name: 'Did the move work?' }).waitFor();
    const item = followUp.locator('[data-follow-up]').first();
    await expect.poll(() => item.locator('[data-verdict]').textContent()).toBe('It worked');
    // the demo's Lee bowls left-handed: boards count from the left gutter, so 20 → 22 is a move to the right
    await expect.poll(() => item.textContent()).toMatch(/Feet 2 boards right, target 1 board right/);
    const pocketRow = item.locator('tr[data-rate="pocket"]');
    await expect.poll(() => pocketRow.textContent()).toMatch(/0 % \(0 of 5\).*100 % \(7 of 7\).*\+100 points/s);

    // every leave: five shown, then all ten on request
    const leaves = page.locator('.session-stats__leaves li');
    await expect.poll(() => leaves.count()).toBe(5);
    await page.getByRole('button', { name: 'Show all 10 leaves' }).click();
    await expect.poll(() => leaves.count()).toBe(10);
    await expect.poll(() => page.locator('.session-stats__leaves').textContent()).toMatch(/7-10/);
    expect(await hasHorizontalScroll(page)).toBe(false);
    await screenshot(page, 'season-session-375');

    // the league: one night, average (246 + 179) / 2 = 212.5 → 212, handicap 0.9 × (220 − 212) = 7.2 → 7
    await page.goto(`/leagues?league=${league.item.id}`);
    await page.getByRole('heading', { level: 2, name: 'Thursday Night Rollers' }).waitFor();
    await expect.poll(() => page.locator('[data-league-night]').count()).toBe(1);
    await expect.poll(() => page.locator('[data-league-average]').textContent()).toBe('212');
    await expect.poll(() => page.locator('[data-league-handicap]').textContent()).toBe('7');
    await expect.poll(() => page.locator('[data-league-night]').textContent()).toMatch(/13-14.*246, 179.*425/s);
    expect(await hasHorizontalScroll(page)).toBe(false);
    await screenshot(page, 'season-league-375');
  });
});

describe('an upkeep reminder leads to a pro-shop order (375 px)', () => {
  it('a spare ball at 200 games since its resurface shows as due on Home; the order dialog opens for that ball', async () => {
    const token = await apiToken(baseUrl, DEMO.dana);
    const auth = { Authorization: `Bearer ${token}` };
    const balls = (await (await fetch(`${baseUrl}/api/arsenal`, { headers: auth })).json()) as {
      items: { id: number; status: string; version: number; name: string; nickname: string | null }[];
    };
    const spare = balls.items.find((b) => b.status === 'active')!;
    await call(token, 'PATCH', `/api/arsenal/${spare.id}`, { version: spare.version, gamesSinceResurface: 200 });
    await call(token, 'PATCH', `/api/upkeep/${spare.id}`, { extractionDone: true });

    const { page } = await open(MOBILE);
    await signIn(page, DEMO.dana);
    const card = page.locator('section.home-upkeep');
    await card.getByRole('heading', { name: 'Ball upkeep' }).waitFor();
    const item = card.locator('[data-upkeep]').filter({ hasText: spare.name }).first();
    await expect.poll(() => item.textContent()).toMatch(/Due.*Resurface due: 200 games since \(every 60\)/s);
    expect(await hasHorizontalScroll(page)).toBe(false);
    await screenshot(page, 'season-upkeep-375');
    await item.getByRole('button', { name: 'Order at the pro shop' }).click();
    const dialog = page.getByRole('dialog', { name: /^Order a service for / });
    await dialog.waitFor();
    // the resurface is preselected from the center's price list (the ball's own grit when the shop offers it)
    await expect
      .poll(() => dialog.locator('.el-select__selected-item').allTextContents())
      .toContainEqual(expect.stringMatching(/^Resurface to \d+ grit/));
  });
});

describe('the pair after a game (375 px)', () => {
  it('a session on a pattern shows how the model ranks the bag for the pair after the games bowled, with the ball in use', async () => {
    const token = await apiToken(baseUrl, DEMO.dana);
    const auth = { Authorization: `Bearer ${token}` };
    const patterns = (await (await fetch(`${baseUrl}/api/patterns?pageSize=100`, { headers: auth })).json()) as {
      items: { id: number; name: string }[];
    };
    const house = patterns.items.find((p) => p.name === 'Copperline House 40')!;
    const balls = (await (await fetch(`${baseUrl}/api/arsenal`, { headers: auth })).json()) as {
      items: { id: number; status: string; name: string }[];
    };
    const ball = balls.items.find((b) => b.status === 'active')!;
    const session = await call(token, 'POST', '/api/sessions', {
      date: '2026-09-04',
      kind: 'practice',
      patternId: house.id,
      lanePair: '5-6',
    });
    // one complete game: 9 and a spare every frame, 9 on the fill ball
    for (let frame = 1; frame <= 10; frame++) {
      const throws = frame < 10 ? [[10], []] : [[10], [], [10]];
      for (const [i, standing] of throws.entries())
        await call(
          token,
          'POST',
          `/api/sessions/${session.item.id}/shots`,
          { gameNumber: 1, frame, delivery: i + 1, standing, ballId: ball.id },
          { 'Idempotency-Key': randomUUID() },
        );
    }

    const { page } = await open(MOBILE);
    await signIn(page, DEMO.dana);
    await page.goto(`/sessions/${session.item.id}`);
    const panel = page.locator('[data-pair-advice]');
    await panel.getByRole('heading', { name: 'Lanes 5-6 after 1 game' }).waitFor();
    await expect
      .poll(() => panel.getByRole('status').textContent(), { timeout: 30000 })
      .toMatch(
        /After 1 game on this pair .+(is still the model's first choice|first .+ time to think about changing balls|within the model's precision)/,
      );
    expect(await hasHorizontalScroll(page)).toBe(false);
    await screenshot(page, 'season-pair-375');
  });
});
