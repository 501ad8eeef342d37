import { afterAll, beforeAll, beforeEach, describe, expect, it } from 'vitest';
import express from 'express';
import cookieParser from 'cookie-parser';
import request from 'supertest';
import { forecastCell, type TimeWindow } from '../../shared/outlook';
import { hourlyForecastSchema, outlookResponseSchema, type ForecastOutlook, type SkyOutlook } from '../../shared/schemas/outlook';
import { sightlineResponseSchema } from '../../shared/schemas/sightline';
import { ForecastClient } from '../../server/forecast/client';
import { ForecastUnavailableError } from '../../server/forecast/errors';
import { startFakeForecastServer, type FakeForecastServer } from '../../server/forecast/fake-forecast-server';
import { FORECAST_REFRESH_INTERVAL_MS, ForecastService } from '../../server/forecast/forecast-service';
import { FORECAST_DAYS, FORECAST_HOURLY_VARIABLES, forecastResponseSchema, forecastUrl, ForecastShapeError, toHourlyForecast } from '../../server/forecast/open-meteo';
import { authenticate, SESSION_COOKIE } from '../../server/middleware/auth';
import { errorHandler } from '../../server/middleware/error-handler';
import { ForecastCacheModel, initForecastCacheModel } from '../../server/models/forecast-cache';
import { outlookRouter, sightlineOutlookRouter } from '../../server/routes/outlook';
import { SightlineService } from '../../server/services/sightline-service';
import { TokenService } from '../../server/services/token-service';
import { UserService } from '../../server/services/user-service';
import type { UserModel } from '../../server/models/user';
import { createTestContext, createUser, signedInAgent, TEST_JWT_SECRET, type TestContext } from './helpers';

// The fake answers in the service's documented format (https://open-meteo.com/en/docs: query
// parameters latitude, longitude, hourly, timezone, wind_speed_unit, forecast_days; JSON with
// latitude, longitude, utc_offset_seconds, hourly_units, hourly.time and one array per variable).
// Checks of parameter names and of the parsing below refer to that page.

const HOUR_MS = 3_600_000;
const DAY_MS = 86_400_000;
/** The shared clock of the fake, the client and the service. */
let nowMs = Date.UTC(2027, 4, 10, 12, 0);
const now = () => new Date(nowMs);
const quiet = () => undefined;

let ctx: TestContext;
let fake: FakeForecastServer;

beforeAll(async () => {
  ctx = await createTestContext();
  // Until server/models/index.ts registers it, the test binds the model itself.
  initForecastCacheModel(ctx.db.sequelize);
  fake = await startFakeForecastServer({ now });
});
afterAll(async () => {
  await fake?.close();
  await ctx?.db.close();
});
beforeEach(() => {
  nowMs = Date.UTC(2027, 4, 10, 12, 0);
  fake.setMode('ok');
});

/** A fresh forecast cell for each test, so cached rows and back-off never cross tests. */
let cellCounter = 0;
function freshPosition(): { lat: number; lon: number } {
  cellCounter += 1;
  return { lat: 30 + cellCounter * 0.7 + 0.012, lon: -20 + cellCounter * 0.9 - 0.013 };
}

function client(options: Partial<ConstructorParameters<typeof ForecastClient>[0]> = {}) {
  return new ForecastClient({ baseUrl: fake.url, now, timeoutMs: 2000, backoffMs: 5, ...options });
}

function service(options: Partial<ConstructorParameters<typeof ForecastService>[0]> = {}) {
  return new ForecastService({ source: client(), now, log: quiet, ...options });
}

/** Tonight's window and one tomorrow night, inside the fake's 16 days. */
const tonight: TimeWindow = { start: new Date(Date.UTC(2027, 4, 10, 22, 0)), end: new Date(Date.UTC(2027, 4, 11, 1, 30)) };
const tomorrow: TimeWindow = { start: new Date(Date.UTC(2027, 4, 11, 23, 15)), end: new Date(Date.UTC(2027, 4, 12, 0, 45)) };

