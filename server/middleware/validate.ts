import type { Request, RequestHandler } from 'express';
import type { z } from 'zod';
import { parseOrThrow } from '../errors';

export { parseOrThrow };

/** Replaces req.body with the parsed value, or answers 400 with per-field messages. */
export function validateBody<S extends z.ZodType>(schema: S): RequestHandler {
  return (req: Request, _res, next) => {
    req.body = parseOrThrow(schema, req.body ?? {});
    next();
  };
}
