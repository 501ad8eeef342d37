import { computed, h, ref } from 'vue';
import { NTag, useDialog, useMessage, type DataTableColumns } from 'naive-ui';
import type { TideEvent } from '../../shared/tide';
import { formatLocalTime } from '../../shared/sky';
import { useSightlineDetailStore } from '@/stores/sightlineDetail';

/** The table of stored tide times (local time of the site) and "clear all" with confirmation. */
export function useTideTimesTable() {
  const detail = useSightlineDetailStore();
  const dialog = useDialog();
  const message = useMessage();
  const clearing = ref(false);

  const rows = computed(() => detail.tideEvents);
  const span = computed(() => {
    const ev = detail.tideEvents;
    if (ev.length === 0) return '';
    return `${formatLocalTime(new Date(ev[0]!.at), detail.timeZone)} to ${formatLocalTime(new Date(ev[ev.length - 1]!.at), detail.timeZone)}`;
  });

  const columns = computed<DataTableColumns<TideEvent>>(() => [
    {
      title: `Local time (${detail.timeZone})`, key: 'at',
      sorter: (a, b) => a.at.localeCompare(b.at), defaultSortOrder: 'ascend',
      render: (row) => h('span', { class: 'mono' }, formatLocalTime(new Date(row.at), detail.timeZone)),
    },
    {
      title: 'Water', key: 'kind', width: 110,
      render: (row) => h(NTag, { size: 'small', round: true, type: row.kind === 'high' ? 'info' : 'default' }, () => (row.kind === 'high' ? 'High' : 'Low')),
    },
    { title: 'Height', key: 'heightM', width: 100, render: (row) => h('span', { class: 'mono' }, row.heightM === undefined ? '–' : `${row.heightM.toFixed(1)} m`) },
  ]);

  function confirmClear(): void {
    dialog.warning({
      title: 'Clear all tide times?',
      content: `All ${detail.tideEvents.length} stored tide times of this sightline will be deleted. Lineups will show an unknown tide status until you paste new ones.`,
      positiveText: 'Clear all',
      negativeText: 'Keep them',
      onPositiveClick: async () => {
        clearing.value = true;
        try {
          await detail.clearTideTimes();
          message.success('Tide times cleared');
          return true;
        } catch (error) {
          message.error((error as Error).message);
          return false;
        } finally {
          clearing.value = false;
        }
      },
    });
  }

  return { rows, span, columns, clearing, confirmClear };
}
