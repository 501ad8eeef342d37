import type { ErrorCode } from '../shared/errors';

const statusByCode: Record<ErrorCode, number> = {
  validation: 400,
  unauthenticated: 401,
  forbidden: 403,
  not_found: 404,
  conflict: 409,
  gone: 410,
  payload_too_large: 413,
  rate_limited: 429,
  internal: 500,
};

/** The one error type the server throws on purpose; the error handler turns it into JSON. */
export class AppError extends Error {
  override name = 'AppError';
  readonly status: number;

  constructor(
    readonly code: ErrorCode,
    message: string,
    readonly fields?: Record<string, string>,
  ) {
    super(message);
    this.status = statusByCode[code];
  }

  static notFound(what = 'Not found'): AppError {
    return new AppError('not_found', what);
  }
}
