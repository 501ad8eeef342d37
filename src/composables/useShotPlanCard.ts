import { ref } from 'vue';
import { useMessage } from 'naive-ui';
import { saveFile } from './saveFile';
import type { ShotCardFormat } from '../../shared/schemas/shot-plan';
import { useShotPlanStore } from '@/stores/shotPlan';

/**
 * The shot card buttons: the HTML card opens in a new tab (the tab is opened at the click, so a
 * popup blocker lets it through, and filled when the card arrives; blocked, it downloads instead),
 * the PDF downloads.
 */
export function useShotPlanCard() {
  const store = useShotPlanStore();
  const message = useMessage();
  const busy = ref<ShotCardFormat | null>(null);

  async function open(format: ShotCardFormat): Promise<void> {
    if (busy.value) return;
    busy.value = format;
    const tab = format === 'html' ? window.open('about:blank', '_blank') : null;
    try {
      const file = await store.card(format);
      if (tab && !tab.closed) {
        const url = URL.createObjectURL(file.blob);
        tab.location.href = url;
        setTimeout(() => URL.revokeObjectURL(url), 60_000);
      } else saveFile(file.blob, file.filename);
    } catch (error) {
      tab?.close();
      message.error((error as Error).message);
    } finally {
      busy.value = null;
    }
  }

  return { busy, open };
}
