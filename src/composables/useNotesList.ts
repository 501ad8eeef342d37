import { computed, reactive, ref } from 'vue';
import { useDialog, useMessage } from 'naive-ui';
import { fieldNoteInputSchema, fieldNoteKinds, type FieldNote, type FieldNoteInput } from '../../shared/schemas/sightline';
import { formatLocalTime } from '../../shared/sky';
import { useFieldNotesStore } from '@/stores/fieldNotes';
import { useSightlineDetailStore } from '@/stores/sightlineDetail';
import { useSessionStore } from '@/stores/session';
import { canChangeNoteAs, roleAllows } from '../../shared/policy/sightline-policy';
import { useFieldErrors } from './useFieldErrors';

/** Labels of the note kinds, in the order of the schema. */
export const NOTE_KIND_LABELS: Record<FieldNote['kind'], string> = { access: 'Access', tide: 'Tide', hazard: 'Hazard', general: 'General' };
export const NOTE_KIND_OPTIONS = fieldNoteKinds.map((k) => ({ label: NOTE_KIND_LABELS[k], value: k }));

type NoteField = 'kind' | 'body';

/** Checks a draft with the shared schema; fills the form's errors and returns the input or null. */
function checked(draft: FieldNoteInput, errors: ReturnType<typeof useFieldErrors<NoteField>>): FieldNoteInput | null {
  errors.clear();
  const parsed = fieldNoteInputSchema.safeParse(draft);
  if (parsed.success) return parsed.data;
  for (const issue of parsed.error.issues) {
    const key = String(issue.path[0] ?? '') as NoteField;
    if ((key === 'kind' || key === 'body') && !errors.fields[key]) errors.fields[key] = issue.message;
  }
  return null;
}

/** The field notes section: list, add, edit in place, delete with confirmation. */
export function useNotesList() {
  const store = useFieldNotesStore();
  const detail = useSightlineDetailStore();
  const dialog = useDialog();
  const message = useMessage();

  const draft = reactive<FieldNoteInput>({ kind: 'general', body: '' });
  const draftErrors = useFieldErrors<NoteField>();
  const adding = ref(false);

  const editingId = ref<string | null>(null);
  const edit = reactive<FieldNoteInput>({ kind: 'general', body: '' });
  const editErrors = useFieldErrors<NoteField>();
  const saving = ref(false);

  const session = useSessionStore();
  const role = computed(() => detail.sightline?.myRole ?? 'outsider');
  /** May this person add notes here (owner and crew; not admins looking in for support). */
  const canAdd = computed(() => roleAllows(role.value, 'add-note'));
  const timeZone = computed(() => detail.timeZone);
  const items = computed(() => store.notes.map((n) => ({
    ...n,
    kindLabel: NOTE_KIND_LABELS[n.kind],
    when: formatLocalTime(new Date(n.createdAt), timeZone.value),
    edited: n.updatedAt !== n.createdAt ? formatLocalTime(new Date(n.updatedAt), timeZone.value) : null,
    canChange: canChangeNoteAs(role.value, session.user?.id ?? '', n.authorId),
  })));

  async function add(): Promise<void> {
    const input = checked({ ...draft }, draftErrors);
    if (!input || adding.value) return;
    adding.value = true;
    try {
      await store.add(input);
      draft.body = '';
      message.success('Note added');
    } catch (error) {
      if (!draftErrors.take(error)) throw error;
    } finally {
      adding.value = false;
    }
  }

  function startEdit(note: FieldNote): void {
    editErrors.clear();
    editingId.value = note.id;
    edit.kind = note.kind;
    edit.body = note.body;
  }

  function cancelEdit(): void {
    editingId.value = null;
  }

  async function saveEdit(): Promise<void> {
    const id = editingId.value;
    const input = checked({ ...edit }, editErrors);
    if (!id || !input || saving.value) return;
    saving.value = true;
    try {
      await store.update(id, input);
      editingId.value = null;
      message.success('Note saved');
    } catch (error) {
      if (!editErrors.take(error)) throw error;
    } finally {
      saving.value = false;
    }
  }

  function confirmDelete(note: FieldNote): void {
    dialog.warning({
      title: 'Delete this note?',
      content: `The ${NOTE_KIND_LABELS[note.kind].toLowerCase()} note by ${note.authorName} will be deleted. This cannot be undone.`,
      positiveText: 'Delete',
      negativeText: 'Keep it',
      onPositiveClick: async () => {
        try {
          await store.remove(note.id);
          message.success('Note deleted');
          return true;
        } catch (error) {
          message.error((error as Error).message);
          return false;
        }
      },
    });
  }

  return { store, items, canAdd, draft, draftErrors, adding, add, editingId, edit, editErrors, saving, startEdit, cancelEdit, saveEdit, confirmDelete };
}
