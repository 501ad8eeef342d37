/**
 * Watches and the sky outlook: the cloud limit of a watch, the outlook in its e-mails and the
 * on-the-day "still clear?" update. A fake clock drives the app, the local forecast fake (with a
 * fixed sky) and the local SMTP fake; the outbox is read back with mailparser.
 *
 * The rules checked are the ones documented in shared/outlook/watch.ts (watchOutlookDecision) and
 * server/services/watch-delivery-service.ts; the badge thresholds are common practice on the okta
 * scale (shared/outlook/summary.ts: 'clear' at most 25 % mean cloud, 'cloudy' from 62.5 %).
 */
import { afterAll, afterEach, beforeAll, describe, expect, it } from 'vitest';
import request from 'supertest';
import { DateTime } from 'luxon';
import type { ParsedMail } from 'mailparser';
import { QueryTypes } from 'sequelize';
import { forecastCell, OUTLOOK_CAUTION } from '../../shared/outlook';
import type { Lineup } from '../../shared/schemas/lineup';
import { skyOutlookSchema } from '../../shared/schemas/outlook';
import { startFakeForecastServer, type FakeForecastMode, type FakeForecastServer, type FakeSky } from '../../server/forecast/fake-forecast-server';
import { SmtpFake } from '../../server/mail/smtp-fake';
import { ForecastCacheModel } from '../../server/models/forecast-cache';
import { WatchDeliveryModel } from '../../server/models/watch-delivery';
import { WatchModel } from '../../server/models/watch';
import { createTestContext, createUser, signedInAgent, type TestContext } from './helpers';
import { createSightline, createWatchApp, FakeClock, mailsTo, scanAndDrain, searchLineups, southSightline, type WatchApp } from './watches-fixture';

const TZ = 'Australia/Sydney';
const DAY_MS = 86_400_000;

/**
 * The invented southern sightline moved 0.4 deg east (still New South Wales, Australia/Sydney):
 * a forecast cell of its own, so the cached forecasts of these tests meet no other test's.
 */
const outlookSightline = {
  ...southSightline,
  name: 'Test ridge under the sky outlook',
  vantage: { ...southSightline.vantage, lon: southSightline.vantage.lon + 0.4 },
  landmark: { ...southSightline.landmark, lon: southSightline.landmark.lon + 0.4 },
};
const CELL_KEY = forecastCell(outlookSightline.vantage.lat, outlookSightline.vantage.lon).key;

/** Fixed skies: the same values at every hour, so a window's mean cloud is that value (arithmetic). */
const CLEAR_SKY: FakeSky = {
  cloud_cover: 10, cloud_cover_low: 5, cloud_cover_mid: 0, cloud_cover_high: 10, precipitation_probability: 0,
  wind_speed_10m: 2, wind_gusts_10m: 4, relative_humidity_2m: 57, temperature_2m: 8, dew_point_2m: 0,
};
const CLOUDY_SKY: FakeSky = { ...CLEAR_SKY, cloud_cover: 90, cloud_cover_low: 85, precipitation_probability: 40 };

let ctx: TestContext;
let smtp: SmtpFake;
let forecastFake: FakeForecastServer;
/** The clock of the current test; the forecast fake reads its "today" from it too. */
let clock = new FakeClock(new Date('2027-06-01T00:00:00Z'));
const apps: WatchApp[] = [];

beforeAll(async () => {
  ctx = await createTestContext();
  smtp = new SmtpFake({ port: 0 });
  await smtp.start();
  forecastFake = await startFakeForecastServer({ now: () => clock.now(), httpControls: true });
});
afterEach(async () => {
  await Promise.all(apps.splice(0).map((a) => a.close()));
  await WatchModel.destroy({ where: {} });
  await ForecastCacheModel.destroy({ where: { cellKey: CELL_KEY } });
  forecastFake.setSky(null);
  forecastFake.setMode('ok');
});
afterAll(async () => {
  await forecastFake?.close();
  await smtp?.stop();
  await ctx?.db.close();
});

async function startApp(options: { forecast?: boolean } = {}): Promise<WatchApp> {
  const env: Record<string, string> = options.forecast === false ? {} : { FORECAST_BASE_URL: forecastFake.url, FORECAST_TIMEOUT_MS: '1000' };
  const app = createWatchApp(ctx.db, clock, smtp, env);
  apps.push(app);
  await app.scheduler.start();
  return app;
}

