import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { DEMO_PASSWORD, demoAccounts } from '../../server/seeders/demo';
import { computedStyle, evalInPage, openBrowser, screenshotPath, signIn, type BrowserSession } from './helpers';

let s: BrowserSession;
beforeAll(async () => { s = await openBrowser(); });
afterAll(async () => { await s?.browser.close(); });

describe('a new user in the browser', () => {
  it('is sent to sign in, registers, sees the home page with name and role', async () => {
    const { page } = s;
    await page.goto('/');
    await page.waitForURL(/\/signin/);
    await page.getByRole('link', { name: 'Create one' }).click();
    await page.waitForURL(/\/register/);

    // A short password is refused beside the field, and nothing is lost from the form.
    await page.locator('input[name="name"]').fill('Wren Haldane');
    await page.locator('input[name="email"]').fill(`wren-${Date.now()}@example.test`);
    await page.locator('input[name="password"]').fill('short');
    await page.getByRole('button', { name: 'Create account' }).click();
    await expect.poll(() => page.getByText('Password must be at least 10 characters').count()).toBe(1);
    expect(await page.locator('input[name="name"]').inputValue()).toBe('Wren Haldane');

    await page.locator('input[name="password"]').fill('a-long-enough-password');
    await page.getByRole('button', { name: 'Create account' }).click();
    await page.getByTestId('home-greeting').waitFor();
    expect(await page.getByTestId('home-greeting').textContent()).toContain('Wren Haldane');
    expect(await page.getByTestId('home-role').textContent()).toBe('member');
    await page.screenshot({ path: screenshotPath('home-dark') });

    // A member is kept out of the admin page.
    await page.goto('/admin');
    await page.waitForURL((url) => url.pathname === '/');
    await page.getByTestId('sign-out').click();
    await page.waitForURL(/\/signin/);
  });

  it('signs in as the demo admin, toggles night vision (remembered), and sees the accounts table', async () => {
    const { page } = s;
    const admin = demoAccounts.find((a) => a.role === 'admin')!;
    // A wrong password shows the one generic message.
    await page.goto('/signin');
    await page.locator('input[name="email"]').fill(admin.email);
    await page.locator('input[name="password"]').fill('not-the-password');
    await page.getByRole('button', { name: 'Sign in' }).click();
    await page.getByTestId('form-error').waitFor();
    expect(await page.getByTestId('form-error').textContent()).toMatch(/not right/);

    await signIn(page, admin.email, DEMO_PASSWORD);
    expect(await page.getByTestId('home-role').textContent()).toBe('admin');

    await page.getByTestId('night-vision-toggle').click();
    expect(await evalInPage(page, 'document.documentElement.dataset.theme')).toBe('night-vision');
    // Red on black: the body is black and the text has red but no green or blue (after the
    // theme's colour transition).
    await expect.poll(() => computedStyle(page, 'body', 'background-color')).toBe('rgb(0, 0, 0)');
    const textColour = await computedStyle(page, '[data-testid="home-greeting"]', 'color');
    const [r, g, b] = textColour.match(/\d+/g)!.map(Number) as [number, number, number];
    expect(r).toBeGreaterThan(150);
    expect(g).toBeLessThan(r / 2);
    expect(b).toBeLessThan(r / 2);
    await page.screenshot({ path: screenshotPath('home-night-vision') });

    await page.reload();
    await page.getByTestId('home-greeting').waitFor();
    expect(await evalInPage(page, 'document.documentElement.dataset.theme')).toBe('night-vision');

    await page.getByRole('link', { name: 'Accounts' }).click();
    await page.getByTestId('account-table').waitFor();
    await expect.poll(() => page.getByText(demoAccounts[1]!.email).count()).toBe(1);
    await page.getByTestId('account-table').screenshot({ path: screenshotPath('admin-accounts-night-vision') });
    await page.getByTestId('night-vision-toggle').click();
    await expect.poll(() => computedStyle(page, 'body', 'background-color')).toBe('rgb(11, 13, 18)');
    await page.waitForTimeout(400); // let the table's own colour transition finish before the picture
    await page.screenshot({ path: screenshotPath('admin-accounts-dark') });
  });

  it('made no request outside 127.0.0.1 and raised no page errors', () => {
    expect(s.offsiteRequests).toEqual([]);
    // The only console errors allowed are the API's deliberate 401/400 answers during the flows above.
    expect(s.pageErrors.filter((e) => !/status of 40[01]/.test(e))).toEqual([]);
  });
});

describe('on a phone screen', () => {
  it('the sign-in page fits without horizontal scrolling', async () => {
    const phone = await openBrowser({ width: 390, height: 780 });
    try {
      await phone.page.goto('/signin');
      await phone.page.getByRole('button', { name: 'Sign in' }).waitFor();
      const overflow = await evalInPage<number>(phone.page, 'document.documentElement.scrollWidth - window.innerWidth');
      expect(overflow).toBeLessThanOrEqual(0);
      await phone.page.screenshot({ path: screenshotPath('signin-phone') });
    } finally {
      await phone.browser.close();
    }
  });
});
