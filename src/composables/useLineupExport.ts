import { ref } from 'vue';
import { useMessage } from 'naive-ui';
import type { LineupExportFormat } from '@/api/lineups';
import { useLineupsStore } from '@/stores/lineups';

/** Hands a file to the browser as a download. */
function saveFile(blob: Blob, filename: string): void {
  const url = URL.createObjectURL(blob);
  const a = document.createElement('a');
  a.href = url;
  a.download = filename;
  a.rel = 'noopener';
  document.body.appendChild(a);
  a.click();
  a.remove();
  // Give the browser a moment to start the download before the URL goes.
  setTimeout(() => URL.revokeObjectURL(url), 10_000);
}

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
