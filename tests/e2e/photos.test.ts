import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import sharp from 'sharp';
import { DEMO_PASSWORD } from '../../server/seeders/demo';
import { clickAt, evalInPage, openBrowser, screenshotPath, signIn, type BrowserSession } from './helpers';

const PRIYA = 'priya@demo.gnomon.test';
// An invented sightline of this test's own, so moving its vantage touches no demo data.
const VANTAGE = { lat: 50.5755, lon: -4.9115, elevationM: 3, cameraHeightM: 1.5 };
const LANDMARK = { lat: 50.5712, lon: -4.9085, baseElevationM: 0, heightM: 38, widthM: 60 };
const WIDTH = 1600;
const HEIGHT = 1067;
const TOP = { x: 800, y: 520 };
const HORIZON_Y = 590;

/** An invented daytime scene: sky, sea to a level horizon, a dark stack whose top is at TOP. */
async function scenePhoto(): Promise<Buffer> {
  const svg = `<svg xmlns="http://www.w3.org/2000/svg" width="${WIDTH}" height="${HEIGHT}">
    <defs><linearGradient id="sky" x1="0" y1="0" x2="0" y2="1"><stop offset="0" stop-color="#5d8fc9"/><stop offset="1" stop-color="#cfe0f0"/></linearGradient></defs>
    <rect width="${WIDTH}" height="${HORIZON_Y}" fill="url(#sky)"/>
    <rect y="${HORIZON_Y}" width="${WIDTH}" height="${HEIGHT - HORIZON_Y}" fill="#2f5670"/>
    <path d="M ${TOP.x - 60} ${HORIZON_Y + 10} L ${TOP.x - 30} ${TOP.y + 12} L ${TOP.x} ${TOP.y} L ${TOP.x + 28} ${TOP.y + 15} L ${TOP.x + 62} ${HORIZON_Y + 10} Z" fill="#3a3128"/>
  </svg>`;
  // EXIF: a 24 mm-equivalent lens, and a GPS position about 100 m north of the vantage.
  return sharp(Buffer.from(svg))
    .jpeg({ quality: 85 })
    .withExif({
      IFD0: { Make: 'Invented', Model: 'Scout One' },
      IFD2: { DateTimeOriginal: '2026:05:02 15:10:00', FocalLength: '16/1', FocalLengthIn35mmFilm: '24' },
      IFD3: { GPSLatitudeRef: 'N', GPSLatitude: '50/1 34/1 35430/1000', GPSLongitudeRef: 'W', GPSLongitude: '4/1 54/1 41400/1000' },
    })
    .toBuffer();
}

let s: BrowserSession;
let sightlineId = '';
beforeAll(async () => {
  s = await openBrowser({ width: 1360, height: 1000 });
  await signIn(s.page, PRIYA, DEMO_PASSWORD);
  const created = await s.page.request.post('/api/sightlines', { data: { name: 'Overlay test stack', vantage: VANTAGE, landmark: LANDMARK } });
  expect(created.status()).toBe(201);
  sightlineId = ((await created.json()) as { sightline: { id: string } }).sightline.id;
});
afterAll(async () => {
  if (sightlineId) await s?.page.request.delete(`/api/sightlines/${sightlineId}`);
  await s?.browser.close();
});

