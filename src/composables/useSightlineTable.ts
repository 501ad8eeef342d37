import { computed, h, reactive, ref } from 'vue';
import { useRouter } from 'vue-router';
import { NButton, NSpace, NTag, useDialog, useMessage, type DataTableColumns } from 'naive-ui';
import { roleAllows } from '../../shared/policy/sightline-policy';
import { formatDecimalDegrees } from '../../shared/geo';
import type { Sightline } from '../../shared/schemas/sightline';
import { findTarget, formatLocalTime } from '../../shared/sky';
import { useSightlinesStore } from '@/stores/sightlines';
import { usePlannerStore } from '@/stores/planner';
import { useFieldErrors } from './useFieldErrors';

/** Shown in the "Next lineup" column while the server computes it. */
export const NEXT_LINEUP_PLACEHOLDER = 'Computing…';

/** Columns, search and actions (open, rename, delete) of the sightlines table. */
export function useSightlineTable() {
  const store = useSightlinesStore();
  const planner = usePlannerStore();
  const router = useRouter();
  const dialog = useDialog();
  const message = useMessage();
  const search = ref('');
  const loadError = ref('');

  /** Start of the next lineup for sorting; sightlines without one sort last. */
  function nextStartMs(s: Sightline): number {
    const next = store.nextLineup[s.id];
    return next && 'lineup' in next && next.lineup ? Date.parse(next.lineup.start) : Number.MAX_SAFE_INTEGER;
  }

  const rows = computed(() => {
    const q = search.value.trim().toLowerCase();
    return q ? store.sightlines.filter((s) => s.name.toLowerCase().includes(q)) : store.sightlines;
  });

  async function refresh(): Promise<void> {
    loadError.value = '';
    try {
      await store.refresh();
      void store.loadNextLineups();
    } catch (error) {
      loadError.value = (error as Error).message;
    }
  }

  function open(s: Sightline): void {
    void router.push({ name: 'home', query: { sightline: s.id } });
  }

  const rename = reactive({ show: false, id: '', initialName: '', busy: false });
  const renameErrors = useFieldErrors<'name'>();
  const renameGeneralError = computed(() => {
    const others = Object.entries(renameErrors.fields).filter(([k]) => k !== 'name').map(([, v]) => v);
    return [renameErrors.state.general, ...others].filter(Boolean).join(' · ');
  });

  function startRename(s: Sightline): void {
    renameErrors.clear();
    Object.assign(rename, { show: true, id: s.id, initialName: s.name, busy: false });
  }

  async function submitRename(name: string): Promise<void> {
    if (rename.busy) return;
    rename.busy = true;
    renameErrors.clear();
    try {
      const updated = await store.update(rename.id, { name });
      if (planner.opened?.id === updated.id) planner.markSaved(updated);
      rename.show = false;
      message.success(`Renamed to “${updated.name}”`);
    } catch (error) {
      if (!renameErrors.take(error)) throw error;
    } finally {
      rename.busy = false;
    }
  }

  function confirmDelete(s: Sightline): void {
    dialog.warning({
      title: 'Delete this sightline?',
      content: `“${s.name}” and its field notes will be deleted. This cannot be undone.`,
      positiveText: 'Delete',
      negativeText: 'Keep it',
      onPositiveClick: async () => {
        try {
          await store.remove(s.id);
          if (planner.opened?.id === s.id) planner.opened = null;
          message.success(`Deleted “${s.name}”`);
          return true;
        } catch (error) {
          message.error((error as Error).message);
          return false;
        }
      },
    });
  }

  const columns: DataTableColumns<Sightline> = [
    {
      title: 'Name', key: 'name', defaultSortOrder: 'ascend',
      sorter: (a, b) => a.name.localeCompare(b.name),
      render: (row) => h('a', { href: `/?sightline=${row.id}`, class: 'sightline-name', onClick: (e: MouseEvent) => { e.preventDefault(); open(row); } }, row.name),
    },
    {
      title: 'Vantage', key: 'vantage', minWidth: 170,
      render: (row) => h('span', { class: 'mono' }, formatDecimalDegrees(row.vantage, 4)),
    },
    { title: 'Target', key: 'targetId', render: (row) => findTarget(row.targetId)?.name ?? row.targetId },
    {
      title: 'Next lineup', key: 'nextLineup',
      sorter: (a, b) => nextStartMs(a) - nextStartMs(b),
      render: (row) => {
        const next = store.nextLineup[row.id];
        if (!next) return h('span', { class: 'placeholder' }, NEXT_LINEUP_PLACEHOLDER);
        if ('error' in next) return h('span', { class: 'placeholder', title: next.error }, 'Unavailable');
        if (!next.lineup) return h('span', { class: 'placeholder' }, 'None in the next 12 months');
        return h('span', { 'data-testid': 'next-lineup', title: 'Peak time, and how good the lineup is' },
          `${formatLocalTime(new Date(next.lineup.peak), row.timezone)} · ${Math.round(next.lineup.score * 100)} %`);
      },
    },
    {
      title: 'Created', key: 'createdAt', width: 190,
      sorter: (a, b) => a.createdAt.localeCompare(b.createdAt),
      render: (row) => formatLocalTime(new Date(row.createdAt), row.timezone),
    },
    {
      title: '', key: 'actions', width: 320,
      render: (row) => h(NSpace, { size: 6, wrap: false }, () => [
        h(NButton, { size: 'small', type: 'primary', secondary: true, 'data-testid': 'sightline-open', onClick: () => open(row) }, () => 'Open'),
        h(NButton, { size: 'small', secondary: true, 'data-testid': 'sightline-lineups', onClick: () => { void router.push({ name: 'sightline', params: { id: row.id } }); } }, () => 'Lineups'),
        // Only what the person's role allows (the shared policy table): crew members see shared rows.
        roleAllows(row.myRole, 'edit') ? h(NButton, { size: 'small', 'data-testid': 'sightline-rename', onClick: () => startRename(row) }, () => 'Rename') : null,
        roleAllows(row.myRole, 'delete') ? h(NButton, { size: 'small', type: 'error', secondary: true, 'data-testid': 'sightline-delete', onClick: () => confirmDelete(row) }, () => 'Delete') : null,
        row.myRole === 'editor' || row.myRole === 'viewer' ? h(NTag, { size: 'small', bordered: false, 'data-testid': 'sightline-shared-role' }, () => `shared · ${row.myRole}`) : null,
      ]),
    },
  ];

  return {
    store, search, rows, columns, loadError, refresh,
    rename, renameNameError: computed(() => renameErrors.fields.name ?? ''), renameGeneralError, submitRename,
  };
}
