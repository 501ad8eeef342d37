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

/** A downloaded file: its bytes and the name the server suggests. */
export interface DownloadedFile {
  blob: Blob;
  filename: string;
}

function filenameOf(response: Response, fallback: string): string {
  const header = response.headers.get('Content-Disposition') ?? '';
  const match = /filename\*?=(?:UTF-8'')?"?([^";]+)"?/i.exec(header);
  return match?.[1] ? decodeURIComponent(match[1]) : fallback;
}

/**
 * A POST whose answer is a file (a calendar, a CSV, a shot card), not JSON. Same conventions as
 * `request()`: same origin, cookies, JSON body, errors as ApiError from the shared error schema.
 */
export async function requestFile(path: string, body: unknown, fallbackName: string): Promise<DownloadedFile> {
  let response: Response;
  try {
    response = await fetch(`/api${path}`, {
      method: 'POST',
      credentials: 'same-origin',
      headers: { 'Content-Type': 'application/json' },
      body: JSON.stringify(body),
    });
  } catch {
    throw new ApiError(0, 'network', 'Cannot reach the Gnomon server. Check your connection and try again.');
  }
  if (!response.ok) {
    const text = await response.text();
    const parsed = apiErrorBodySchema.safeParse(text ? safeJson(text) : undefined);
    if (parsed.success) throw new ApiError(response.status, parsed.data.error.code, parsed.data.error.message, parsed.data.error.fields);
    throw new ApiError(response.status, 'internal', `The server answered ${response.status}`);
  }
  return { blob: await response.blob(), filename: filenameOf(response, fallbackName) };
}
