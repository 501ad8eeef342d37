import { computed, h, onMounted, reactive } from 'vue';
import type { DataTableColumns, PaginationProps } from 'naive-ui';
import { OUTBOX_MAX_PAGE_SIZE, type OutboxSummary } from '../../shared/schemas/outbox';
import { formatLocalTime } from '../../shared/sky';
import { useOutboxStore } from '@/stores/outbox';
import { browserZone } from './useLineupTime';

/** The browser's own zone: mail belongs to no site. */

/** A size in bytes as '812 B', '14.2 kB', '1.3 MB' (SI units, 1 kB = 1000 B). */
export function sizeText(bytes: number): string {
  if (bytes < 1000) return `${bytes} B`;
  if (bytes < 1_000_000) return `${(bytes / 1000).toFixed(1)} kB`;
  return `${(bytes / 1_000_000).toFixed(1)} MB`;
}

/** An ISO instant in the browser's zone, '2027-05-20 01:18 BST'. */
export function receivedText(iso: string): string {
  const date = new Date(iso);
  return Number.isNaN(date.getTime()) ? iso : formatLocalTime(date, browserZone());
}

const PAGE_SIZES = [10, 20, 50, OUTBOX_MAX_PAGE_SIZE];

/**
 * The admin's Outbox page: a paged table of what the local mail catcher received (paged by the
 * server), and the message opened from a row.
 */
export function useOutboxPage() {
  const store = useOutboxStore();
  onMounted(() => { void store.load(1); });

  const columns: DataTableColumns<OutboxSummary> = [
    { title: 'Received', key: 'receivedAt', width: 210, render: (row) => h('span', { class: 'mono' }, receivedText(row.receivedAt)) },
    { title: 'To', key: 'envelopeTo', minWidth: 200, ellipsis: { tooltip: true }, render: (row) => row.envelopeTo.join(', ') },
    { title: 'Subject', key: 'subject', minWidth: 260, ellipsis: { tooltip: true }, render: (row) => row.subject || '(no subject)' },
    { title: 'Size', key: 'sizeBytes', width: 100, align: 'right', render: (row) => h('span', { class: 'mono' }, sizeText(row.sizeBytes)) },
  ];

  const pagination = reactive<PaginationProps>({
    page: 1,
    pageSize: store.pageSize,
    itemCount: 0,
    pageSizes: PAGE_SIZES,
    showSizePicker: true,
    onUpdatePage: (page: number) => { void store.load(page); },
    onUpdatePageSize: (size: number) => { void store.load(1, size); },
  });
  // The table shows what the store holds: the page the server answered.
  const paging = computed(() => ({ ...pagination, page: store.page, pageSize: store.pageSize, itemCount: store.total }));

  function rowProps(row: OutboxSummary) {
    return {
      class: 'outbox-row',
      style: 'cursor: pointer',
      tabindex: 0,
      'data-testid': 'outbox-row',
      'data-message-id': row.id,
      onClick: () => { void store.open(row.id); },
      onKeydown: (e: KeyboardEvent) => { if (e.key === 'Enter') void store.open(row.id); },
    };
  }

  const showMessage = computed({
    get: () => store.selectedId !== null,
    set: (show: boolean) => { if (!show) store.close(); },
  });

  return { store, columns, pagination: paging, rowProps, showMessage };
}
