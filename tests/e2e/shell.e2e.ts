import { describe, expect, it } from 'vitest';
import { DEMO, DESKTOP, MOBILE, hasHorizontalScroll, mailedLink, screenshot, signIn, uniqueEmail, useBrowser } from './browser';

const { baseUrl, open } = useBrowser(DESKTOP);

/** The reset link mailed to `email`, read from the project's own test mailbox (`/api/dev/mail`, as the admin). */
const waitForResetLink = (email: string): Promise<string> => mailedLink(baseUrl, email, '/reset-password');

describe('client shell: sign-up, sign-in, sign-out', () => {
  it('sign-up: a new visitor creates an account, lands on Home signed in as a bowler, then signs out from the account menu', async () => {
    const { page } = await open();
    await page.goto('/');
    await page.waitForURL(/\/sign-in\?redirect=/);
    await page.getByRole('link', { name: 'Create an account' }).click();
    await page.getByRole('heading', { level: 1, name: 'Create an account' }).waitFor();

    const email = uniqueEmail('newbowler');
    await page.getByLabel('Display name').fill('Rowan Tester');
    await page.getByLabel('E-mail').fill(email);
    await page.getByLabel('Password').fill('a-long-enough-password');
    await screenshot(page, 'sign-up-desktop');
    await page.getByRole('button', { name: 'Create account' }).click();

    await page.getByRole('heading', { level: 1, name: 'Welcome, Rowan' }).waitFor();
    expect(new URL(page.url()).pathname).toBe('/');
    await page.getByText('You are signed in as a bowler').waitFor();
    expect(await page.evaluate(() => localStorage.getItem('lanewright.token'))).toBeTruthy();
    await screenshot(page, 'home-new-bowler-desktop');

    // The sign-up mail's link confirms the address.
    await page.goto(await mailedLink(baseUrl, email, '/verify-email'));
    await page.getByText('Your address is confirmed').waitFor();
    await screenshot(page, 'verify-email-desktop');
    await page.getByRole('link', { name: 'Go to Home' }).click();
    await page.getByRole('heading', { level: 1, name: 'Welcome, Rowan' }).waitFor();

    await page.getByRole('button', { name: 'Account menu for Rowan Tester' }).click();
    await page.getByRole('menuitem', { name: 'Sign out' }).click();
    await page.getByRole('heading', { level: 1, name: 'Sign in' }).waitFor();
    await page.getByText('You are signed out.').waitFor();
    expect(await page.evaluate(() => localStorage.getItem('lanewright.token'))).toBeNull();
    await screenshot(page, 'signed-out-desktop');
  });

  it('sign-up: an e-mail that is already registered gets the same answer as a new one (check your inbox); its owner gets the mail', async () => {
    const { page } = await open();
    await page.goto('/sign-up');
    await page.getByLabel('Display name').fill('Someone Else');
    await page.getByLabel('E-mail').fill(DEMO.dana);
    await page.getByLabel('Password').fill('a-long-enough-password');
    await page.getByRole('button', { name: 'Create account' }).click();
    await page.getByText('Check your inbox').waitFor();
    expect(await page.getByText('already registered').count()).toBe(0);
    expect(new URL(page.url()).pathname).toBe('/sign-up');
    await screenshot(page, 'sign-up-taken-desktop');
  });

  it('sign-in: dana signs in with the demo password and sees Home with her role', async () => {
    const { page } = await open();
    await signIn(page, DEMO.dana);
    await page.getByRole('heading', { level: 1, name: 'Welcome, Dana' }).waitFor();
    const nav = page.getByRole('navigation', { name: 'Main' });
    const links = await nav.getByRole('link').allTextContents();
    expect(links).toEqual(expect.arrayContaining(['Home', 'Profile']));
    expect(links).not.toContain('Admin');
    await page.getByRole('heading', { level: 2, name: 'Last session' }).waitFor();
    await screenshot(page, 'home-bowler-desktop');
  });

  it('sign-in: a wrong password shows one generic message and stays on sign-in', async () => {
    const { page } = await open();
    await page.goto('/sign-in');
    await page.getByLabel('E-mail').fill(DEMO.dana);
    await page.getByLabel('Password').fill('not-the-password');
    await page.getByRole('button', { name: 'Sign in', exact: true }).click();
    await page.getByRole('alert').filter({ hasText: 'E-mail or password is not correct' }).waitFor();
    expect(new URL(page.url()).pathname).toBe('/sign-in');
    await screenshot(page, 'sign-in-wrong-password-desktop');
  });

  it('401 policy: a stale token sends the visitor to sign-in, and signing in returns to the page asked for', async () => {
    const { page } = await open();
    await page.goto('/sign-in');
    await page.evaluate(() => localStorage.setItem('lanewright.token', 'not-a-valid-token'));
    await page.goto('/profile');
    await page.getByRole('heading', { level: 1, name: 'Sign in' }).waitFor();
    expect(new URL(page.url()).searchParams.get('redirect')).toBe('/profile');
    expect(await page.evaluate(() => localStorage.getItem('lanewright.token'))).toBeNull();
    await page.getByLabel('E-mail').fill(DEMO.lee);
    await page.getByLabel('Password').fill('lanewright-demo');
    await page.getByRole('button', { name: 'Sign in', exact: true }).click();
    await page.getByRole('heading', { level: 1, name: 'Profile' }).waitFor();
    expect(new URL(page.url()).pathname).toBe('/profile');
  });
});

