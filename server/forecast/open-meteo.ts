/**
 * The forecast service's request and response, for an Open-Meteo-compatible forecast endpoint.
 *
 * Parameter and response field names as documented for the Weather Forecast API at
 * https://open-meteo.com/en/docs: `GET /v1/forecast` with `latitude`, `longitude`, `hourly` (a
 * comma-separated list of variables), `timezone` (default GMT), `wind_speed_unit` (`ms` for m/s;
 * default km/h) and `forecast_days` (0..16, default 7). The JSON answer has `latitude`,
 * `longitude` (of the grid cell used), `elevation`, `generationtime_ms`, `utc_offset_seconds`,
 * `timezone`, `timezone_abbreviation`, `hourly_units` and `hourly` (a `time` array of ISO 8601
 * local times "YYYY-MM-DDTHH:MM" and one array per variable). Errors are HTTP 400 with
 * `{ "error": true, "reason": "..." }`. The answer names no model run.
 */
import { z } from 'zod';
import { forecastHourSchema, MAX_FORECAST_HOURS, type ForecastHour, type HourlyForecast } from '../../shared/schemas/outlook';
import type { ForecastCell } from '../../shared/outlook';

/** The hourly variables Gnomon asks for, in the service's names. */
export const FORECAST_HOURLY_VARIABLES = [
  'cloud_cover',
  'cloud_cover_low',
  'cloud_cover_mid',
  'cloud_cover_high',
  'precipitation_probability',
  'wind_speed_10m',
  'wind_gusts_10m',
  'relative_humidity_2m',
  'temperature_2m',
  'dew_point_2m',
] as const;
export type ForecastHourlyVariable = (typeof FORECAST_HOURLY_VARIABLES)[number];

/** Days asked for: the most the service gives (its documented maximum). */
export const FORECAST_DAYS = 16;

/** The forecast URL for a cell under the base URL (a trailing slash on the base is fine). */
export function forecastUrl(baseUrl: string, cell: Pick<ForecastCell, 'lat' | 'lon'>): string {
  const base = baseUrl.replace(/\/+$/, '');
  // Built by hand so the variable list keeps its plain commas, as in the service's examples.
  return `${base}/v1/forecast?latitude=${cell.lat}&longitude=${cell.lon}`
    + `&hourly=${FORECAST_HOURLY_VARIABLES.join(',')}`
    + `&timezone=GMT&wind_speed_unit=ms&forecast_days=${FORECAST_DAYS}`;
}

const valuesSchema = z.array(z.number().finite().nullable()).max(MAX_FORECAST_HOURS);

/** The part of the service's JSON answer Gnomon reads. Extra fields are allowed and ignored. */
export const forecastResponseSchema = z.object({
  latitude: z.number().finite(),
  longitude: z.number().finite(),
  generationtime_ms: z.number().finite().optional(),
  // Asked for GMT: the times are UTC only if the service applied no offset.
  utc_offset_seconds: z.literal(0),
  timezone: z.string(),
  hourly_units: z.record(z.string(), z.string()),
  hourly: z.object({
    time: z.array(z.string().regex(/^\d{4}-\d{2}-\d{2}T\d{2}:00$/, 'hourly times must be YYYY-MM-DDTHH:00')).max(MAX_FORECAST_HOURS),
    cloud_cover: valuesSchema,
    cloud_cover_low: valuesSchema.optional(),
    cloud_cover_mid: valuesSchema.optional(),
    cloud_cover_high: valuesSchema.optional(),
    precipitation_probability: valuesSchema.optional(),
    wind_speed_10m: valuesSchema.optional(),
    wind_gusts_10m: valuesSchema.optional(),
    relative_humidity_2m: valuesSchema.optional(),
    temperature_2m: valuesSchema.optional(),
    dew_point_2m: valuesSchema.optional(),
  }),
});
export type ForecastResponse = z.infer<typeof forecastResponseSchema>;

/** The service's error body (HTTP 400). */
export const forecastErrorBodySchema = z.object({ error: z.literal(true), reason: z.string() });

/** Units each variable must come in (what was asked for); a different unit is a malformed answer. */
const EXPECTED_UNITS: Partial<Record<ForecastHourlyVariable, string[]>> = {
  wind_speed_10m: ['m/s'],
  wind_gusts_10m: ['m/s'],
  temperature_2m: ['°C'],
  dew_point_2m: ['°C'],
};

