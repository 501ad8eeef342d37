import type { z } from 'zod';
import { fieldErrorsFromZod, type ErrorCode } from '../shared/errors';

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

/** Parses `source` with the schema or throws a 400 with per-field messages (for routes and services). */
export function parseOrThrow<S extends z.ZodType>(schema: S, source: unknown): z.infer<S> {
  const result = schema.safeParse(source);
  if (!result.success) {
    throw new AppError('validation', 'Some fields need attention', fieldErrorsFromZod(result.error));
  }
  return result.data;
}