describe('client shell: profile', () => {
  it('profile: dana changes rev rate and hand, saves, and both survive a reload', async () => {
    const { page } = await open();
    await signIn(page, DEMO.dana);
    await page.getByRole('navigation', { name: 'Main' }).getByRole('link', { name: 'Profile' }).click();
    await page.getByRole('heading', { level: 1, name: 'Profile' }).waitFor();
    const rev = page.getByLabel('Rev rate (rpm)');
    // The form shows the typical starting values until the saved profile has arrived: read it after that.
    await page.getByRole('status').filter({ hasText: 'Profile loaded.' }).waitFor({ state: 'attached' });
    expect(await rev.inputValue()).toBe('380');
    expect(await page.getByRole('radio', { name: 'Right' }).isChecked()).toBe(true);

    await rev.fill('420');
    await rev.press('Tab');
    // Element Plus hides the native radio under its styled label: click the label, then read the radio.
    await page.getByRole('radiogroup', { name: 'Hand' }).getByText('Left', { exact: true }).click();
    expect(await page.getByRole('radio', { name: 'Left' }).isChecked()).toBe(true);
    await page.getByRole('button', { name: 'Save profile' }).click();
    await page.getByRole('status').filter({ hasText: 'Profile saved.' }).waitFor({ state: 'attached' });
    await page.getByText('Your release parameters are up to date.').waitFor();
    await screenshot(page, 'profile-saved-desktop');

    await page.reload();
    await page.getByLabel('Rev rate (rpm)').waitFor();
    await page.getByRole('status').filter({ hasText: 'Profile loaded.' }).waitFor({ state: 'attached' });
    expect(await page.getByLabel('Rev rate (rpm)').inputValue()).toBe('420');
    expect(await page.getByRole('radio', { name: 'Left' }).isChecked()).toBe(true);
    expect(await page.getByLabel('Ball speed (mph)').inputValue()).toBe('16.5');
  });

  it('profile: a rev rate out of range shows the field message and nothing is saved', async () => {
    const { page } = await open(MOBILE);
    await signIn(page, DEMO.coach);
    await page.goto('/profile');
    const rev = page.getByLabel('Rev rate (rpm)');
    await rev.waitFor();
    await page.getByRole('status').filter({ hasText: 'Profile loaded.' }).waitFor({ state: 'attached' });
    await rev.fill('900');
    await rev.press('Tab');
    await page.getByRole('button', { name: 'Save profile' }).click();
    await page.getByRole('alert').filter({ hasText: 'At most 700 rpm' }).waitFor();
    await rev.scrollIntoViewIfNeeded();
    await screenshot(page, 'profile-bad-value-mobile');

    await page.reload();
    await page.getByRole('status').filter({ hasText: 'Profile loaded.' }).waitFor({ state: 'attached' });
    expect(await page.getByLabel('Rev rate (rpm)').inputValue()).toBe('340');
  });

  it('profile: a metric bowler sees speed in km/h and PAP in cm', async () => {
    const { page } = await open();
    await signIn(page, DEMO.lee);
    await page.goto('/profile');
    const speed = page.getByLabel('Ball speed (km/h)');
    await page.getByRole('status').filter({ hasText: 'Profile loaded.' }).waitFor({ state: 'attached' });
    // 18.5 mph × 1.609344 = 29.77 km/h, shown to one decimal.
    expect(await speed.inputValue()).toBe('29.8');
    // 4.75 in × 2.54 = 12.065 cm.
    expect(await page.getByLabel('PAP over, to the right (cm)').inputValue()).toBe('12.1');
    await screenshot(page, 'profile-metric-desktop');
  });
});

