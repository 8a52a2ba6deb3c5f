import { describe, expect, it } from 'vitest';
import { screenshot, signIn, useServerAndBrowser, watchConsole } from '../support/e2e';

const env = useServerAndBrowser();

const demoUsers = [
  { email: 'therapist@mendstep.test', home: '/today', heading: 'Today', name: 'Tamsin Ruel' },
  { email: 'supervisor@mendstep.test', home: '/review', heading: 'Review desk', name: 'Owen Halloway' },
  { email: 'admin@mendstep.test', home: '/staff', heading: 'Staff', name: 'Priya Castell' },
];

describe('signing in in Chromium at 1280×800', () => {
  for (const user of demoUsers) {
    it(`the demo ${user.heading.toLowerCase()} user lands on their home with no console or CSP errors`, async () => {
      const context = await env.browser.newContext({ viewport: { width: 1280, height: 800 } });
      const page = await context.newPage();
      const errors = watchConsole(page);
      await page.goto(`${env.server.baseUrl}/`);
      await page.waitForURL(/\/sign-in\?next=/);
      await signIn(page, env.server.baseUrl, user.email);
      await page.waitForURL(`**${user.home}`);
      await page.getByRole('heading', { level: 1, name: user.heading }).waitFor();
      await expect(page.getByTestId('signed-in-user').textContent()).resolves.toBe(user.name);
      // The font is bundled and served by us.
      await expect(page.evaluate(async () => { await document.fonts.ready; return document.fonts.check('16px Lexend'); })).resolves.toBe(true);
      await screenshot(page, `home-${user.home.slice(1)}`);
      // 401 from /api/auth/me before sign-in is expected; anything else is not.
      expect(errors.filter((e) => !e.includes('401'))).toEqual([]);
      await context.close();
    });
  }

  it('sends a signed-out visitor of a protected page to sign in, then back to that page', async () => {
    const context = await env.browser.newContext({ viewport: { width: 1280, height: 800 } });
    const page = await context.newPage();
    await page.goto(`${env.server.baseUrl}/staff`);
    await page.waitForURL('**/sign-in?next=%2Fstaff');
    await page.getByLabel('E-mail').fill('admin@mendstep.test');
    await page.getByLabel('Password').fill('demo-table-2026');
    await page.getByRole('button', { name: 'Sign in' }).click();
    await page.waitForURL('**/staff');
    await page.getByRole('cell', { name: 'therapist@mendstep.test' }).waitFor();
    // Another clinic's staff never appear.
    expect(await page.getByText('therapist@other.mendstep.test').count()).toBe(0);
    await screenshot(page, 'staff-table');
    await context.close();
  });

  it('shows the generic error for a wrong password and stays on the sign-in page', async () => {
    const context = await env.browser.newContext({ viewport: { width: 1280, height: 800 } });
    const page = await context.newPage();
    await signIn(page, env.server.baseUrl, 'therapist@mendstep.test', 'not-the-right-one');
    await page.getByText('That e-mail and password do not match an active account.').waitFor();
    expect(new URL(page.url()).pathname).toBe('/sign-in');
    await context.close();
  });

  it('signs out and a protected page asks for sign-in again', async () => {
    const context = await env.browser.newContext({ viewport: { width: 1280, height: 800 } });
    const page = await context.newPage();
    await signIn(page, env.server.baseUrl, 'therapist@mendstep.test');
    await page.waitForURL('**/today');
    await page.getByRole('button', { name: 'Sign out' }).click();
    await page.waitForURL('**/sign-in');
    await page.goto(`${env.server.baseUrl}/today`);
    await page.waitForURL('**/sign-in?next=%2Ftoday');
    await context.close();
  });
});
