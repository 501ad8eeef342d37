import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { readFileSync } from 'node:fs';
import { PDFParse } from 'pdf-parse';
import { DEMO_PASSWORD } from '../../server/seeders/demo';
import { openBrowser, screenshotPath, signIn, type BrowserSession } from './helpers';

const PRIYA = 'priya@demo.gnomon.test';
const NAME = 'Shot plan test stack';
// Invented pins of this test's own: a south-facing stack where the galactic centre lines up in spring.
const VANTAGE = { lat: 50.5755, lon: -4.9115, elevationM: 3, cameraHeightM: 1.5 };
const LANDMARK = { lat: 50.5712, lon: -4.9085, baseElevationM: 0, heightM: 38, widthM: 60 };

let s: BrowserSession;
let sightlineId = '';
beforeAll(async () => {
  s = await openBrowser({ width: 1360, height: 1000 });
  await signIn(s.page, PRIYA, DEMO_PASSWORD);
  const created = await s.page.request.post('/api/sightlines', { data: { name: NAME, vantage: VANTAGE, landmark: LANDMARK } });
  expect(created.status()).toBe(201);
  sightlineId = ((await created.json()) as { sightline: { id: string } }).sightline.id;
});
afterAll(async () => {
  if (sightlineId) await s?.page.request.delete(`/api/sightlines/${sightlineId}`);
  await s?.browser.close();
});

describe('gear and the shot plan in the browser', () => {
  it('lists the demo gear and adds a lens, refusing a name already used with a field message', async () => {
    const { page } = s;
    await page.getByTestId('nav-gear').click();
    await page.getByTestId('gear-page').waitFor();
    await expect.poll(() => page.locator('[data-testid="gear-body-table"] tbody tr').count()).toBeGreaterThan(0);
    const lenses = page.locator('[data-testid="gear-lens-table"] tbody tr');
    const before = await lenses.count();
    await page.getByTestId('gear-add-lens').click();
    const form = page.getByTestId('gear-lens-form');
    await form.waitFor();
    // 'Twenty-four' is one of the demo lenses already (server/seeders/demo-gear.ts).
    await form.getByTestId('gear-lens-name-input').locator('input').fill('Twenty-four');
    await form.getByTestId('gear-lens-focal-input').locator('input').fill('20');
    await form.getByTestId('gear-lens-aperture').locator('input').fill('1.8');
    await form.getByTestId('gear-lens-submit').click();
    await expect.poll(() => form.getByText(/already/i).count()).toBeGreaterThan(0);
    await form.getByTestId('gear-lens-name-input').locator('input').fill('Test twenty');
    await form.getByTestId('gear-lens-submit').click();
    await expect.poll(() => lenses.count()).toBe(before + 1);
  });

  it('plans a lineup with the field of view, both exposure rules and the timeline, and downloads the shot card PDF', async () => {
    const { page } = s;
    await page.goto(`/sightlines/${sightlineId}?tab=shotplan`);
    await page.getByTestId('shot-plan-results').waitFor({ timeout: 40_000 });
    for (const id of ['shot-plan-fov-h', 'shot-plan-rule500', 'shot-plan-npf', 'shot-plan-timeline']) {
      expect(await page.getByTestId(id).count(), id).toBeGreaterThan(0);
    }
    expect(await page.getByTestId('shot-plan-fov-h').textContent()).toMatch(/\d+(\.\d)?°/);
    await page.screenshot({ path: screenshotPath('shot-plan'), fullPage: true });

    const download = page.waitForEvent('download');
    await page.getByTestId('shot-plan-download-pdf').click();
    const file = await (await download).path();
    const bytes = readFileSync(file);
    expect(bytes.subarray(0, 5).toString('latin1')).toBe('%PDF-');
    const text = (await new PDFParse({ data: new Uint8Array(bytes) }).getText()).text;
    expect(text).toContain(NAME);
    expect(text).toMatch(/Lineup \d{2}:\d{2}/);
    // 401: the signed-out check before sign-in; 409: the refused duplicate name above.
    expect(s.pageErrors.filter((e) => !/status of 40[19]/.test(e))).toEqual([]);
  });
});
