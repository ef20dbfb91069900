import { describe, expect, it } from 'vitest';
import type { Page } from 'playwright-core';
import {
  chooseOption,
  DEMO,
  DEMO_PASSWORD,
  MOBILE,
  eventually,
  hasHorizontalScroll,
  screenshot,
  signIn,
  uniqueEmail,
  verifyByMail,
  useBrowser,
} from './browser';

const { baseUrl, open } = useBrowser(MOBILE);

/** Picks an option of an Element Plus select (see chooseOption: it waits for the select to be enabled). */
async function choose(page: Page, combobox: string, option: string | RegExp): Promise<void> {
  await chooseOption(page, page.getByRole('combobox', { name: combobox }), option, { exact: false, first: true });
}

async function login(email: string): Promise<string> {
  const res = await fetch(`${baseUrl}/api/auth/login`, {
    method: 'POST',
    headers: { 'Content-Type': 'application/json' },
    body: JSON.stringify({ email, password: DEMO_PASSWORD }),
  });
  expect(res.status).toBe(200);
  return ((await res.json()) as { token: string }).token;
}

/** The demo seed links the coach to Dana; should a seed lack the link, it is made here through the API (invite, accept). */
async function ensureLinked(): Promise<void> {
  const auth = (t: string) => ({ Authorization: `Bearer ${t}`, 'Content-Type': 'application/json' });
  const coachToken = await login(DEMO.coach);
  const students = (await (await fetch(`${baseUrl}/api/coach/students`, { headers: auth(coachToken) })).json()) as {
    items: { student: { email: string } }[];
  };
  if (students.items.some((s) => s.student.email === DEMO.dana)) return;
  const invited = await fetch(`${baseUrl}/api/coach/invitations`, {
    method: 'POST',
    headers: auth(coachToken),
    body: JSON.stringify({ email: DEMO.dana }),
  });
  expect(invited.status).toBe(201);
  const link = ((await invited.json()) as { item: { id: number } }).item;
  const accepted = await fetch(`${baseUrl}/api/coach/links/${link.id}/accept`, { method: 'POST', headers: auth(await login(DEMO.dana)) });
  expect(accepted.status).toBe(200);
}

