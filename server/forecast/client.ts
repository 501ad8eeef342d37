/**
 * The client of the hosted forecast service (Open-Meteo-compatible `GET /v1/forecast`, see
 * ./open-meteo.ts for the documented names). Node's own fetch, a timeout per attempt, a few
 * retries with doubling back-off on 5xx and connection failures; the body is read with a size
 * limit and parsed with zod. Every failure is a ForecastUnavailableError, never a crash.
 *
 * Not retried: 4xx (the request itself is wrong, or the service asks us to slow down), a body
 * that cannot be read (the same answer would come again), and a timeout (a hanging service
 * would otherwise hold a page for several timeouts; the next lookup after the back-off period
 * tries again).
 */
import type { HourlyForecast } from '../../shared/schemas/outlook';
import { forecastCell } from '../../shared/outlook';
import { ForecastUnavailableError } from './errors';
import { forecastErrorBodySchema, forecastResponseSchema, forecastUrl, ForecastShapeError, toHourlyForecast } from './open-meteo';

/** What the forecast service layer needs from a client: the hourly forecast of a cell centre. */
export interface ForecastSource {
  fetchHourly(lat: number, lon: number): Promise<HourlyForecast>;
}

export interface ForecastClientOptions {
  /** The service's base URL, e.g. https://api.open-meteo.com (the path /v1/forecast is added). */
  baseUrl: string;
  /** Time allowed for one attempt, headers and body, ms (default 8000). */
  timeoutMs?: number;
  /** Further attempts after a 5xx or a connection failure (default 2). */
  retries?: number;
  /** Wait before the first retry, ms, doubled for each further one (default 400). */
  backoffMs?: number;
  /** Largest body read, bytes (default 2 MiB; 16 days of ten variables is about 40 kB). */
  maxBodyBytes?: number;
  /** The clock that stamps fetchedAt (tests give their own). */
  now?: () => Date;
  /** The fetch to use (tests may wrap it). */
  fetch?: typeof fetch;
  /** How to wait between attempts (tests may skip the wait). */
  sleep?: (ms: number) => Promise<void>;
}

const DEFAULT_TIMEOUT_MS = 8000;
const DEFAULT_RETRIES = 2;
const DEFAULT_BACKOFF_MS = 400;
const DEFAULT_MAX_BODY_BYTES = 2 * 1024 * 1024;

const wait = (ms: number) => new Promise<void>((resolve) => { setTimeout(resolve, ms); });

/** A failure worth another attempt. */
class RetryableFailure extends Error {
  constructor(readonly failure: ForecastUnavailableError) {
    super(failure.message);
  }
}

function isTimeout(error: unknown): boolean {
  return error instanceof Error && (error.name === 'TimeoutError' || (error.name === 'AbortError' && /timeout/i.test(String(error.message))));
}

/** Reads at most `limit` bytes of the body as UTF-8, or throws 'malformed' when it is longer. */
async function readBody(response: Response, limit: number): Promise<string> {
  const declared = Number(response.headers.get('content-length'));
  if (Number.isFinite(declared) && declared > limit) {
    await response.body?.cancel().catch(() => undefined);
    throw new ForecastUnavailableError('malformed', `the body is ${declared} bytes, more than ${limit}`);
  }
  if (!response.body) return '';
  const reader = response.body.getReader();
  const chunks: Uint8Array[] = [];
  let size = 0;
  for (;;) {
    const { done, value } = await reader.read();
    if (done) break;
    size += value.byteLength;
    if (size > limit) {
      await reader.cancel().catch(() => undefined);
      throw new ForecastUnavailableError('malformed', `the body is more than ${limit} bytes`);
    }
    chunks.push(value);
  }
  return Buffer.concat(chunks).toString('utf8');
}

/** Fetches hourly forecasts from the configured service. */
export class ForecastClient implements ForecastSource {
  private readonly baseUrl: string;
  private readonly timeoutMs: number;
  private readonly retries: number;
  private readonly backoffMs: number;
  private readonly maxBodyBytes: number;
  private readonly now: () => Date;
  private readonly fetchFn: typeof fetch;
  private readonly sleep: (ms: number) => Promise<void>;

