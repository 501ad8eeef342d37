import {
  outboxListResponseSchema,
  outboxMessageResponseSchema,
  type OutboxListResponse,
  type OutboxMessage,
} from '../../shared/schemas/outbox';
import { request } from './client';

/** GET /api/outbox?page=&pageSize= (admins): what the local mail catcher received, newest first. */
export async function listOutbox(query: { page: number; pageSize: number }): Promise<OutboxListResponse> {
  const params = new URLSearchParams({ page: String(query.page), pageSize: String(query.pageSize) });
  return request('GET', `/outbox?${params}`, { schema: outboxListResponseSchema });
}

/** GET /api/outbox/:id: one message, parsed. */
export async function getOutboxMessage(id: string): Promise<OutboxMessage> {
  return (await request('GET', `/outbox/${encodeURIComponent(id)}`, { schema: outboxMessageResponseSchema })).message;
}

/** Address of the message as received (an .eml download). */
export function outboxRawUrl(id: string): string {
  return `/api/outbox/${encodeURIComponent(id)}/raw`;
}
