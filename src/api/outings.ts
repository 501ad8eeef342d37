import {
  outingListResponseSchema,
  outingResponseSchema,
  type Outing,
  type OutingAnswer,
  type OutingInputBody,
} from '../../shared/schemas/outing';
import type { z } from 'zod';
import type { outingUpdateSchema } from '../../shared/schemas/outing';
import { request } from './client';

export type OutingChange = z.input<typeof outingUpdateSchema>;

const listPath = (sightlineId: string) => `/sightlines/${encodeURIComponent(sightlineId)}/outings`;
const outingPath = (id: string) => `/outings/${encodeURIComponent(id)}`;

export async function listOutings(sightlineId: string): Promise<Outing[]> {
  return (await request('GET', listPath(sightlineId), { schema: outingListResponseSchema })).outings;
}

export async function createOuting(sightlineId: string, body: OutingInputBody): Promise<Outing> {
  return (await request('POST', listPath(sightlineId), { body, schema: outingResponseSchema })).outing;
}

export async function getOuting(id: string): Promise<Outing> {
  return (await request('GET', outingPath(id), { schema: outingResponseSchema })).outing;
}

export async function updateOuting(id: string, change: OutingChange): Promise<Outing> {
  return (await request('PATCH', outingPath(id), { body: change, schema: outingResponseSchema })).outing;
}

export async function deleteOuting(id: string): Promise<void> {
  await request('DELETE', outingPath(id));
}

export async function answerOuting(id: string, answer: OutingAnswer, note = ''): Promise<Outing> {
  return (await request('PUT', `${outingPath(id)}/answer`, { body: { answer, note }, schema: outingResponseSchema })).outing;
}
