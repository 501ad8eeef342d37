import type { z } from 'zod';
import {
  sightlineListResponseSchema,
  sightlineResponseSchema,
  type Sightline,
  type SightlineInputBody,
  type sightlineUpdateSchema,
} from '../../shared/schemas/sightline';
import { lineupSearchResponseSchema, type LineupSearchResponse } from '../../shared/schemas/lineup';
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

/** The next good lineups of a saved sightline over the coming year (its own target unless given). */
export async function fetchNextLineups(id: string, options: { target?: string; count?: number } = {}): Promise<LineupSearchResponse> {
  const query = new URLSearchParams();
  if (options.target) query.set('target', options.target);
  if (options.count) query.set('count', String(options.count));
  const suffix = query.size ? `?${query}` : '';
  return request('GET', `${path(id)}/next-lineups${suffix}`, { schema: lineupSearchResponseSchema });
}
