import { z } from 'zod';

/** Machine-readable error codes the API returns in `error.code`. */
export const errorCodes = [
  'validation',
  'unauthenticated',
  'forbidden',
  'not_found',
  'conflict',
  /** The thing existed but is over: an expired or withdrawn link. */
  'gone',
  'rate_limited',
  'payload_too_large',
  'internal',
] as const;
export type ErrorCode = (typeof errorCodes)[number];

/** The one JSON shape of every error the API returns. */
export const apiErrorBodySchema = z.object({
  error: z.object({
    code: z.enum(errorCodes),
    message: z.string(),
    /** Per-field messages, keyed by the field's dotted path (e.g. `vantage.lat`). */
    fields: z.record(z.string(), z.string()).optional(),
  }),
});
export type ApiErrorBody = z.infer<typeof apiErrorBodySchema>;

/**
 * Turns zod issues into one message per field (the first issue wins), keyed by dotted path.
 * Issues on the object itself are keyed `_`.
 */
export function fieldErrorsFromZod(error: z.ZodError): Record<string, string> {
  const fields: Record<string, string> = {};
  for (const issue of error.issues) {
    const key = issue.path.length ? issue.path.map(String).join('.') : '_';
    if (!(key in fields)) fields[key] = issue.message;
  }
  return fields;
}
