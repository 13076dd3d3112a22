/**
 * Mail that is never lost or doubled. Invitations and reminders are written to the outbox in
 * the same transaction as the invitees' state change, each with a queue job that will send it
 * if nothing else does (a safety net, due FIRST_RETRY_SECONDS later). The request then tries
 * them at once, so a healthy mail server delivers while the user waits. A row is claimed
 * (queued → sending) before it is handed to the mail server, so no two processes send it; a
 * mail server that is down sends it back to queued with the reason, and the job tries again
 * with exponential backoff; a refusal (SMTP 5xx) or MAX_MAIL_ATTEMPTS failures fail it with
 * the reason. A process that dies mid-send leaves the row 'sending': the sweep fails it as
 * "may have been delivered" rather than risk a second copy.
 */
import type { AppDeps } from '../deps';
import type { DbOrTx } from '../../db/client';
import type { JobSender } from '../jobs/queue';
import { fromStoredHeaders, storedHeaders, type OutgoingMail } from '../mail/mailer';
import {
  claimOutboxMail,
  finishOutboxSend,
  insertOutboxMails,
  type MailKind,
} from '../../db/queries/mail-outbox';
import { clearInvitation } from '../../db/queries/invitees';

export const MAIL_JOB = 'mail-send';
export const MAX_MAIL_ATTEMPTS = 10;
export const FIRST_RETRY_SECONDS = 30;

/** 30 s, 1, 2, 4 … minutes, at most 30 minutes apart: ten attempts span about three hours. */
export function retryDelaySeconds(attempts: number): number {
  return Math.min(FIRST_RETRY_SECONDS * 2 ** Math.max(0, attempts - 1), 30 * 60);
}

type SmtpError = { code?: unknown; responseCode?: unknown; response?: unknown; message?: unknown };

/** A refusal that a retry cannot change: SMTP 5xx (RFC 5321, section 4.2.1). */
export function isPermanentMailError(err: unknown): boolean {
  const code = (err as SmtpError)?.responseCode;
  return typeof code === 'number' && code >= 500 && code < 600;
}

/** Why a send failed, in words a researcher can act on. */
export function describeMailError(err: unknown): string {
  const e = (err ?? {}) as SmtpError;
  if (typeof e.responseCode === 'number') {
    const said = typeof e.response === 'string' ? `: ${e.response.slice(0, 160)}` : '';
    return e.responseCode >= 500
      ? `The mail server refused the message (${e.responseCode}${said})`
      : `The mail server deferred the message (${e.responseCode}${said})`;
  }
  const code = typeof e.code === 'string' ? ` (${e.code})` : '';
  return `The mail server could not be reached${code}`;
}

export type QueuedMail = { inviteeId: string; kind: MailKind; mail: OutgoingMail };

/** Writes the mails to the outbox, each with its safety-net job, inside the caller's transaction. */
export async function queueMails(
  tx: DbOrTx,
  jobs: JobSender | undefined,
  scope: { teamId: string; studyId: string },
  mails: QueuedMail[],
): Promise<string[]> {
  const ids = await insertOutboxMails(
    tx,
    mails.map(({ inviteeId, kind, mail }) => ({
      ...scope,
      inviteeId,
      kind,
      toAddress: mail.to,
      subject: mail.subject,
      textBody: mail.text,
      htmlBody: mail.html ?? null,
      headers: storedHeaders(mail),
    })),
  );
  // Without a queue in this process, the workers' sweep finds the rows (orphan-sweep.ts).
  if (jobs)
    for (const id of ids)
      await jobs.send(MAIL_JOB, { outboxId: id }, { tx, startAfterSeconds: FIRST_RETRY_SECONDS });
  return ids;
}

export type DeliveryOutcome = 'sent' | 'retrying' | 'failed' | 'skipped';

/**
 * One attempt at one outbox row. With `scheduleRetry` (the job), a failure that may pass is
 * given its next job in the same transaction that puts the row back in the queue.
 */
export async function deliverOutboxMail(
  deps: AppDeps,
  id: string,
  opts: { scheduleRetry: boolean },
): Promise<DeliveryOutcome> {
  const row = await claimOutboxMail(deps.db, id, new Date());
  if (!row) return 'skipped';
  try {
    await deps.mailer.send({
      to: row.toAddress,
      subject: row.subject,
      text: row.textBody,
      ...(row.htmlBody ? { html: row.htmlBody } : {}),
      ...fromStoredHeaders(row.headers as Record<string, string>),
    });
  } catch (err) {
    const reason = describeMailError(err);
    deps.logger.warn({ err, outboxId: id, attempts: row.attempts }, 'mail not delivered');
    if (isPermanentMailError(err) || row.attempts >= MAX_MAIL_ATTEMPTS) {
      const final =
        row.attempts >= MAX_MAIL_ATTEMPTS && !isPermanentMailError(err)
          ? `${reason}; gave up after ${row.attempts} attempts`
          : reason;
      await deps.db.transaction(async (tx) => {
        await finishOutboxSend(tx, { id, status: 'failed', error: final, now: new Date() });
        // An invitation that failed for good can be sent again from the invitee list.
        if (row.kind === 'invitation' && row.inviteeId) await clearInvitation(tx, row.inviteeId);
      });
      return 'failed';
    }
    await deps.db.transaction(async (tx) => {
      await finishOutboxSend(tx, { id, status: 'queued', error: reason, now: new Date() });
      if (opts.scheduleRetry && deps.jobs)
        await deps.jobs.send(
          MAIL_JOB,
          { outboxId: id },
          { tx, startAfterSeconds: retryDelaySeconds(row.attempts) },
        );
    });
    return 'retrying';
  }
  await finishOutboxSend(deps.db, { id, status: 'sent', error: null, now: new Date() });
  return 'sent';
}

/** Tries the freshly queued rows now, a few at a time; counts the outcomes. */
export async function deliverNow(
  deps: AppDeps,
  ids: string[],
  concurrency = 4,
): Promise<Record<DeliveryOutcome, number>> {
  const counts: Record<DeliveryOutcome, number> = { sent: 0, retrying: 0, failed: 0, skipped: 0 };
  let next = 0;
  const worker = async () => {
    while (next < ids.length) {
      const id = ids[next++];
      counts[await deliverOutboxMail(deps, id, { scheduleRetry: false })]++;
    }
  };
  await Promise.all(Array.from({ length: concurrency }, worker));
  return counts;
}
