import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { randomUUID } from 'node:crypto';
import { DEMO_PASSWORD } from '../../server/seeders/demo';
import { evalInPage, openBrowser, screenshotPath, signIn, type BrowserSession } from './helpers';

const TOMAS = 'tomas@demo.gnomon.test';
const INES = 'ines@demo.gnomon.test';
const NAME = 'Crew test point';
// Invented pins of this test's own (a south-facing stack), so the demo's sightlines stay as they are.
const VANTAGE = { lat: 50.5755, lon: -4.9115, elevationM: 3, cameraHeightM: 1.5 };
const LANDMARK = { lat: 50.5712, lon: -4.9085, baseElevationM: 0, heightM: 38, widthM: 60 };
const INVITEE = `nell-${randomUUID().slice(0, 8)}@example.test`;

let owner: BrowserSession;
let invitee: BrowserSession | undefined;
let sightlineId = '';
let outingPath = '';

beforeAll(async () => {
  owner = await openBrowser({ width: 1360, height: 950 });
  await signIn(owner.page, TOMAS, DEMO_PASSWORD);
  const created = await owner.page.request.post('/api/sightlines', { data: { name: NAME, vantage: VANTAGE, landmark: LANDMARK } });
  expect(created.status()).toBe(201);
  sightlineId = ((await created.json()) as { sightline: { id: string } }).sightline.id;
});
afterAll(async () => {
  if (sightlineId) await owner?.page.request.delete(`/api/sightlines/${sightlineId}`);
  await owner?.browser.close();
  await invitee?.browser.close();
});

/** The invite link in the last e-mail to the address, read from the Outbox as an admin would. */
async function inviteLinkFromOutbox(email: string): Promise<string> {
  const admin = await openBrowser();
  try {
    await signIn(admin.page, INES, DEMO_PASSWORD);
    const list = (await (await admin.page.request.get('/api/outbox?pageSize=50')).json()) as { messages: Array<{ id: string; envelopeTo: string[] }> };
    const summary = list.messages.find((m) => m.envelopeTo.includes(email));
    if (!summary) throw new Error(`no e-mail to ${email} in the outbox`);
    const { message } = (await (await admin.page.request.get(`/api/outbox/${summary.id}`)).json()) as { message: { text: string } };
    const link = /https?:\/\/\S+\/invites\/accept\?token=\S+/.exec(message.text)?.[0];
    if (!link) throw new Error('no invite link in the e-mail');
    return link;
  } finally {
    await admin.browser.close();
  }
}