function asForecast(o: SkyOutlook | undefined): ForecastOutlook {
  expect(o?.status).toBe('forecast');
  return o as ForecastOutlook;
}

async function expectFailure(promise: Promise<unknown>, kind: ForecastUnavailableError['kind']): Promise<ForecastUnavailableError> {
  const error = await promise.then(() => undefined, (e: unknown) => e);
  expect(error).toBeInstanceOf(ForecastUnavailableError);
  expect((error as ForecastUnavailableError).kind).toBe(kind);
  return error as ForecastUnavailableError;
}

describe('the local fake', () => {
  it('answers in the service format, honouring forecast_days and the hourly list', async () => {
    const res = await request(fake.url).get('/v1/forecast').query({ latitude: 50.6, longitude: -1.9, hourly: 'cloud_cover,wind_speed_10m', forecast_days: 2, timezone: 'GMT', wind_speed_unit: 'ms' });
    expect(res.status).toBe(200);
    expect(Object.keys(res.body).sort()).toEqual(['elevation', 'generationtime_ms', 'hourly', 'hourly_units', 'latitude', 'longitude', 'timezone', 'timezone_abbreviation', 'utc_offset_seconds']);
    expect(Object.keys(res.body.hourly).sort()).toEqual(['cloud_cover', 'time', 'wind_speed_10m']);
    expect(res.body.hourly.time).toHaveLength(48);
    // The service's hours start at 00:00 today, in "YYYY-MM-DDTHH:MM" local (here GMT) times.
    expect(res.body.hourly.time[0]).toBe('2027-05-10T00:00');
    expect(res.body.hourly.time[47]).toBe('2027-05-11T23:00');
    expect(res.body.hourly_units).toEqual({ time: 'iso8601', cloud_cover: '%', wind_speed_10m: 'm/s' });
    expect(res.body.utc_offset_seconds).toBe(0);
  });

  it('defaults to 7 days and km/h, and converts the wind', async () => {
    const base = { latitude: 50.6, longitude: -1.9, hourly: 'wind_speed_10m' };
    const kmh = await request(fake.url).get('/v1/forecast').query(base);
    const ms = await request(fake.url).get('/v1/forecast').query({ ...base, wind_speed_unit: 'ms' });
    expect(kmh.body.hourly.time).toHaveLength(7 * 24);
    expect(kmh.body.hourly_units.wind_speed_10m).toBe('km/h');
    // 1 m/s = 3.6 km/h (definition); both are rounded to 0.1, so they may differ by 0.05 x 3.6 + 0.05.
    kmh.body.hourly.wind_speed_10m.forEach((v: number, i: number) => expect(Math.abs(v - ms.body.hourly.wind_speed_10m[i] * 3.6)).toBeLessThanOrEqual(0.23 + 1e-9));
  });

  it('is deterministic and varies with position and hour', async () => {
    const q = (latitude: number) => request(fake.url).get('/v1/forecast').query({ latitude, longitude: -1.9, hourly: 'cloud_cover', forecast_days: 3 });
    const [a, b, c] = await Promise.all([q(50.6), q(50.6), q(44.2)]);
    expect(a.body.hourly.cloud_cover).toEqual(b.body.hourly.cloud_cover);
    expect(a.body.hourly.cloud_cover).not.toEqual(c.body.hourly.cloud_cover);
    expect(new Set(a.body.hourly.cloud_cover).size).toBeGreaterThan(5);
  });

  it.each([
    ['an unknown hourly variable', { latitude: 50, longitude: 0, hourly: 'cloud_cover,sky_colour' }],
    ['forecast_days above 16', { latitude: 50, longitude: 0, hourly: 'cloud_cover', forecast_days: 17 }],
    ['a latitude out of range', { latitude: 95, longitude: 0, hourly: 'cloud_cover' }],
    ['no longitude', { latitude: 50, hourly: 'cloud_cover' }],
  ])('answers 400 with the service error body for %s', async (_label, query) => {
    const res = await request(fake.url).get('/v1/forecast').query(query);
    expect(res.status).toBe(400);
    expect(res.body.error).toBe(true);
    expect(typeof res.body.reason).toBe('string');
  });
});

