import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { DateTime } from 'luxon';
import type { Page } from 'playwright-core';
import { DEMO_PASSWORD, demoAccounts } from '../../server/seeders/demo';
import { formatDecimalDegrees, geodesicInverse, parseCoordinates } from '../../shared/geo';
import { localDateOf, nightReport } from '../../shared/sky';
import {
  clickAt, computedStyle, evalInPage, failTileRequests, isTileRequest, openBrowser, screenshotPath, signIn, type BrowserSession,
} from './helpers';

const member = demoAccounts.find((a) => a.role === 'member')!;
const MAP = '[data-testid="scouting-map"] .leaflet-container';
// A vantage and a landmark on the south coast of Ireland, typed in degrees, minutes and seconds.
const VANTAGE_DMS = `52°07'24.2"N 7°07'24.2"W`;
const LANDMARK_DMS = '52 06 40 N, 7 05 50 W';

const readout = (page: Page, key: string) => page.getByTestId(`readout-${key}`).textContent();
const fieldValue = (page: Page, kind: 'vantage' | 'landmark') => page.locator(`input[name="${kind}-coordinates"]`).inputValue();

async function typeCoordinates(page: Page, kind: 'vantage' | 'landmark', text: string): Promise<void> {
  const input = page.locator(`input[name="${kind}-coordinates"]`);
  await input.fill(text);
  await input.press('Enter');
}

/** Drags an element by an offset in pixels, in small steps as a hand would. */
async function drag(page: Page, selector: string, dx: number, dy: number): Promise<void> {
  const box = (await page.locator(selector).first().boundingBox())!;
  const x = box.x + box.width / 2;
  const y = box.y + box.height / 2;
  await page.mouse.move(x, y);
  await page.mouse.down();
  for (let i = 1; i <= 8; i += 1) await page.mouse.move(x + (dx * i) / 8, y + (dy * i) / 8);
  await page.mouse.up();
}

let s: BrowserSession;
// The browser sits in Los Angeles while the site is in Ireland: every time shown must be Irish.
beforeAll(async () => {
  s = await openBrowser({ width: 1360, height: 900 }, { timezoneId: 'America/Los_Angeles' });
  await failTileRequests(s);
  await signIn(s.page, member.email, DEMO_PASSWORD);
});
afterAll(async () => { await s?.browser.close(); });

