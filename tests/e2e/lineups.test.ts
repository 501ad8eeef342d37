import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { DateTime } from 'luxon';
import type { Page } from 'playwright-core';
import { DEMO_PASSWORD } from '../../server/seeders/demo';
import { demoTideLines } from '../../server/seeders/demo-tides';
import { computedStyle, evalInPage, openBrowser, screenshotPath, signIn, type BrowserSession } from './helpers';

const TOMAS = 'tomas@demo.gnomon.test';
const KESTREL = 'Kestrel Stack from the south cove';
const ZONE = 'Europe/London';

/** The id of a demo sightline by name, from the API with the page's session cookie. */
async function sightlineId(page: Page, name: string): Promise<string> {
  const response = await page.request.get('/api/sightlines');
  expect(response.ok()).toBe(true);
  const body = (await response.json()) as { sightlines: Array<{ id: string; name: string }> };
  const found = body.sightlines.find((x) => x.name === name);
  if (!found) throw new Error(`no demo sightline named ${name}`);
  return found.id;
}

/** Types a date into one end of the lineup range picker. */
async function typeRange(page: Page, first: string, last: string): Promise<void> {
  const start = page.getByTestId('lineup-range').locator('input').nth(0);
  const end = page.getByTestId('lineup-range').locator('input').nth(1);
  await start.fill(first);
  await end.fill(last);
  await end.press('Enter');
  await page.locator('body').click({ position: { x: 5, y: 5 } });
}

async function waitForSearch(page: Page): Promise<void> {
  await page.getByTestId('lineup-done').waitFor({ timeout: 20_000 });
}

/** Red-only check for a computed colour: red clearly ahead of green and blue. */
function isRed(rgb: string): boolean {
  const [r, g, b] = (rgb.match(/\d+(\.\d+)?/g) ?? []).map(Number) as [number, number, number];
  return r > 60 && g <= r / 2 && b <= r / 2;
}

let s: BrowserSession;
let id = '';
// The browser is in Los Angeles, the site in Cornwall: every time shown must be the site's.
beforeAll(async () => {
  s = await openBrowser({ width: 1360, height: 900 }, { timezoneId: 'America/Los_Angeles' });
  await signIn(s.page, TOMAS, DEMO_PASSWORD);
  id = await sightlineId(s.page, KESTREL);
});
afterAll(async () => { await s?.browser.close(); });