describe('reading the service answer', () => {
  // A hand-made answer in the documented shape (https://open-meteo.com/en/docs, "JSON Return Object").
  function answer(hourly: Record<string, unknown>, units: Record<string, string> = {}) {
    return {
      latitude: 52.52, longitude: 13.419, elevation: 44.8, generationtime_ms: 2.2, utc_offset_seconds: 0,
      timezone: 'GMT', timezone_abbreviation: 'GMT',
      hourly_units: { time: 'iso8601', cloud_cover: '%', wind_speed_10m: 'm/s', temperature_2m: '°C', ...units },
      hourly: { time: ['2027-05-10T21:00', '2027-05-10T22:00', '2027-05-10T23:00'], cloud_cover: [10, null, 100.4], ...hourly },
    };
  }
  const cell = { lat: 52.5, lon: 13.4 };
  const fetchedAt = new Date('2027-05-10T12:00:00Z');

  it('builds the documented query for a cell', () => {
    expect(forecastUrl('https://forecast.example.test/', cell)).toBe(
      'https://forecast.example.test/v1/forecast?latitude=52.5&longitude=13.4'
      + '&hourly=cloud_cover,cloud_cover_low,cloud_cover_mid,cloud_cover_high,precipitation_probability,wind_speed_10m,wind_gusts_10m,relative_humidity_2m,temperature_2m,dew_point_2m'
      + '&timezone=GMT&wind_speed_unit=ms&forecast_days=16',
    );
  });

  it('reads GMT times as UTC, leaves out hours without cloud cover, clamps overshoot and blanks values out of range', () => {
    const body = forecastResponseSchema.parse(answer({ wind_speed_10m: [3.2, 4, 500], temperature_2m: [12.5, 11, 10] }));
    const f = toHourlyForecast(body, cell, fetchedAt);
    expect(f.hours.map((h) => h.time)).toEqual(['2027-05-10T21:00:00.000Z', '2027-05-10T23:00:00.000Z']);
    expect(f.hours[0]).toMatchObject({ cloudCoverPct: 10, windSpeedMs: 3.2, temperatureC: 12.5, cloudCoverLowPct: null, dewPointC: null });
    expect(f.hours[1]).toMatchObject({ cloudCoverPct: 100, windSpeedMs: null, temperatureC: 10 });
    expect(f).toMatchObject({ lat: 52.5, lon: 13.4, issuedAt: '2027-05-10T12:00:00.000Z', fetchedAt: '2027-05-10T12:00:00.000Z' });
  });

  it('refuses wind in another unit than asked, and arrays that do not match the times', () => {
    const kmh = forecastResponseSchema.parse(answer({ wind_speed_10m: [10, 12, 14] }, { wind_speed_10m: 'km/h' }));
    expect(() => toHourlyForecast(kmh, cell, fetchedAt)).toThrow(ForecastShapeError);
    const short = forecastResponseSchema.parse(answer({ temperature_2m: [1, 2] }));
    expect(() => toHourlyForecast(short, cell, fetchedAt)).toThrow(ForecastShapeError);
  });

  it('refuses an answer in another time zone than GMT, or without cloud cover', () => {
    expect(forecastResponseSchema.safeParse({ ...answer({}), utc_offset_seconds: 7200 }).success).toBe(false);
    const noCloud = answer({});
    delete (noCloud.hourly as Record<string, unknown>).cloud_cover;
    expect(forecastResponseSchema.safeParse(noCloud).success).toBe(false);
  });
});

