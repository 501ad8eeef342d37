import { computed, reactive, ref } from 'vue';
import { useRouter } from 'vue-router';
import { useMessage } from 'naive-ui';
import { usePlannerStore } from '@/stores/planner';
import { useSightlinesStore } from '@/stores/sightlines';
import { useFieldErrors } from './useFieldErrors';

/**
 * Saving the plan: "Save sightline" asks for a name and creates it; once the plan is a saved
 * sightline, "Save changes" updates it. API errors are shown and nothing typed is lost.
 */
export function useSaveSightline() {
  const planner = usePlannerStore();
  const sightlines = useSightlinesStore();
  const message = useMessage();
  const router = useRouter();
  const errors = useFieldErrors<string>();
  const dialog = reactive({ show: false, initialName: '' });
  const busy = ref(false);

  const canSave = computed(() => planner.vantage !== null && planner.landmark !== null);
  const whyNot = computed(() => {
    if (!planner.vantagePoint || !planner.landmarkPoint) return 'Place both pins to save the sightline.';
    if (!canSave.value) return 'Fix the heights to save the sightline.';
    return '';
  });

  /** Field messages other than the name's (e.g. a height the server refused), as one line. */
  const generalError = computed(() => {
    const others = Object.entries(errors.fields).filter(([key]) => key !== 'name').map(([key, text]) => `${key}: ${text}`);
    return [errors.state.general, ...others].filter(Boolean).join(' · ');
  });
  const nameError = computed(() => errors.fields.name ?? '');

  function openDialog(): void {
    errors.clear();
    dialog.initialName = planner.opened ? `${planner.opened.name} (copy)` : '';
    dialog.show = true;
  }

  async function saveNew(name: string): Promise<void> {
    if (busy.value) return;
    const input = planner.sightlineInput(name);
    if (!input) {
      errors.clear();
      errors.state.general = whyNot.value;
      return;
    }
    busy.value = true;
    errors.clear();
    try {
      const saved = await sightlines.create(input);
      planner.markSaved(saved);
      dialog.show = false;
      message.success(`Saved “${saved.name}”`);
      await router.replace({ query: { sightline: saved.id } });
    } catch (error) {
      if (!errors.take(error)) throw error;
    } finally {
      busy.value = false;
    }
  }

  async function saveChanges(): Promise<void> {
    const opened = planner.opened;
    if (!opened || busy.value) return;
    const input = planner.sightlineInput(opened.name);
    if (!input) {
      message.warning(whyNot.value);
      return;
    }
    busy.value = true;
    try {
      const { name: _name, ...change } = input;
      const saved = await sightlines.update(opened.id, change);
      planner.markSaved(saved);
      message.success(`Saved the changes to “${saved.name}”`);
    } catch (error) {
      message.error((error as Error).message);
    } finally {
      busy.value = false;
    }
  }

  return { dialog, busy, canSave, whyNot, nameError, generalError, openDialog, saveNew, saveChanges };
}
