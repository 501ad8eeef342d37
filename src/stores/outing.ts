import { defineStore } from 'pinia';
import { ref } from 'vue';
import type { Outing, OutingAnswer } from '../../shared/schemas/outing';
import * as outingsApi from '@/api/outings';
import type { OutingChange } from '@/api/outings';

/** The outing an outing page shows, and the signed-in person's answer to it. */
export const useOutingStore = defineStore('outing', () => {
  const outing = ref<Outing | null>(null);
  const loading = ref(false);
  const loadError = ref('');

  async function open(id: string): Promise<void> {
    loading.value = true;
    loadError.value = '';
    if (outing.value?.id !== id) outing.value = null;
    try {
      outing.value = await outingsApi.getOuting(id);
    } catch (error) {
      loadError.value = (error as Error).message;
    } finally {
      loading.value = false;
    }
  }

  async function answer(value: OutingAnswer, note = ''): Promise<void> {
    if (!outing.value) return;
    outing.value = await outingsApi.answerOuting(outing.value.id, value, note);
  }

  async function update(change: OutingChange): Promise<void> {
    if (!outing.value) return;
    outing.value = await outingsApi.updateOuting(outing.value.id, change);
  }

  async function cancel(): Promise<void> {
    if (!outing.value) return;
    await outingsApi.deleteOuting(outing.value.id);
    outing.value = null;
  }

  return { outing, loading, loadError, open, answer, update, cancel };
});