/** The night of a lineup: the local date of its evening (start - 12 h), by luxon from the IANA zone. */
function nightByLuxon(l: Lineup): DateTime {
  return DateTime.fromISO(l.start, { zone: TZ }).minus({ hours: 12 }).startOf('day');
}

/** A local instant as the e-mail shows it ('yyyy-MM-dd HH:mm AEST'), by luxon; AEST is UTC+10 in June (IANA tz database). */
function localByLuxon(at: Date): string {
  return `${DateTime.fromMillis(Math.round(at.getTime() / 60_000) * 60_000, { zone: TZ }).toFormat('yyyy-MM-dd HH:mm')} AEST`;
}

/** "tonight", "tomorrow night" or "in N days", counted from the local date of `now` to the night's (by luxon). */
function whenByLuxon(l: Lineup, now: Date): string {
  const days = Math.round(nightByLuxon(l).diff(DateTime.fromJSDate(now, { zone: TZ }).startOf('day'), 'days').days);
  return days <= 0 ? 'tonight' : days === 1 ? 'tomorrow night' : `in ${days} days`;
}

/** A user with the sightline and one of its good mid-June lineups (as the delivery tests pick it). */
async function scenario() {
  const user = await createUser('member', 'Sky watcher');
  const agent = await signedInAgent(ctx.app, user);
  const sightline = await createSightline(agent, outlookSightline);
  const { lineups, timezone } = await searchLineups(agent, sightline.id, '2027-05-25', '2027-07-01');
  expect(timezone).toBe(TZ);
  const L = lineups.find((l) => l.start >= '2027-06-08' && l.score >= 0.5 && l.durationMin >= 30);
  expect(L, 'a good lineup in mid June (common practice: the galactic centre is high in the southern winter)').toBeDefined();
  return { user, sightline, L: L! };
}

async function createWatch(agent: request.Agent, body: object): Promise<string> {
  const res = await agent.post('/api/watches').send(body);
  expect(res.status, JSON.stringify(res.body)).toBe(201);
  return res.body.watch.id as string;
}

function watchOf(mail: ParsedMail): string | undefined {
  return mail.headers.get('x-gnomon-watch') as string | undefined;
}