/** Where our field of each variable lives. */
const FIELD_OF: Record<ForecastHourlyVariable, keyof Omit<ForecastHour, 'time'>> = {
  cloud_cover: 'cloudCoverPct',
  cloud_cover_low: 'cloudCoverLowPct',
  cloud_cover_mid: 'cloudCoverMidPct',
  cloud_cover_high: 'cloudCoverHighPct',
  precipitation_probability: 'precipitationProbabilityPct',
  wind_speed_10m: 'windSpeedMs',
  wind_gusts_10m: 'windGustsMs',
  relative_humidity_2m: 'relativeHumidityPct',
  temperature_2m: 'temperatureC',
  dew_point_2m: 'dewPointC',
};

const PERCENT_VARIABLES = new Set<ForecastHourlyVariable>(['cloud_cover', 'cloud_cover_low', 'cloud_cover_mid', 'cloud_cover_high', 'precipitation_probability', 'relative_humidity_2m']);

/** Thrown by toHourlyForecast when the answer parses but does not add up. */
export class ForecastShapeError extends Error {
  override name = 'ForecastShapeError';
}

/**
 * Turns the service's answer into Gnomon's hourly forecast: times to UTC instants, each variable
 * into its field. Hours without total cloud cover are left out. Percentages a hair outside 0..100
 * (interpolation overshoot) are clamped; any other value outside the shape's range becomes null
 * ("not given") rather than failing the whole forecast.
 *
 * @param body - the parsed answer
 * @param cell - the cell asked for (the answer's own position is the model grid cell's centre)
 * @param fetchedAt - when the answer arrived; stands for the issue time, which the answer lacks
 * @throws ForecastShapeError when the arrays do not match the times, or a unit is not the one asked for
 */
export function toHourlyForecast(body: ForecastResponse, cell: Pick<ForecastCell, 'lat' | 'lon'>, fetchedAt: Date): HourlyForecast {
  const { time } = body.hourly;
  for (const variable of FORECAST_HOURLY_VARIABLES) {
    const values = body.hourly[variable];
    if (values === undefined) continue;
    if (values.length !== time.length) throw new ForecastShapeError(`hourly.${variable} has ${values.length} values for ${time.length} times`);
    const unit = body.hourly_units[variable];
    const expected = EXPECTED_UNITS[variable];
    if (expected && unit !== undefined && !expected.includes(unit)) throw new ForecastShapeError(`hourly.${variable} is in ${unit}, not ${expected.join(' or ')}`);
  }
  const hours: ForecastHour[] = [];
  let previousMs = -Infinity;
  time.forEach((t, i) => {
    const ms = Date.parse(`${t}:00Z`);
    if (!Number.isFinite(ms)) throw new ForecastShapeError(`hourly.time[${i}] is not a time: ${t}`);
    if (ms <= previousMs) throw new ForecastShapeError(`hourly.time[${i}] is not after the time before it`);
    previousMs = ms;
    const cloud = body.hourly.cloud_cover[i];
    if (cloud === null || cloud === undefined) return;
    const hour: Record<string, unknown> = { time: new Date(ms).toISOString() };
    for (const variable of FORECAST_HOURLY_VARIABLES) {
      let value = body.hourly[variable]?.[i] ?? null;
      if (value !== null && PERCENT_VARIABLES.has(variable) && value >= -1 && value <= 101) value = Math.min(100, Math.max(0, value));
      hour[FIELD_OF[variable]] = value;
    }
    const checked = forecastHourSchema.safeParse(hour);
    if (checked.success) {
      hours.push(checked.data);
      return;
    }
    // Blank out what is out of range; the hour stays if its total cloud cover is sound.
    for (const issue of checked.error.issues) {
      const field = issue.path[0];
      if (typeof field === 'string' && field !== 'time') hour[field] = null;
    }
    const retried = forecastHourSchema.safeParse({ ...hour, cloudCoverPct: hour.cloudCoverPct ?? Number.NaN });
    if (retried.success) hours.push(retried.data);
  });
  const fetched = fetchedAt.toISOString();
  return { lat: cell.lat, lon: cell.lon, issuedAt: fetched, fetchedAt: fetched, hours };
}