describe('a crew in the browser', () => {
  it('the owner plans an outing on a lineup night and invites a viewer by e-mail', async () => {
    const { page } = owner;
    await page.goto(`/sightlines/${sightlineId}?tab=crew`);
    await page.getByTestId('crew-panel').waitFor();
    // The night list fills from the default lineup search.
    await page.getByTestId('outing-night').waitFor({ timeout: 30_000 });
    await page.getByTestId('outing-night').click();
    await page.locator('.n-base-select-option').first().click();
    expect(await page.getByTestId('outing-meeting-time').locator('input').inputValue()).toMatch(/^\d{4}-\d{2}-\d{2}T\d{2}:\d{2}$/);
    // The meeting point starts at the vantage; a click on the map moves the pin there.
    expect(await page.getByTestId('outing-lat').locator('input').inputValue()).toBe(VANTAGE.lat.toFixed(5));
    const map = page.getByTestId('outing-map');
    await map.scrollIntoViewIfNeeded();
    const box = (await map.boundingBox())!;
    await page.mouse.click(box.x + box.width * 0.3, box.y + box.height * 0.3);
    await expect.poll(() => page.getByTestId('outing-lat').locator('input').inputValue()).not.toBe(VANTAGE.lat.toFixed(5));
    await page.getByTestId('outing-gear').locator('textarea').fill('Head torch with a red mode, warm layers');
    await page.getByTestId('outing-plan').click();
    await page.getByTestId('outing-page').waitFor();
    outingPath = new URL(page.url()).pathname;
    expect(outingPath).toMatch(new RegExp(`^/sightlines/${sightlineId}/outings/[0-9a-f-]{36}$`));

    await page.goto(`/sightlines/${sightlineId}?tab=crew`);
    await page.getByTestId('crew-invite-email').locator('input').fill(INVITEE);
    await page.getByTestId('crew-invite-role').click();
    await page.locator('.n-base-select-option', { hasText: 'Viewer' }).click();
    await page.getByTestId('crew-invite-send').click();
    await page.getByTestId('crew-invite-result').waitFor();
    expect(await page.getByTestId('crew-invite-result').textContent()).toContain(`Sent to ${INVITEE}`);
    expect(await page.getByTestId('crew-invite').count()).toBe(1);
  });

  it('the invitee opens the e-mail link, registers with the invited address and lands on the sightline as a viewer who cannot edit', async () => {
    const link = await inviteLinkFromOutbox(INVITEE);
    invitee = await openBrowser({ width: 390, height: 844 });
    const { page } = invitee;
    const url = new URL(link);
    await page.goto(`${url.pathname}${url.search}`);
    await page.getByTestId('invite-offer').waitFor();
    expect(await page.getByTestId('invite-offer').textContent()).toContain(NAME);
    await page.getByTestId('invite-register').click();
    await page.getByTestId('register-form').waitFor();
    expect(await page.locator('input[name="email"]').inputValue()).toBe(INVITEE);
    await page.locator('input[name="name"]').fill('Nell Newcomer');
    await page.locator('input[name="password"]').fill('a-long-invented-password');
    await page.getByRole('button', { name: 'Create account' }).click();
    await page.getByTestId('sightline-name').getByText(NAME).waitFor({ timeout: 20_000 });

    // A viewer sees the plan but not the controls that change it.
    await page.goto(`/sightlines/${sightlineId}?tab=tides`);
    await page.getByTestId('tides-read-only').waitFor();
    expect(await page.getByTestId('tide-paste').count()).toBe(0);
    await page.goto(`/sightlines/${sightlineId}?tab=photos`);
    await page.getByTestId('photos-panel').waitFor();
    expect(await page.getByTestId('photo-uploader').count()).toBe(0);
    // And the API refuses a change all the same.
    const rename = await page.request.patch(`/api/sightlines/${sightlineId}`, { data: { name: 'Mine now' } });
    expect(rename.status()).toBe(403);
  });

  it('the viewer answers the outing on a phone in the red theme and the owner sees it', async () => {
    const { page } = invitee!;
    await page.goto(outingPath);
    await page.getByTestId('outing-page').waitFor();
    await page.getByTestId('night-vision-toggle').click();
    expect(await page.getByTestId('outing-gear').textContent()).toContain('red mode');
    await page.locator('[data-testid="outing-map"] .gn-pin-meeting').waitFor();
    await page.getByTestId('outing-answer-going').click();
    await page.locator('[data-testid="outing-person"][data-answer="going"]').waitFor();
    expect(await page.getByTestId('outing-counts').textContent()).toContain('1 going');
    await page.getByTestId('night-panel').waitFor();
    expect(await page.getByTestId('tide-caution').count()).toBeGreaterThan(0);
    expect(await page.getByTestId('safety-caution').count()).toBe(1);
    // Nothing runs off the side of a phone screen.
    const overflow = await evalInPage<number>(page, 'document.documentElement.scrollWidth - window.innerWidth');
    expect(overflow).toBeLessThanOrEqual(1);
    await page.screenshot({ path: screenshotPath('outing-phone-night-vision'), fullPage: true });

    const seen = await owner.page.request.get(`/api/outings/${outingPath.split('/').pop()}`);
    const people = ((await seen.json()) as { outing: { people: Array<{ name: string; answer: string | null }> } }).outing.people;
    expect(people.find((p) => p.name === 'Nell Newcomer')?.answer).toBe('going');
    expect(invitee!.pageErrors.filter((e) => !/status of 40[13]/.test(e))).toEqual([]);
    expect(invitee!.offsiteRequests).toEqual([]);
  });
});
