import { computed, h } from 'vue';
import { RouterLink } from 'vue-router';
import { NButton, NSpace, NSwitch, NTag, type DataTableColumns } from 'naive-ui';
import type { Watch } from '../../shared/schemas/watch';
import { formatLocalTime } from '../../shared/sky';
import WatchDeliveries from '@/components/watch/WatchDeliveries.vue';
import { useWatchesStore } from '@/stores/watches';
import type { WatchActions } from './useWatchActions';
import { conditionParts, leadTimesText } from './useWatchLabels';

/**
 * Columns of a table of watches: an expand arrow for the watch's e-mails, the sightline (linked to
 * its page; left out on the sightline's own tab), target, conditions, lead times, the pause
 * switch, when it last sent, and edit / delete.
 */
export function watchColumns(actions: WatchActions, options: { withSightline: boolean }): DataTableColumns<Watch> {
  const columns: DataTableColumns<Watch> = [
    {
      type: 'expand',
      renderExpand: (row) => h(WatchDeliveries, { watchId: row.id, sightlineId: row.sightlineId, timeZone: row.timezone }),
    },
  ];
  if (options.withSightline) {
    columns.push({
      title: 'Sightline', key: 'sightlineName', minWidth: 150,
      sorter: (a, b) => a.sightlineName.localeCompare(b.sightlineName),
      render: (row) => h(RouterLink, {
        to: { name: 'sightline', params: { id: row.sightlineId }, query: { tab: 'watch' } },
        class: 'watch-sightline',
        'data-testid': 'watch-sightline-link',
      }, () => row.sightlineName),
    });
  }
  columns.push(
    {
      title: 'Target', key: 'targetName', minWidth: 130,
      sorter: (a, b) => a.targetName.localeCompare(b.targetName),
      render: (row) => h('span', { 'data-testid': 'watch-target-name' }, row.targetName),
    },
    {
      title: 'Conditions', key: 'conditions', minWidth: 200,
      render: (row) => h('span', { class: 'watch-conditions', 'data-testid': 'watch-conditions' }, conditionParts(row).join(' · ')),
    },
    {
      title: 'E-mail', key: 'leadDays', minWidth: 150,
      render: (row) => h('span', { 'data-testid': 'watch-lead-times' }, leadTimesText(row.leadDays)),
    },
    {
      title: 'Paused', key: 'paused', width: 90,
      render: (row) => h(NSwitch, {
        size: 'small',
        value: row.paused,
        loading: actions.pausing.has(row.id),
        'aria-label': row.paused ? 'Resume this watch' : 'Pause this watch',
        title: row.paused ? 'Paused: no e-mails. Switch off to resume.' : 'Switch on to stop the e-mails for a while',
        'data-testid': 'watch-paused',
        'onUpdate:value': (paused: boolean) => actions.setPaused(row, paused),
      }),
    },
    {
      title: 'Last sent', key: 'lastSentAt', minWidth: 150,
      sorter: (a, b) => (a.lastSentAt ?? '').localeCompare(b.lastSentAt ?? ''),
      render: (row) => (row.lastSentAt
        ? h('span', { class: 'watch-when', 'data-testid': 'watch-last-sent' }, formatLocalTime(new Date(row.lastSentAt), row.timezone))
        : h(NTag, { size: 'small', bordered: false, 'data-testid': 'watch-last-sent' }, () => 'Not yet')),
    },
    {
      title: '', key: 'actions', width: 150,
      render: (row) => h(NSpace, { size: 6, wrap: false }, () => [
        h(NButton, { size: 'small', 'data-testid': 'watch-edit', onClick: () => actions.startEdit(row) }, () => 'Edit'),
        h(NButton, { size: 'small', type: 'error', secondary: true, 'data-testid': 'watch-delete', onClick: () => actions.confirmDelete(row) }, () => 'Delete'),
      ]),
    },
  );
  return columns;
}

/** Row attributes for a browser test to find a watch. */
export function watchRowProps(row: Watch): Record<string, string> {
  return { 'data-testid': 'watch-row', 'data-watch-id': row.id, 'data-paused': String(row.paused) };
}

/** The Watches page's table: every watch of the user. */
export function useWatchTable(actions: WatchActions) {
  const store = useWatchesStore();
  const columns = watchColumns(actions, { withSightline: true });
  const empty = computed(() => store.loaded && store.watches.length === 0);
  return { store, columns, empty, rowProps: watchRowProps };
}
