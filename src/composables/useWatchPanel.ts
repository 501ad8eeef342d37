import { computed, ref, watch } from 'vue';
import { useMessage } from 'naive-ui';
import { useWatchesStore } from '@/stores/watches';
import { useSightlineDetailStore } from '@/stores/sightlineDetail';
import { useWatchActions } from './useWatchActions';
import { useWatchForm } from './useWatchForm';
import { watchColumns, watchRowProps } from './useWatchTable';

/**
 * The Watch tab of a sightline page: a new-watch form prefilled from the sightline (its target,
 * the default conditions) and this sightline's watches, with pause, edit, delete and their e-mails.
 */
export function useWatchPanel() {
  const store = useWatchesStore();
  const detail = useSightlineDetailStore();
  const message = useMessage();
  const actions = useWatchActions();
  const form = useWatchForm();
  const creating = ref(false);

  const sightline = computed(() => detail.sightline);
  /** Whether the sightline has a tide rule (a reachable-only watch needs one). */
  const tideRule = computed<'set' | 'none' | 'unknown'>(() => (!sightline.value ? 'unknown' : sightline.value.tideRule ? 'set' : 'none'));
  const items = computed(() => (sightline.value ? store.ofSightline(sightline.value.id) : []));
  const loading = computed(() => sightline.value !== null && store.sightlineLoading === sightline.value.id);
  const columns = watchColumns(actions, { withSightline: false });

  watch(() => sightline.value?.id, (id) => {
    if (!id) return;
    form.fillDefaults(sightline.value?.targetId);
    void store.loadForSightline(id);
  }, { immediate: true });

  async function create(): Promise<void> {
    const s = sightline.value;
    if (!s || creating.value) return;
    const input = form.buildInput(s.id);
    if (!input) return;
    creating.value = true;
    try {
      const created = await store.create(input);
      form.fillDefaults(s.targetId);
      message.success(`Watching ${created.targetName} at ${created.sightlineName}`);
    } catch (error) {
      if (!form.takeServer(error)) throw error;
    } finally {
      creating.value = false;
    }
  }

  return { store, sightline, tideRule, items, loading, columns, rowProps: watchRowProps, actions, form, creating, create };
}