describe('ForecastClient against the fake', () => {
  it('asks with the documented parameters and parses every hour of 16 days', async () => {
    const p = { lat: 50.6001, lon: -1.9502 };
    const forecast = await client().fetchHourly(p.lat, p.lon);
    // The cell centre is sent, not the vantage (50.6, -2.0).
    expect(fake.lastQuery).toEqual({
      latitude: '50.6', longitude: '-2',
      hourly: FORECAST_HOURLY_VARIABLES.join(','),
      timezone: 'GMT', wind_speed_unit: 'ms', forecast_days: String(FORECAST_DAYS),
    });
    expect(hourlyForecastSchema.parse(forecast)).toEqual(forecast);
    expect(forecast.lat).toBe(50.6);
    expect(forecast.lon).toBe(-2);
    expect(forecast.hours).toHaveLength(FORECAST_DAYS * 24);
    expect(forecast.hours[0]!.time).toBe('2027-05-10T00:00:00.000Z');
    expect(forecast.fetchedAt).toBe(now().toISOString());
    expect(forecast.issuedAt).toBe(forecast.fetchedAt);

    // Value by value against the raw answer for the same query.
    const raw = await request(fake.url).get('/v1/forecast').query(fake.lastQuery as Record<string, string>);
    forecast.hours.forEach((h, i) => {
      expect(h.cloudCoverPct).toBe(raw.body.hourly.cloud_cover[i]);
      expect(h.cloudCoverLowPct).toBe(raw.body.hourly.cloud_cover_low[i]);
      expect(h.precipitationProbabilityPct).toBe(raw.body.hourly.precipitation_probability[i]);
      expect(h.windSpeedMs).toBe(raw.body.hourly.wind_speed_10m[i]);
      expect(h.windGustsMs).toBe(raw.body.hourly.wind_gusts_10m[i]);
      expect(h.relativeHumidityPct).toBe(raw.body.hourly.relative_humidity_2m[i]);
      expect(h.temperatureC).toBe(raw.body.hourly.temperature_2m[i]);
      expect(h.dewPointC).toBe(raw.body.hourly.dew_point_2m[i]);
    });
  });

  it('gives up on a hanging service after the timeout, without retrying', async () => {
    fake.setMode('hang');
    const before = fake.requestCount;
    const started = Date.now();
    await expectFailure(client({ timeoutMs: 300 }).fetchHourly(51.3, 0.2), 'timeout');
    expect(Date.now() - started).toBeLessThan(2000);
    expect(fake.requestCount - before).toBe(1);
  });

  it('retries a 500 with back-off, then fails as server-error', async () => {
    fake.setMode('error-500');
    const before = fake.requestCount;
    const waits: number[] = [];
    const error = await expectFailure(client({ retries: 2, backoffMs: 40, sleep: async (ms) => { waits.push(ms); } }).fetchHourly(51.3, 0.2), 'server-error');
    expect(error.status).toBe(500);
    expect(fake.requestCount - before).toBe(3);
    expect(waits).toEqual([40, 80]);
  });

  it('recovers when the service answers after one 500', async () => {
    fake.setMode('error-500', 1);
    const before = fake.requestCount;
    const forecast = await client().fetchHourly(51.3, 0.2);
    expect(forecast.hours).toHaveLength(FORECAST_DAYS * 24);
    expect(fake.requestCount - before).toBe(2);
  });

  it.each([['malformed-json'], ['malformed-shape']] as const)('turns a %s body into a malformed failure, not retried', async (mode) => {
    fake.setMode(mode);
    const before = fake.requestCount;
    await expectFailure(client().fetchHourly(51.3, 0.2), 'malformed');
    expect(fake.requestCount - before).toBe(1);
  });

  it('does not retry a 4xx', async () => {
    let calls = 0;
    const counting: typeof fetch = (input, init) => { calls += 1; return fetch(input, init); };
    // The fake answers 404 outside /v1/forecast.
    await expectFailure(client({ baseUrl: `${fake.url}/elsewhere`, fetch: counting }).fetchHourly(51.3, 0.2), 'refused');
    expect(calls).toBe(1);
  });

  it('retries a refused connection, then fails as network', async () => {
    const closed = await startFakeForecastServer();
    const url = closed.url;
    await closed.close();
    let calls = 0;
    const counting: typeof fetch = (input, init) => { calls += 1; return fetch(input, init); };
    await expectFailure(client({ baseUrl: url, fetch: counting }).fetchHourly(51.3, 0.2), 'network');
    expect(calls).toBe(3);
  });

  it('refuses a base URL that is not http(s)', () => {
    expect(() => new ForecastClient({ baseUrl: 'ftp://example.test' })).toThrow(RangeError);
    expect(() => new ForecastClient({ baseUrl: 'not a url' })).toThrow(RangeError);
  });
});

