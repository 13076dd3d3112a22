/**
 * The mail outbox (schema: db/schema/mail.ts). A row is claimed for sending with a conditional
 * update (queued → sending), so only one process ever sends it; it ends sent or failed, or
 * goes back to queued with the reason while the mail server cannot take it.
 * Tenant: none applies: the mail worker drains the outbox of every team; rows are claimed by
 * their id.
 */
import { and, eq, lt, sql } from 'drizzle-orm';
import type { DbOrTx } from '../client';
import { failQueuedRows, listQueuedRows } from './queued-rows';
import { mailOutbox } from '../schema/mail';

export type MailKind = 'invitation' | 'reminder';
export type MailStatus = 'queued' | 'sending' | 'sent' | 'failed';

export type NewOutboxMail = {
  teamId: string;
  studyId: string;
  inviteeId: string;
  kind: MailKind;
  toAddress: string;
  subject: string;
  textBody: string;
  htmlBody: string | null;
  headers: Record<string, string>;
};

export async function insertOutboxMails(db: DbOrTx, rows: NewOutboxMail[]): Promise<string[]> {
  const ids: string[] = [];
  // Chunks keep each statement well under PostgreSQL's bind-parameter limit.
  for (let i = 0; i < rows.length; i += 1000) {
    const out = await db
      .insert(mailOutbox)
      .values(rows.slice(i, i + 1000))
      .returning({ id: mailOutbox.id });
    ids.push(...out.map((r) => r.id));
  }
  return ids;
}

/** Takes a queued row for sending; null when it is sent, failed or being sent elsewhere. */
export async function claimOutboxMail(db: DbOrTx, id: string, now: Date) {
  const [row] = await db
    .update(mailOutbox)
    .set({ status: 'sending', sendingAt: now, attempts: sql`${mailOutbox.attempts} + 1` })
    .where(and(eq(mailOutbox.id, id), eq(mailOutbox.status, 'queued')))
    .returning();
  return row ?? null;
}

/** Ends a send: sent, failed for good, or queued again (with the reason) for a retry. */
export async function finishOutboxSend(
  db: DbOrTx,
  params: { id: string; status: 'sent' | 'failed' | 'queued'; error: string | null; now: Date },
) {
  await db
    .update(mailOutbox)
    .set({
      status: params.status,
      lastError: params.error,
      ...(params.status === 'sent' ? { sentAt: params.now } : {}),
      ...(params.status === 'failed' ? { failedAt: params.now } : {}),
    })
    .where(and(eq(mailOutbox.id, params.id), eq(mailOutbox.status, 'sending')));
}

/**
 * Rows left 'sending' by a process that stopped mid-send: the mail server may have taken the
 * message, so they are failed (with that reason) rather than sent again — nobody gets it twice.
 */
export async function failInterruptedSends(db: DbOrTx, params: { before: Date; error: string }) {
  const rows = await db
    .update(mailOutbox)
    .set({ status: 'failed', lastError: params.error, failedAt: new Date() })
    .where(and(eq(mailOutbox.status, 'sending'), lt(mailOutbox.sendingAt, params.before)))
    .returning({ id: mailOutbox.id });
  return rows.map((r) => r.id);
}

/** Queued rows created before `createdBefore` (orphan-sweep.ts). */
export function listQueuedOutboxMails(db: DbOrTx, createdBefore: Date) {
  return listQueuedRows(db, mailOutbox, createdBefore);
}

export function failQueuedOutboxMails(db: DbOrTx, ids: string[], error: string) {
  return failQueuedRows(db, mailOutbox, ids, {
    status: 'failed',
    lastError: error,
    failedAt: new Date(),
  });
}

/**
 * The latest mail of each invitee (kind, status, reason), as a correlated subquery column of a
 * select from invitees (spelled out: Drizzle leaves a one-table select's columns unqualified,
 * which inside this subquery would name the outbox's own id).
 */
export const latestMailOfInvitee = sql<{
  kind: MailKind;
  status: MailStatus;
  reason: string | null;
} | null>`(select json_build_object('kind', m.kind, 'status', m.status, 'reason', m.last_error)
     from ${mailOutbox} m where m.invitee_id = "invitees"."id"
    order by m.created_at desc limit 1)`;
