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
  headers?: Record<string, string>;
};
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
    async send(mail) {
      await transport.sendMail({ from: env.MAIL_FROM, ...mail });
    },
    close() {
      transport.close();
    },
  };
}
