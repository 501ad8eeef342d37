/**
 * The local SMTP fake: an SMTP server (smtp-server) on 127.0.0.1 that delivers nowhere and stores
 * every message it accepts in the outbox table, where admins read it. `npm start` runs it when no
 * SMTP_URL is set, so the embedded app and the tests never send to a real address.
 */
import type { AddressInfo } from 'node:net';
import { SMTPServer, type SMTPServerAddress } from 'smtp-server';
import { simpleParser } from 'mailparser';
import { OutboxMessageModel } from '../models/outbox-message';

/** Largest message accepted, bytes (a watch e-mail is a few tens of kB). */
const MAX_MESSAGE_BYTES = 10 * 1024 * 1024;

export interface SmtpFakeOptions {
  /** Port on 127.0.0.1; 0 takes any free port. */
  port: number;
  /** Called after each stored message (tests wait on it). */
  onStored?: (message: OutboxMessageModel) => void;
}

/** An SMTP error with the reply code the client sees. */
function smtpError(code: number, message: string): Error & { responseCode: number } {
  return Object.assign(new Error(message), { responseCode: code });
}

function messageIdOf(value: unknown): string | null {
  if (typeof value !== 'string' || !value.trim()) return null;
  return value.trim().replace(/^<|>$/g, '');
}

export class SmtpFake {
  private readonly server: SMTPServer;
  private listening = false;
  private refusing: { reason: string; code: number } | undefined;
  private actualPort = 0;

  constructor(private readonly options: SmtpFakeOptions) {
    this.server = new SMTPServer({
      name: 'gnomon-smtp-fake',
      banner: 'Gnomon local SMTP fake: messages are stored in the outbox, never delivered',
      secure: false,
      // Plain SMTP on loopback only: no TLS to negotiate and no accounts to check.
      disabledCommands: ['STARTTLS', 'AUTH'],
      authOptional: true,
      size: MAX_MESSAGE_BYTES,
      closeTimeout: 1000,
      logger: false,
      onMailFrom: (_address: SMTPServerAddress, _session, callback) => {
        if (this.refusing) return callback(smtpError(this.refusing.code, this.refusing.reason));
        callback();
      },
      onData: (stream, session, callback) => {
        const chunks: Buffer[] = [];
        stream.on('data', (chunk: Buffer) => chunks.push(chunk));
        stream.on('end', () => {
          const sizeExceeded = (stream as unknown as { sizeExceeded?: boolean }).sizeExceeded;
          if (sizeExceeded) return callback(smtpError(552, 'Message too large for the outbox'));
          const raw = Buffer.concat(chunks);
          const from = session.envelope.mailFrom;
          const to = session.envelope.rcptTo.map((r) => r.address);
          this.store(raw, from ? from.address : '', to).then(() => callback(), (error: unknown) => {
            console.error('SMTP fake: storing a message failed:', error);
            callback(smtpError(451, 'The outbox could not store the message; try again later'));
          });
        });
      },
    });
    this.server.on('error', (error) => { console.error('SMTP fake:', error.message); });
  }

  private async store(raw: Buffer, envelopeFrom: string, envelopeTo: string[]): Promise<void> {
    const parsed = await simpleParser(raw, { skipHtmlToText: true, skipTextToHtml: true, skipImageLinks: true });
    const message = await OutboxMessageModel.create({
      messageId: messageIdOf(parsed.messageId),
      envelopeFrom,
      envelopeTo,
      subject: parsed.subject ?? '',
      raw,
      sizeBytes: raw.length,
    });
    this.options.onStored?.(message);
  }

  /** Starts listening on 127.0.0.1; resolves with the port. */
  async start(): Promise<number> {
    if (this.listening) return this.actualPort;
    await new Promise<void>((resolve, reject) => {
      const onError = (error: Error) => reject(error);
      this.server.server.once('error', onError);
      this.server.listen(this.options.port, '127.0.0.1', () => {
        this.server.server.off('error', onError);
        resolve();
      });
    });
    this.listening = true;
    this.actualPort = (this.server.server.address() as AddressInfo).port;
    return this.actualPort;
  }

  get port(): number {
    return this.actualPort;
  }

  /** The SMTP_URL that points at this fake. */
  get url(): string {
    return `smtp://127.0.0.1:${this.actualPort}`;
  }

  /**
   * From now on every message is refused at MAIL FROM with the reply code and reason: by default a
   * temporary failure (451), as an overloaded or broken mail server answers; a 5xx code is a
   * permanent refusal. accept() ends it.
   */
  refuse(reason = 'Temporarily refusing mail', code = 451): void {
    this.refusing = { reason, code };
  }

  accept(): void {
    this.refusing = undefined;
  }

  async stop(): Promise<void> {
    if (!this.listening) return;
    this.listening = false;
    await new Promise<void>((resolve) => { this.server.close(() => resolve()); });
  }
}
