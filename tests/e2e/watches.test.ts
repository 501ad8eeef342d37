import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { DEMO_PASSWORD } from '../../server/seeders/demo';
import { openBrowser, screenshotPath, signIn, type BrowserSession } from './helpers';

const PRIYA = 'priya@demo.gnomon.test';
const INES = 'ines@demo.gnomon.test';
const NAME = 'Watch test headland';
// Invented pins of this test's own.
const VANTAGE = { lat: 50.5755, lon: -4.9115, elevationM: 3, cameraHeightM: 1.5 };
const LANDMARK = { lat: 50.5712, lon: -4.9085, baseElevationM: 0, heightM: 38, widthM: 60 };

let s: BrowserSession;
let sightlineId = '';
beforeAll(async () => {
  s = await openBrowser({ width: 1360, height: 950 });
  await signIn(s.page, PRIYA, DEMO_PASSWORD);
  const created = await s.page.request.post('/api/sightlines', { data: { name: NAME, vantage: VANTAGE, landmark: LANDMARK } });
  expect(created.status()).toBe(201);
  sightlineId = ((await created.json()) as { sightline: { id: string } }).sightline.id;
});
afterAll(async () => {
  if (sightlineId) await s?.page.request.delete(`/api/sightlines/${sightlineId}`);
  await s?.browser.close();
});

describe('watches in the browser', () => {
  it('refuses a bad form with field messages, then creates a watch from the sightline page', async () => {
    const { page } = s;
    await page.goto(`/sightlines/${sightlineId}?tab=watch`);
    const form = page.getByTestId('watch-form-create');
    await form.waitFor();
    // No night of the week allowed: the shared schema refuses it before anything is sent.
    for (let d = 1; d <= 7; d++) await form.getByTestId(`watch-weekday-${d}`).click();
    await form.getByTestId('watch-submit').click();
    await expect.poll(() => form.getByText('Allow at least one night of the week').count()).toBe(1);
    await form.getByTestId('watch-weekday-5').click();
    await form.getByTestId('watch-weekday-6').click();
    await form.getByTestId('watch-submit').click();
    await page.locator('[data-testid="sightline-watch-table"] [data-testid="watch-row"]').first().waitFor();
    expect(await page.locator('[data-testid="sightline-watch-table"] [data-testid="watch-row"]').count()).toBe(1);
  });

  it('lists it on the Watches page, pauses it, and shows the calendar feed address', async () => {
    const { page } = s;
    await page.goto('/watches');
    await page.getByTestId('watches-page').waitFor();
    const row = page.locator('[data-testid="watch-row"]', { hasText: NAME });
    await row.waitFor();
    expect(await row.getAttribute('data-paused')).toBe('false');
    expect(await row.getByTestId('watch-conditions').textContent()).toMatch(/Fri/);
    await row.getByTestId('watch-paused').click();
    await expect.poll(() => row.getAttribute('data-paused')).toBe('true');
    const feed = await page.getByTestId('calendar-feed-url').locator('input').inputValue();
    expect(feed).toMatch(/\/api\/calendar\/[^/]+\.ics$/);
    // The feed answers as iCalendar without signing in.
    const ics = await page.request.get(new URL(feed).pathname);
    expect(ics.status()).toBe(200);
    expect(await ics.text()).toContain('BEGIN:VCALENDAR');
    await page.screenshot({ path: screenshotPath('watches-page'), fullPage: true });
  });

  it('an admin reads the outbox; members are sent home', async () => {
    const admin = await openBrowser({ width: 1280, height: 900 });
    try {
      await signIn(admin.page, INES, DEMO_PASSWORD);
      await admin.page.goto('/admin/outbox');
      await admin.page.getByTestId('outbox-page').waitFor();
      await admin.page.locator('[data-testid="outbox-table"]').waitFor();
    } finally {
      await admin.browser.close();
    }
    await s.page.goto('/admin/outbox');
    await s.page.getByTestId('home-greeting').waitFor();
    expect(s.pageErrors.filter((e) => !/status of 40[13]/.test(e))).toEqual([]);
    expect(s.offsiteRequests).toEqual([]);
  });
});
