/**
 * A local stand-in for the hosted forecast service, so that `npm start` and the tests never reach
 * out of the machine. It answers `GET /v1/forecast` on 127.0.0.1 in the service's own JSON format
 * (the names documented at https://open-meteo.com/en/docs, see ./open-meteo.ts) with invented
 * data: deterministic for a position (rounded to 0.01 deg) and an hour, varying smoothly from hour
 * to hour and from place to place, so every run shows the same skies.
 *
 * It honours `latitude`, `longitude`, `hourly` (only the variables asked for come back),
 * `forecast_days` (0..16, default 7), `wind_speed_unit` (kmh, ms, mph, kn) and `timezone` (GMT or
 * UTC only); hours start at 00:00 UTC of the fake's "today". Bad parameters answer 400 with
 * `{ "error": true, "reason": ... }` as the service does.
 *
 * Test controls on the returned handle: answer 500, a malformed body (not JSON, or JSON of the
 * wrong shape), or hang (never answer) for the next n requests or until told otherwise; a fixed
 * sky (the same values, e.g. 10 % cloud, at every hour and place, until cleared); and a request
 * counter. With `httpControls`, the same controls are at `POST /__fake/mode`,
 * `POST /__fake/sky?cloud_cover=..` (no values: back to the invented skies) and
 * `GET /__fake/state`, for tests that run the app in another process.
 *
 * Run alone: `node --import tsx server/forecast/fake-forecast-server.ts [port]` (0 picks a free port).
 */
import type { Server, ServerResponse } from 'node:http';
import { pathToFileURL } from 'node:url';
import { resolve } from 'node:path';
import express, { type Express, type Request, type Response } from 'express';
import { dewPointC } from '../../shared/outlook';
import { MS_PER_DAY, MS_PER_HOUR } from '../../shared/units';
import { FORECAST_HOURLY_VARIABLES, type ForecastHourlyVariable } from './open-meteo';

/** How the fake answers. */
export const fakeForecastModes = ['ok', 'error-500', 'malformed-json', 'malformed-shape', 'hang'] as const;
export type FakeForecastMode = (typeof fakeForecastModes)[number];

/** Most forecast days the service gives (its documented limit). */
const MAX_FORECAST_DAYS = 16;
const DEFAULT_FORECAST_DAYS = 7;

/** Units of the variables in the service's spelling; wind speeds follow wind_speed_unit. */
const UNITS: Record<ForecastHourlyVariable, string> = {
  cloud_cover: '%',
  cloud_cover_low: '%',
  cloud_cover_mid: '%',
  cloud_cover_high: '%',
  precipitation_probability: '%',
  wind_speed_10m: 'km/h',
  wind_gusts_10m: 'km/h',
  relative_humidity_2m: '%',
  temperature_2m: '°C',
  dew_point_2m: '°C',
};

/** wind_speed_unit: the unit's label in hourly_units (the labels are the fake's own) and the factor from m/s. */
const WIND_UNITS: Record<string, { unit: string; perMs: number }> = {
  kmh: { unit: 'km/h', perMs: 3.6 },
  ms: { unit: 'm/s', perMs: 1 },
  mph: { unit: 'mph', perMs: 3600 / 1609.344 },
  kn: { unit: 'kn', perMs: 3600 / 1852 },
};

/**
 * FNV-1a, 32 bit, of a string, as a number in [0, 1). A tiny hash of our own: the fake only needs
 * repeatable noise, not a cryptographic or widely shared function.
 */
function unitHash(text: string): number {
  let h = 0x811c9dc5;
  for (let i = 0; i < text.length; i += 1) {
    h ^= text.charCodeAt(i);
    h = Math.imul(h, 0x01000193);
  }
  return (h >>> 0) / 4294967296;
}

/** Smooth value noise in [0, 1): random values every `stepHours`, eased in between. */
function smoothNoise(seed: string, hourIndex: number, stepHours: number): number {
  const k = Math.floor(hourIndex / stepHours);
  const f = (hourIndex - k * stepHours) / stepHours;
  const ease = f * f * (3 - 2 * f);
  const a = unitHash(`${seed}|${k}`);
  const b = unitHash(`${seed}|${k + 1}`);
  return a + (b - a) * ease;
}

const clamp = (v: number, lo: number, hi: number) => Math.min(hi, Math.max(lo, v));
const round1 = (v: number) => Math.round(v * 10) / 10;