describe('reference photos and the sky overlay in the browser', () => {
  it('uploads a photo with progress, shows it in the gallery with its EXIF and warns that it was taken far from the vantage', async () => {
    const { page } = s;
    await page.goto(`/sightlines/${sightlineId}?tab=photos`);
    await page.getByTestId('photos-panel').waitFor();
    await page.locator('[data-testid="photo-upload"] input[type="file"]').setInputFiles({ name: 'scouting.jpg', mimeType: 'image/jpeg', buffer: await scenePhoto() });
    await page.locator('[data-testid="photo-upload-item"][data-status="done"]').waitFor({ timeout: 20_000 });
    expect(await page.getByTestId('photo-thumb').count()).toBe(1);
    await page.getByTestId('photo-image').waitFor();
    // The display copy has loaded and keeps the photo's shape.
    await page.waitForFunction(`document.querySelector('[data-testid="photo-image"]').naturalWidth > 0`);
    const shape = await evalInPage<number>(page, `(() => { const i = document.querySelector('[data-testid="photo-image"]'); return i.naturalWidth / i.naturalHeight; })()`);
    expect(shape).toBeCloseTo(WIDTH / HEIGHT, 2);
    const details = await page.getByTestId('photo-details').textContent();
    expect(details).toContain('Scout One');
    expect(details).toContain('24 mm');
    expect(await page.getByTestId('photo-far-from-vantage').textContent()).toMatch(/Taken \d+ m from the vantage/);
    expect(await page.getByTestId('overlay-needs-calibration').isVisible()).toBe(true);
  });

  it('calibrates by clicking the landmark top and two horizon points, then draws the track, the frame and the galactic plane', async () => {
    const { page } = s;
    await page.getByTestId('calibration-start').click();
    expect(await page.getByTestId('calibration-prompt').textContent()).toContain('top of the landmark');
    await clickAt(page, '[data-testid="photo-image"]', TOP.x / WIDTH, TOP.y / HEIGHT);
    await clickAt(page, '[data-testid="photo-image"]', 200 / WIDTH, HORIZON_Y / HEIGHT);
    await clickAt(page, '[data-testid="photo-image"]', 1400 / WIDTH, HORIZON_Y / HEIGHT);
    expect(await page.getByTestId('calibration-horizon-point').count()).toBe(2);
    // Prefilled from EXIF: the 35 mm-equivalent focal length.
    expect(await page.getByTestId('calibration-focal35').locator('input').inputValue()).toBe('24');
    await page.getByTestId('calibration-save').click();
    await page.getByTestId('photo-calibrated').waitFor();
    await page.getByTestId('overlay-controls').waitFor();

    const photos = (await (await page.request.get(`/api/sightlines/${sightlineId}/photos`)).json()) as {
      photos: Array<{ calibration: { pose: { rollDeg: number; horizontalFovDeg: number }; landmarkTopPx: { x: number; y: number }; residualPx: number } }>;
    };
    const calibration = photos.photos[0]!.calibration;
    // The click landed within a few screen pixels of the drawn top (display scaling), level horizon: roll 0.
    expect(Math.abs(calibration.landmarkTopPx.x - TOP.x)).toBeLessThan(6);
    expect(Math.abs(calibration.landmarkTopPx.y - TOP.y)).toBeLessThan(6);
    expect(Math.abs(calibration.pose.rollDeg)).toBeLessThan(0.5);
    // 24 mm equivalent: 2 atan(36 / 48) = 73.74 deg (pinhole formula, computed).
    expect(calibration.pose.horizontalFovDeg).toBeCloseTo(73.74, 1);
    expect(calibration.residualPx).toBeLessThan(0.5);

    // The default search found lineups (the galactic centre over a south-facing stack), so every layer draws.
    await page.getByTestId('overlay-track').waitFor({ state: 'attached', timeout: 30_000 });
    for (const layer of ['overlay-track', 'overlay-frame', 'overlay-galactic-plane', 'overlay-horizon', 'overlay-peak']) {
      expect(await page.getByTestId(layer).count(), layer).toBe(1);
    }
    expect(await page.getByTestId('overlay-tick').count()).toBeGreaterThan(2);
    // The drawn true horizon runs close to the marked sea horizon (a sea horizon dips a few arcminutes below it).
    const horizonY = await evalInPage<number>(page, `(() => { const p = document.querySelector('[data-testid="overlay-horizon"]'); const l = p.getTotalLength(); let best = 1e9, y = 0; for (let s = 0; s <= l; s += l / 400) { const q = p.getPointAtLength(s); if (Math.abs(q.x - 800) < best) { best = Math.abs(q.x - 800); y = q.y; } } return y; })()`);
    expect(Math.abs(horizonY - HORIZON_Y)).toBeLessThan(15);
  });

  it('moves the target along its track with the time slider', async () => {
    const { page } = s;
    const before = await page.getByTestId('overlay-readout').textContent();
    const marker = () => evalInPage<string>(page, `document.querySelector('[data-testid="overlay-target"] circle')?.getAttribute('cx') ?? ''`);
    const markerBefore = await marker();
    // A click on the slider's rail a fifth of the way along: the lineup's peak is elsewhere.
    await clickAt(page, '[data-testid="overlay-time"] .n-slider-rail', 0.2, 0.5);
    const after = await page.getByTestId('overlay-readout').textContent();
    expect(after).not.toBe(before);
    expect(await marker()).not.toBe(markerBefore);
    await page.getByTestId('photo-stage').scrollIntoViewIfNeeded();
    await page.screenshot({ path: screenshotPath('sky-overlay'), fullPage: true });
  });

  it('sets the vantage to the photo position; the calibration is then marked as off', async () => {
    const { page } = s;
    await page.getByTestId('photo-set-vantage').click();
    await page.getByRole('button', { name: 'Move the vantage' }).click();
    await page.getByTestId('photo-near-vantage').waitFor();
    expect(await page.getByTestId('photo-near-vantage').textContent()).toMatch(/Taken 0 m from the vantage/);
    await page.getByTestId('calibration-stale').waitFor();
    // The signed-out /me check before sign-in answers 401; nothing else may fail.
    expect(s.pageErrors.filter((e) => !/status of 401/.test(e))).toEqual([]);
    expect(s.offsiteRequests).toEqual([]);
  });
});
