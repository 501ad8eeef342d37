/**
 * The local SMTP fake and the admins' outbox: every message received over SMTP is stored and can be
 * listed and read back parsed.
 */
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import request from 'supertest';
import nodemailer from 'nodemailer';
import { outboxListResponseSchema, outboxMessageResponseSchema } from '../../shared/schemas/outbox';
import { SmtpFake } from '../../server/mail/smtp-fake';
import { OutboxMessageModel } from '../../server/models/outbox-message';
import { createTestContext, createUser, signedInAgent, type TestContext } from './helpers';

let ctx: TestContext;
let fake: SmtpFake;
beforeAll(async () => {
  ctx = await createTestContext();
  fake = new SmtpFake({ port: 0 });
  await fake.start();
});
afterAll(async () => {
  await fake.stop();
  await ctx.db.close();
});

async function send(subject: string, extra: object = {}) {
  const transport = nodemailer.createTransport({ url: fake.url });
  try {
    return await transport.sendMail({
      from: 'Gnomon test <sender@example.test>',
      to: 'Night Person <night@example.test>',
      cc: 'second@example.test',
      subject,
      text: 'Plain text body',
      html: '<p style="color:#e0442f">HTML body</p>',
      ...extra,
    });
  } finally {
    transport.close();
  }
}

describe('the SMTP fake', () => {
  it('listens on 127.0.0.1 and stores the envelope, subject and raw source of each message', async () => {
    expect(fake.url).toMatch(/^smtp:\/\/127\.0\.0\.1:\d+$/);
    const info = await send('Stored as sent');
    expect(info.accepted).toEqual(['night@example.test', 'second@example.test']);
    const row = await OutboxMessageModel.findOne({ where: { subject: 'Stored as sent' } });
    expect(row).not.toBeNull();
    expect(row!.envelopeFrom).toBe('sender@example.test');
    expect(row!.envelopeTo).toEqual(['night@example.test', 'second@example.test']);
    expect(row!.messageId).toBe(info.messageId.replace(/^<|>$/g, ''));
    expect(row!.sizeBytes).toBe(row!.raw.length);
    // The raw source is the RFC 5322 message: headers, a blank line, the body.
    expect(row!.raw.toString('utf8')).toMatch(/^[\s\S]*Subject: Stored as sent\r\n[\s\S]*\r\n\r\n/);
  });

  it('refuses while told to, with the reply code a mail client sees (RFC 5321 4yz: try again later)', async () => {
    fake.refuse('Busy', 451);
    try {
      await expect(send('Refused')).rejects.toMatchObject({ responseCode: 451 });
    } finally {
      fake.accept();
    }
    expect(await OutboxMessageModel.count({ where: { subject: 'Refused' } })).toBe(0);
  });
});

describe('GET /api/outbox', () => {
  it('lists newest first with paging, and shows one message parsed, for admins', async () => {
    for (const n of [1, 2, 3]) await send(`Paged ${n}`);
    await send('With a file', {
      attachments: [{ filename: 'lineup.ics', content: 'BEGIN:VCALENDAR\r\nEND:VCALENDAR\r\n', contentType: 'text/calendar' }],
    });
    const admin = await signedInAgent(ctx.app, await createUser('admin'));
    const page1 = outboxListResponseSchema.parse((await admin.get('/api/outbox?pageSize=2')).body);
    expect(page1.page).toBe(1);
    expect(page1.pageSize).toBe(2);
    expect(page1.total).toBeGreaterThanOrEqual(5);
    expect(page1.messages.map((m) => m.subject)).toEqual(['With a file', 'Paged 3']);
    const page2 = outboxListResponseSchema.parse((await admin.get('/api/outbox?page=2&pageSize=2')).body);
    expect(page2.messages.map((m) => m.subject)).toEqual(['Paged 2', 'Paged 1']);

    const id = page1.messages[0]!.id;
    const one = await admin.get(`/api/outbox/${id}`);
    expect(one.status).toBe(200);
    const { message } = outboxMessageResponseSchema.parse(one.body);
    expect(message).toMatchObject({
      subject: 'With a file',
      // mailparser writes display names as RFC 5322 quoted strings.
      from: '"Gnomon test" <sender@example.test>',
      to: '"Night Person" <night@example.test>',
      envelopeTo: ['night@example.test', 'second@example.test'],
      attachments: [{ filename: 'lineup.ics', contentType: 'text/calendar' }],
    });
    expect(message.text?.trim()).toBe('Plain text body');
    expect(message.html).toContain('HTML body');
    expect(Date.parse(message.date!)).not.toBeNaN();

    const raw = await admin.get(`/api/outbox/${id}/raw`).buffer(true).parse((res, cb) => {
      const chunks: Buffer[] = [];
      res.on('data', (c: Buffer) => chunks.push(c));
      res.on('end', () => cb(null, Buffer.concat(chunks)));
    });
    expect(raw.headers['content-type']).toMatch(/^message\/rfc822/);
    expect((raw.body as Buffer).equals((await OutboxMessageModel.findByPk(id))!.raw)).toBe(true);
  });

  it('is for admins only, and checks its query and ids', async () => {
    expect((await request(ctx.app).get('/api/outbox')).status).toBe(401);
    const member = await signedInAgent(ctx.app, await createUser('member'));
    expect((await member.get('/api/outbox')).status).toBe(403);
    const admin = await signedInAgent(ctx.app, await createUser('admin'));
    for (const [query, field] of [['page=0', 'page'], ['pageSize=101', 'pageSize'], ['pageSize=x', 'pageSize']] as const) {
      const res = await admin.get(`/api/outbox?${query}`);
      expect(res.status).toBe(400);
      expect(res.body.error.fields[field]).toBeTruthy();
    }
    expect((await admin.get('/api/outbox/nope')).status).toBe(400);
    expect((await admin.get('/api/outbox/00000000-0000-4000-8000-000000000000')).status).toBe(404);
  });
});
