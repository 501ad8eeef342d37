import { h, reactive, ref } from 'vue';
import { NButton, NSpace, NTag, useDialog, useMessage, type DataTableColumns } from 'naive-ui';
import type { CameraBodyRecord, LensRecord } from '../../shared/schemas/shot-plan';
import { useGearStore } from '@/stores/gear';
import { useBodyForm, useLensForm } from './useGearForms';

/** '5.90 µm' */
export function pitchText(um: number): string {
  return `${um.toFixed(2)} µm`;
}

/** '14 mm' for a prime, '24–70 mm' for a zoom. */
export function focalText(lens: Pick<LensRecord, 'range'>): string {
  return lens.range.isZoom ? `${lens.range.minMm}–${lens.range.maxMm} mm` : `${lens.range.minMm} mm`;
}

function actions(onEdit: () => void, onDelete: () => void, what: string) {
  return h(NSpace, { size: 6, wrap: false }, () => [
    h(NButton, { size: 'small', 'data-testid': `gear-${what}-edit`, onClick: onEdit }, () => 'Edit'),
    h(NButton, { size: 'small', type: 'error', secondary: true, 'data-testid': `gear-${what}-delete`, onClick: onDelete }, () => 'Delete'),
  ]);
}

/**
 * The Gear page: the tables of bodies and lenses with their derived figures, the add / edit dialogs
 * (one form each, checked with the shared schemas), delete after a confirmation, and the
 * star-tracker switch.
 */
export function useGearPage() {
  const store = useGearStore();
  const message = useMessage();
  const dialog = useDialog();
  const body = useBodyForm();
  const lens = useLensForm();
  const editor = reactive({ body: false, lens: false, bodyId: null as string | null, lensId: null as string | null });
  const saving = ref(false);

  function addBody(): void { body.fill(null); editor.bodyId = null; editor.body = true; }
  function editBody(record: CameraBodyRecord): void { body.fill(record); editor.bodyId = record.id; editor.body = true; }
  function addLens(): void { lens.fill(null); editor.lensId = null; editor.lens = true; }
  function editLens(record: LensRecord): void { lens.fill(record); editor.lensId = record.id; editor.lens = true; }

  async function saveBody(): Promise<void> {
    const input = body.validated();
    if (!input || saving.value) return;
    saving.value = true;
    try {
      const saved = editor.bodyId ? await store.updateBody(editor.bodyId, body.patchOf(input)) : await store.createBody(input);
      editor.body = false;
      message.success(`Saved ${saved.name}`);
    } catch (error) {
      if (!body.errors.take(error)) throw error;
    } finally {
      saving.value = false;
    }
  }

  async function saveLens(): Promise<void> {
    const input = lens.validated();
    if (!input || saving.value) return;
    saving.value = true;
    try {
      const saved = editor.lensId ? await store.updateLens(editor.lensId, lens.patchOf(input)) : await store.createLens(input);
      editor.lens = false;
      message.success(`Saved ${saved.name}`);
    } catch (error) {
      if (!lens.errors.take(error)) throw error;
    } finally {
      saving.value = false;
    }
  }

  function confirmDelete(kind: 'body' | 'lens', record: { id: string; name: string }): void {
    dialog.warning({
      title: `Delete ${record.name}?`,
      content: `It leaves your gear; shot plans made with it keep what they showed. This cannot be undone.`,
      positiveText: 'Delete',
      negativeText: 'Keep it',
      positiveButtonProps: { 'data-testid': 'gear-delete-confirm' } as never,
      onPositiveClick: async () => {
        try {
          await (kind === 'body' ? store.removeBody(record.id) : store.removeLens(record.id));
          message.success(`Deleted ${record.name}`);
          return true;
        } catch (error) {
          message.error((error as Error).message);
          return false;
        }
      },
    });
  }

  async function setStarTracker(available: boolean): Promise<void> {
    try {
      await store.setStarTracker(available);
      message.success(available ? 'Star tracker: available' : 'Star tracker: none');
    } catch (error) {
      message.error((error as Error).message);
    }
  }

  const bodyColumns: DataTableColumns<CameraBodyRecord> = [
    { title: 'Name', key: 'name', minWidth: 160, sorter: (a, b) => a.name.localeCompare(b.name), render: (r) => h('strong', { 'data-testid': 'gear-body-name' }, r.name) },
    { title: 'Sensor', key: 'sensor', minWidth: 120, render: (r) => `${r.sensorWidthMm} × ${r.sensorHeightMm} mm` },
    {
      title: 'Crop factor', key: 'crop', width: 110,
      sorter: (a, b) => a.derived.cropFactor - b.derived.cropFactor,
      render: (r) => h('span', { class: 'num', 'data-testid': 'gear-body-crop' }, r.derived.cropFactor.toFixed(2)),
    },
    {
      title: 'Pixel pitch', key: 'pitch', width: 150,
      render: (r) => h('span', { class: 'num', 'data-testid': 'gear-body-pitch' }, [
        pitchText(r.derived.pixelPitchUm),
        r.derived.pixelPitchSource === 'pixel-pitch' ? '' : h(NTag, { size: 'tiny', bordered: false, class: 'derived', title: 'Worked out from the pixel count' }, () => 'derived'),
      ]),
    },
    { title: 'Pixels', key: 'pixels', minWidth: 150, render: (r) => `${r.derived.widthPx} × ${r.derived.heightPx} (${r.derived.megapixels.toFixed(1)} MP)` },
    { title: '', key: 'actions', width: 150, render: (r) => actions(() => editBody(r), () => confirmDelete('body', r), 'body') },
  ];

  const lensColumns: DataTableColumns<LensRecord> = [
    { title: 'Name', key: 'name', minWidth: 160, sorter: (a, b) => a.name.localeCompare(b.name), render: (r) => h('strong', { 'data-testid': 'gear-lens-name' }, r.name) },
    { title: 'Focal length', key: 'focal', minWidth: 120, sorter: (a, b) => a.range.minMm - b.range.minMm, render: (r) => h('span', { class: 'num', 'data-testid': 'gear-lens-focal' }, focalText(r)) },
    { title: 'Kind', key: 'kind', width: 90, render: (r) => (r.range.isZoom ? 'zoom' : 'prime') },
    { title: 'Widest aperture', key: 'aperture', width: 140, render: (r) => h('span', { class: 'num' }, `f/${r.widestApertureF}`) },
    { title: '', key: 'actions', width: 150, render: (r) => actions(() => editLens(r), () => confirmDelete('lens', r), 'lens') },
  ];

  return {
    store, body, lens, editor, saving, bodyColumns, lensColumns,
    addBody, editBody, addLens, editLens, saveBody, saveLens, setStarTracker,
    rowProps: (kind: 'body' | 'lens') => (row: { id: string }): Record<string, string> => ({ 'data-testid': `gear-${kind}-row`, 'data-gear-id': row.id }),
  };
}
export type GearPage = ReturnType<typeof useGearPage>;
