import { lineupSearchResponseSchema, type LineupSearchRequestBody, type LineupSearchResponse } from '../../shared/schemas/lineup';
import { request, requestFile, type DownloadedFile } from './client';

/** File formats of POST /api/lineups/export. */
export type LineupExportFormat = 'ics' | 'csv';

export type { DownloadedFile };

/** POST /api/lineups/search; long ranges take up to about a second; `signal` cancels it. */
export async function searchLineups(body: LineupSearchRequestBody, signal?: AbortSignal): Promise<LineupSearchResponse> {
  return request('POST', '/lineups/search', { body, schema: lineupSearchResponseSchema, ...(signal ? { signal } : {}) });
}


/** POST /api/lineups/export?format=ics|csv with the search body: the same lineups as a file. */
export function exportLineups(body: LineupSearchRequestBody, format: LineupExportFormat): Promise<DownloadedFile> {
  return requestFile(`/lineups/export?format=${format}`, body, `gnomon-lineups.${format}`);
}
