/**
 * Outgoing mail through nodemailer over SMTP. Locally that is the fake mail server started by
 * the start command and the tests (maildev); in production SMTP_* points at the real host.
 */
import nodemailer from 'nodemailer';
import type { Env } from '../env';

export type OutgoingMail = {
  to: string;
  subject: string;
  text: string;
  html?: string;
  /** Display name beside MAIL_FROM (the address stays the server's, so SPF/DKIM hold). */
  fromName?: string;
  replyTo?: string;
  headers?: Record<string, string>;
};

/**
 * The outbox keeps a mail's headers as one JSON object; the sender name and reply-to travel
 * in it under these keys and are taken out again before sending.
 */
const SENDER_NAME_KEY = 'X-Choicewright-Sender-Name';
const REPLY_TO_KEY = 'Reply-To';

export function storedHeaders(mail: OutgoingMail): Record<string, string> {
  return {
    ...(mail.headers ?? {}),
    ...(mail.fromName ? { [SENDER_NAME_KEY]: mail.fromName } : {}),
    ...(mail.replyTo ? { [REPLY_TO_KEY]: mail.replyTo } : {}),
  };
}

export function fromStoredHeaders(
  stored: Record<string, string>,
): Pick<OutgoingMail, 'fromName' | 'replyTo' | 'headers'> {
  const { [SENDER_NAME_KEY]: fromName, [REPLY_TO_KEY]: replyTo, ...headers } = stored;
  return { ...(fromName ? { fromName } : {}), ...(replyTo ? { replyTo } : {}), headers };
}
/** The bare address of a "Name <address>" sender, or the text itself when it has no name. */
export const addressOf = (sender: string) => sender.match(/<([^<>]+)>\s*$/)?.[1] ?? sender.trim();

export type Mailer = { send(mail: OutgoingMail): Promise<void>; close(): void };

export function createMailer(
  env: Pick<
    Env,
    'SMTP_HOST' | 'SMTP_PORT' | 'SMTP_USER' | 'SMTP_PASS' | 'SMTP_SECURE' | 'MAIL_FROM'
  >,
): Mailer {
  const transport = nodemailer.createTransport({
    host: env.SMTP_HOST,
    port: env.SMTP_PORT,
    secure: env.SMTP_SECURE,
    auth: env.SMTP_USER ? { user: env.SMTP_USER, pass: env.SMTP_PASS ?? '' } : undefined,
    // The local fake server has no certificate; real hosts negotiate STARTTLS as usual.
    ignoreTLS: !env.SMTP_SECURE && (env.SMTP_HOST === '127.0.0.1' || env.SMTP_HOST === 'localhost'),
  });
  return {
    async send({ fromName, ...mail }) {
      const from = fromName ? { name: fromName, address: addressOf(env.MAIL_FROM) } : env.MAIL_FROM;
      await transport.sendMail({ from, ...mail });
    },
    close() {
      transport.close();
    },
  };
}
