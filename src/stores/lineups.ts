import { defineStore } from 'pinia';
import { reactive, ref } from 'vue';
import type { LineupSearchRequestBody, LineupSearchResponse } from '../../shared/schemas/lineup';
import { ApiError } from '@/api/client';
import * as lineupsApi from '@/api/lineups';
import type { DownloadedFile, LineupExportFormat } from '@/api/lineups';

/** One lineup search as it runs: what was asked, what came back, and how it went. */
export interface LineupSearchRun {
  body: LineupSearchRequestBody | null;
  result: LineupSearchResponse | null;
  running: boolean;
  /** Date.now() when the running search started. */
  startedAtMs: number;
  /** Wall time of the last finished search, ms. */
  lastDurationMs: number;
  /** True when the user cancelled the last search. */
  cancelled: boolean;
  /** A message for a failed search ('' when none). */
  error: string;
  /** Per-field messages from the server (dotted paths such as `conditions.sunMaxAltDeg`). */
  fields: Record<string, string>;
}

function emptyRun(): LineupSearchRun {
  return { body: null, result: null, running: false, startedAtMs: 0, lastDurationMs: 0, cancelled: false, error: '', fields: {} };
}

function isAbort(error: unknown): boolean {
  return (error as { name?: string } | null)?.name === 'AbortError';
}

/**
 * Lineup searches of the sightline page: the one the results table shows and the one-year search
 * of the year view. A new search cancels the one before it; `cancel` stops one on request.
 */
export const useLineupsStore = defineStore('lineups', () => {
  const search = reactive<LineupSearchRun>(emptyRun());
  const year = reactive<LineupSearchRun>(emptyRun());
  const controllers = new Map<LineupSearchRun, AbortController>();
  /** The night a night chart shows, 'YYYY-MM-DD' in the site zone, or null. */
  const selectedNight = ref<string | null>(null);

  async function run(state: LineupSearchRun, body: LineupSearchRequestBody): Promise<void> {
    controllers.get(state)?.abort();
    const controller = new AbortController();
    controllers.set(state, controller);
    Object.assign(state, { body, running: true, startedAtMs: Date.now(), cancelled: false, error: '', fields: {} });
    try {
      const result = await lineupsApi.searchLineups(body, controller.signal);
      if (controllers.get(state) !== controller) return;
      state.result = result;
    } catch (error) {
      if (controllers.get(state) !== controller) return;
      if (isAbort(error)) state.cancelled = true;
      else if (error instanceof ApiError) {
        state.error = error.message;
        state.fields = error.fields;
      } else state.error = (error as Error).message;
    } finally {
      if (controllers.get(state) === controller) {
        controllers.delete(state);
        state.running = false;
        state.lastDurationMs = Date.now() - state.startedAtMs;
      }
    }
  }

  function cancelRun(state: LineupSearchRun): void {
    controllers.get(state)?.abort();
  }

  /** Runs the search of the results table. */
  function runSearch(body: LineupSearchRequestBody): Promise<void> {
    return run(search, body);
  }

  /** Runs the one-year search of the year view. */
  function runYear(body: LineupSearchRequestBody): Promise<void> {
    return run(year, body);
  }

  function cancelSearch(): void {
    cancelRun(search);
  }

  function cancelYear(): void {
    cancelRun(year);
  }

  /** Runs both searches again with what they last asked (after the tide data changed). */
  async function refreshAll(): Promise<void> {
    await Promise.all([search.body && !search.running ? run(search, search.body) : undefined, year.body && !year.running ? run(year, year.body) : undefined]);
  }

  /** The last search's lineups as a file from the server (iCalendar or CSV). */
  async function exportFile(format: LineupExportFormat): Promise<DownloadedFile> {
    if (!search.body) throw new Error('Run a search first');
    return lineupsApi.exportLineups(search.body, format);
  }

  /** Forgets everything (another sightline is opened). */
  function reset(): void {
    for (const state of [search, year]) {
      cancelRun(state);
      // Forget the controller first, so the cancelled request's answer is ignored.
      controllers.delete(state);
    }
    Object.assign(search, emptyRun());
    Object.assign(year, emptyRun());
    selectedNight.value = null;
  }

  return { search, year, selectedNight, runSearch, runYear, cancelSearch, cancelYear, refreshAll, exportFile, reset };
});
