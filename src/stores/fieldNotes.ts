import { defineStore } from 'pinia';
import { ref } from 'vue';
import type { FieldNote, FieldNoteInput } from '../../shared/schemas/sightline';
import * as notesApi from '@/api/notes';

function newestFirst(a: FieldNote, b: FieldNote): number {
  return b.createdAt.localeCompare(a.createdAt);
}

/** The field notes of one sightline, newest first. */
export const useFieldNotesStore = defineStore('fieldNotes', () => {
  const sightlineId = ref<string | null>(null);
  const notes = ref<FieldNote[]>([]);
  const loading = ref(false);
  const loadError = ref('');

  async function load(id: string): Promise<void> {
    if (sightlineId.value !== id) notes.value = [];
    sightlineId.value = id;
    loading.value = true;
    loadError.value = '';
    try {
      const list = await notesApi.listNotes(id);
      if (sightlineId.value === id) notes.value = [...list].sort(newestFirst);
    } catch (error) {
      loadError.value = (error as Error).message;
    } finally {
      loading.value = false;
    }
  }

  function requireId(): string {
    if (!sightlineId.value) throw new Error('No sightline is open');
    return sightlineId.value;
  }

  async function add(input: FieldNoteInput): Promise<FieldNote> {
    const note = await notesApi.createNote(requireId(), input);
    notes.value = [note, ...notes.value].sort(newestFirst);
    return note;
  }

  async function update(noteId: string, input: FieldNoteInput): Promise<FieldNote> {
    const note = await notesApi.updateNote(requireId(), noteId, input);
    notes.value = notes.value.map((n) => (n.id === noteId ? note : n));
    return note;
  }

  async function remove(noteId: string): Promise<void> {
    await notesApi.deleteNote(requireId(), noteId);
    notes.value = notes.value.filter((n) => n.id !== noteId);
  }

  return { sightlineId, notes, loading, loadError, load, add, update, remove };
});
