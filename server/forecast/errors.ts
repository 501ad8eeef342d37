/** Why a forecast could not be had. */
export type ForecastFailureKind =
  /** No forecast service is configured (FORECAST_BASE_URL unset). */
  | 'not-configured'
  /** No answer within the timeout. */
  | 'timeout'
  /** The connection failed (refused, reset, DNS). */
  | 'network'
  /** The service answered 5xx (after the retries). */
  | 'server-error'
  /** The service refused the request (4xx, e.g. 400 for a bad parameter or 429 for too many calls). */
  | 'refused'
  /** The service answered 200 with a body we cannot read (not JSON, or not the expected shape). */
  | 'malformed';

/** Plain words for each failure, for the outlook's "unavailable" message. */
const MESSAGES: Record<ForecastFailureKind, string> = {
  'not-configured': 'No forecast service is set up on this server',
  timeout: 'The forecast service did not answer in time',
  network: 'The forecast service could not be reached',
  'server-error': 'The forecast service had a problem',
  refused: 'The forecast service refused the request',
  malformed: 'The forecast service sent an answer that could not be read',
};

/** The one error the forecast client throws: the service is down, slow, refusing or garbled. */
export class ForecastUnavailableError extends Error {
  override name = 'ForecastUnavailableError';

  constructor(
    readonly kind: ForecastFailureKind,
    /** Detail for the log (status, the service's reason, the parse problem); not shown to people. */
    readonly detail?: string,
    readonly status?: number,
    options?: { cause?: unknown },
  ) {
    super(detail ? `${MESSAGES[kind]}: ${detail}` : MESSAGES[kind], options);
  }

  /** The message shown to people in an 'unavailable' outlook. */
  get publicMessage(): string {
    return MESSAGES[this.kind];
  }
}