describe('the cloud limit of a watch', () => {
  it('sends under a clear outlook within the limit, showing the outlook; on a steady sky the on-the-day e-mail is a plain one', async () => {
    const { user, sightline, L } = await scenario();
    clock = new FakeClock(new Date(Date.parse(L.start) - 3 * DAY_MS));
    forecastFake.setSky(CLEAR_SKY);
    const a = await startApp();
    const agent = await signedInAgent(a.app, user);
    const watchId = await createWatch(agent, { sightlineId: sightline.id, weekdays: [nightByLuxon(L).weekday], leadDays: [3, 0], maxCloudPct: 30 });
    expect((await agent.get(`/api/watches/${watchId}`)).body.watch.maxCloudPct).toBe(30);

    await scanAndDrain(a.scheduler);
    const mails = await mailsTo(user.email);
    expect(mails).toHaveLength(1);
    const text = mails[0]!.mail.text!;
    // 10 % at every hour: mean and highest hour 10 %, 'clear' (at most 25 %, no hour over 50 %);
    // air 8 °C with dew point 0 °C is 8 °C from dew, so the dew risk is low (common practice: within 4 °C).
    expect(text).toContain('Sky outlook: clear: mean cloud 10 % (highest hour 10 %), dew risk low');
    // The service names no model run, so the forecast is dated by its fetch: the scan's "now".
    expect(text).toContain(`Forecast made: ${localByLuxon(clock.now())}`);
    expect(text).toContain('Your cloud limit: at most 30 % cloud: within it');
    expect(text).toContain(OUTLOOK_CAUTION);
    expect(text).not.toMatch(/Still clear\?/);
    expect(mails[0]!.mail.html).toContain('Sky outlook</td>');
    expect(mails[0]!.mail.subject).toMatch(new RegExp(`^Lineup ${whenByLuxon(L, clock.now())}: `));

    // The delivery keeps the outlook it showed (for the on-the-day comparison).
    const sent = await WatchDeliveryModel.findOne({ where: { watchId, leadDays: 3 } });
    const [row] = await ctx.db.sequelize.query<{ outlook: unknown }>('SELECT outlook FROM watch_deliveries WHERE id = :id', { replacements: { id: sent!.id }, type: QueryTypes.SELECT });
    const kept = skyOutlookSchema.parse(row!.outlook);
    expect(kept).toMatchObject({ status: 'forecast', badge: 'clear', meanCloudPct: 10 });

    // On the day, after 09:00 local, the same clear sky: the lead-0 e-mail, with no "changed" line.
    clock.set(nightByLuxon(L).set({ hour: 10 }).toJSDate());
    await scanAndDrain(a.scheduler);
    await scanAndDrain(a.scheduler);
    const after = await mailsTo(user.email);
    expect(after).toHaveLength(2);
    expect(after[1]!.mail.subject).toMatch(/^Lineup tonight: Galactic Centre at /);
    expect(after[1]!.mail.text).toContain('Sky outlook: clear: mean cloud 10 %');
    expect(after[1]!.mail.text).not.toMatch(/Still clear\?|changed a lot/);
  }, 90_000);

  it('holds the e-mail back under a cloudy outlook and sends it once the sky clears while the lead is current; a watch without a limit sends at once', async () => {
    const { user, sightline, L } = await scenario();
    clock = new FakeClock(new Date(Date.parse(L.start) - 3 * DAY_MS));
    forecastFake.setSky(CLOUDY_SKY);
    const a = await startApp();
    const agent = await signedInAgent(a.app, user);
    const weekdays = [nightByLuxon(L).weekday];
    const limited = await createWatch(agent, { sightlineId: sightline.id, weekdays, leadDays: [3], maxCloudPct: 30 });
    const unlimited = await createWatch(agent, { sightlineId: sightline.id, weekdays, leadDays: [3] });

    const scanned = await a.scheduler.deliveries.scan(clock.now());
    expect(scanned).toMatchObject({ created: 1, failedWatches: 0, heldBackByCloud: 1 });
    expect(await WatchDeliveryModel.count({ where: { watchId: limited } })).toBe(0);
    for (const id of scanned.toSend) expect(await a.scheduler.deliveries.send(id, clock.now())).toBe('sent');
    let mails = await mailsTo(user.email);
    expect(mails.map((m) => watchOf(m.mail))).toEqual([unlimited]);
    // 90 % at every hour is 'cloudy' (from 62.5 %, five oktas).
    expect(mails[0]!.mail.text).toContain('Sky outlook: cloudy: mean cloud 90 % (highest hour 90 %)');
    expect(mails[0]!.mail.text).not.toContain('Your cloud limit');

    // Still cloudy an hour later: nothing for the limited watch.
    clock.set(new Date(clock.now().getTime() + 3_600_000 + 60_000));
    await scanAndDrain(a.scheduler);
    expect(await mailsTo(user.email)).toHaveLength(1);

    // A day later the sky has cleared; the 3-day lead is still the current one: the e-mail goes, once.
    forecastFake.setSky(CLEAR_SKY);
    clock.set(new Date(Date.parse(L.start) - 2 * DAY_MS));
    await scanAndDrain(a.scheduler);
    await scanAndDrain(a.scheduler);
    mails = await mailsTo(user.email);
    expect(mails.map((m) => watchOf(m.mail))).toEqual([unlimited, limited]);
    expect(mails[1]!.mail.subject).toMatch(new RegExp(`^Lineup ${whenByLuxon(L, clock.now())}: `));
    expect(mails[1]!.mail.text).toContain('Your cloud limit: at most 30 % cloud: within it');
  }, 90_000);

  it('withdraws an e-mail whose sky clouded over between the scan and the send, and records it again when it clears', async () => {
    const { user, sightline, L } = await scenario();
    clock = new FakeClock(new Date(Date.parse(L.start) - 3 * DAY_MS));
    forecastFake.setSky(CLEAR_SKY);
    const a = await startApp();
    const agent = await signedInAgent(a.app, user);
    const watchId = await createWatch(agent, { sightlineId: sightline.id, weekdays: [nightByLuxon(L).weekday], leadDays: [3], maxCloudPct: 30 });
    const scanned = await a.scheduler.deliveries.scan(clock.now());
    expect(scanned.created).toBe(1);

    // The send is late (past the hour a forecast is reused) and the sky is now cloudy.
    forecastFake.setSky(CLOUDY_SKY);
    clock.set(new Date(clock.now().getTime() + 2 * 3_600_000));
    expect(await a.scheduler.deliveries.send(scanned.toSend[0]!, clock.now())).toBe('skipped');
    expect(await WatchDeliveryModel.count({ where: { watchId } })).toBe(0);
    expect(await mailsTo(user.email)).toHaveLength(0);

    forecastFake.setSky(CLEAR_SKY);
    clock.set(new Date(clock.now().getTime() + 2 * 3_600_000));
    await scanAndDrain(a.scheduler);
    expect(await mailsTo(user.email)).toHaveLength(1);
    expect(await WatchDeliveryModel.findOne({ where: { watchId } })).toMatchObject({ status: 'sent', leadDays: 3 });
  }, 90_000);

  it.each<[string, FakeForecastMode | 'not-configured', string]>([
    ['answers 500', 'error-500', 'The forecast service had a problem'],
    ['hangs', 'hang', 'The forecast service did not answer in time'],
    ['sends a body that is not JSON', 'malformed-json', 'The forecast service sent an answer that could not be read'],
    ['is not set up', 'not-configured', 'No forecast service is set up on this server'],
  ])('sends anyway, saying the outlook is unknown, when the forecast service %s', async (_label, mode, message) => {
    const { user, sightline, L } = await scenario();
    clock = new FakeClock(new Date(Date.parse(L.start) - 3 * DAY_MS));
    if (mode !== 'not-configured') forecastFake.setMode(mode);
    const a = await startApp({ forecast: mode !== 'not-configured' });
    const agent = await signedInAgent(a.app, user);
    const watchId = await createWatch(agent, { sightlineId: sightline.id, weekdays: [nightByLuxon(L).weekday], leadDays: [3], maxCloudPct: 30 });

    const scanned = await a.scheduler.deliveries.scan(clock.now());
    expect(scanned).toMatchObject({ created: 1, failedWatches: 0, heldBackByCloud: 0 });
    expect(await a.scheduler.deliveries.send(scanned.toSend[0]!, clock.now())).toBe('sent');
    const mails = await mailsTo(user.email);
    expect(mails).toHaveLength(1);
    const text = mails[0]!.mail.text!;
    expect(text).toContain(`Sky outlook: forecast unavailable: ${message}`);
    expect(text).toContain('Your cloud limit: at most 30 % cloud: the outlook is unknown, so this e-mail is sent anyway');
    expect(await WatchDeliveryModel.findOne({ where: { watchId } })).toMatchObject({ status: 'sent', attempts: 1, lastError: null });
  }, 60_000);
});

