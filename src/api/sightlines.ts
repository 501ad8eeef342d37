import type { z } from 'zod';
import {
  fieldNoteListResponseSchema,
  fieldNoteResponseSchema,
  sightlineListResponseSchema,
  sightlineResponseSchema,
  type FieldNote,
  type FieldNoteInput,
  type Sightline,
  type SightlineInputBody,
  type sightlineUpdateSchema,
} from '../../shared/schemas/sightline';
import { request } from './client';

/** A partial change of a sightline as sent (a rename is `{ name }`). */
export type SightlineChange = z.input<typeof sightlineUpdateSchema>;

const path = (id: string) => `/sightlines/${encodeURIComponent(id)}`;

export async function listSightlines(): Promise<Sightline[]> {
  return (await request('GET', '/sightlines', { schema: sightlineListResponseSchema })).sightlines;
}

export async function getSightline(id: string): Promise<Sightline> {
  return (await request('GET', path(id), { schema: sightlineResponseSchema })).sightline;
}

export async function createSightline(body: SightlineInputBody): Promise<Sightline> {
  return (await request('POST', '/sightlines', { body, schema: sightlineResponseSchema })).sightline;
}

export async function updateSightline(id: string, change: SightlineChange): Promise<Sightline> {
  return (await request('PATCH', path(id), { body: change, schema: sightlineResponseSchema })).sightline;
}

export async function deleteSightline(id: string): Promise<void> {
  await request('DELETE', path(id));
}

export async function listFieldNotes(sightlineId: string): Promise<FieldNote[]> {
  return (await request('GET', `${path(sightlineId)}/notes`, { schema: fieldNoteListResponseSchema })).notes;
}

export async function createFieldNote(sightlineId: string, body: FieldNoteInput): Promise<FieldNote> {
  return (await request('POST', `${path(sightlineId)}/notes`, { body, schema: fieldNoteResponseSchema })).note;
}

export async function updateFieldNote(sightlineId: string, noteId: string, body: FieldNoteInput): Promise<FieldNote> {
  return (await request('PUT', `${path(sightlineId)}/notes/${encodeURIComponent(noteId)}`, { body, schema: fieldNoteResponseSchema })).note;
}

export async function deleteFieldNote(sightlineId: string, noteId: string): Promise<void> {
  await request('DELETE', `${path(sightlineId)}/notes/${encodeURIComponent(noteId)}`);
}