describe('client shell: roles', () => {
  it('role guard: a bowler opening the admin page is refused with a visible message', async () => {
    const { page } = await open();
    await signIn(page, DEMO.dana);
    const nav = page.getByRole('navigation', { name: 'Main' });
    expect(await nav.getByRole('link', { name: 'Admin', exact: true }).count()).toBe(0);

    await page.goto('/admin/users');
    await page.getByRole('heading', { level: 1, name: 'Not allowed' }).waitFor();
    await page.getByText('That page is only for admins.').waitFor();
    await page.getByText('You are signed in as a bowler.').waitFor();
    expect(await page.getByRole('table').count()).toBe(0);
    await screenshot(page, 'forbidden-bowler-desktop');
  });

  it('admin: the admin sees the user table, filters it, and changes a role after confirming', async () => {
    const { page } = await open();
    await signIn(page, DEMO.admin);
    await page.getByRole('navigation', { name: 'Main' }).getByRole('link', { name: 'Admin', exact: true }).click();
    await page.getByRole('heading', { level: 1, name: 'Users and roles' }).waitFor();
    await page.getByRole('cell', { name: DEMO.dana }).waitFor();
    await page.getByRole('cell', { name: DEMO.proprietor }).waitFor();
    await screenshot(page, 'admin-users-desktop');

    // Element Plus keeps the combobox input of a non-filterable select visually hidden: open it by keyboard.
    await page.getByRole('combobox', { name: 'Role' }).focus();
    await page.keyboard.press('Enter');
    await page.getByRole('option', { name: 'Proprietor' }).click();
    await page.getByRole('cell', { name: DEMO.dana }).waitFor({ state: 'detached' });
    await page.getByRole('cell', { name: DEMO.proprietor }).waitFor();
    await page.getByRole('status').filter({ hasText: '1 user found.' }).waitFor();
    await page.getByRole('button', { name: 'Clear filters' }).click();
    await page.getByRole('cell', { name: DEMO.dana }).waitFor();

    await page.getByLabel('Search by name or e-mail').fill('marchetti');
    await page.getByRole('cell', { name: DEMO.dana }).waitFor({ state: 'detached' });
    await page.getByRole('cell', { name: DEMO.lee }).waitFor();

    await page.getByRole('button', { name: 'Change role of Lee Marchetti' }).click();
    const dialog = page.getByRole('dialog', { name: 'Change role: Lee Marchetti' });
    await dialog.waitFor();
    await dialog.getByRole('radiogroup', { name: 'New role' }).getByText('Coach', { exact: true }).click();
    expect(await dialog.getByRole('radio', { name: /^Coach/ }).isChecked()).toBe(true);
    await dialog.getByRole('button', { name: 'Continue' }).click();
    await dialog.getByText('Make Lee Marchetti a coach instead of a bowler?').waitFor();
    await screenshot(page, 'admin-role-confirm-desktop');
    await dialog.getByRole('button', { name: 'Yes, change the role' }).click();
    await page.getByText('Lee Marchetti is now a coach.').waitFor();
    await page
      .getByRole('row', { name: /Lee Marchetti/ })
      .getByText('Coach', { exact: true })
      .waitFor();
  });

  it('admin page at 375 px: the table scrolls inside its card, the page itself does not', async () => {
    const { page } = await open(MOBILE);
    await signIn(page, DEMO.admin);
    await page.goto('/admin/users');
    await page.getByRole('cell', { name: DEMO.dana }).waitFor();
    expect(await hasHorizontalScroll(page)).toBe(false);
    await screenshot(page, 'admin-users-mobile');
  });
});

