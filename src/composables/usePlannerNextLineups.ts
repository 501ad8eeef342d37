import { ref, watch, type Ref } from 'vue';
import type { Lineup } from '../../shared/schemas/lineup';
import { useSightlinesStore } from '@/stores/sightlines';

/**
 * The next good lineups of the sightline open in the planner (from the server, which caches them),
 * refreshed when another sightline is opened or the target changes.
 */
export function usePlannerNextLineups(sightlineId: Ref<string | undefined>, targetId: Ref<string>) {
  const store = useSightlinesStore();
  const lineups = ref<Lineup[]>([]);
  const timezone = ref('UTC');
  const loading = ref(false);
  const error = ref('');

  watch([sightlineId, targetId], async ([id, target]) => {
    lineups.value = [];
    error.value = '';
    if (!id) return;
    loading.value = true;
    try {
      const result = await store.nextLineupsFor(id, target, 3);
      if (sightlineId.value !== id) return; // another sightline was opened meanwhile
      lineups.value = result.lineups;
      timezone.value = result.timezone;
    } catch (e) {
      error.value = (e as Error).message;
    } finally {
      loading.value = false;
    }
  }, { immediate: true });

  return { lineups, timezone, loading, error };
}
