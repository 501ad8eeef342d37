import { sightlineResponseSchema, tideTimesResponseSchema, type Sightline, type TideTimesResponse } from '../../shared/schemas/sightline';
import type { TideRule } from '../../shared/tide';
import { request } from './client';

const path = (id: string) => `/sightlines/${encodeURIComponent(id)}`;

/** PUT /api/sightlines/:id/tide-rule: sets (or with null removes) the tide rule; the sightline back. */
export async function putTideRule(sightlineId: string, rule: TideRule | null): Promise<Sightline> {
  return (await request('PUT', `${path(sightlineId)}/tide-rule`, { body: { rule }, schema: sightlineResponseSchema })).sightline;
}

/** GET /api/sightlines/:id/tide-times: the stored tide events by time. */
export async function getTideTimes(sightlineId: string): Promise<TideTimesResponse> {
  return request('GET', `${path(sightlineId)}/tide-times`, { schema: tideTimesResponseSchema });
}

/**
 * POST /api/sightlines/:id/tide-times with pasted text (local times of the site): all stored events
 * and the warnings back; any bad line refuses the whole paste (400 with fields `lines.N`).
 */
export async function pasteTideTimes(sightlineId: string, text: string): Promise<TideTimesResponse> {
  return request('POST', `${path(sightlineId)}/tide-times`, { body: { text }, schema: tideTimesResponseSchema });
}

/** DELETE /api/sightlines/:id/tide-times: removes every stored tide event. */
export async function clearTideTimes(sightlineId: string): Promise<void> {
  await request('DELETE', `${path(sightlineId)}/tide-times`);
}
