import { computed, watch } from 'vue';
import type { SkyOutlook } from '../../shared/schemas/outlook';
import { useOutlookStore } from '@/stores/outlook';
import { useSightlinePageContext } from './useSightlineDetailPage';

/**
 * The sky outlook of the sightline page's search result, for the results table and the night
 * chart: asks the outlook store once whenever the sightline or the search result changes (the
 * store skips a request it has made already, so two sections showing it cost one request), and
 * looks a lineup's outlook up by its start. Nothing here can fail the search or the chart: a
 * lineup without an outlook just shows none.
 */
export function useLineupOutlook() {
  const page = useSightlinePageContext();
  const store = useOutlookStore();

  watch(
    () => [page.detail.sightline?.id ?? null, page.lineups.search.result] as const,
    ([sightlineId, result]) => {
      if (!sightlineId || !result) return;
      void store.loadFor(sightlineId, result.lineups);
    },
    { immediate: true },
  );

  /** The outlook of a lineup; null while it is being asked for. */
  function outlookOf(lineup: { start: string }): SkyOutlook | null {
    return store.outlookOf(lineup.start);
  }

  /** The outlooks by lineup start, for layouts that look many up at once. */
  const byStart = computed<ReadonlyMap<string, SkyOutlook>>(() => new Map(Object.entries(store.byStart)));

  return {
    outlookOf,
    byStart,
    status: computed(() => store.status),
    error: computed(() => store.error),
    caution: computed(() => store.caution),
  };
}
export type LineupOutlook = ReturnType<typeof useLineupOutlook>;
