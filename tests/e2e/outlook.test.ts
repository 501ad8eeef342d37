import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { DEMO_PASSWORD } from '../../server/seeders/demo';
import { destinationPoint } from '../../shared/geo';
import { findTarget, targetHorizontal } from '../../shared/sky';
import { openBrowser, screenshotPath, signIn, type BrowserSession } from './helpers';

const TOMAS = 'tomas@demo.gnomon.test';
// An invented inland site with a very wide landmark facing where the Orion Nebula stands three
// nights from now at 23:00 UTC, so this week has lineups inside the forecast's reach, whatever the date.
const VANTAGE = { lat: 40.2, lon: -3.7, elevationM: 600, cameraHeightM: 1.5 };

let s: BrowserSession;
let sightlineId = '';
beforeAll(async () => {
  const m42 = findTarget('m42')!;
  const at = new Date(Date.now() + 3 * 86_400_000);
  at.setUTCHours(23, 0, 0, 0);
  const h = targetHorizontal(m42, { lat: VANTAGE.lat, lon: VANTAGE.lon, elevationM: VANTAGE.elevationM }, at);
  const spot = destinationPoint(VANTAGE, h.azimuthDeg, 1000);
  s = await openBrowser({ width: 1360, height: 1000 });
  await signIn(s.page, TOMAS, DEMO_PASSWORD);
  const created = await s.page.request.post('/api/sightlines', {
    data: {
      name: 'Outlook test ridge', vantage: VANTAGE, bandHeightDeg: 80, targetId: 'm42',
      landmark: { lat: spot.lat, lon: spot.lon, baseElevationM: 600, heightM: 5, widthM: 3000 },
    },
  });
  expect(created.status(), await created.text()).toBe(201);
  sightlineId = ((await created.json()) as { sightline: { id: string } }).sightline.id;
});
afterAll(async () => {
  if (sightlineId) await s?.page.request.delete(`/api/sightlines/${sightlineId}`);
  await s?.browser.close();
});

describe('the sky outlook in the browser', () => {
  it('puts a clear / mixed / cloudy badge on the lineups within the forecast and "no forecast yet" beyond it', async () => {
    const { page } = s;
    await page.goto(`/sightlines/${sightlineId}`);
    await page.getByTestId('lineup-done').waitFor({ timeout: 30_000 });
    const badges = page.getByTestId('outlook-badge');
    await expect.poll(() => page.locator('[data-testid="outlook-badge"][data-kind="clear"], [data-testid="outlook-badge"][data-kind="mixed"], [data-testid="outlook-badge"][data-kind="cloudy"]').count(), { timeout: 15_000 }).toBeGreaterThan(0);
    const kinds = await badges.evaluateAll((els) => els.map((e) => e.getAttribute('data-kind')));
    expect(kinds.length).toBeGreaterThan(3);
    for (const k of kinds) expect(['clear', 'mixed', 'cloudy', 'no-forecast-yet', 'past', 'unavailable', 'loading']).toContain(k);
  });

  it('draws the hourly cloud bars and the caution on the night chart of a lineup within reach', async () => {
    const { page } = s;
    // The first lineup is within the next days: open its night.
    await page.getByTestId('tab-night').click();
    await page.getByTestId('night-panel').waitFor();
    await page.getByTestId('night-outlook').waitFor({ timeout: 15_000 });
    expect(await page.locator('[data-testid="night-panel"] rect.cloud-bar').count()).toBeGreaterThan(0);
    expect(await page.getByTestId('outlook-caution').textContent()).toBeTruthy();
    await page.screenshot({ path: screenshotPath('night-chart-outlook'), fullPage: true });
    expect(s.pageErrors.filter((e) => !/status of 401/.test(e))).toEqual([]);
  });
});