/** The invented weather of one hour at a position, in SI units (wind m/s). */
function inventHour(lat: number, lon: number, hourIndex: number): Record<ForecastHourlyVariable, number> {
  const seed = `${lat.toFixed(2)},${lon.toFixed(2)}`;
  // Cloud layers come and go over 5 to 11 hours; some hours clear, some overcast.
  const low = clamp(smoothNoise(`${seed}|low`, hourIndex, 5) * 1.8 - 1.0, 0, 1);
  const mid = clamp(smoothNoise(`${seed}|mid`, hourIndex, 11) * 1.7 - 0.9, 0, 1);
  const high = clamp(smoothNoise(`${seed}|high`, hourIndex, 7) * 1.5 - 0.7, 0, 1);
  // Layers overlap at random: the total is the sky not left clear by any of them.
  const total = 1 - (1 - low) * (1 - mid) * (1 - high);
  // A daily temperature cycle by local solar time, coolest before dawn, cooler towards the poles.
  const solarHour = (((hourIndex % 24) + lon / 15) % 24 + 24) % 24;
  const daily = Math.cos(((solarHour - 15) / 24) * 2 * Math.PI);
  const temperature = 24 - 0.45 * Math.abs(lat) + 5 * daily + 6 * (smoothNoise(`${seed}|temp`, hourIndex, 24) - 0.5);
  const humidity = clamp(64 - 16 * daily + 30 * (smoothNoise(`${seed}|rh`, hourIndex, 9) - 0.5) + 10 * low, 15, 100);
  const t = clamp(round1(temperature), -60, 50);
  const rh = Math.round(humidity);
  const wind = 0.5 + 9 * smoothNoise(`${seed}|wind`, hourIndex, 8) ** 2;
  return {
    cloud_cover: Math.round(100 * total),
    cloud_cover_low: Math.round(100 * low),
    cloud_cover_mid: Math.round(100 * mid),
    cloud_cover_high: Math.round(100 * high),
    precipitation_probability: Math.round(100 * clamp(low * 1.2 - 0.2, 0, 1) * smoothNoise(`${seed}|rain`, hourIndex, 6)),
    wind_speed_10m: wind,
    wind_gusts_10m: wind * (1.3 + 0.6 * smoothNoise(`${seed}|gust`, hourIndex, 3)),
    relative_humidity_2m: rh,
    temperature_2m: t,
    dew_point_2m: round1(dewPointC(t, rh)),
  };
}

/** Values every hour takes in a fixed sky, in SI units (wind m/s); variables left out stay invented (so set temperature and dew point together). */
export type FakeSky = Partial<Record<ForecastHourlyVariable, number>>;

/** Checks a fixed sky: known variable names and finite values in the service's ranges. */
function checkSky(sky: FakeSky): FakeSky {
  for (const [name, value] of Object.entries(sky)) {
    if (!(FORECAST_HOURLY_VARIABLES as readonly string[]).includes(name)) throw new RangeError(`Unknown hourly variable '${name}'`);
    const isPct = UNITS[name as ForecastHourlyVariable] === '%';
    if (typeof value !== 'number' || !Number.isFinite(value) || (isPct && (value < 0 || value > 100))) {
      throw new RangeError(`${name} must be a finite number${isPct ? ' from 0 to 100' : ''} (got ${String(value)})`);
    }
  }
  return { ...sky };
}

/** The fake's state: what it answers and how many requests it has seen. */
export interface FakeForecastState {
  /** A fixed sky over the invented one, or null. */
  sky: FakeSky | null;
  mode: FakeForecastMode;
  /** Requests left in `mode` before it returns to 'ok'; Infinity for "until told otherwise". */
  remaining: number;
  requestCount: number;
  /** The query of the last /v1/forecast request. */
  lastQuery: Record<string, unknown> | null;
  /** The fake's clock: its "today" starts the hours. */
  now: () => Date;
  hanging: Set<ServerResponse>;
}

class BadParameter extends Error {}

function numberParam(req: Request, name: string, min: number, max: number): number {
  const raw = req.query[name];
  if (typeof raw !== 'string' || raw.trim() === '') throw new BadParameter(`Parameter '${name}' is required`);
  const value = Number(raw);
  if (!Number.isFinite(value) || value < min || value > max) throw new BadParameter(`Parameter '${name}' must be a number from ${min} to ${max}`);
  return value;
}

