import { z } from 'zod';

/**
 * The outbox: every message the local SMTP fake received (the embedded start and the tests send
 * mail only there). Admins only.
 */

export const OUTBOX_MAX_PAGE_SIZE = 100;

/** GET /api/outbox?page=1&pageSize=20: newest first. */
export const outboxListQuerySchema = z.object({
  page: z.coerce.number({ error: 'Page is a whole number from 1' }).int('Page is a whole number from 1').min(1, 'Page is a whole number from 1').max(100_000).default(1),
  pageSize: z.coerce.number({ error: `Page size is 1 to ${OUTBOX_MAX_PAGE_SIZE}` }).int().min(1, `Page size is 1 to ${OUTBOX_MAX_PAGE_SIZE}`).max(OUTBOX_MAX_PAGE_SIZE, `Page size is 1 to ${OUTBOX_MAX_PAGE_SIZE}`).default(20),
});
export type OutboxListQuery = z.infer<typeof outboxListQuerySchema>;

/** One row of the outbox list. */
export const outboxSummarySchema = z.object({
  id: z.uuid(),
  /** Message-ID header, without the angle brackets; null when the message had none. */
  messageId: z.string().nullable(),
  /** SMTP envelope: MAIL FROM and the RCPT TO addresses. */
  envelopeFrom: z.string(),
  envelopeTo: z.array(z.string()),
  subject: z.string(),
  sizeBytes: z.number().int(),
  receivedAt: z.string(),
});
export type OutboxSummary = z.infer<typeof outboxSummarySchema>;

export const outboxListResponseSchema = z.object({
  messages: z.array(outboxSummarySchema),
  total: z.number().int(),
  page: z.number().int(),
  pageSize: z.number().int(),
});
export type OutboxListResponse = z.infer<typeof outboxListResponseSchema>;

export const outboxAttachmentSchema = z.object({
  filename: z.string().nullable(),
  contentType: z.string(),
  sizeBytes: z.number().int(),
});

/**
 * GET /api/outbox/:id: the message parsed. `html` is the sender's HTML as received: show it only in
 * a sandboxed frame (iframe sandbox with no permissions, srcdoc), never inline in the page.
 */
export const outboxMessageSchema = outboxSummarySchema.extend({
  /** Header From / To as text, e.g. '"Gnomon watches" <watches@gnomon.localhost>'. */
  from: z.string(),
  to: z.string(),
  /** Date header (ISO), null when missing. */
  date: z.string().nullable(),
  text: z.string().nullable(),
  html: z.string().nullable(),
  attachments: z.array(outboxAttachmentSchema),
});
export type OutboxMessage = z.infer<typeof outboxMessageSchema>;
export const outboxMessageResponseSchema = z.object({ message: outboxMessageSchema });