describe('the planner in the browser, with no map tiles', () => {
  it('shows the offline coastline and grid instead of a blank map', async () => {
    const { page } = s;
    await page.locator(MAP).waitFor();
    await page.getByTestId('map-offline-notice').waitFor();
    expect(await page.getByTestId('map-offline-notice').textContent()).toContain('Map tiles unavailable: showing the offline coastline');
    await expect.poll(() => page.locator(`${MAP} path.gn-land`).count(), { timeout: 15_000 }).toBeGreaterThan(0);
    expect(await page.locator(`${MAP} path.gn-grid`).count()).toBeGreaterThan(3);
    expect(await page.getByTestId('readout-message').textContent()).toBe('Place the vantage, then the landmark.');
    await page.screenshot({ path: screenshotPath('planner-offline-world') });
    // The safety caution stays on the home page.
    expect(await page.getByTestId('safety-caution').textContent()).toContain('A plan, not a promise');
  });

  it('places both pins by clicking the map, and the readout follows every move', async () => {
    const { page } = s;
    await page.getByTestId('place-vantage').click();
    await clickAt(page, MAP, 0.47, 0.38);
    await page.locator('.gn-pin-vantage').waitFor();
    // The first vantage zooms the map in and switches to placing the landmark.
    await expect.poll(() => page.locator('[data-testid="place-landmark"].n-radio-button--checked').count()).toBe(1);
    expect(await page.getByTestId('readout-message').textContent()).toBe('Place the landmark to see the sightline.');

    await clickAt(page, MAP, 0.75, 0.3);
    await page.locator('.gn-pin-landmark').waitFor();
    await page.getByTestId('readout-distance').waitFor();
    const distance1 = await readout(page, 'distance');
    const bearing1 = await readout(page, 'true-bearing');
    expect(distance1).toMatch(/^\d+(\.\d+)? (m|km)$/);
    expect(bearing1).toMatch(/^\d{1,3}\.\d°$/);
    for (const key of ['magnetic-bearing', 'declination', 'top-angle', 'base-angle', 'angular-width']) {
      expect(await readout(page, key)).toMatch(/°/);
    }
    expect(await page.locator(`${MAP} path.gn-sightline`).count()).toBe(1);

    // Clicking again moves the landmark.
    await clickAt(page, MAP, 0.3, 0.75);
    await expect.poll(() => readout(page, 'distance')).not.toBe(distance1);
    expect(await readout(page, 'true-bearing')).not.toBe(bearing1);

    // Dragging the landmark moves it too, live.
    const distance2 = await readout(page, 'distance');
    await drag(page, '.gn-pin-landmark', 120, -60);
    await expect.poll(() => readout(page, 'distance')).not.toBe(distance2);

    // Sun, Moon and target rays from the vantage, with their legend.
    for (const id of ['target', 'sun', 'moon']) {
      expect(await page.locator(`${MAP} path.gn-ray-${id}`).count()).toBe(1);
      expect(await page.getByTestId(`ray-legend-${id}`).textContent()).toMatch(/(alt|below the horizon).*az \d/);
    }
  });

  it('takes typed DMS coordinates, refuses a bad pair beside the field, and matches the geodesic', async () => {
    const { page } = s;
    await typeCoordinates(page, 'vantage', VANTAGE_DMS);
    await typeCoordinates(page, 'landmark', LANDMARK_DMS);
    const v = parseCoordinates(VANTAGE_DMS);
    const l = parseCoordinates(LANDMARK_DMS);
    if (!v.ok || !l.ok) throw new Error('test coordinates do not parse');
    await expect.poll(() => fieldValue(page, 'vantage')).toBe(formatDecimalDegrees(v, 6));
    expect(await fieldValue(page, 'landmark')).toBe(formatDecimalDegrees(l, 6));
    expect(await page.getByTestId('vantage-coordinates-feedback').textContent()).toBe(`DMS 52°07'24.2"N 7°07'24.2"W`);

    // The readout is the WGS84 geodesic (checked here with the shared geodesy in Node).
    const line = geodesicInverse(v, l);
    await expect.poll(() => readout(page, 'distance')).toBe(`${(line.distanceM / 1000).toFixed(2)} km`);
    expect(await readout(page, 'true-bearing')).toBe(`${line.initialBearingDeg.toFixed(1)}°`);

    // Imperial units change the display, not the values.
    await page.getByTestId('units-imperial').click();
    expect(await readout(page, 'distance')).toBe(`${(line.distanceM / 1609.344).toFixed(2)} mi`);
    expect(await page.locator('input[name="cameraHeightM"]').inputValue()).toBe('4.92');
    await page.getByTestId('units-metric').click();
    expect(await page.locator('input[name="cameraHeightM"]').inputValue()).toBe('1.5');

    // A longitude out of range is explained beside the field; the text and the pin stay.
    await typeCoordinates(page, 'vantage', '52.1, 200');
    await expect.poll(() => page.getByTestId('vantage-coordinates-feedback').textContent()).toContain('Longitude 200 is out of range');
    expect(await fieldValue(page, 'vantage')).toBe('52.1, 200');
    expect(await readout(page, 'distance')).toBe(`${(line.distanceM / 1000).toFixed(2)} km`);
    await typeCoordinates(page, 'vantage', VANTAGE_DMS);

    // A height out of range is refused beside its field and the readout waits for it.
    await page.locator('input[name="landmarkHeightM"]').fill('5000');
    await expect.poll(() => page.getByText('Between 0 and 2000 m').count()).toBe(1);
    expect(await page.getByTestId('readout-message').textContent()).toContain('Fix the heights');
    await page.locator('input[name="landmarkHeightM"]').fill('40');
    await page.getByTestId('readout-distance').waitFor();
  });

  it('shows every time in the site\'s zone, whatever the browser\'s, and the slider moves the rays', async () => {
    const { page } = s;
    expect(await page.getByTestId('sky-zone').textContent()).toContain('Europe/Dublin');
    expect(await evalInPage(page, 'Intl.DateTimeFormat().resolvedOptions().timeZone')).toBe('America/Los_Angeles');
    // Sunset as the sky engine gives it for this site, read on an Irish clock.
    const zone = 'Europe/Dublin';
    const tonight = localDateOf(new Date(Date.now() - 12 * 3_600_000), zone);
    const night = nightReport({ lat: 52.12, lon: -7.12, elevationM: 0 }, tonight, { timeZone: zone });
    const sunsetClock = DateTime.fromJSDate(night.sunset!.utc, { zone }).toFormat('HH:mm');
    expect(await page.getByTestId('night-moments').textContent()).toContain(`Sunset ${sunsetClock}`);
    expect(await page.getByTestId('sky-time').textContent()).toMatch(/ (GMT|IST)$/);

    const before = await page.getByTestId('sky-time').textContent();
    const sunRay = await page.locator(`${MAP} path.gn-ray-sun`).getAttribute('d');
    await clickAt(page, '[data-testid="time-slider"] .n-slider-rail', 0.85, 0.5);
    await expect.poll(() => page.getByTestId('sky-time').textContent()).not.toBe(before);
    expect(await page.getByTestId('ray-legend-time').textContent()).toBe(await page.getByTestId('sky-time').textContent());
    await expect.poll(() => page.locator(`${MAP} path.gn-ray-sun`).getAttribute('d')).not.toBe(sunRay);
  });

  it('draws where to stand and moves the vantage to a chosen spot', async () => {
    const { page } = s;
    await page.getByTestId('where-to-stand-toggle').click();
    await expect.poll(() => page.locator('.gn-spot').count()).toBeGreaterThan(3);
    expect(await page.locator(`${MAP} path.gn-wts-line`).count()).toBe(1);
    await page.locator('.leaflet-control-zoom-out').click();
    await page.waitForTimeout(400); // the zoom animation
    const spot = page.locator('.gn-spot', { has: page.locator('.gn-spot-label', { hasText: /^3°$/ }) });
    await spot.click();
    // From that spot the landmark top stands at 3 degrees, in line with the target.
    await expect.poll(() => readout(page, 'top-angle')).toBe('+3.00°');
    await page.screenshot({ path: screenshotPath('planner-desktop') });
  });

  it('saves the sightline, lists it, renames it, opens it, and deletes it after a confirmation', async () => {
    const { page } = s;
    const name = `Stack from the headland ${Date.now()}`;
    const vantageText = await fieldValue(page, 'vantage');

    // An empty name is refused beside the field by the API; the dialog stays open.
    await page.getByTestId('save-sightline').click();
    await page.getByTestId('sightline-name-submit').click();
    await expect.poll(() => page.getByTestId('sightline-name-dialog').getByText('Name the sightline').count()).toBe(1);
    await page.locator('input[name="sightline-name"]').fill(name);
    await page.getByTestId('sightline-name-submit').click();
    await expect.poll(() => page.getByTestId('opened-sightline').textContent()).toBe(name);
    expect(page.url()).toMatch(/\?sightline=[0-9a-f-]{36}$/);

    await page.getByRole('link', { name: 'Sightlines' }).click();
    await page.getByTestId('sightline-table').waitFor();
    const table = page.getByTestId('sightline-table');
    await expect.poll(() => table.getByText(name).count()).toBe(1);
    // Each row's next good lineup arrives from the server: a time with a score, or "none".
    await expect.poll(async () => /\d{4}-\d{2}-\d{2} \d{2}:\d{2} .* · \d+ %|None in the next 12 months/.test((await table.textContent()) ?? ''), { timeout: 20_000 }).toBe(true);
    await page.locator('input[aria-label="Search sightlines by name"]').fill(name.slice(-13));
    await expect.poll(() => page.locator('[data-testid="sightline-table"] tbody tr').count()).toBe(1);
    await page.locator('[data-testid="sightline-table"]').screenshot({ path: screenshotPath('sightlines-table') });

    const renamed = `${name} renamed`;
    await page.getByTestId('sightline-rename').click();
    await page.locator('input[name="sightline-name"]').fill(renamed);
    await page.getByTestId('sightline-name-submit').click();
    await expect.poll(() => table.getByText(renamed).count()).toBe(1);

    await page.getByTestId('sightline-open').click();
    await page.waitForURL(/\?sightline=/);
    await expect.poll(() => page.getByTestId('opened-sightline').textContent()).toBe(renamed);
    expect(await fieldValue(page, 'vantage')).toBe(vantageText);

    await page.getByRole('link', { name: 'Sightlines' }).click();
    await page.locator('input[aria-label="Search sightlines by name"]').fill(renamed);
    await page.getByTestId('sightline-delete').click();
    const confirm = page.locator('.n-dialog', { hasText: 'Delete this sightline?' });
    await confirm.waitFor();
    await page.waitForTimeout(400); // the dialog's opening animation
    await page.screenshot({ path: screenshotPath('sightline-delete-confirm') });
    await confirm.getByRole('button', { name: 'Delete', exact: true }).click();
    await expect.poll(() => table.getByText(renamed).count()).toBe(0);
  });

  it('opens a demo sightline at a real coast with both pins in view', async () => {
    const { page } = s;
    await page.locator('input[aria-label="Search sightlines by name"]').fill('');
    const table = page.getByTestId('sightline-table');
    await expect.poll(() => table.getByTestId('sightline-open').count()).toBeGreaterThan(0);
    const name = (await table.locator('tbody tr').first().locator('.sightline-name').textContent())!;
    await table.getByTestId('sightline-open').first().click();
    await expect.poll(() => page.getByTestId('opened-sightline').textContent()).toBe(name);
    await page.locator('.gn-pin-landmark').waitFor();
    // The map frames the sightline: both pins inside the map.
    const mapBox = (await page.locator(MAP).boundingBox())!;
    for (const pin of ['.gn-pin-vantage', '.gn-pin-landmark']) {
      const box = (await page.locator(pin).boundingBox())!;
      expect(box.x, pin).toBeGreaterThan(mapBox.x);
      expect(box.x + box.width, pin).toBeLessThan(mapBox.x + mapBox.width);
      expect(box.y, pin).toBeGreaterThan(mapBox.y);
      expect(box.y + box.height, pin).toBeLessThan(mapBox.y + mapBox.height);
    }
    await page.waitForTimeout(300);
    await page.screenshot({ path: screenshotPath('planner-demo-sightline') });
  });

  it('keeps the map readable in night vision (red only)', async () => {
    const { page } = s;
    await page.locator(MAP).waitFor();
    await page.getByTestId('night-vision-toggle').click();
    await expect.poll(() => computedStyle(page, 'body', 'background-color')).toBe('rgb(0, 0, 0)');
    for (const selector of ['.gn-pin-vantage .gn-pin-body', '.gn-pin-landmark .gn-pin-body', 'path.gn-ray-target', 'path.gn-sightline']) {
      const colour = await computedStyle(page, selector, selector.startsWith('path') ? 'stroke' : 'fill');
      const [r, g, b] = colour.match(/\d+/g)!.map(Number) as [number, number, number];
      expect(r, selector).toBeGreaterThan(150);
      expect(g, selector).toBeLessThan(r / 2);
      expect(b, selector).toBeLessThan(r / 2);
    }
    await page.waitForTimeout(400); // the theme's colour transition
    await page.screenshot({ path: screenshotPath('planner-night-vision') });
    await page.getByTestId('night-vision-toggle').click();
  });

  it('made no request outside 127.0.0.1 but the tile server, and raised no page errors', () => {
    expect(s.offsiteRequests).toEqual([]);
    // The only console errors allowed are the API's deliberate answers: 401 before signing in,
    // 400 for the empty name above.
    expect(s.pageErrors.filter((e) => !/status of 40[01]/.test(e))).toEqual([]);
  });
});

