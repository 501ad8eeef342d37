import { apiErrorBodySchema } from '../../shared/errors';
import { lineupSearchResponseSchema, type LineupSearchRequestBody, type LineupSearchResponse } from '../../shared/schemas/lineup';
import { ApiError, request } from './client';

/** File formats of POST /api/lineups/export. */
export type LineupExportFormat = 'ics' | 'csv';

/** A downloaded file: its bytes and the name the server suggests. */
export interface DownloadedFile {
  blob: Blob;
  filename: string;
}

/** POST /api/lineups/search; long ranges take up to about a second; `signal` cancels it. */
export async function searchLineups(body: LineupSearchRequestBody, signal?: AbortSignal): Promise<LineupSearchResponse> {
  return request('POST', '/lineups/search', { body, schema: lineupSearchResponseSchema, ...(signal ? { signal } : {}) });
}

function filenameOf(response: Response, fallback: string): string {
  const header = response.headers.get('Content-Disposition') ?? '';
  const match = /filename\*?=(?:UTF-8'')?"?([^";]+)"?/i.exec(header);
  return match?.[1] ? decodeURIComponent(match[1]) : fallback;
}

/**
 * POST /api/lineups/export?format=ics|csv with the search body: the same lineups as a file.
 *
 * The one call that does not go through request(): request() reads every answer as JSON, and this
 * answer is a calendar or CSV file. It keeps request()'s conventions (same origin, cookies, errors
 * as ApiError from the shared error schema).
 */
export async function exportLineups(body: LineupSearchRequestBody, format: LineupExportFormat): Promise<DownloadedFile> {
  let response: Response;
  try {
    response = await fetch(`/api/lineups/export?format=${format}`, {
      method: 'POST',
      credentials: 'same-origin',
      headers: { 'Content-Type': 'application/json' },
      body: JSON.stringify(body),
    });
  } catch {
    throw new ApiError(0, 'network', 'Cannot reach the Gnomon server. Check your connection and try again.');
  }
  if (!response.ok) {
    let json: unknown;
    try { json = await response.json(); } catch { json = undefined; }
    const parsed = apiErrorBodySchema.safeParse(json);
    if (parsed.success) throw new ApiError(response.status, parsed.data.error.code, parsed.data.error.message, parsed.data.error.fields);
    throw new ApiError(response.status, 'internal', `The server answered ${response.status}`);
  }
  return { blob: await response.blob(), filename: filenameOf(response, `gnomon-lineups.${format}`) };
}