describe('ForecastService: cache in PostgreSQL', () => {
  it('summarises windows and stores the forecast under the rounded position', async () => {
    const p = freshPosition();
    const before = fake.requestCount;
    const [a, b] = await service().outlookFor(p.lat, p.lon, [tonight, tomorrow]);
    expect(fake.requestCount - before).toBe(1);
    const o = asForecast(a);
    expect(o.complete).toBe(true);
    // 22:00-01:30 uses the hours 22, 23, 00 and 01 (see shared/outlook/summary.ts).
    expect(o.hours.map((h) => h.time)).toEqual(['2027-05-10T22:00:00.000Z', '2027-05-10T23:00:00.000Z', '2027-05-11T00:00:00.000Z', '2027-05-11T01:00:00.000Z']);
    expect(o.issuedAt).toBe(now().toISOString());
    // 23:15-00:45 uses 23 (15 min), 00 (60 min) and 01 (15 min).
    expect(asForecast(b).hours.map((h) => h.time)).toEqual(['2027-05-11T23:00:00.000Z', '2027-05-12T00:00:00.000Z', '2027-05-12T01:00:00.000Z']);
    const rows = await ForecastCacheModel.findAll({ where: { cellKey: forecastCell(p.lat, p.lon).key } });
    expect(rows).toHaveLength(1);
    expect(rows[0]!.lat).toBe(forecastCell(p.lat, p.lon).lat);
  });

  it('answers again from the database without asking the service, also from a new service instance', async () => {
    const p = freshPosition();
    const first = await service().outlookFor(p.lat, p.lon, [tonight]);
    const count = fake.requestCount;
    const again = await service().outlookFor(p.lat, p.lon, [tonight]);
    // A nearby vantage in the same 0.1 deg cell shares the row.
    const nearby = await service().outlookFor(p.lat + 0.02, p.lon - 0.02, [tonight]);
    expect(fake.requestCount).toBe(count);
    expect(again).toEqual(first);
    expect(nearby).toEqual(first);
  });

  it('asks again only once the refresh interval (1 h) has passed', async () => {
    const p = freshPosition();
    const forecasts = service();
    await forecasts.outlookFor(p.lat, p.lon, [tonight]);
    const count = fake.requestCount;
    nowMs += FORECAST_REFRESH_INTERVAL_MS - 60_000;
    await forecasts.outlookFor(p.lat, p.lon, [tonight]);
    expect(fake.requestCount).toBe(count);
    nowMs += 2 * 60_000;
    const [o] = await forecasts.outlookFor(p.lat, p.lon, [tonight]);
    expect(fake.requestCount).toBe(count + 1);
    expect(asForecast(o).issuedAt).toBe(now().toISOString());
    expect(await ForecastCacheModel.count({ where: { cellKey: forecastCell(p.lat, p.lon).key } })).toBe(2);
  });

  it('shares one fetch among concurrent requests for the same cell', async () => {
    const p = freshPosition();
    const forecasts = service();
    const before = fake.requestCount;
    const results = await Promise.all(Array.from({ length: 6 }, (_v, i) => forecasts.outlookFor(p.lat + i * 0.005, p.lon, [tonight])));
    expect(fake.requestCount - before).toBe(1);
    for (const r of results) expect(r).toEqual(results[0]);
    expect(await ForecastCacheModel.count({ where: { cellKey: forecastCell(p.lat, p.lon).key } })).toBe(1);
  });

  it('refuses a row that breaks the table constraints', async () => {
    const bad = { cellKey: 'somewhere', lat: 10, lon: 10, issuedAt: now(), fetchedAt: now(), forecast: { hours: [] } as never };
    await expect(ForecastCacheModel.create(bad)).rejects.toThrow(/forecast_cache_cell_key/);
    await expect(ForecastCacheModel.create({ ...bad, cellKey: '10.0,10.0', issuedAt: new Date(nowMs + HOUR_MS) })).rejects.toThrow(/forecast_cache_issued/);
  });
});

