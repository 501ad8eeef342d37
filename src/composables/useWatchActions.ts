import { reactive, ref } from 'vue';
import { useDialog, useMessage } from 'naive-ui';
import type { Watch } from '../../shared/schemas/watch';
import { useWatchesStore } from '@/stores/watches';
import { useWatchForm } from './useWatchForm';

/**
 * What can be done to a listed watch, on the Watches page and on a sightline's Watch tab:
 * pause or resume, delete after a confirmation, and edit in a dialog with the same form as a new
 * watch.
 */
export function useWatchActions() {
  const store = useWatchesStore();
  const dialog = useDialog();
  const message = useMessage();

  /** Ids of watches whose pause switch is on its way to the server. */
  const pausing = reactive(new Set<string>());

  async function setPaused(watch: Watch, paused: boolean): Promise<void> {
    if (pausing.has(watch.id)) return;
    pausing.add(watch.id);
    try {
      await store.setPaused(watch.id, paused);
      message.success(paused ? `Paused: no e-mails for ${watch.targetName} at ${watch.sightlineName}` : `Watching ${watch.targetName} at ${watch.sightlineName} again`);
    } catch (error) {
      message.error((error as Error).message);
    } finally {
      pausing.delete(watch.id);
    }
  }

  function confirmDelete(watch: Watch): void {
    dialog.warning({
      title: 'Delete this watch?',
      content: `You will get no more e-mails about ${watch.targetName} at ${watch.sightlineName}, and its lineups leave your calendar feed. This cannot be undone.`,
      positiveText: 'Delete',
      negativeText: 'Keep it',
      // Attributes fall through to the button element, for browser tests.
      positiveButtonProps: { 'data-testid': 'watch-delete-confirm' } as never,
      onPositiveClick: async () => {
        try {
          await store.remove(watch.id);
          message.success('Watch deleted');
          return true;
        } catch (error) {
          message.error((error as Error).message);
          return false;
        }
      },
    });
  }

  const editor = reactive({ show: false, watch: null as Watch | null });
  const editForm = useWatchForm();
  const saving = ref(false);

  function startEdit(watch: Watch): void {
    editForm.fillFrom(watch);
    editor.watch = watch;
    editor.show = true;
  }

  async function saveEdit(): Promise<void> {
    const watch = editor.watch;
    const change = editForm.buildUpdate();
    if (!watch || !change || saving.value) return;
    saving.value = true;
    try {
      await store.update(watch.id, change);
      editor.show = false;
      message.success('Watch saved');
    } catch (error) {
      if (!editForm.takeServer(error)) throw error;
    } finally {
      saving.value = false;
    }
  }

  return { store, pausing, setPaused, confirmDelete, editor, editForm, saving, startEdit, saveEdit };
}
export type WatchActions = ReturnType<typeof useWatchActions>;