describe('the planner with map tiles', () => {
  it('shows the tiles and no offline notice when the tile server answers', async () => {
    const b = await openBrowser();
    try {
      // A stand-in tile server: every tile is a 1x1 PNG.
      const png = Buffer.from('iVBORw0KGgoAAAANSUhEUgAAAAEAAAABCAQAAAC1HAwCAAAAC0lEQVR42mNkYAAAAAYAAjCB0C8AAAAASUVORK5CYII=', 'base64');
      await b.context.route((url) => isTileRequest(url.toString()), (route) => route.fulfill({ status: 200, contentType: 'image/png', body: png }));
      await signIn(b.page, member.email, DEMO_PASSWORD);
      await expect.poll(() => b.page.locator(`${MAP} img.leaflet-tile-loaded`).count()).toBeGreaterThan(0);
      expect(b.tileRequests.length).toBeGreaterThan(0);
      expect(await b.page.getByTestId('map-offline-notice').count()).toBe(0);
      expect(await b.page.locator(`${MAP} path.gn-land`).count()).toBe(0);
      expect(b.offsiteRequests).toEqual([]);
    } finally {
      await b.browser.close();
    }
  });
});

describe('"use my location"', () => {
  it('places the vantage where the browser says, and explains a refusal', async () => {
    const b = await openBrowser();
    try {
      await failTileRequests(b);
      await signIn(b.page, member.email, DEMO_PASSWORD);
      await b.context.grantPermissions(['geolocation']);
      await b.context.setGeolocation({ latitude: 51.8706, longitude: -8.3012 });
      await b.page.getByTestId('use-my-location').click();
      await expect.poll(() => fieldValue(b.page, 'vantage')).toBe('51.870600, -8.301200');
      await b.page.locator('.gn-pin-vantage').waitFor();

      await b.context.clearPermissions();
      await b.page.getByTestId('use-my-location').click();
      await expect.poll(() => b.page.getByTestId('location-message').textContent()).toContain('Location was refused');
    } finally {
      await b.browser.close();
    }
  });
});

