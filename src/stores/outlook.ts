import { defineStore } from 'pinia';
import { ref } from 'vue';
import { OUTLOOK_CAUTION, windowReach, type WindowReach } from '../../shared/outlook';
import { MAX_OUTLOOK_WINDOWS, type SkyOutlook } from '../../shared/schemas/outlook';
import { ApiError } from '@/api/client';
import * as outlookApi from '@/api/outlook';

/** A lineup window as the search gives it (ISO instants). */
export interface OutlookLineup {
  start: string;
  end: string;
}

/** How the last outlook request went. */
export type OutlookLoadStatus = 'idle' | 'loading' | 'ready' | 'failed';

function isAbort(error: unknown): boolean {
  return (error as { name?: string } | null)?.name === 'AbortError';
}

/**
 * The sky outlook of the lineups of a search result: one POST /api/outlook with every window
 * within the forecast's reach (at most MAX_OUTLOOK_WINDOWS, the earliest), asked once per
 * sightline and set of windows however many rows or charts show them. Windows beyond the reach
 * get "no forecast yet" without asking; those over get "lineup over". A failed request marks the
 * asked windows "forecast unavailable"; it never touches the search.
 */
export const useOutlookStore = defineStore('outlook', () => {
  /** Outlook per lineup start (the search's own ISO string). */
  const byStart = ref<Record<string, SkyOutlook>>({});
  const status = ref<OutlookLoadStatus>('idle');
  const error = ref('');
  const caution = ref(OUTLOOK_CAUTION);
  /** What was last asked: sightline and windows. A repeat of it does nothing. */
  let askedKey = '';
  let controller: AbortController | null = null;

  /**
   * Asks for the outlooks of a search result's lineups at a saved sightline, unless exactly that
   * was asked already (a second caller, a re-render, a search repeated with the same lineups).
   */
  async function loadFor(sightlineId: string, lineups: readonly OutlookLineup[], now: Date = new Date()): Promise<void> {
    const usable = lineups.filter((l) => Date.parse(l.end) > Date.parse(l.start));
    let reach: WindowReach[];
    try {
      reach = windowReach(usable.map((l) => ({ start: new Date(l.start), end: new Date(l.end) })), now);
    } catch {
      // Never expected with a search's lineups; the planner goes on without an outlook.
      status.value = 'failed';
      error.value = 'The sky outlook could not be worked out for these lineups';
      return;
    }
    const within = usable.filter((_l, i) => reach[i] === 'within').sort((a, b) => a.start.localeCompare(b.start));
    const asked = within.slice(0, MAX_OUTLOOK_WINDOWS);
    const key = `${sightlineId}|${asked.map((l) => `${l.start}/${l.end}`).join(',')}|${usable.length}`;
    if (key === askedKey) return;
    askedKey = key;
    controller?.abort();
    controller = null;

    const local: Record<string, SkyOutlook> = {};
    usable.forEach((l, i) => {
      if (reach[i] === 'beyond') local[l.start] = { status: 'no-forecast-yet', start: l.start, end: l.end, issuedAt: null, horizonEnd: null };
      if (reach[i] === 'over') local[l.start] = { status: 'past', start: l.start, end: l.end };
    });
    for (const l of within.slice(MAX_OUTLOOK_WINDOWS)) {
      local[l.start] = { status: 'unavailable', start: l.start, end: l.end, message: `At most ${MAX_OUTLOOK_WINDOWS} lineups at once: search a shorter range for these` };
    }
    byStart.value = local;
    error.value = '';
    if (asked.length === 0) {
      status.value = 'ready';
      return;
    }

    status.value = 'loading';
    const mine = new AbortController();
    controller = mine;
    try {
      const answer = await outlookApi.fetchOutlooks({ sightlineId, windows: asked.map((l) => ({ start: l.start, end: l.end })) }, mine.signal);
      if (controller !== mine) return;
      const next = { ...byStart.value };
      // One outlook per window, in the order asked.
      asked.forEach((l, i) => {
        const o = answer.outlooks[i];
        next[l.start] = o ?? { status: 'unavailable', start: l.start, end: l.end, message: 'The server sent no outlook for this lineup' };
      });
      byStart.value = next;
      caution.value = answer.caution || OUTLOOK_CAUTION;
      status.value = 'ready';
    } catch (e) {
      if (controller !== mine || isAbort(e)) return;
      const message = e instanceof ApiError ? e.message : 'The sky outlook could not be loaded';
      const next = { ...byStart.value };
      for (const l of asked) next[l.start] = { status: 'unavailable', start: l.start, end: l.end, message };
      byStart.value = next;
      error.value = message;
      status.value = 'failed';
      // A later call with the same lineups may try again.
      askedKey = '';
    } finally {
      if (controller === mine) controller = null;
    }
  }

  /** The outlook of a lineup by its start; null while it is being asked for (or never was). */
  function outlookOf(start: string): SkyOutlook | null {
    return byStart.value[start] ?? null;
  }

  /** Forgets everything (another sightline is opened). */
  function reset(): void {
    controller?.abort();
    controller = null;
    askedKey = '';
    byStart.value = {};
    status.value = 'idle';
    error.value = '';
    caution.value = OUTLOOK_CAUTION;
  }

  return { byStart, status, error, caution, loadFor, outlookOf, reset };
});
