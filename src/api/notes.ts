import {
  fieldNoteListResponseSchema,
  fieldNoteResponseSchema,
  type FieldNote,
  type FieldNoteInput,
} from '../../shared/schemas/sightline';
import { request } from './client';

const notesPath = (sightlineId: string) => `/sightlines/${encodeURIComponent(sightlineId)}/notes`;
const notePath = (sightlineId: string, noteId: string) => `${notesPath(sightlineId)}/${encodeURIComponent(noteId)}`;

/** GET /api/sightlines/:id/notes. */
export async function listNotes(sightlineId: string): Promise<FieldNote[]> {
  return (await request('GET', notesPath(sightlineId), { schema: fieldNoteListResponseSchema })).notes;
}

/** POST /api/sightlines/:id/notes. */
export async function createNote(sightlineId: string, input: FieldNoteInput): Promise<FieldNote> {
  return (await request('POST', notesPath(sightlineId), { body: input, schema: fieldNoteResponseSchema })).note;
}

/** PUT /api/sightlines/:id/notes/:noteId. */
export async function updateNote(sightlineId: string, noteId: string, input: FieldNoteInput): Promise<FieldNote> {
  return (await request('PUT', notePath(sightlineId, noteId), { body: input, schema: fieldNoteResponseSchema })).note;
}

/** DELETE /api/sightlines/:id/notes/:noteId. */
export async function deleteNote(sightlineId: string, noteId: string): Promise<void> {
  await request('DELETE', notePath(sightlineId, noteId));
}
