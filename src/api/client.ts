import type { z } from 'zod';
import { apiErrorBodySchema, type ErrorCode } from '../../shared/errors';

/** An error answer from the API, or a network failure (status 0). */
export class ApiError extends Error {
  override name = 'ApiError';
  constructor(
    readonly status: number,
    readonly code: ErrorCode | 'network',
    message: string,
    readonly fields: Record<string, string> = {},
  ) {
    super(message);
  }
}

type Method = 'GET' | 'POST' | 'PUT' | 'PATCH' | 'DELETE';

interface RequestOptions<S extends z.ZodType | undefined> {
  body?: unknown;
  schema?: S;
  signal?: AbortSignal;
}

/**
 * The one way the client talks to the API: same-origin JSON, cookies for the session, answers
 * checked with the shared schema, errors turned into ApiError.
 */
export async function request<S extends z.ZodType | undefined = undefined>(
  method: Method,
  path: string,
  options: RequestOptions<S> = {},
): Promise<S extends z.ZodType ? z.infer<S> : void> {
  let response: Response;
  try {
    response = await fetch(`/api${path}`, {
      method,
      credentials: 'same-origin',
      headers: options.body !== undefined ? { 'Content-Type': 'application/json' } : undefined,
      body: options.body !== undefined ? JSON.stringify(options.body) : undefined,
      signal: options.signal,
    });
  } catch (error) {
    if ((error as Error).name === 'AbortError') throw error;
    throw new ApiError(0, 'network', 'Cannot reach the Gnomon server. Check your connection and try again.');
  }
  const text = await response.text();
  const json: unknown = text ? safeJson(text) : undefined;
  if (!response.ok) {
    const parsed = apiErrorBodySchema.safeParse(json);
    if (parsed.success) {
      const { code, message, fields } = parsed.data.error;
      throw new ApiError(response.status, code, message, fields);
    }
    throw new ApiError(response.status, 'internal', `The server answered ${response.status}`);
  }
  if (!options.schema) return undefined as never;
  const parsed = options.schema.safeParse(json);
  if (!parsed.success) throw new ApiError(response.status, 'internal', 'The server sent an answer this page does not understand');
  return parsed.data as never;
}

function safeJson(text: string): unknown {
  try {
    return JSON.parse(text);
  } catch {
    return undefined;
  }
}