function forecastBody(req: Request, now: Date, sky: FakeSky | null) {
  const lat = numberParam(req, 'latitude', -90, 90);
  const lon = numberParam(req, 'longitude', -180, 180);
  const daysRaw = req.query.forecast_days;
  const days = daysRaw === undefined ? DEFAULT_FORECAST_DAYS : Number(daysRaw);
  if (!Number.isInteger(days) || days < 0 || days > MAX_FORECAST_DAYS) throw new BadParameter(`Parameter 'forecast_days' must be an integer from 0 to ${MAX_FORECAST_DAYS}`);
  const timezone = typeof req.query.timezone === 'string' ? req.query.timezone : 'GMT';
  if (timezone !== 'GMT' && timezone !== 'UTC') throw new BadParameter('This local forecast service answers in GMT only');
  const timeformat = req.query.timeformat ?? 'iso8601';
  if (timeformat !== 'iso8601') throw new BadParameter('This local forecast service answers with iso8601 times only');
  const windKey = typeof req.query.wind_speed_unit === 'string' ? req.query.wind_speed_unit : 'kmh';
  const wind = WIND_UNITS[windKey];
  if (!wind) throw new BadParameter(`Parameter 'wind_speed_unit' must be one of ${Object.keys(WIND_UNITS).join(', ')}`);
  const hourlyRaw = req.query.hourly;
  const asked = (Array.isArray(hourlyRaw) ? hourlyRaw : hourlyRaw === undefined ? [] : [hourlyRaw])
    .flatMap((v) => String(v).split(',')).map((v) => v.trim()).filter((v) => v !== '');
  for (const v of asked) {
    if (!(FORECAST_HOURLY_VARIABLES as readonly string[]).includes(v)) throw new BadParameter(`Unknown hourly variable '${v}' for this local forecast service`);
  }
  const variables = [...new Set(asked)] as ForecastHourlyVariable[];

  // The grid cell used, as the service reports it: a 0.05 deg grid here.
  const cellLat = Math.round(lat / 0.05) * 0.05;
  const cellLon = Math.round(lon / 0.05) * 0.05;
  const firstHour = Math.floor(now.getTime() / MS_PER_DAY) * (MS_PER_DAY / MS_PER_HOUR);
  const time: string[] = [];
  const series: Record<string, number[]> = Object.fromEntries(variables.map((v) => [v, []]));
  for (let i = 0; i < days * 24; i += 1) {
    const hourIndex = firstHour + i;
    time.push(new Date(hourIndex * MS_PER_HOUR).toISOString().slice(0, 16));
    const hour = { ...inventHour(Math.round(lat * 100) / 100, Math.round(lon * 100) / 100, hourIndex), ...sky };
    for (const v of variables) {
      const value = v === 'wind_speed_10m' || v === 'wind_gusts_10m' ? round1(hour[v] * wind.perMs) : hour[v];
      series[v]!.push(value);
    }
  }
  const units: Record<string, string> = { time: 'iso8601' };
  for (const v of variables) units[v] = v === 'wind_speed_10m' || v === 'wind_gusts_10m' ? wind.unit : UNITS[v];
  return {
    latitude: Number(cellLat.toFixed(2)),
    longitude: Number(cellLon.toFixed(2)),
    generationtime_ms: 0.2,
    utc_offset_seconds: 0,
    timezone: 'GMT',
    timezone_abbreviation: 'GMT',
    elevation: 0,
    hourly_units: units,
    hourly: { time, ...series },
  };
}

/** The fake as an Express app over the given state (no listen). */
export function createFakeForecastApp(state: FakeForecastState, options: { httpControls?: boolean } = {}): Express {
  const app = express();
  app.disable('x-powered-by');

  if (options.httpControls) {
    app.get('/__fake/state', (_req, res) => {
      res.json({ mode: state.mode, remaining: Number.isFinite(state.remaining) ? state.remaining : null, requestCount: state.requestCount, sky: state.sky });
    });
    app.post('/__fake/sky', (req, res) => {
      try {
        const entries = Object.entries(req.query).map(([k, v]) => [k, typeof v === 'string' && v.trim() !== '' ? Number(v) : Number.NaN]);
        state.sky = entries.length ? checkSky(Object.fromEntries(entries) as FakeSky) : null;
        res.json({ ok: true, sky: state.sky });
      } catch (error) {
        res.status(400).json({ error: true, reason: (error as Error).message });
      }
    });
    app.post('/__fake/mode', (req, res) => {
      const mode = req.query.mode;
      const times = req.query.times === undefined ? Infinity : Number(req.query.times);
      if (!(fakeForecastModes as readonly unknown[]).includes(mode) || !(times > 0)) {
        res.status(400).json({ error: true, reason: `mode must be one of ${fakeForecastModes.join(', ')}; times a positive number` });
        return;
      }
      state.mode = mode as FakeForecastMode;
      state.remaining = times;
      res.json({ ok: true });
    });
  }

  app.get('/v1/forecast', (req: Request, res: Response) => {
    state.requestCount += 1;
    state.lastQuery = { ...req.query };
    const mode = state.mode;
    if (mode !== 'ok') {
      state.remaining -= 1;
      if (state.remaining <= 0) {
        state.mode = 'ok';
        state.remaining = Infinity;
      }
    }
    switch (mode) {
      case 'hang':
        // Never answered; closing the fake ends it.
        state.hanging.add(res);
        res.on('close', () => state.hanging.delete(res));
        return;
      case 'error-500':
        res.status(500).json({ error: true, reason: 'Internal error of the local forecast service (test mode)' });
        return;
      case 'malformed-json':
        res.status(200).type('application/json').send('{"latitude": 50.6, "hourly": {"time": ["2027-');
        return;
      case 'malformed-shape':
        res.status(200).json({ latitude: 'north', longitude: -1.9, utc_offset_seconds: 0, timezone: 'GMT', hourly_units: {}, hourly: { time: ['2027-05-10T00:00'], cloud_cover: [12, 40] } });
        return;
      case 'ok':
        break;
    }
    try {
      res.json(forecastBody(req, state.now(), state.sky));
    } catch (error) {
      if (error instanceof BadParameter) {
        res.status(400).json({ error: true, reason: error.message });
        return;
      }
      throw error;
    }
  });

  app.use((_req, res) => { res.status(404).json({ error: true, reason: 'Not found' }); });
  return app;
}