describe('"still clear?" on the day', () => {
  it('sends the on-the-day e-mail despite the limit when the sky clouded over since the earlier e-mail, and says so; a watch with no earlier e-mail for the lineup holds it back', async () => {
    const { user, sightline, L } = await scenario();
    const threeDaysBefore = new Date(Date.parse(L.start) - 3 * DAY_MS);
    clock = new FakeClock(threeDaysBefore);
    forecastFake.setSky(CLEAR_SKY);
    const a = await startApp();
    const agent = await signedInAgent(a.app, user);
    const weekdays = [nightByLuxon(L).weekday];
    const watched = await createWatch(agent, { sightlineId: sightline.id, weekdays, leadDays: [3, 0], maxCloudPct: 30 });
    // Asks only on the day: no earlier e-mail to compare with.
    const dayOnly = await createWatch(agent, { sightlineId: sightline.id, weekdays, leadDays: [0], maxCloudPct: 30 });
    await scanAndDrain(a.scheduler);
    expect((await mailsTo(user.email)).map((m) => watchOf(m.mail))).toEqual([watched]);

    forecastFake.setSky(CLOUDY_SKY);
    clock.set(nightByLuxon(L).set({ hour: 10 }).toJSDate());
    await scanAndDrain(a.scheduler);
    await scanAndDrain(a.scheduler);
    const mails = await mailsTo(user.email);
    expect(mails.map((m) => watchOf(m.mail))).toEqual([watched, watched]);
    const update = mails[1]!.mail;
    // 10 % to 90 %: 80 points, more than the 25 points (two oktas) that count as a lot on their own.
    expect(update.subject).toMatch(/^Still clear\? Now cloudy, 90 % cloud\. Lineup tonight: Galactic Centre at /);
    // The earlier forecast is dated by its fetch, three days before (the service names no model run).
    expect(update.text).toContain(`Still clear? No: the sky outlook changed a lot since our last e-mail: then clear, 10 % cloud (forecast made ${localByLuxon(threeDaysBefore)}), now cloudy, 90 % cloud.`);
    expect(update.text).toContain('Your cloud limit: at most 30 % cloud: cloudier now; sent because the outlook changed a lot since the last e-mail');
    expect(update.html).toContain('Still clear? No: the sky outlook changed a lot');
    expect(await WatchDeliveryModel.count({ where: { watchId: dayOnly } })).toBe(0);

    // One e-mail per lineup and lead time still: the update is the lead-0 delivery itself.
    await scanAndDrain(a.scheduler);
    expect(await mailsTo(user.email)).toHaveLength(2);
    const list = await agent.get(`/api/watches/${watched}/deliveries`);
    expect(list.body.deliveries.map((d: { leadDays: number; status: string }) => [d.leadDays, d.status])).toEqual([[0, 'sent'], [3, 'sent']]);
  }, 90_000);
});