describe('lineups of a saved sightline in the browser', () => {
  it('opens the sightline page with its name and the site zone, and runs the default search at once', async () => {
    const { page } = s;
    await page.goto(`/sightlines/${id}`);
    await page.getByTestId('sightline-name').getByText(KESTREL).waitFor();
    expect(await page.getByTestId('sightline-zone').textContent()).toContain(ZONE);
    await waitForSearch(page);
    // The default range is the next 12 months of nights from today in the site's zone.
    const today = DateTime.now().setZone(ZONE).toISODate()!;
    expect(await page.getByTestId('lineup-range').locator('input').nth(0).inputValue()).toBe(today);
    expect(await page.getByTestId('safety-caution').textContent()).toContain('A plan, not a promise');
  });

  it('searches the galactic centre over March to October 2027 and lists lineups in site time', async () => {
    const { page } = s;
    await typeRange(page, '2027-03-01', '2027-10-01');
    expect(await page.getByTestId('lineup-range').locator('input').nth(1).inputValue()).toBe('2027-10-01');
    await page.getByTestId('lineup-search').click();
    await waitForSearch(page);
    const rows = page.getByTestId('lineup-row');
    await expect.poll(() => rows.count()).toBeGreaterThan(3);
    const nights = await rows.evaluateAll((els) => els.map((el) => el.getAttribute('data-night') ?? ''));
    for (const night of nights) {
      expect(night >= '2027-03-01' && night <= '2027-10-01', night).toBe(true);
    }
    // Every start-end cell carries the site's zone label (GMT before 28 March, BST after), never Pacific time.
    const text = await page.getByTestId('lineup-table').textContent();
    expect(text).toMatch(/\d\d:\d\d – \d\d:\d\d (BST|GMT)/);
    expect(text).not.toMatch(/PDT|PST/);
    // No stored tide times cover 2027 (the demo's month is from today): every status is unknown.
    const statuses = await page.getByTestId('tide-status').evaluateAll((els) => els.map((el) => el.getAttribute('data-status')));
    expect(new Set(statuses)).toEqual(new Set(['unknown']));
    expect(await page.getByTestId('lineup-results').getByTestId('tide-caution').count()).toBe(1);
    await page.screenshot({ path: screenshotPath('lineups-desktop'), fullPage: true });
  });

  it('checks a custom RA/Dec target beside its fields before searching', async () => {
    const { page } = s;
    await page.getByTestId('target-mode-custom').click();
    await page.getByTestId('custom-ra').locator('input').fill('25 10');
    await page.getByTestId('custom-dec').locator('input').fill('-28 56 10');
    await page.getByTestId('lineup-search').click();
    await page.getByText('RA in hours, 0 to below 24').waitFor();
    await page.getByTestId('target-mode-catalogue').click();
  });

  it('shows a running search with its elapsed time and cancels it', async () => {
    const { page } = s;
    // Hold the next search for a while at the network, so there is time to cancel it.
    await page.route('**/api/lineups/search', async (route) => {
      await new Promise((resolve) => setTimeout(resolve, 3000));
      await route.continue().catch(() => undefined);
    }, { times: 1 });
    await page.getByTestId('lineup-search').click();
    await page.getByTestId('lineup-progress').waitFor();
    expect(await page.getByTestId('lineup-progress').textContent()).toMatch(/Searching… \d+\.\d s/);
    await page.getByTestId('lineup-cancel').click();
    await page.getByTestId('lineup-cancelled').waitFor();
    // The table keeps the last results.
    expect(await page.getByTestId('lineup-row').count()).toBeGreaterThan(3);
    await page.getByTestId('lineup-search').click();
    await waitForSearch(page);
  });

  it('opens the night chart of a lineup from its row', async () => {
    const { page } = s;
    const first = page.getByTestId('lineup-row').first();
    const night = (await first.getAttribute('data-night'))!;
    await first.click();
    await page.getByTestId('night-chart-time').waitFor();
    expect(new URL(page.url()).searchParams.get('night')).toBe(night);
    expect(await page.getByTestId('night-title').textContent()).toContain(DateTime.fromISO(night).toFormat('ccc d'));
    expect((await page.getByTestId('night-chart-target').getAttribute('d'))!.length).toBeGreaterThan(50);
    expect((await page.getByTestId('night-chart-sun').getAttribute('d'))!.length).toBeGreaterThan(50);
    expect(await page.getByTestId('night-chart-lineup').count()).toBeGreaterThan(0);
    expect(await page.getByTestId('night-lineup').count()).toBeGreaterThan(0);
    expect(await page.getByTestId('night-chart-tide').count()).toBe(1);
    await page.getByTestId('night-panel').screenshot({ path: screenshotPath('night-chart-desktop') });

    await page.getByTestId('chart-view-altaz').click();
    await page.getByTestId('night-chart-altaz').waitFor();
    expect(await page.getByTestId('altaz-frame').count()).toBe(1);
    expect(await page.getByTestId('altaz-landmark').count()).toBe(1);
    await page.getByTestId('night-panel').screenshot({ path: screenshotPath('night-chart-altaz-desktop') });
    await page.getByTestId('chart-view-time').click();
  });

  it('shows the year view with scored nights and midsummer nights without darkness', async () => {
    const { page } = s;
    await page.getByRole('tab', { name: 'Year view' }).click();
    await page.getByTestId('year-heatmap').waitFor();
    await page.getByTestId('year-view').getByTestId('lineup-done').waitFor({ timeout: 20_000 });
    // March 2027 to February 2028: 366 nights (2028 is a leap year).
    expect(await page.getByTestId('year-cell').count()).toBe(366);
    await expect.poll(() => page.locator('[data-testid="year-cell"][data-kind="score"]').count()).toBeGreaterThan(3);
    // At 50.6 N the Sun stays above -18 deg around the June solstice (90 - 50.6 - 23.4 = 16 deg below).
    expect(await page.locator('[data-testid="year-cell"][data-date="2027-06-21"]').getAttribute('data-kind')).toBe('no-dark');
    expect(await page.locator('[data-testid="year-cell"][data-date="2027-12-21"]').getAttribute('data-kind')).not.toBe('no-dark');
    await page.getByTestId('year-view').screenshot({ path: screenshotPath('year-view-desktop') });
    const scored = page.locator('[data-testid="year-cell"][data-kind="score"]').first();
    const date = (await scored.getAttribute('data-date'))!;
    await scored.click();
    await page.getByTestId('night-chart-time').waitFor();
    expect(new URL(page.url()).searchParams.get('night')).toBe(date);
  });

  it('pastes tide times: shows errors beside line numbers, refuses them, then saves and the status changes', async () => {
    const { page } = s;
    await page.getByRole('tab', { name: 'Lineups' }).click();
    const first = page.getByTestId('lineup-row').first();
    const night = (await first.getAttribute('data-night'))!;
    expect(await first.getByTestId('tide-status').getAttribute('data-status')).toBe('unknown');

    await page.getByRole('tab', { name: 'Tides' }).click();
    await page.getByTestId('tide-paste').waitFor();
    expect(await page.getByTestId('tides-panel').getByTestId('tide-caution').count()).toBeGreaterThanOrEqual(3);
    const before = Number(await page.getByTestId('tide-count').textContent());

    // A typo on line 2: shown beside its number, and Save stays off.
    await page.getByTestId('tide-text').locator('textarea').fill('2027-05-04 03:12 L 0.4\n2027-05-04 9h31 H 5.1');
    await page.getByTestId('tide-line-error').waitFor();
    expect(await page.getByTestId('tide-line-error').getAttribute('data-line')).toBe('2');
    expect(await page.getByTestId('tide-line-error').textContent()).toContain('Expected a time');
    expect(await page.getByTestId('tide-save').isDisabled()).toBe(true);
    await page.getByTestId('tide-paste').screenshot({ path: screenshotPath('tide-paste-error') });

    // Three days of invented tide times around the first lineup's night, in the site's local time.
    const startDate = DateTime.fromISO(night, { zone: ZONE }).minus({ days: 1 }).toISODate()!;
    const lines = demoTideLines({ startDate, days: 3, timeZone: ZONE, firstLowMinutes: 4 * 60 + 10, meanRangeM: 5.2 });
    await page.getByTestId('tide-text').locator('textarea').fill(lines.join('\n'));
    await expect.poll(() => page.getByTestId('tide-line-error').count()).toBe(0);
    expect(await page.getByTestId('tide-preview-summary').textContent()).toContain(`${lines.length} tide times read`);
    await page.getByTestId('tide-save').click();
    await expect.poll(() => page.getByTestId('tide-count').textContent()).toBe(String(before + lines.length));
    await page.getByTestId('tides-panel').screenshot({ path: screenshotPath('tides-desktop') });

    // The lineups are searched again with the new tide times: that night's status is now decided.
    await page.getByRole('tab', { name: 'Lineups' }).click();
    const row = page.locator(`[data-testid="lineup-row"][data-night="${night}"]`).first();
    await expect.poll(() => row.getByTestId('tide-status').getAttribute('data-status'), { timeout: 20_000 }).not.toBe('unknown');
    expect(['reachable', 'cut-off']).toContain(await row.getByTestId('tide-status').getAttribute('data-status'));
    await page.getByTestId('lineup-results').screenshot({ path: screenshotPath('lineups-tide-status') });
  });

  it('adds, edits and deletes a field note (with confirmation)', async () => {
    const { page } = s;
    await page.getByRole('tab', { name: 'Field notes' }).click();
    await page.getByTestId('notes-panel').waitFor();
    const count = await page.getByTestId('note-item').count();
    expect(count).toBeGreaterThan(0); // the demo's own notes
    await page.getByTestId('note-body').locator('textarea').fill('Parking at the lay-by fills up on clear weekends.');
    await page.getByTestId('note-add').click();
    await expect.poll(() => page.getByTestId('note-item').count()).toBe(count + 1);
    const note = page.getByTestId('note-item').filter({ hasText: 'Parking at the lay-by' });
    expect(await note.textContent()).toContain('Tomas Quill');
    await note.getByTestId('note-edit').click();
    await page.getByTestId('note-edit-body').locator('textarea').fill('Parking at the lay-by fills up on clear weekends: come early.');
    await page.getByTestId('note-save').click();
    await page.getByTestId('note-item').filter({ hasText: 'come early' }).waitFor();
    await page.getByTestId('note-item').filter({ hasText: 'come early' }).getByTestId('note-delete').click();
    await page.getByRole('button', { name: 'Delete' }).last().click();
    await expect.poll(() => page.getByTestId('note-item').count()).toBe(count);
  });

  it('exports the lineups as an iCalendar file from the server', async () => {
    const { page } = s;
    await page.getByRole('tab', { name: 'Lineups' }).click();
    const [download] = await Promise.all([page.waitForEvent('download'), page.getByTestId('export-ics').click()]);
    expect(download.suggestedFilename()).toMatch(/\.ics$/);
    const path = await download.path();
    const { readFile } = await import('node:fs/promises');
    const text = await readFile(path, 'utf8');
    expect(text).toMatch(/^BEGIN:VCALENDAR/);
    expect((text.match(/BEGIN:VEVENT/g) ?? []).length).toBeGreaterThan(3);
  });

  it('draws the night chart in red only in the night-vision theme', async () => {
    const { page } = s;
    await page.getByTestId('night-vision-toggle').click();
    await expect.poll(() => computedStyle(page, 'body', 'background-color')).toBe('rgb(0, 0, 0)');
    await page.getByRole('tab', { name: 'Night chart' }).click();
    await page.getByTestId('night-chart-time').waitFor();
    for (const selector of ['[data-testid="night-chart-target"]', '[data-testid="night-chart-sun"]', '[data-testid="night-chart-moon"]']) {
      expect(isRed(await computedStyle(page, selector, 'stroke')), selector).toBe(true);
    }
    await page.waitForTimeout(400); // the theme's colour transition
    await page.screenshot({ path: screenshotPath('night-chart-night-vision'), fullPage: true });
    await page.getByRole('tab', { name: 'Year view' }).click();
    await page.getByTestId('year-heatmap').waitFor();
    expect(isRed(await computedStyle(page, '[data-testid="year-cell"][data-kind="score"]', 'fill'))).toBe(true);
    await page.getByTestId('year-view').screenshot({ path: screenshotPath('year-view-night-vision') });
    await page.getByRole('tab', { name: 'Lineups' }).click();
    await page.waitForTimeout(300);
    await page.screenshot({ path: screenshotPath('lineups-night-vision') });
    await page.getByTestId('night-vision-toggle').click();
  });

  it('made no request outside 127.0.0.1 and raised no page errors', () => {
    expect(s.offsiteRequests.filter((u) => !/tile\.openstreetmap\.org/.test(u))).toEqual([]);
    // The one console error allowed is the API's 401 to the signed-out first visit of the sign-in page.
    expect(s.pageErrors.filter((e) => !/status of 401/.test(e))).toEqual([]);
  });
});

