import { simpleParser, type AddressObject } from 'mailparser';
import type { OutboxListQuery, OutboxListResponse, OutboxMessage } from '../../shared/schemas/outbox';
import { AppError } from '../errors';
import { OutboxMessageModel } from '../models/outbox-message';

function addressText(value: AddressObject | AddressObject[] | undefined): string {
  if (!value) return '';
  return (Array.isArray(value) ? value : [value]).map((a) => a.text).join(', ');
}

/** The messages the local SMTP fake received, for admins. */
export class OutboxService {
  async list(query: OutboxListQuery): Promise<OutboxListResponse> {
    const { rows, count } = await OutboxMessageModel.findAndCountAll({
      attributes: { exclude: ['raw'] },
      order: [['receivedAt', 'DESC'], ['id', 'ASC']],
      limit: query.pageSize,
      offset: (query.page - 1) * query.pageSize,
    });
    return { messages: rows.map((m) => m.toSummary()), total: count, page: query.page, pageSize: query.pageSize };
  }

  private async find(id: string): Promise<OutboxMessageModel> {
    const message = await OutboxMessageModel.findByPk(id);
    if (!message) throw AppError.notFound('No such message in the outbox');
    return message;
  }

  /** One message parsed with mailparser: headers, text, HTML and the attachments' names and types. */
  async get(id: string): Promise<OutboxMessage> {
    const message = await this.find(id);
    const parsed = await simpleParser(message.raw, { skipImageLinks: true });
    return {
      ...message.toSummary(),
      from: addressText(parsed.from),
      to: addressText(parsed.to),
      date: parsed.date ? parsed.date.toISOString() : null,
      text: parsed.text ?? null,
      html: typeof parsed.html === 'string' ? parsed.html : null,
      attachments: parsed.attachments.map((a) => ({ filename: a.filename ?? null, contentType: a.contentType, sizeBytes: a.size })),
    };
  }

  /** The raw source as received (RFC 5322). */
  async raw(id: string): Promise<Buffer> {
    return (await this.find(id)).raw;
  }
}