describe('the cloud limit in the API and the database', () => {
  it('is optional, 0 to 100 whole percent, and can be removed', async () => {
    const user = await createUser('member', 'Limit setter');
    const agent = await signedInAgent(ctx.app, user);
    const sightline = await createSightline(agent, outlookSightline);
    const plain = await agent.post('/api/watches').send({ sightlineId: sightline.id });
    expect(plain.status).toBe(201);
    expect(plain.body.watch.maxCloudPct).toBeNull();

    for (const bad of [101, -1, 12.5, '30']) {
      const res = await agent.post('/api/watches').send({ sightlineId: sightline.id, maxCloudPct: bad });
      expect(res.status, String(bad)).toBe(400);
      expect(res.body.error.code).toBe('validation');
      expect(res.body.error.fields.maxCloudPct).toBe('The cloud limit is a whole percentage from 0 to 100');
    }
    const id = plain.body.watch.id as string;
    expect((await agent.patch(`/api/watches/${id}`).send({ maxCloudPct: 0 })).body.watch.maxCloudPct).toBe(0);
    expect((await agent.patch(`/api/watches/${id}`).send({ maxCloudPct: 100 })).body.watch.maxCloudPct).toBe(100);
    expect((await agent.patch(`/api/watches/${id}`).send({ maxCloudPct: null })).body.watch.maxCloudPct).toBeNull();

    // The CHECK constraint refuses what the API would (PostgreSQL: a failed CHECK aborts the UPDATE).
    await expect(ctx.db.sequelize.query('UPDATE watches SET max_cloud_pct = 150 WHERE id = :id', { replacements: { id } })).rejects.toThrow(/watches_max_cloud_pct/);
  });
});

describe('the forecast fake\'s fixed sky', () => {
  // The answer's shape is the service's documented one (https://open-meteo.com/en/docs); the fixed
  // values replace the invented ones at every hour, the others stay as they were.
  const query = { latitude: -35, longitude: 149.4, hourly: 'cloud_cover,relative_humidity_2m', forecast_days: 1, timezone: 'GMT' };

  it('gives every hour the set values, over HTTP too, and refuses values out of range', async () => {
    const invented = (await request(forecastFake.url).get('/v1/forecast').query(query)).body.hourly;
    expect(new Set(invented.cloud_cover).size).toBeGreaterThan(1);

    forecastFake.setSky({ cloud_cover: 37 });
    const fixed = (await request(forecastFake.url).get('/v1/forecast').query(query)).body.hourly;
    expect(fixed.cloud_cover).toEqual(Array(24).fill(37));
    expect(fixed.relative_humidity_2m).toEqual(invented.relative_humidity_2m);

    expect((await request(forecastFake.url).post('/__fake/sky').query({ cloud_cover: 64 })).status).toBe(200);
    expect((await request(forecastFake.url).get('/v1/forecast').query(query)).body.hourly.cloud_cover).toEqual(Array(24).fill(64));
    expect((await request(forecastFake.url).get('/__fake/state')).body.sky).toEqual({ cloud_cover: 64 });
    const bad = await request(forecastFake.url).post('/__fake/sky').query({ cloud_cover: 140 });
    expect(bad.status).toBe(400);
    expect(bad.body.error).toBe(true);
    expect(() => forecastFake.setSky({ sky_colour: 3 } as FakeSky)).toThrow(RangeError);

    expect((await request(forecastFake.url).post('/__fake/sky')).status).toBe(200);
    expect((await request(forecastFake.url).get('/v1/forecast').query(query)).body.hourly.cloud_cover).toEqual(invented.cloud_cover);
  });
});
