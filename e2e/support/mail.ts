/**
 * Reads mail the app sent, from the fake mail server's HTTP API (maildev), as a person would
 * open their inbox. The e2e server (scripts/e2e-server.sh) sends to SMTP 1125; the API is on 1180.
 */
import { randomBytes } from 'node:crypto';

export const MAIL_API = process.env.E2E_MAIL_API ?? 'http://127.0.0.1:1180/api/email';

export type Mail = { subject: string; text: string; to: { address: string }[] };

/** A fresh address per run, so mail from earlier runs never gets in the way. */
export function uniqueAddress(prefix: string): string {
  return `${prefix}-${randomBytes(4).toString('hex')}@example.test`;
}

/** The newest mail to an address (whose subject matches, when given). */
export async function waitForMail(to: string, timeoutMs = 15_000, subject?: RegExp): Promise<Mail> {
  const deadline = Date.now() + timeoutMs;
  for (;;) {
    const res = await fetch(MAIL_API);
    if (!res.ok) throw new Error(`mail server answered ${res.status}`);
    const mails = ((await res.json()) as Mail[]).filter(
      (m) =>
        m.to.some((t) => t.address.toLowerCase() === to.toLowerCase()) &&
        (!subject || subject.test(m.subject)),
    );
    if (mails.length > 0) return mails[mails.length - 1];
    if (Date.now() > deadline) throw new Error(`no mail to ${to} within ${timeoutMs} ms`);
    await new Promise((r) => setTimeout(r, 250));
  }
}

export function firstLink(text: string): string {
  const m = text.match(/https?:\/\/\S+/);
  if (!m) throw new Error('no link in the mail');
  return m[0];
}