describe('on a phone screen', () => {
  it('stacks the planner: map on top, panels below, no sideways scrolling', async () => {
    const phone = await openBrowser({ width: 390, height: 844 });
    try {
      await failTileRequests(phone);
      await signIn(phone.page, member.email, DEMO_PASSWORD);
      const { page } = phone;
      await page.locator(MAP).waitFor();
      await typeCoordinates(page, 'vantage', VANTAGE_DMS);
      await typeCoordinates(page, 'landmark', LANDMARK_DMS);
      await page.getByTestId('readout-distance').waitFor();
      await page.getByTestId('map-offline-notice').waitFor();
      const map = (await page.getByTestId('scouting-map').boundingBox())!;
      const panels = (await page.locator('.planner-panels').boundingBox())!;
      expect(map.width).toBeGreaterThan(300);
      expect(panels.y).toBeGreaterThanOrEqual(map.y + map.height);
      const overflow = await evalInPage<number>(page, 'document.documentElement.scrollWidth - window.innerWidth');
      expect(overflow).toBeLessThanOrEqual(0);
      await page.waitForTimeout(300);
      await page.screenshot({ path: screenshotPath('planner-phone') });
      await page.screenshot({ path: screenshotPath('planner-phone-full'), fullPage: true });
    } finally {
      await phone.browser.close();
    }
  });
});
