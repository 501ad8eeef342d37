/**
 * Outgoing mail over SMTP (nodemailer), configured by SMTP_URL. One connection per message (no
 * pool): watch e-mails are few, and a fresh connection sees a server that came back at once.
 */
import nodemailer from 'nodemailer';

export interface OutgoingMail {
  from: string;
  to: string;
  subject: string;
  text: string;
  html: string;
  /** Message-ID without angle brackets; deterministic per delivery, so a duplicate is visible. */
  messageId: string;
  headers?: Record<string, string>;
  attachments?: Array<{ filename: string; content: string; contentType: string }>;
}

export interface SentMail {
  accepted: string[];
  rejected: string[];
  response: string;
}

/** Sends one message or throws (nodemailer's error carries `responseCode` for SMTP replies). */
export interface Mailer {
  send(mail: OutgoingMail): Promise<SentMail>;
  close(): void;
}

/** Bounds on one SMTP exchange, ms: a sender never holds a delivery longer than these add up to. */
export const SMTP_TIMEOUTS = { connectionTimeout: 15_000, greetingTimeout: 15_000, socketTimeout: 30_000 } as const;

export function createSmtpMailer(smtpUrl: string): Mailer {
  const transport = nodemailer.createTransport({ url: smtpUrl, ...SMTP_TIMEOUTS });
  return {
    async send(mail) {
      const info = await transport.sendMail({
        from: mail.from,
        to: mail.to,
        subject: mail.subject,
        text: mail.text,
        html: mail.html,
        messageId: `<${mail.messageId}>`,
        headers: mail.headers,
        attachments: mail.attachments,
      });
      const asText = (list: unknown[] | undefined) => (list ?? []).map((a) => (typeof a === 'string' ? a : (a as { address: string }).address));
      return { accepted: asText(info.accepted), rejected: asText(info.rejected), response: String(info.response ?? '') };
    },
    close() {
      transport.close();
    },
  };
}

/** The mailer when no SMTP server is configured: every send fails with a clear reason. */
export function createUnconfiguredMailer(): Mailer {
  return {
    send() {
      return Promise.reject(new Error('No SMTP_URL is configured: watch e-mails cannot be sent'));
    },
    close() {},
  };
}