describe('ForecastService: when the service fails', () => {
  it('says unavailable after a 500 (retried), and does not ask again during the back-off', async () => {
    const p = freshPosition();
    fake.setMode('error-500');
    const forecasts = service();
    const before = fake.requestCount;
    const outlooks = await forecasts.outlookFor(p.lat, p.lon, [tonight, tomorrow]);
    expect(fake.requestCount - before).toBe(3);
    expect(outlooks.map((o) => o.status)).toEqual(['unavailable', 'unavailable']);
    expect(outlooks[0]!.status === 'unavailable' && outlooks[0]!.message).toBe('The forecast service had a problem');
    const again = await forecasts.outlookFor(p.lat, p.lon, [tonight]);
    expect(again[0]!.status).toBe('unavailable');
    expect(fake.requestCount - before).toBe(3);
    // After the back-off (5 min) with the service back, it asks once more and succeeds.
    fake.setMode('ok');
    nowMs += 6 * 60_000;
    expect((await forecasts.outlookFor(p.lat, p.lon, [tonight]))[0]!.status).toBe('forecast');
    expect(fake.requestCount - before).toBe(4);
  });

  it('says unavailable, promptly, when the service hangs', async () => {
    const p = freshPosition();
    fake.setMode('hang');
    const started = Date.now();
    const [o] = await service({ source: client({ timeoutMs: 300 }) }).outlookFor(p.lat, p.lon, [tonight]);
    expect(Date.now() - started).toBeLessThan(2000);
    expect(o).toEqual({ status: 'unavailable', start: tonight.start.toISOString(), end: tonight.end.toISOString(), message: 'The forecast service did not answer in time' });
  });

  it('says unavailable for a malformed body', async () => {
    const p = freshPosition();
    fake.setMode('malformed-json');
    const [o] = await service().outlookFor(p.lat, p.lon, [tonight]);
    expect(o!.status === 'unavailable' && o!.message).toBe('The forecast service sent an answer that could not be read');
  });

  it('falls back on the stored forecast when a refetch fails, up to 12 hours old', async () => {
    const p = freshPosition();
    const forecasts = service();
    const fetchedAt = now().toISOString();
    await forecasts.outlookFor(p.lat, p.lon, [tonight]);
    fake.setMode('error-500');
    nowMs += 2 * HOUR_MS;
    const [stale] = await forecasts.outlookFor(p.lat, p.lon, [tonight]);
    expect(asForecast(stale).issuedAt).toBe(fetchedAt);
    const lookup = await forecasts.forecastFor(p.lat, p.lon);
    expect(lookup.stale).toBe(true);
    nowMs += 11 * HOUR_MS;
    const [old] = await forecasts.outlookFor(p.lat, p.lon, [tonight]);
    expect(old!.status).toBe('unavailable');
  });

  it('says unavailable without a configured service', async () => {
    const p = freshPosition();
    const [o] = await new ForecastService({ source: null, now, log: quiet }).outlookFor(p.lat, p.lon, [tonight]);
    expect(o!.status === 'unavailable' && o!.message).toBe('No forecast service is set up on this server');
  });
});