describe('coach: invitations, plans and the side-by-side what-if at 375 px', () => {
  it('a coach invites a new bowler, who accepts on Home; the coach sends a plan that shows on the student’s Home', async () => {
    const email = uniqueEmail('student');
    const reg = await fetch(`${baseUrl}/api/auth/register`, {
      method: 'POST',
      headers: { 'Content-Type': 'application/json' },
      body: JSON.stringify({ email, password: 'a-long-password-1', displayName: 'Rowan Pike' }),
    });
    expect(reg.status).toBe(201);
    await verifyByMail(baseUrl, email); // only a confirmed address claims an invitation

    const coach = await open();
    await signIn(coach.page, DEMO.coach);
    await coach.page.goto('/coach');
    await coach.page.getByRole('heading', { level: 1, name: 'Coach' }).waitFor();
    await coach.page.getByLabel("Student's e-mail").fill(email);
    await coach.page.getByRole('button', { name: 'Send invitation' }).click();
    await coach.page.getByRole('heading', { level: 3, name: 'Waiting for an answer' }).waitFor();
    await coach.page.getByText(email).first().waitFor();
    expect(await hasHorizontalScroll(coach.page)).toBe(false);
    await screenshot(coach.page, 'coach-invite-mobile');

    const student = await open();
    await signIn(student.page, email, 'a-long-password-1');
    await student.page.getByRole('heading', { level: 2, name: 'Coach invitations' }).waitFor();
    await student.page.getByRole('button', { name: 'Accept Tobias Wren' }).click();
    await student.page.getByRole('heading', { level: 2, name: 'Coach invitations' }).waitFor({ state: 'detached' });
    await student.page.goto('/coach');
    await student.page.getByText('your coach since').waitFor();
    expect(await hasHorizontalScroll(student.page)).toBe(false);

    await coach.page.reload();
    await coach.page.getByRole('button', { name: 'Open Rowan Pike' }).click();
    await coach.page.getByRole('heading', { level: 2, name: 'Rowan Pike' }).waitFor();
    await coach.page.getByLabel('Title').fill('Spare shooting first');
    await coach.page.getByLabel('The plan').fill('Use the 3-6-9 system for every corner pin this week; keep the strike target.');
    await coach.page.getByRole('button', { name: 'Send plan' }).click();
    await coach.page.getByRole('status').filter({ hasText: 'Plan “Spare shooting first” sent to Rowan Pike.' }).waitFor();
    expect(await hasHorizontalScroll(coach.page)).toBe(false);

    await student.page.goto('/');
    await student.page.getByRole('heading', { level: 2, name: 'Plans from your coach' }).waitFor();
    await student.page.getByText('Spare shooting first').waitFor();
    await screenshot(student.page, 'home-plan-mobile');
    expect(await hasHorizontalScroll(student.page)).toBe(false);
  });

  it('the coach compares two surfaces of a student’s ball on one condition with both paths on one lane', async () => {
    await ensureLinked();
    const { page } = await open();
    await signIn(page, DEMO.coach);
    await page.goto('/coach');
    await page.getByRole('button', { name: 'Open Dana Holloway' }).click();
    await page.getByRole('heading', { level: 3, name: 'Side by side: two balls, or two versions of one' }).waitFor();
    await choose(page, 'Ball to compare', /^Big Red/);
    await choose(page, 'Condition to compare on', 'Long Haul 47');
    await choose(page, 'Version B grit', '4000 grit');
    const verdict = page
      .getByRole('status')
      .filter({ hasText: /^From A to B: Breakpoint (\d+\.\d ft (later|earlier)|at the same distance)/ });
    await verdict.waitFor({ timeout: 60000 });
    await page.getByRole('img', { name: /^Lane view of Long Haul 47 from above/ }).waitFor();
    await eventually(() => page.locator('svg path[data-ball="a"]').count()).toBe(1);
    await eventually(() => page.locator('svg path[data-ball="b"]').count()).toBe(1);
    await screenshot(page, 'coach-what-if-mobile');
    expect(await hasHorizontalScroll(page)).toBe(false);

    // Two different balls of the student's, late in the pattern's life (25 games), with the student's calibration named.
    await choose(page, 'Ball B', /^Backend/);
    await page.getByRole('spinbutton', { name: 'Games bowled on the pattern' }).fill('25');
    await page.getByRole('spinbutton', { name: 'Games bowled on the pattern' }).press('Tab');
    await expect.poll(() => page.getByRole('spinbutton', { name: 'Games bowled on the pattern' }).inputValue()).toBe('25');
    await eventually(async () => {
      const names = await page.locator('svg [data-ball]').evaluateAll((els) => els.map((e) => e.getAttribute('data-ball')));
      return names.includes('a') && names.includes('b');
    }).toBe(true);
    const legend = page.getByRole('list', { name: 'Legend' });
    await legend.getByText(/B: Backend \(Skylark Arc\) — /).waitFor();
    await legend.getByText(/A: Big Red/).waitFor();
    await page.getByTestId('coach-calibration').waitFor();
    await page
      .getByRole('status')
      .filter({ hasText: /^From A to B: / })
      .waitFor({ timeout: 60000 });
    await screenshot(page, 'coach-two-balls-mobile');
    expect(await hasHorizontalScroll(page)).toBe(false);

    // The student's stats, read by the coach.
    await page.getByRole('link', { name: "Dana Holloway's stats and calibration" }).click();
    await page.getByRole('heading', { level: 1, name: 'Stats — Dana Holloway' }).waitFor();
    await page
      .getByRole('heading', { level: 2, name: /^(Overall|Calibration)$/ })
      .or(page.getByText('No shots logged for this choice yet.'))
      .first()
      .waitFor({ timeout: 90000 });
    expect(await page.locator('.el-alert--error').count()).toBe(0);
    expect(await hasHorizontalScroll(page)).toBe(false);
  });
});
