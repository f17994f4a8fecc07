import nodemailer, { type Transporter } from 'nodemailer';
import type { Db } from '../../db/client';
import { newId } from '../../db/ids';
import { outbox, type OutboxMessage } from '../../db/schema';
import { startCaptureServer, type CaptureServer } from './fake-smtp';

/** SMTP connections a server process keeps open. */
const MAIL_CONNECTIONS = 4;

export interface MailSettings {
  /** Real SMTP server; when absent and `capture` is on, a local capture server is used. */
  host?: string | undefined;
  port?: number | undefined;
  user?: string | undefined;
  password?: string | undefined;
  /** TLS from the first byte (port 465); otherwise STARTTLS when the server offers it. */
  secure?: boolean | undefined;
  from: string;
  /** Demo and development mode: start the local capture server when no host is set. */
  capture: boolean;
}

export interface OutgoingMail {
  kind: string;
  to: string[];
  cc?: string[];
  subject: string;
  text: string;
  html: string;
  related?: { type: string; id: string };
}

export interface Mailer {
  /** `captured` (local server), `sent` (real server) or `failed`; the outbox row is returned. */
  send(mail: OutgoingMail): Promise<OutboxMessage>;
  mode: 'capture' | 'smtp' | 'off';
  close(): Promise<void>;
}

/**
 * Mail through nodemailer over SMTP. Every message, sent or not, is recorded in the outbox
 * table, so admins can see what went out (and, in demo mode, read it on the Outbox page).
 */
/**
 * A few SMTP connections kept open and reused: a connection per message cost ~0.1 s each, so opening a
 * shortlist to 500 voters took 54 s before its reply.
 */
const POOL = { pool: true, maxConnections: MAIL_CONNECTIONS } as const;

/** Sends `mails` over the pool's connections at once (each recorded in the outbox); resolves when all are done. */
export async function sendAll(mailer: Mailer, mails: OutgoingMail[]): Promise<OutboxMessage[]> {
  const results: OutboxMessage[] = new Array(mails.length);
  let next = 0;
  const worker = async (): Promise<void> => {
    for (let i = next++; i < mails.length; i = next++) results[i] = await mailer.send(mails[i]!);
  };
  await Promise.all(Array.from({ length: Math.min(MAIL_CONNECTIONS, mails.length) }, worker));
  return results;
}

export async function createMailer(db: Db, settings: MailSettings): Promise<Mailer> {
  let capture: CaptureServer | undefined;
  let mode: Mailer['mode'] = 'off';
  let transport: Transporter | undefined;
  if (settings.host) {
    mode = 'smtp';
    transport = nodemailer.createTransport({
      ...POOL,
      host: settings.host,
      port: settings.port ?? (settings.secure ? 465 : 587),
      secure: settings.secure ?? false,
      ...(settings.user ? { auth: { user: settings.user, pass: settings.password ?? '' } } : {}),
    });
  } else if (settings.capture) {
    mode = 'capture';
    capture = await startCaptureServer();
    transport = nodemailer.createTransport({ ...POOL, host: '127.0.0.1', port: capture.port, secure: false, ignoreTLS: true });
  }

  async function record(mail: OutgoingMail, status: string, details: { messageId?: string; raw?: string; error?: string }): Promise<OutboxMessage> {
    const [row] = await db
      .insert(outbox)
      .values({
        id: newId(),
        kind: mail.kind,
        toAddresses: mail.to.join(', '),
        ccAddresses: (mail.cc ?? []).join(', '),
        subject: mail.subject,
        textBody: mail.text,
        htmlBody: mail.html,
        relatedType: mail.related?.type ?? null,
        relatedId: mail.related?.id ?? null,
        status,
        error: details.error ?? null,
        messageId: details.messageId ?? null,
        raw: details.raw ?? null,
      })
      .returning();
    return row!;
  }

  return {
    mode,
    async send(mail) {
      if (!transport) return record(mail, 'failed', { error: 'No SMTP server is configured (set SMTP_HOST).' });
      try {
        const info = await transport.sendMail({ from: settings.from, to: mail.to, cc: mail.cc, subject: mail.subject, text: mail.text, html: mail.html });
        const messageId = String(info.messageId ?? '');
        return record(mail, capture ? 'captured' : 'sent', { messageId, ...(capture ? { raw: capture.take(messageId) ?? '' } : {}) });
      } catch (error) {
        return record(mail, 'failed', { error: error instanceof Error ? error.message : String(error) });
      }
    },
    async close() {
      transport?.close();
      await capture?.close();
    },
  };
}