describe('ForecastService: horizon', () => {
  it('says "no forecast yet" beyond the 16 days without asking the service, and past for old windows', async () => {
    const p = freshPosition();
    const before = fake.requestCount;
    const later: TimeWindow = { start: new Date(nowMs + 30 * DAY_MS), end: new Date(nowMs + 30 * DAY_MS + 2 * HOUR_MS) };
    const earlier: TimeWindow = { start: new Date(Date.UTC(2027, 4, 8, 22)), end: new Date(Date.UTC(2027, 4, 9, 1)) };
    const outlooks = await service().outlookFor(p.lat, p.lon, [later, earlier]);
    expect(fake.requestCount).toBe(before);
    expect(outlooks.map((o) => o.status)).toEqual(['no-forecast-yet', 'past']);
  });

  it('says "no forecast yet" with the horizon for a window after the last forecast hour', async () => {
    const p = freshPosition();
    // The fake's 16 days end with the hour 2027-05-25T23:00.
    const edge: TimeWindow = { start: new Date(Date.UTC(2027, 4, 25, 23, 40)), end: new Date(Date.UTC(2027, 4, 26, 2)) };
    const [o] = await service().outlookFor(p.lat, p.lon, [edge]);
    expect(o).toMatchObject({ status: 'no-forecast-yet', horizonEnd: '2027-05-25T23:00:00.000Z', issuedAt: now().toISOString() });
  });
});

