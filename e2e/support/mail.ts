/**
 * Reads mail the app sent, from the fake mail server's HTTP API (maildev), as a person would
 * open their inbox. The e2e server (scripts/e2e-server.sh) sends to SMTP 1125; the API is on 1180.
 */
import { randomBytes } from 'node:crypto';
import { maildevInbox } from '../../tests/support/mailbox';

export { firstLink } from '../../tests/support/mailbox';

export const MAIL_API = process.env.E2E_MAIL_API ?? 'http://127.0.0.1:1180/api/email';

/** A fresh address per run, so mail from earlier runs never gets in the way. */
export function uniqueAddress(prefix: string): string {
  return `${prefix}-${randomBytes(4).toString('hex')}@example.test`;
}

const inbox = maildevInbox(() => MAIL_API, 250);

/** The newest mail to an address (whose subject matches, when given). */
export const waitForMail = (to: string, timeoutMs = 15_000, subject?: RegExp) =>
  inbox.waitForMail(to, timeoutMs, subject);
