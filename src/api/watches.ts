import {
  unsubscribeStateSchema,
  watchDeliveryListResponseSchema,
  watchListResponseSchema,
  watchResponseSchema,
  type UnsubscribeState,
  type Watch,
  type WatchDelivery,
  type WatchInputBody,
  type WatchUpdateBody,
} from '../../shared/schemas/watch';
import { request } from './client';

const watchPath = (id: string) => `/watches/${encodeURIComponent(id)}`;

/** GET /api/watches, or only one sightline's with `sightlineId`. Newest first. */
export async function listWatches(options: { sightlineId?: string } = {}): Promise<Watch[]> {
  const query = new URLSearchParams();
  if (options.sightlineId) query.set('sightlineId', options.sightlineId);
  const suffix = query.size ? `?${query}` : '';
  return (await request('GET', `/watches${suffix}`, { schema: watchListResponseSchema })).watches;
}

/** POST /api/watches. */
export async function createWatch(input: WatchInputBody): Promise<Watch> {
  return (await request('POST', '/watches', { body: input, schema: watchResponseSchema })).watch;
}

/** PATCH /api/watches/:id: any of the conditions, the target or `paused`. */
export async function updateWatch(id: string, change: WatchUpdateBody): Promise<Watch> {
  return (await request('PATCH', watchPath(id), { body: change, schema: watchResponseSchema })).watch;
}

/** DELETE /api/watches/:id. */
export async function deleteWatch(id: string): Promise<void> {
  await request('DELETE', watchPath(id));
}

/** GET /api/watches/:id/deliveries: the e-mails of a watch, newest first. */
export async function listDeliveries(id: string): Promise<WatchDelivery[]> {
  return (await request('GET', `${watchPath(id)}/deliveries`, { schema: watchDeliveryListResponseSchema })).deliveries;
}

/** GET /api/watches/unsubscribe?token=: what an e-mail's pause link would do (no sign-in). */
export async function getUnsubscribeState(token: string): Promise<UnsubscribeState> {
  return request('GET', `/watches/unsubscribe?${new URLSearchParams({ token })}`, { schema: unsubscribeStateSchema });
}

/** POST /api/watches/unsubscribe: pauses the watch of a pause link; a used link answers 409 'conflict'. */
export async function pauseWithToken(token: string): Promise<UnsubscribeState> {
  return request('POST', '/watches/unsubscribe', { body: { token }, schema: unsubscribeStateSchema });
}
