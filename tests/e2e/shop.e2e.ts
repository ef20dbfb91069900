import fs from 'node:fs';
import path from 'node:path';
import { describe, expect, it } from 'vitest';
import type { Page } from 'playwright-core';
import {
  chooseOption,
  eventually,
  ARTIFACTS_DIR,
  DEMO,
  DESKTOP,
  MOBILE,
  hasHorizontalScroll,
  screenshot,
  signIn,
  useBrowser,
} from './browser';

/**
 * The resurface order flow in the browser: the proprietor puts a 4000-grit resurface on Copperline Bowl's price list;
 * the demo bowler orders it for one of her balls from the Ball page, pays on the payment service's hosted card
 * page (the project's local fake of it in tests) — first with the test card that is declined (the order stays
 * unpaid, the reason shown), then with the one that succeeds — and comes back to the order, which shows as paid
 * once the signed webhook reached the server. The proprietor marks it in progress and ready on the orders board
 * and sees the day's takings; the Ball page then shows 4000 grit in its surface history, and the matchup ranks
 * the ball with its new surface (the engine's prediction for it changes).
 *
 * Test cards: 4242 4242 4242 4242 succeeds, 4000 0000 0000 0002 is declined — the numbers the payment service
 * documents for its test mode, which the fake follows (CONTRACT-8).
 */

const { open } = useBrowser(DESKTOP);

const RUN = Date.now() % 100000;
const SERVICE_NAME = `Resurface to 4000 grit, e2e ${RUN}`;
/** An unusual price, so the page can only show it if it came from the price list the proprietor just set. */
const PRICE_TEXT = '$38.75';
const BALL = 'Big Red';

/** State carried from one step of the flow to the next. */
const flow = { ballId: 0, orderId: 0, before: null as null | MatchupRow };

/** Picks an option of an Element Plus select (see chooseOption: it waits for the select to be enabled). */
async function choose(page: Page, scope: Page | ReturnType<Page['getByRole']>, combobox: string, option: string | RegExp): Promise<void> {
  await chooseOption(page, scope.getByRole('combobox', { name: combobox }), option);
}

interface MatchupRow {
  surface: string;
  prediction: string;
}

/** Ranks dana's arsenal on Short Sprint 34 and reads the row of one ball: its surface as shown and its predicted skid/breakpoint/entry angle. */
async function matchupRowOf(page: Page, ballId: number): Promise<MatchupRow> {
  await page.goto('/matchup');
  await page.getByRole('heading', { level: 1, name: 'Matchup' }).waitFor();
  await choose(page, page, 'Condition', 'Short Sprint 34');
  await page.getByRole('button', { name: 'Rank my arsenal' }).click();
  await page.getByRole('heading', { level: 2, name: /^Ranking for Short Sprint 34, after 0 games/ }).waitFor({ timeout: 60000 });
  const row = page.locator(`tr[data-ball-id="${ballId}"]`);
  await row.waitFor();
  const surface = ((await row.locator('.matchup-ranking-table__sub').textContent()) ?? '').trim();
  const prediction = ((await row.locator('.matchup-ranking-table__inline').textContent()) ?? '').replace(/\s+/g, ' ').trim();
  return { surface, prediction };
}

/** How many orders the signed-in bowler has (through the API with the page's own token). */
async function countOrders(page: Page): Promise<number> {
  return page.evaluate(async () => {
    const token = window.localStorage.getItem('lanewright.token');
    const res = await fetch('/api/orders?pageSize=1', { headers: { Authorization: `Bearer ${token}` } });
    return ((await res.json()) as { total: number }).total;
  });
}

/** The order dialog's service list has loaded (its select is enabled). */
async function waitForServices(page: Page): Promise<void> {
  await page.waitForFunction(
    () => document.querySelector('.shop-order-dialog [aria-label="Service"]:not([aria-disabled="true"])') !== null,
  );
}

/** "#12" as the board shows an order, not matching "#123". */
function orderTag(id: number): RegExp {
  return new RegExp(`#${id}(?!\\d)`);
}

/** Presses an order's move button on the board and confirms it in the dialog that asks first. */
async function confirmMove(page: Page, label: 'Mark in progress' | 'Mark ready' | 'Mark collected', orderId: number): Promise<void> {
  await page.getByRole('button', { name: `${label}: order ${orderId}` }).click();
  const confirm = page.getByRole('dialog', { name: `${label}: order #${orderId}?` });
  await confirm.waitFor();
  await confirm.getByRole('button', { name: label, exact: true }).click();
  await confirm.waitFor({ state: 'hidden' });
}