describe('the sightline page on a phone', () => {
  it('fits the width and shows the table, the night chart and the year view', async () => {
    const phone = await openBrowser({ width: 390, height: 800 });
    try {
      const { page } = phone;
      await signIn(page, TOMAS, DEMO_PASSWORD);
      await page.goto(`/sightlines/${id}`);
      await waitForSearch(page);
      const overflow = () => evalInPage<number>(page, 'document.documentElement.scrollWidth - window.innerWidth');
      expect(await overflow()).toBeLessThanOrEqual(0);
      await page.screenshot({ path: screenshotPath('lineups-phone'), fullPage: true });
      await page.getByTestId('lineup-row').first().click();
      await page.getByTestId('night-chart-time').waitFor();
      expect(await overflow()).toBeLessThanOrEqual(0);
      await page.screenshot({ path: screenshotPath('night-chart-phone'), fullPage: true });
      await page.getByRole('tab', { name: 'Year view' }).click();
      await page.getByTestId('year-heatmap').waitFor();
      expect(await overflow()).toBeLessThanOrEqual(0);
      await page.screenshot({ path: screenshotPath('year-view-phone'), fullPage: true });
      expect(phone.pageErrors.filter((e) => !/status of 401/.test(e))).toEqual([]);
    } finally {
      await phone.browser.close();
    }
  });
});
