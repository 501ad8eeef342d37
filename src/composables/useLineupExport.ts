import { ref } from 'vue';
import { useMessage } from 'naive-ui';
import { saveFile } from './saveFile';
import type { LineupExportFormat } from '@/api/lineups';
import { useLineupsStore } from '@/stores/lineups';

/** The export buttons: the last search's lineups as an iCalendar or CSV file from the server. */
export function useLineupExport() {
  const store = useLineupsStore();
  const message = useMessage();
  const busy = ref<LineupExportFormat | null>(null);

  async function exportAs(format: LineupExportFormat): Promise<void> {
    if (busy.value) return;
    busy.value = format;
    try {
      const file = await store.exportFile(format);
      saveFile(file.blob, file.filename);
    } catch (error) {
      message.error((error as Error).message);
    } finally {
      busy.value = null;
    }
  }

  return { busy, exportAs };
}