/** Fills the hosted card page (any future expiry, any CVC) and presses Pay. */
async function payWithCard(page: Page, card: string, price = PRICE_TEXT): Promise<void> {
  await page.getByRole('form', { name: 'Card details' }).waitFor();
  await page.getByLabel('Card number').fill(card);
  await page.getByLabel('Expiry (MM / YY)').fill('12 / 34');
  await page.getByLabel('CVC').fill('123');
  await page.getByLabel('Name on card').fill('Dana Example');
  await page.getByRole('button', { name: `Pay ${price}` }).click();
}

describe('pro shop: order, card payment, shop board, surface update', () => {
  it('the proprietor adds a 4000-grit resurface to the price list', async () => {
    const { page } = await open();
    await signIn(page, DEMO.proprietor);
    await page.goto('/center-admin');
    await page.getByRole('heading', { level: 1, name: 'Center admin' }).waitFor();
    await page.getByRole('tab', { name: 'Price list' }).click();
    await page.getByRole('heading', { level: 2, name: 'Price list' }).waitFor();
    await page.getByRole('button', { name: 'Add a service' }).click();
    const dialog = page.getByRole('dialog', { name: 'Add a service' });
    await dialog.waitFor();
    // Resurface is the default kind; its target grit starts at 4000.
    expect(await dialog.getByLabel('Target grit').inputValue()).toBe('4000');
    await dialog.getByLabel('Name on the price list').fill(SERVICE_NAME);
    // A wrong price is refused with a message and left as typed, never corrected.
    const price = dialog.getByLabel('Price (USD)');
    await price.fill('-5');
    await dialog.getByRole('button', { name: 'Add service' }).click();
    await dialog.getByText('A price cannot be negative').waitFor();
    expect(await price.inputValue()).toBe('-5');
    await price.fill('38.755');
    await dialog.getByRole('button', { name: 'Add service' }).click();
    await dialog.getByText('At most two decimals (whole cents)').waitFor();
    expect(await price.inputValue()).toBe('38.755');
    await screenshot(page, 'shop-price-refused-desktop');
    await price.fill('38.75');
    await dialog.getByRole('button', { name: 'Add service' }).click();
    await dialog.waitFor({ state: 'hidden' });
    const row = page.locator('.shop-price-list__table').getByRole('row').filter({ hasText: SERVICE_NAME });
    await row.waitFor();
    expect(await row.innerText()).toContain(PRICE_TEXT);
    await screenshot(page, 'shop-price-list-desktop');
  });

  it('dana orders it for Big Red from the Ball page; a declined card leaves the order unpaid with the reason; the test card that succeeds pays it', async () => {
    const { page } = await open();
    await signIn(page, DEMO.dana);

    // The ball and its matchup row before the work.
    await page.goto('/arsenal');
    await page.getByRole('link', { name: BALL, exact: true }).click();
    await page.getByRole('heading', { level: 1, name: BALL }).waitFor();
    flow.ballId = Number(/\/arsenal\/(\d+)/.exec(page.url())?.[1]);
    expect(flow.ballId).toBeGreaterThan(0);
    const surfaceBefore = await page.locator('dt:text-is("Surface") + dd').first().innerText();
    expect(surfaceBefore).not.toBe('4000 grit');
    flow.before = await matchupRowOf(page, flow.ballId);
    expect(flow.before.surface).toContain(surfaceBefore);

    // Order from the Ball page.
    await page.goto(`/arsenal/${flow.ballId}`);
    await page.getByRole('button', { name: 'Order a service' }).click();
    const dialog = page.getByRole('dialog', { name: `Order a service for ${BALL} (Thunderhead Talon)` });
    await dialog.waitFor();
    // Dana follows Copperline Bowl: it is offered first and chosen already.
    await dialog.getByRole('combobox', { name: 'Center' }).waitFor();
    await page.waitForFunction(
      () => document.querySelector('.shop-order-dialog [aria-label="Service"]:not([aria-disabled="true"])') !== null,
    );
    expect(await dialog.locator('.el-select').first().innerText()).toContain('Copperline Bowl');
    await choose(page, dialog, 'Service', new RegExp(`^${SERVICE_NAME}`));
    await dialog.getByTestId('order-price').filter({ hasText: PRICE_TEXT }).waitFor();
    await dialog.getByText('Resurfacing and polishing use abrasives and solvents').waitFor();
    await dialog.getByText(/Check your league’s or tournament’s equipment rules/).waitFor();
    await dialog.getByLabel('Notes for the shop (optional)').fill('Please keep the logo.');
    await screenshot(page, 'shop-order-dialog-desktop');
    await dialog.getByRole('button', { name: `Pay by card ${PRICE_TEXT}` }).click();

    // The hosted card page: the declined test card.
    await page.waitForURL(/\/pay\//);
    await payWithCard(page, '4000 0000 0000 0002');
    await page.getByRole('alert').filter({ hasText: 'Your card was declined.' }).waitFor();
    await screenshot(page, 'shop-card-declined-desktop');

    // Meanwhile, in another tab, the order is not paid and says why.
    const other = await page.context().newPage();
    await other.goto('/orders');
    await other.locator('.orders__table').getByRole('row').filter({ hasText: SERVICE_NAME }).getByRole('link').click();
    await other.getByRole('heading', { level: 1, name: /^Order \d+$/ }).waitFor();
    flow.orderId = Number(/\/orders\/(\d+)/.exec(other.url())?.[1]);
    await other.getByText('The payment did not go through').waitFor();
    expect(await other.getByTestId('payment-error').innerText()).toContain('Your card was declined.');
    expect(await other.locator('.app-page-header .order-status-tag').innerText()).toBe('Ordered');
    await other.close();

    // The card page lets her try another card: the one that succeeds.
    await payWithCard(page, '4242 4242 4242 4242');
    await page.waitForURL(/\/orders\/\d+\?checkout=done/);
    expect(Number(/\/orders\/(\d+)/.exec(page.url())?.[1])).toBe(flow.orderId);
    await page.getByRole('alert').filter({ hasText: 'Payment confirmed' }).waitFor({ timeout: 60000 });
    expect(await page.locator('.app-page-header .order-status-tag').innerText()).toBe('Paid');
    await page.getByText('The payment did not go through').waitFor({ state: 'detached' });
    expect(await page.getByRole('list', { name: 'Order progress' }).innerText()).toContain('Paid');
    await screenshot(page, 'shop-order-paid-desktop');

    // My orders lists it as paid.
    await page.getByRole('navigation', { name: 'Main' }).getByRole('link', { name: 'Orders' }).click();
    await page.getByRole('heading', { level: 1, name: 'My orders' }).waitFor();
    const row = page.locator('.orders__table').getByRole('row').filter({ hasText: SERVICE_NAME });
    await row.waitFor();
    expect(await row.innerText()).toContain('Paid');
    await screenshot(page, 'shop-my-orders-desktop');

    // The arsenal shows the ball at the shop, with a link to its order, instead of "in the bag".
    await page.goto('/arsenal');
    const ballRow = page
      .locator('.arsenal__table')
      .getByRole('row')
      .filter({ has: page.getByRole('link', { name: BALL, exact: true }) });
    const atShop = ballRow.getByRole('link', { name: `At the shop — order #${flow.orderId}` });
    await atShop.waitFor();
    expect(await ballRow.innerText()).not.toContain('In the bag');
    await page.goto(`/arsenal/${flow.ballId}`);
    await page.getByRole('heading', { level: 2, name: 'Specs' }).waitFor();
    expect(await page.getByTestId('ball-at-shop').innerText()).toBe(`At the shop — order #${flow.orderId}`);
    await page.goto('/arsenal');
    await atShop.click();
    await page.waitForURL(new RegExp(`/orders/${flow.orderId}$`));
  });

  it('the proprietor marks it in progress, then ready, on the orders board and sees the day’s takings', async () => {
    expect(flow.orderId).toBeGreaterThan(0);
    const { page } = await open();
    await signIn(page, DEMO.proprietor);
    await page.goto('/center-admin?tab=orders');
    await page.getByRole('heading', { level: 2, name: 'Orders' }).waitFor();
    await choose(page, page, 'Order status', 'Paid');
    const row = page
      .locator('.order-board__table')
      .getByRole('row')
      .filter({ hasText: orderTag(flow.orderId) });
    await row.waitFor();
    expect(await row.innerText()).toContain('Please keep the logo.');
    await screenshot(page, 'shop-orders-board-desktop');

    // Back to every status, so the row stays in view as it moves on.
    await choose(page, page, 'Order status', 'Any status');
    // A move asks first; "Not yet" changes nothing.
    await page.getByRole('button', { name: `Mark in progress: order ${flow.orderId}` }).click();
    const ask = page.getByRole('dialog', { name: `Mark in progress: order #${flow.orderId}?` });
    await ask.getByText(/You can undo this for 2 minutes/).waitFor();
    await ask.getByRole('button', { name: 'Not yet' }).click();
    await ask.waitFor({ state: 'hidden' });
    expect(await row.innerText()).toContain('Paid');
    await confirmMove(page, 'Mark in progress', flow.orderId);
    await row.getByText('In progress').waitFor();
    // The move can be undone for a short while.
    const undo = page.getByTestId('order-undo');
    await undo.getByText(`Order #${flow.orderId} marked in progress.`).waitFor();
    await screenshot(page, 'shop-orders-board-undo-desktop');
    await undo.getByRole('button', { name: 'Undo' }).click();
    await row.getByText('Paid', { exact: true }).waitFor();
    await page
      .getByRole('status')
      .filter({ hasText: `Undone: order ${flow.orderId} is paid again.` })
      .waitFor();
    await confirmMove(page, 'Mark in progress', flow.orderId);
    await row.getByText('In progress').waitFor();
    await page.getByRole('button', { name: `Mark ready: order ${flow.orderId}` }).click();
    const ready = page.getByRole('dialog', { name: `Mark ready: order #${flow.orderId}?` });
    await ready.getByText(/gets an e-mail to collect it\. .*This cannot be undone\./).waitFor();
    await ready.getByRole('button', { name: 'Mark ready', exact: true }).click();
    await row.getByText('Ready to collect').waitFor();
    await page.getByRole('button', { name: `Mark collected: order ${flow.orderId}` }).waitFor();
    expect(await page.getByTestId('order-undo').count()).toBe(0);
    await screenshot(page, 'shop-orders-board-ready-desktop');

    // Today's takings (the center's day, in its time zone) include the payment, by service.
    await page.getByRole('tab', { name: 'Takings' }).click();
    const byService = page.getByRole('table', { name: 'Takings by service' }).getByRole('row').filter({ hasText: SERVICE_NAME });
    await byService.waitFor();
    expect((await byService.innerText()).replace(/\s+/g, ' ')).toContain(`1 ${PRICE_TEXT}`);
    expect(Number(await page.getByTestId('takings-orders').innerText())).toBeGreaterThanOrEqual(1);
    expect(await page.getByTestId('takings-zone').innerText()).toBe('America/Denver');
    await screenshot(page, 'shop-takings-desktop');

    // A week up to today: the days with takings, the total, and the CSV of the same range.
    const today = await page.getByLabel('Last day').inputValue();
    const weekAgo = new Date(Date.parse(`${today}T00:00:00Z`) - 6 * 86400000).toISOString().slice(0, 10);
    await page.getByLabel('First day').fill(weekAgo);
    await page.getByLabel('First day').press('Enter');
    const byDay = page.getByRole('table', { name: 'Takings by day' });
    await byDay.locator(`time[datetime="${today}"]`).waitFor();
    await screenshot(page, 'shop-takings-range-desktop');
    const [download] = await Promise.all([page.waitForEvent('download'), page.getByRole('button', { name: 'Download CSV' }).click()]);
    expect(download.suggestedFilename()).toBe(`takings-${weekAgo}-to-${today}.csv`);
    const csv = fs.readFileSync(await download.path(), 'utf8').split('\r\n');
    expect(csv[0]).toBe('Date,Orders paid,Taken (USD),Refunded (USD),Net (USD)');
    expect(csv.filter((l) => /^\d{4}-\d\d-\d\d,/.test(l))).toHaveLength(7);
    const total = csv.find((l) => l.startsWith('Total,'))!.split(',');
    expect(`$${total[2]}`).toBe(await page.getByTestId('takings-paid').innerText());
    expect(csv).toContain('Time zone,America/Denver');

    // The last day before the first is refused with a message, not swapped.
    await page.getByLabel('First day').fill(today);
    await page.getByLabel('First day').press('Enter');
    await page.getByLabel('Last day').fill(weekAgo);
    await page.getByLabel('Last day').press('Enter');
    await page.getByRole('alert').filter({ hasText: 'The last day comes on or after the first.' }).waitFor();
  });

  it('the proprietor takes a walk-in order at the counter, moves it along, and undoes a collection made by mistake', async () => {
    const { page } = await open();
    await signIn(page, DEMO.proprietor);
    await page.goto('/center-admin?tab=orders');
    await page.getByRole('heading', { level: 2, name: 'Orders' }).waitFor();
    await page.getByRole('button', { name: 'Take a walk-in order' }).click();
    const dialog = page.getByRole('dialog', { name: 'Walk-in order' });
    await dialog.waitFor();
    await dialog.getByRole('button', { name: 'Take the order' }).click();
    await dialog.getByText('Choose a service').first().waitFor();
    await dialog.getByText('The customer’s name is required').waitFor();
    await dialog.getByText('A phone number or e-mail is required').waitFor();
    await page.waitForFunction(
      () => document.querySelector('.shop-walk-in-dialog [aria-label="Service"]:not([aria-disabled="true"])') !== null,
    );
    await choose(page, dialog, 'Service', new RegExp(`^${SERVICE_NAME}`));
    await dialog.getByTestId('walk-in-price').filter({ hasText: PRICE_TEXT }).waitFor();
    const customer = `Walk-in Rowan ${RUN}`;
    await dialog.getByLabel('Customer’s name').fill(customer);
    await dialog.getByLabel('Phone or e-mail').fill('555-0199');
    await dialog.getByLabel('The ball, in words').fill('Purple swirl, 15 lb, "R" on the thumb');
    await screenshot(page, 'shop-walk-in-dialog-desktop');
    await dialog.getByRole('button', { name: 'Take the order' }).click();
    await dialog.waitFor({ state: 'hidden' });
    const row = page.locator('.order-board__table').getByRole('row').filter({ hasText: customer });
    await row.waitFor();
    expect(await row.innerText()).toContain('Walk-in · 555-0199');
    expect(await row.innerText()).toContain('Paid');
    const orderId = Number(/#(\d+)/.exec(await row.innerText())?.[1]);
    expect(orderId).toBeGreaterThan(0);
    // Paid at the counter: no card refund is offered.
    expect(await page.getByRole('button', { name: `Refund order ${orderId}` }).count()).toBe(0);

    await confirmMove(page, 'Mark in progress', orderId);
    await row.getByText('In progress').waitFor();
    await page.getByRole('button', { name: `Mark ready: order ${orderId}` }).click();
    const ready = page.getByRole('dialog', { name: `Mark ready: order #${orderId}?` });
    await ready.getByText(`Let ${customer} (walk-in, 555-0199) know it is ready.`, { exact: false }).waitFor();
    await ready.getByRole('button', { name: 'Mark ready', exact: true }).click();
    await row.getByText('Ready to collect').waitFor();
    await confirmMove(page, 'Mark collected', orderId);
    await row.getByText('Collected', { exact: true }).waitFor();
    await page.getByTestId('order-undo').getByRole('button', { name: 'Undo' }).click();
    await row.getByText('Ready to collect').waitFor();
    await page.getByRole('button', { name: `Mark collected: order ${orderId}` }).waitFor();
    await screenshot(page, 'shop-walk-in-undone-desktop');
  });

  it('the Ball page shows the new surface in its history, and the matchup ranks the ball with it', async () => {
    expect(flow.ballId).toBeGreaterThan(0);
    const { page } = await open();
    await signIn(page, DEMO.dana);
    await page.goto(`/orders/${flow.orderId}`);
    await page.locator('.app-page-header .order-status-tag').filter({ hasText: 'Ready to collect' }).waitFor();
    await page.getByText('Your ball is ready to collect at Copperline Bowl.').waitFor();

    await page.goto(`/arsenal/${flow.ballId}`);
    await page.getByRole('heading', { level: 1, name: BALL }).waitFor();
    expect(await page.locator('dt:text-is("Surface") + dd').first().innerText()).toBe('4000 grit');
    const history = page.getByRole('region', { name: 'Surface history' });
    const newest = history.locator('.el-timeline-item').first();
    expect(await newest.innerText()).toContain('Current');
    expect(await newest.innerText()).toContain('4000 grit');
    expect(await newest.innerText()).toMatch(/was \d+ grit/);
    await screenshot(page, 'shop-ball-surface-desktop');

    const after = await matchupRowOf(page, flow.ballId);
    expect(after.surface).toContain('4000 grit');
    expect(after.surface).not.toBe(flow.before?.surface);
    // The engine ran on the new surface: a smoother ball skids longer, so its predicted numbers change.
    expect(after.prediction).not.toBe('');
    expect(after.prediction).not.toBe(flow.before?.prediction);
    const skid = (s: string) => Number(/skid ([\d.]+) ft/.exec(s)?.[1]);
    expect(skid(after.prediction)).toBeGreaterThan(skid(flow.before?.prediction ?? ''));
    await screenshot(page, 'shop-matchup-after-desktop');
  });

  it('a surface suggestion in the matchup opens the order dialog on that ball with the suggested service', async () => {
    const { page } = await open();
    await signIn(page, DEMO.dana);
    await page.goto('/matchup');
    await page.getByRole('heading', { level: 1, name: 'Matchup' }).waitFor();
    await choose(page, page, 'Condition', 'Long Haul 47');
    await page.getByRole('button', { name: 'Rank my arsenal' }).click();
    await page.getByRole('heading', { level: 2, name: /^Ranking for Long Haul 47/ }).waitFor({ timeout: 60000 });
    // Open the reasons ball by ball until one has a surface suggestion the shop can do.
    const whys = page.getByRole('button', { name: /^Why: / });
    const order = page.getByRole('button', { name: /^Order at the pro shop: / }).first();
    const n = await whys.count();
    for (let i = 0; i < n && (await order.count()) === 0; i += 1) await whys.nth(i).click();
    await order.waitFor();
    const label = (await order.getAttribute('aria-label')) ?? '';
    await order.click();
    const dialog = page.getByRole('dialog', { name: /^Order a service for / });
    await dialog.waitFor();
    // The ball is fixed to the one of the suggestion.
    expect(await dialog.getByRole('combobox', { name: 'Ball' }).isDisabled()).toBe(true);
    const grit = /(\d+) grit/.exec(label)?.[1];
    expect(grit).toMatch(/^\d+$/);
    // Once the price list has arrived, either its matching resurface is chosen, or the dialog says the list has none
    // for that grit (until then the select reads 'Choose a service' and there is no hint).
    const hint = dialog.locator('.shop-order-dialog__hint');
    const outcome = async () =>
      (await hint.count()) ? `hint: ${await hint.innerText()}` : `service: ${await dialog.locator('.el-select').nth(1).innerText()}`;
    await eventually(outcome).toContain(`${grit} grit`);
    // The page under it is long (every reason open): a picture of the dialog alone, its opening transition run to the end.
    await dialog
      .locator('.el-dialog')
      .screenshot({ path: path.join(ARTIFACTS_DIR, 'shop-order-from-suggestion-desktop.png'), animations: 'disabled' });
  });
});

describe('pro shop: a card that asks for authentication, a refund, and what another bowler sees', () => {
  it('dana pays a plug and redrill with the card that asks for authentication; the proprietor refunds it after a confirmation', async () => {
    const bowler = await open();
    await signIn(bowler.page, DEMO.dana);
    await bowler.page.goto('/orders');
    await bowler.page.getByRole('heading', { level: 1, name: 'My orders' }).waitFor();
    await bowler.page.getByRole('button', { name: 'Order a service' }).click();
    const dialog = bowler.page.getByRole('dialog', { name: 'Order a pro-shop service' });
    await dialog.waitFor();
    await waitForServices(bowler.page);
    await choose(bowler.page, dialog, 'Service', /^Plug and redrill/);
    // Drilling work shows the technician caution instead of the sanding one.
    await dialog.getByText(/work for a qualified pro-shop technician/).waitFor();
    expect(await dialog.getByText('Resurfacing and polishing use abrasives and solvents').count()).toBe(0);
    await choose(bowler.page, dialog, 'Ball', /^Control \(Old Growth\)/);
    const price = (await dialog.getByTestId('order-price').innerText()).trim();
    expect(price).toMatch(/^\$\d+\.\d\d$/);
    await dialog.getByRole('button', { name: `Pay by card ${price}` }).click();
    await bowler.page.waitForURL(/\/pay\//);
    await payWithCard(bowler.page, '4000 0025 0000 3155', price);
    await bowler.page.getByRole('heading', { level: 1, name: 'Confirm this payment' }).waitFor();
    await bowler.page.getByRole('button', { name: 'Approve' }).click();
    await bowler.page.waitForURL(/\/orders\/\d+\?checkout=done/);
    const orderId = Number(/\/orders\/(\d+)/.exec(bowler.page.url())?.[1]);
    await bowler.page.getByRole('alert').filter({ hasText: 'Payment confirmed' }).waitFor({ timeout: 60000 });

    const owner = await open();
    await signIn(owner.page, DEMO.proprietor);
    await owner.page.goto('/center-admin?tab=orders');
    const row = owner.page
      .locator('.order-board__table')
      .getByRole('row')
      .filter({ hasText: orderTag(orderId) });
    await row.waitFor();
    await owner.page.getByRole('button', { name: `Refund order ${orderId}` }).click();
    const confirm = owner.page.getByRole('dialog', { name: `Refund order #${orderId}?` });
    await confirm.waitFor();
    // Keeping the payment changes nothing.
    await confirm.getByRole('button', { name: 'Keep the payment' }).click();
    await confirm.waitFor({ state: 'hidden' });
    expect(await row.innerText()).toContain('Paid');
    await owner.page.getByRole('button', { name: `Refund order ${orderId}` }).click();
    await confirm.getByRole('button', { name: 'Refund', exact: true }).click();
    await row.getByText('Refunded', { exact: true }).waitFor();
    await screenshot(owner.page, 'shop-orders-board-refunded-desktop');

    await owner.page.getByRole('tab', { name: 'Takings' }).click();
    await owner.page.getByTestId('takings-refunded').filter({ hasText: price }).waitFor();

    await bowler.page.reload();
    expect(await bowler.page.locator('.app-page-header .order-status-tag').innerText()).toBe('Refunded');
  });

  it('a declined card, then back to the order: unpaid with the reason shown, payable again, and cancelled after a confirmation', async () => {
    const { page } = await open();
    await signIn(page, DEMO.dana);
    await page.goto('/orders');
    await page.getByRole('button', { name: 'Order a service' }).click();
    const dialog = page.getByRole('dialog', { name: 'Order a pro-shop service' });
    await dialog.waitFor();
    await waitForServices(page);
    await choose(page, dialog, 'Service', /^Polish/);
    await choose(page, dialog, 'Ball', /^Backend \(Skylark Arc\)/);
    const price = (await dialog.getByTestId('order-price').innerText()).trim();
    await dialog.getByRole('button', { name: `Pay by card ${price}` }).click();
    await page.waitForURL(/\/pay\//);
    await payWithCard(page, '4000 0000 0000 0002', price);
    await page.getByRole('alert').filter({ hasText: 'Your card was declined.' }).waitFor();
    await page.getByRole('button', { name: 'Cancel and go back' }).click();

    await page.waitForURL(/\/orders\/\d+\?checkout=cancelled/);
    const orderId = Number(/\/orders\/(\d+)/.exec(page.url())?.[1]);
    await page.getByRole('heading', { level: 1, name: `Order ${orderId}` }).waitFor();
    await page.getByText('The payment did not go through').waitFor();
    expect(await page.getByTestId('payment-error').innerText()).toContain('Your card was declined.');
    expect(await page.locator('.app-page-header .order-status-tag').innerText()).toBe('Ordered');
    await screenshot(page, 'shop-order-declined-desktop');

    // "Try paying again" goes back to a card page for the same amount; she leaves it again.
    await page.getByRole('button', { name: `Try paying again ${price}` }).click();
    await page.waitForURL(/\/pay\//);
    await page.getByRole('button', { name: `Pay ${price}` }).waitFor();
    await page.getByRole('button', { name: 'Cancel and go back' }).click();
    await page.waitForURL(new RegExp(`/orders/${orderId}\\?checkout=cancelled`));
    await page.getByRole('heading', { level: 1, name: `Order ${orderId}` }).waitFor();

    // Cancelling asks first; keeping it changes nothing.
    await page.getByRole('button', { name: 'Cancel order' }).click();
    const confirm = page.getByRole('dialog', { name: 'Cancel this order?' });
    await confirm.getByRole('button', { name: 'Keep it' }).click();
    await confirm.waitFor({ state: 'hidden' });
    expect(await page.locator('.app-page-header .order-status-tag').innerText()).toBe('Ordered');
    await page.getByRole('button', { name: 'Cancel order' }).click();
    await confirm.getByRole('button', { name: 'Cancel the order' }).click();
    await page.locator('.app-page-header .order-status-tag').filter({ hasText: 'Cancelled' }).waitFor();
    expect(await page.getByRole('button', { name: /^Try paying again/ }).count()).toBe(0);
  });

  it('another bowler has no orders and cannot open dana’s', async () => {
    expect(flow.orderId).toBeGreaterThan(0);
    const { page } = await open();
    await signIn(page, DEMO.lee);
    await page.goto('/orders');
    await page.getByText(/^\s*No orders yet\./).waitFor();
    await page.goto(`/orders/${flow.orderId}`);
    await page.getByText('This order does not exist or is not yours.').waitFor();
    expect(await page.getByText(SERVICE_NAME).count()).toBe(0);
  });
});

describe('pro shop: a price changed while the bowler looks at it', () => {
  it('is refused, not charged: the dialog shows the new price from the list and asks again', async () => {
    const bowler = await open();
    await signIn(bowler.page, DEMO.dana);
    await bowler.page.goto(`/arsenal/${flow.ballId}`);
    await bowler.page.getByRole('button', { name: 'Order a service' }).click();
    const dialog = bowler.page.getByRole('dialog', { name: /^Order a service for / });
    await dialog.waitFor();
    await choose(bowler.page, dialog, 'Service', new RegExp(`^${SERVICE_NAME}`));
    await dialog.getByTestId('order-price').filter({ hasText: PRICE_TEXT }).waitFor();

    // Meanwhile the proprietor raises the price.
    const owner = await open();
    await signIn(owner.page, DEMO.proprietor);
    await owner.page.goto('/center-admin?tab=prices');
    await owner.page.getByRole('button', { name: `Edit ${SERVICE_NAME}` }).click();
    const edit = owner.page.getByRole('dialog', { name: `Edit ${SERVICE_NAME}` });
    await edit.waitFor();
    await edit.getByLabel('Price (USD)').fill('41.25');
    await edit.getByRole('button', { name: 'Save service' }).click();
    await owner.page.locator('.shop-price-list__table').getByRole('row').filter({ hasText: SERVICE_NAME }).getByText('$41.25').waitFor();

    // The bowler presses Pay with the old price on screen: refused, and the new one shown.
    const ordersBefore = await countOrders(bowler.page);
    await dialog.getByRole('button', { name: `Pay by card ${PRICE_TEXT}` }).click();
    await dialog.getByText('The shop changed this price a moment ago.').waitFor();
    await dialog.getByTestId('order-price').filter({ hasText: '$41.25' }).waitFor();
    await dialog.getByRole('button', { name: 'Pay by card $41.25' }).waitFor();
    expect(bowler.page.url()).not.toMatch(/\/pay\//);
    expect(await countOrders(bowler.page)).toBe(ordersBefore);
    await screenshot(bowler.page, 'shop-order-price-changed-desktop');
  });
});

describe('pro shop at 375 px', () => {
  it('My orders, the order page, the order dialog and the orders board fit a phone without a horizontal scrollbar', async () => {
    expect(flow.orderId).toBeGreaterThan(0);
    const bowler = await open(MOBILE);
    await signIn(bowler.page, DEMO.dana);
    await bowler.page.goto('/orders');
    // On a phone the orders are a list of cards, not a table that scrolls sideways.
    await bowler.page.getByRole('list', { name: 'Your orders' }).getByRole('listitem').filter({ hasText: SERVICE_NAME }).waitFor();
    expect(await hasHorizontalScroll(bowler.page)).toBe(false);
    await screenshot(bowler.page, 'shop-my-orders-mobile');

    await bowler.page.goto(`/orders/${flow.orderId}`);
    await bowler.page.getByRole('list', { name: 'Order progress' }).waitFor();
    expect(await hasHorizontalScroll(bowler.page)).toBe(false);
    await screenshot(bowler.page, 'shop-order-mobile');

    await bowler.page.goto(`/arsenal/${flow.ballId}`);
    await bowler.page.getByRole('heading', { level: 2, name: 'Surface history' }).waitFor();
    expect(await hasHorizontalScroll(bowler.page)).toBe(false);
    // Keyboard: the button opens the dialog with Enter.
    await bowler.page.getByRole('button', { name: 'Order a service' }).focus();
    await bowler.page.keyboard.press('Enter');
    const dialog = bowler.page.getByRole('dialog', { name: /^Order a service for / });
    await dialog.waitFor();
    await choose(bowler.page, dialog, 'Service', new RegExp(`^${SERVICE_NAME}`));
    await dialog.getByTestId('order-price').waitFor();
    expect(await hasHorizontalScroll(bowler.page)).toBe(false);
    const box = await dialog.boundingBox();
    expect(box && box.x >= 0 && box.x + box.width <= MOBILE.width).toBe(true);
    await screenshot(bowler.page, 'shop-order-dialog-mobile');

    const owner = await open(MOBILE);
    await signIn(owner.page, DEMO.proprietor);
    await owner.page.goto('/center-admin?tab=orders');
    const card = owner.page
      .getByRole('list', { name: 'Orders board' })
      .getByRole('listitem')
      .filter({ hasText: orderTag(flow.orderId) });
    await card.waitFor();
    expect(await hasHorizontalScroll(owner.page)).toBe(false);
    await screenshot(owner.page, 'shop-orders-board-mobile');
    // The bowler collects the ball: the last step, from the phone.
    await confirmMove(owner.page, 'Mark collected', flow.orderId);
    await card.getByText('Collected', { exact: true }).waitFor();
    await owner.page.getByTestId('order-undo').getByRole('button', { name: 'Undo' }).waitFor();
    expect(await hasHorizontalScroll(owner.page)).toBe(false);
    await screenshot(owner.page, 'shop-orders-board-undo-mobile');
    expect(await owner.page.getByRole('button', { name: `Refund order ${flow.orderId}` }).count()).toBe(0);
    await owner.page.getByRole('tab', { name: 'Takings' }).click();
    await owner.page.getByRole('table', { name: 'Takings by service' }).waitFor();
    expect(await hasHorizontalScroll(owner.page)).toBe(false);
    await screenshot(owner.page, 'shop-takings-mobile');
    const today = await owner.page.getByLabel('Last day').inputValue();
    const weekAgo = new Date(Date.parse(`${today}T00:00:00Z`) - 6 * 86400000).toISOString().slice(0, 10);
    await owner.page.getByLabel('First day').fill(weekAgo);
    await owner.page.getByLabel('First day').press('Enter');
    await owner.page.getByRole('table', { name: 'Takings by day' }).locator(`time[datetime="${today}"]`).waitFor();
    expect(await hasHorizontalScroll(owner.page)).toBe(false);
    await screenshot(owner.page, 'shop-takings-range-mobile');

    await owner.page.getByRole('tab', { name: 'Orders' }).click();
    await owner.page.getByRole('button', { name: 'Take a walk-in order' }).click();
    const walkIn = owner.page.getByRole('dialog', { name: 'Walk-in order' });
    await walkIn.getByLabel('The ball, in words').waitFor();
    expect(await hasHorizontalScroll(owner.page)).toBe(false);
    const box2 = await walkIn.boundingBox();
    expect(box2 && box2.x >= 0 && box2.x + box2.width <= MOBILE.width).toBe(true);
    await screenshot(owner.page, 'shop-walk-in-dialog-mobile');
    await walkIn.getByRole('button', { name: 'Cancel' }).click();
    await walkIn.waitFor({ state: 'hidden' });
    await owner.page.getByRole('tab', { name: 'Price list' }).click();
    await owner.page.locator('.shop-price-list__table').getByRole('row').filter({ hasText: SERVICE_NAME }).waitFor();
    expect(await hasHorizontalScroll(owner.page)).toBe(false);
    await screenshot(owner.page, 'shop-price-list-mobile');
  });
});