describe('outlook routes', () => {
  let app: express.Express;
  let owner: UserModel;
  let sightlineId: string;
  const tokens = new TokenService(TEST_JWT_SECRET, 24);
  const cookieOf = (user: UserModel) => `${SESSION_COOKIE}=${tokens.sign({ sub: user.id, role: user.role })}`;

  beforeAll(async () => {
    // The routers on a small app of their own, until server/app.ts mounts them.
    const forecasts = new ForecastService({ source: client(), sightlines: new SightlineService(), now, log: quiet });
    app = express();
    app.use(express.json());
    app.use(cookieParser());
    app.use(authenticate(tokens, new UserService()));
    app.use('/api/outlook', outlookRouter({ forecast: forecasts }));
    app.use('/api/sightlines/:id/outlook', sightlineOutlookRouter({ forecast: forecasts }));
    app.use(errorHandler);

    owner = await createUser('member', 'Outlook Owner');
    const agent = await signedInAgent(ctx.app, owner);
    const res = await agent.post('/api/sightlines').send({
      name: 'Outlook stack',
      vantage: { lat: 57.1203, lon: -6.0107, elevationM: 12, cameraHeightM: 1.5 },
      landmark: { lat: 57.1251, lon: -6.0183, baseElevationM: 0, heightM: 40, widthM: 15 },
    });
    expect(res.status).toBe(201);
    sightlineId = sightlineResponseSchema.parse(res.body).sightline.id;
  });

  const windowsBody = [{ start: '2027-05-10T22:00:00Z', end: '2027-05-11T01:30:00Z' }, { start: '2027-07-01T22:00:00Z', end: '2027-07-01T23:00:00Z' }];

  it('POST /api/outlook gives the outlooks of a sightline in order, with the caution', async () => {
    const res = await request(app).post('/api/outlook').set('Cookie', cookieOf(owner)).send({ sightlineId, windows: windowsBody });
    expect(res.status).toBe(200);
    const body = outlookResponseSchema.parse(res.body);
    expect(body.outlooks.map((o) => o.status)).toEqual(['forecast', 'no-forecast-yet']);
    expect(body.caution).toMatch(/not a promise/);
  });

  it('POST /api/outlook takes a typed vantage too', async () => {
    const res = await request(app).post('/api/outlook').set('Cookie', cookieOf(owner)).send({ vantage: { lat: 46.5, lon: 7.9 }, windows: windowsBody.slice(0, 1) });
    expect(res.status).toBe(200);
    expect(outlookResponseSchema.parse(res.body).outlooks[0]!.status).toBe('forecast');
  });

  it('GET /api/sightlines/:id/outlook gives the outlook of one window', async () => {
    const res = await request(app).get(`/api/sightlines/${sightlineId}/outlook`).query({ from: '2027-05-11T21:30:00Z', to: '2027-05-11T23:00:00Z' }).set('Cookie', cookieOf(owner));
    expect(res.status).toBe(200);
    const [o] = outlookResponseSchema.parse(res.body).outlooks;
    expect(asForecast(o).hours.map((h) => h.time)).toEqual(['2027-05-11T22:00:00.000Z', '2027-05-11T23:00:00.000Z']);
  });

  it('still answers 200 when the service is down, with unavailable windows', async () => {
    fake.setMode('error-500');
    const res = await request(app).post('/api/outlook').set('Cookie', cookieOf(owner)).send({ vantage: { lat: -41.3, lon: 174.8 }, windows: windowsBody });
    expect(res.status).toBe(200);
    expect(outlookResponseSchema.parse(res.body).outlooks.map((o) => o.status)).toEqual(['unavailable', 'no-forecast-yet']);
  });

  it.each([
    ['no windows', { vantage: { lat: 10, lon: 10 } }, 'windows'],
    ['an empty list', { vantage: { lat: 10, lon: 10 }, windows: [] }, 'windows'],
    ['an end before the start', { vantage: { lat: 10, lon: 10 }, windows: [{ start: '2027-05-11T01:00:00Z', end: '2027-05-10T22:00:00Z' }] }, 'windows.0.end'],
    ['a window of three days', { vantage: { lat: 10, lon: 10 }, windows: [{ start: '2027-05-10T00:00:00Z', end: '2027-05-13T00:00:00Z' }] }, 'windows.0.end'],
    ['a day that does not exist', { vantage: { lat: 10, lon: 10 }, windows: [{ start: '2027-02-30', end: '2027-03-01' }] }, 'windows.0.start'],
    ['neither sightline nor vantage', { windows: windowsBody }, 'sightlineId'],
    ['both sightline and vantage', { sightlineId: '00000000-0000-4000-8000-000000000000', vantage: { lat: 10, lon: 10 }, windows: windowsBody }, 'vantage'],
    ['a latitude out of range', { vantage: { lat: 91, lon: 10 }, windows: windowsBody }, 'vantage.lat'],
  ])('POST /api/outlook answers 400 for %s', async (_label, body, field) => {
    const res = await request(app).post('/api/outlook').set('Cookie', cookieOf(owner)).send(body);
    expect(res.status).toBe(400);
    expect(res.body.error.code).toBe('validation');
    expect(Object.keys(res.body.error.fields)).toContain(field);
  });

  it('GET answers 400 for a bad id or range', async () => {
    const badId = await request(app).get('/api/sightlines/not-an-id/outlook').query({ from: '2027-05-10T22:00:00Z', to: '2027-05-10T23:00:00Z' }).set('Cookie', cookieOf(owner));
    expect(badId.status).toBe(400);
    const badRange = await request(app).get(`/api/sightlines/${sightlineId}/outlook`).query({ from: '2027-05-10T23:00:00Z', to: '2027-05-10T22:00:00Z' }).set('Cookie', cookieOf(owner));
    expect(badRange.status).toBe(400);
    expect(badRange.body.error.fields).toHaveProperty('to');
  });

  it('needs a sign-in', async () => {
    expect((await request(app).post('/api/outlook').send({ vantage: { lat: 10, lon: 10 }, windows: windowsBody })).status).toBe(401);
    expect((await request(app).get(`/api/sightlines/${sightlineId}/outlook`).query({ from: '2027-05-10T22:00:00Z', to: '2027-05-10T23:00:00Z' })).status).toBe(401);
  });

  it("hides another member's sightline (404) but lets an admin read it", async () => {
    const stranger = await createUser('member', 'Outlook Stranger');
    const admin = await createUser('admin', 'Outlook Admin');
    const asStranger = await request(app).post('/api/outlook').set('Cookie', cookieOf(stranger)).send({ sightlineId, windows: windowsBody });
    expect(asStranger.status).toBe(404);
    const getAsStranger = await request(app).get(`/api/sightlines/${sightlineId}/outlook`).query({ from: '2027-05-10T22:00:00Z', to: '2027-05-10T23:00:00Z' }).set('Cookie', cookieOf(stranger));
    expect(getAsStranger.status).toBe(404);
    const asAdmin = await request(app).post('/api/outlook').set('Cookie', cookieOf(admin)).send({ sightlineId, windows: windowsBody });
    expect(asAdmin.status).toBe(200);
  });
});
