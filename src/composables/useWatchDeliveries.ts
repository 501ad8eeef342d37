import { computed, onMounted, type Ref } from 'vue';
import { formatLocalTime } from '../../shared/sky';
import { useWatchesStore } from '@/stores/watches';
import { nightLabel, nightOf } from './useLineupTime';
import { DELIVERY_STATUS, leadDayLabel } from './useWatchLabels';

/** How many of a watch's e-mails the small list shows. */
export const DELIVERIES_SHOWN = 10;

/** The recent e-mails of one watch: status, night (linked to its night chart) and lead time. */
export function useWatchDeliveries(watchId: Ref<string>, timeZone: Ref<string>) {
  const store = useWatchesStore();
  onMounted(() => { void store.loadDeliveries(watchId.value); });

  const list = computed(() => store.deliveries[watchId.value]);
  const items = computed(() => (list.value?.items ?? []).slice(0, DELIVERIES_SHOWN).map((d) => {
    const night = nightOf(d.lineupStart, timeZone.value);
    return {
      id: d.id,
      night,
      nightText: nightLabel(night),
      lead: leadDayLabel(d.leadDays),
      status: DELIVERY_STATUS[d.status],
      statusKey: d.status,
      sent: d.sentAt ? formatLocalTime(new Date(d.sentAt), timeZone.value) : null,
      problem: d.status === 'failed' || d.status === 'skipped' ? d.lastError : null,
      attempts: d.attempts,
    };
  }));
  const more = computed(() => Math.max(0, (list.value?.items.length ?? 0) - DELIVERIES_SHOWN));

  return {
    items,
    more,
    loading: computed(() => list.value?.loading ?? true),
    error: computed(() => list.value?.error ?? ''),
    reload: () => store.loadDeliveries(watchId.value),
  };
}
