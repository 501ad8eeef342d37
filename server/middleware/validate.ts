import type { Request, RequestHandler } from 'express';
import type { z } from 'zod';
import { fieldErrorsFromZod } from '../../shared/errors';
import { AppError } from '../errors';

/** Parses `source` with the schema or throws a 400 with per-field messages. */
export function parseOrThrow<S extends z.ZodType>(schema: S, source: unknown): z.infer<S> {
  const result = schema.safeParse(source);
  if (!result.success) {
    throw new AppError('validation', 'Some fields need attention', fieldErrorsFromZod(result.error));
  }
  return result.data;
}

/** Replaces req.body with the parsed value, or answers 400 with per-field messages. */
export function validateBody<S extends z.ZodType>(schema: S): RequestHandler {
  return (req: Request, _res, next) => {
    req.body = parseOrThrow(schema, req.body ?? {});
    next();
  };
}