/** A running fake and its test controls. */
export interface FakeForecastServer {
  /** Base URL for FORECAST_BASE_URL, e.g. http://127.0.0.1:41234 */
  url: string;
  port: number;
  /** /v1/forecast requests seen so far (including the ones answered with errors). */
  readonly requestCount: number;
  /** The query of the last /v1/forecast request. */
  readonly lastQuery: Record<string, unknown> | null;
  /** Answer in `mode` for the next `times` requests (default: until told otherwise), then 'ok'. */
  setMode(mode: FakeForecastMode, times?: number): void;
  /** Every hour takes these values (SI units, wind m/s) until `setSky(null)` brings back the invented skies. */
  setSky(sky: FakeSky | null): void;
  resetRequestCount(): void;
  /** Stops listening and ends hanging requests. */
  close(): Promise<void>;
}

export interface FakeForecastOptions {
  /** Port on 127.0.0.1; 0 (default) picks a free one. */
  port?: number;
  host?: string;
  /** The fake's clock (its "today"); default the real time. */
  now?: () => Date;
  /** Serve the controls over HTTP too (POST /__fake/mode?mode=..&times=.., GET /__fake/state). */
  httpControls?: boolean;
}

/** Starts the fake forecast service on 127.0.0.1. */
export async function startFakeForecastServer(options: FakeForecastOptions = {}): Promise<FakeForecastServer> {
  const state: FakeForecastState = {
    sky: null, mode: 'ok', remaining: Infinity, requestCount: 0, lastQuery: null,
    now: options.now ?? (() => new Date()), hanging: new Set(),
  };
  const app = createFakeForecastApp(state, { httpControls: options.httpControls });
  const host = options.host ?? '127.0.0.1';
  const server = await new Promise<Server>((resolveServer, reject) => {
    const s = app.listen(options.port ?? 0, host, () => resolveServer(s));
    s.on('error', reject);
  });
  const address = server.address();
  const port = typeof address === 'object' && address ? address.port : options.port ?? 0;
  let closing: Promise<void> | undefined;
  return {
    url: `http://${host}:${port}`,
    port,
    get requestCount() { return state.requestCount; },
    get lastQuery() { return state.lastQuery; },
    setMode(mode, times = Infinity) {
      if (!(fakeForecastModes as readonly string[]).includes(mode)) throw new RangeError(`mode must be one of ${fakeForecastModes.join(', ')}`);
      if (!(times > 0)) throw new RangeError('times must be above 0');
      state.mode = mode;
      state.remaining = times;
    },
    setSky(sky) { state.sky = sky === null ? null : checkSky(sky); },
    resetRequestCount() { state.requestCount = 0; },
    close() {
      closing ??= new Promise<void>((r) => {
        for (const res of state.hanging) res.destroy();
        server.close(() => r());
        server.closeAllConnections();
      });
      return closing;
    },
  };
}

// Run alone: node --import tsx server/forecast/fake-forecast-server.ts [port]
if (process.argv[1] && import.meta.url === pathToFileURL(resolve(process.argv[1])).href) {
  const port = Number(process.argv[2] ?? 0);
  if (!Number.isInteger(port) || port < 0 || port > 65535) {
    console.error('Usage: fake-forecast-server.ts [port 0..65535]');
    process.exit(1);
  }
  const fake = await startFakeForecastServer({ port, httpControls: true });
  console.log(`Local forecast service (invented data) on ${fake.url}/v1/forecast`);
  const stop = () => { fake.close().then(() => process.exit(0), () => process.exit(1)); };
  process.on('SIGINT', stop);
  process.on('SIGTERM', stop);
}