describe('client shell: small screens', () => {
  it('sign-in at 375 px has no horizontal scroll', async () => {
    const { page } = await open(MOBILE);
    await page.goto('/sign-in');
    await page.getByRole('heading', { level: 1, name: 'Sign in' }).waitFor();
    await page.getByLabel('E-mail').waitFor();
    expect(await hasHorizontalScroll(page)).toBe(false);
    await screenshot(page, 'sign-in-mobile');
  });

  it('at 375 px the navigation collapses into a menu button that opens a drawer with the links and sign-out', async () => {
    const { page } = await open(MOBILE);
    await signIn(page, DEMO.dana);
    expect(await hasHorizontalScroll(page)).toBe(false);
    await screenshot(page, 'home-bowler-mobile');
    const menu = page.getByRole('button', { name: 'Open navigation' });
    await menu.click();
    const drawer = page.getByRole('dialog', { name: 'Lanewright' });
    await drawer.getByRole('link', { name: 'Profile' }).waitFor();
    await screenshot(page, 'nav-drawer-mobile');
    await drawer.getByRole('link', { name: 'Profile' }).click();
    await page.getByRole('heading', { level: 1, name: 'Profile' }).waitFor();
    await page.getByLabel('Rev rate (rpm)').waitFor();
    expect(await hasHorizontalScroll(page)).toBe(false);
    await screenshot(page, 'profile-mobile');

    await menu.click();
    await page.getByRole('dialog', { name: 'Lanewright' }).getByRole('button', { name: 'Sign out' }).click();
    await page.getByRole('heading', { level: 1, name: 'Sign in' }).waitFor();
  });

  it('keyboard: the skip link comes first and sign-in works with the keyboard alone', async () => {
    const { page } = await open();
    await page.goto('/sign-in');
    await page.getByLabel('E-mail').waitFor();
    await page.keyboard.press('Tab');
    expect(await page.evaluate(() => document.activeElement?.textContent?.trim())).toBe('Skip to content');
    await page.keyboard.press('Enter');
    await page.keyboard.press('Tab');
    expect(await page.evaluate(() => document.activeElement?.id)).toBe(await page.getByLabel('E-mail').getAttribute('id'));
    await page.keyboard.type(DEMO.dana);
    await page.keyboard.press('Tab');
    expect(await page.evaluate(() => document.activeElement?.id)).toBe(await page.getByLabel('Password').getAttribute('id'));
    await page.keyboard.type('lanewright-demo');
    await page.keyboard.press('Enter');
    await page.getByRole('heading', { level: 1, name: 'Welcome, Dana' }).waitFor();
  });

  it('reset password: the link from the e-mail sets a new password that then signs in', async () => {
    const email = uniqueEmail('resetter');
    const register = await fetch(`${baseUrl}/api/auth/register`, {
      method: 'POST',
      headers: { 'Content-Type': 'application/json' },
      body: JSON.stringify({ email, password: 'the-first-password', displayName: 'Quill Resetter' }),
    });
    expect(register.status).toBe(201);

    const { page } = await open(MOBILE);
    await page.goto('/reset-password');
    await page.getByLabel('E-mail').fill(email);
    await page.getByRole('button', { name: 'Send reset link' }).click();
    await page.getByText(`If an account exists for ${email}`).waitFor();

    const link = await waitForResetLink(email);
    await page.goto(link);
    await page.getByRole('heading', { level: 1, name: 'Choose a new password' }).waitFor();
    await page.getByLabel('New password', { exact: true }).fill('the-second-password');
    await page.getByLabel('Repeat the new password').fill('not-the-same');
    await page.getByRole('button', { name: 'Save new password' }).click();
    await page.getByRole('alert').filter({ hasText: 'The two passwords do not match' }).waitFor();
    await page.getByLabel('Repeat the new password').fill('the-second-password');
    await page.getByRole('button', { name: 'Save new password' }).click();
    await page.getByText('Your password has been changed.').waitFor();
    await screenshot(page, 'reset-done-mobile');

    await page.getByLabel('E-mail').fill(email);
    await page.getByLabel('Password').fill('the-second-password');
    await page.getByRole('button', { name: 'Sign in', exact: true }).click();
    await page.getByRole('heading', { level: 1, name: 'Welcome, Quill' }).waitFor();

    // The same link does not work twice.
    await page.goto(link);
    await page.getByLabel('New password', { exact: true }).fill('the-third-password');
    await page.getByLabel('Repeat the new password').fill('the-third-password');
    await page.getByRole('button', { name: 'Save new password' }).click();
    await page.getByRole('alert').filter({ hasText: 'invalid or has expired' }).waitFor();
    await screenshot(page, 'reset-link-used-mobile');
  });

  it('reset password: asking for a link confirms without saying whether the account exists', async () => {
    const { page } = await open(MOBILE);
    await page.goto('/sign-in');
    await page.getByRole('link', { name: 'Forgot your password?' }).click();
    await page.getByRole('heading', { level: 1, name: 'Reset your password' }).waitFor();
    await page.getByLabel('E-mail').fill('nobody@example.test');
    await page.getByRole('button', { name: 'Send reset link' }).click();
    await page.getByText('If an account exists for nobody@example.test').waitFor();
    expect(await hasHorizontalScroll(page)).toBe(false);
    await screenshot(page, 'reset-request-mobile');
  });
});