  constructor(options: ForecastClientOptions) {
    let url: URL;
    try {
      url = new URL(options.baseUrl);
    } catch {
      throw new RangeError(`baseUrl must be an http(s) URL (got ${options.baseUrl})`);
    }
    if (url.protocol !== 'http:' && url.protocol !== 'https:') throw new RangeError(`baseUrl must be an http(s) URL (got ${options.baseUrl})`);
    this.baseUrl = options.baseUrl;
    this.timeoutMs = options.timeoutMs ?? DEFAULT_TIMEOUT_MS;
    this.retries = options.retries ?? DEFAULT_RETRIES;
    this.backoffMs = options.backoffMs ?? DEFAULT_BACKOFF_MS;
    this.maxBodyBytes = options.maxBodyBytes ?? DEFAULT_MAX_BODY_BYTES;
    this.now = options.now ?? (() => new Date());
    this.fetchFn = options.fetch ?? fetch;
    this.sleep = options.sleep ?? wait;
    if (!(this.timeoutMs > 0)) throw new RangeError('timeoutMs must be above 0');
    if (!Number.isInteger(this.retries) || this.retries < 0 || this.retries > 5) throw new RangeError('retries must be an integer from 0 to 5');
  }

  /**
   * The hourly forecast of the forecast cell holding (lat, lon): the cell's centre is what is sent.
   *
   * @throws ForecastUnavailableError when the service fails, after the retries
   */
  async fetchHourly(lat: number, lon: number): Promise<HourlyForecast> {
    const cell = forecastCell(lat, lon);
    const url = forecastUrl(this.baseUrl, cell);
    let lastFailure: ForecastUnavailableError | undefined;
    for (let attempt = 0; attempt <= this.retries; attempt += 1) {
      if (attempt > 0) await this.sleep(this.backoffMs * 2 ** (attempt - 1));
      try {
        return await this.attempt(url, cell);
      } catch (error) {
        if (!(error instanceof RetryableFailure)) throw error;
        lastFailure = error.failure;
      }
    }
    throw lastFailure!;
  }

  private async attempt(url: string, cell: { lat: number; lon: number }): Promise<HourlyForecast> {
    let response: Response;
    let text: string;
    try {
      response = await this.fetchFn(url, { signal: AbortSignal.timeout(this.timeoutMs), headers: { accept: 'application/json' } });
      text = await readBody(response, this.maxBodyBytes);
    } catch (error) {
      if (error instanceof ForecastUnavailableError) throw error;
      if (isTimeout(error)) throw new ForecastUnavailableError('timeout', `no answer within ${this.timeoutMs} ms`, undefined, { cause: error });
      throw new RetryableFailure(new ForecastUnavailableError('network', error instanceof Error ? error.message : String(error), undefined, { cause: error }));
    }
    if (response.status >= 500) {
      throw new RetryableFailure(new ForecastUnavailableError('server-error', `HTTP ${response.status}`, response.status));
    }
    if (response.status >= 400) {
      let reason = `HTTP ${response.status}`;
      try {
        const body = forecastErrorBodySchema.safeParse(JSON.parse(text));
        if (body.success) reason = `HTTP ${response.status}: ${body.data.reason.slice(0, 300)}`;
      } catch {
        // Not the service's JSON error: the status says enough.
      }
      throw new ForecastUnavailableError('refused', reason, response.status);
    }
    if (response.status !== 200) throw new ForecastUnavailableError('malformed', `HTTP ${response.status}`, response.status);
    let json: unknown;
    try {
      json = JSON.parse(text);
    } catch {
      throw new ForecastUnavailableError('malformed', 'the body is not JSON');
    }
    const parsed = forecastResponseSchema.safeParse(json);
    if (!parsed.success) {
      const first = parsed.error.issues[0];
      throw new ForecastUnavailableError('malformed', first ? `${first.path.join('.') || 'body'}: ${first.message}` : 'unexpected shape');
    }
    try {
      return toHourlyForecast(parsed.data, cell, this.now());
    } catch (error) {
      if (error instanceof ForecastShapeError) throw new ForecastUnavailableError('malformed', error.message);
      throw error;
    }
  }
}
