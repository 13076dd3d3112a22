/**
 * Invitees of a study. Sends "claim" rows with a conditional update before mailing, so two
 * concurrent sends never mail the same person twice and an unsubscribe is honoured by every
 * send that starts after it.
 * Tenant: the study in every where-clause (loaded for the team by the caller), but for the
 * look-ups by personal token (unsubscribe and the respondent link: the token is the proof) and
 * clearInvitation and markUnsubscribed, which take the id of a row just claimed or found so.
 */
import {
  and,
  asc,
  count,
  eq,
  exists,
  ilike,
  inArray,
  isNotNull,
  isNull,
  lt,
  or,
  sql,
  type SQL,
} from 'drizzle-orm';
import type { PgUpdateSetSource } from 'drizzle-orm/pg-core';
import type { DbOrTx } from '../client';
import { invitees, respondents } from '../schema/fieldwork';
import { studies } from '../schema/studies';
import type { InviteeState } from '../../shared/schemas/invitees';
import { latestMailOfInvitee } from './mail-outbox';

const inviteeColumns = {
  id: invitees.id,
  studyId: invitees.studyId,
  email: invitees.email,
  name: invitees.name,
  externalId: invitees.externalId,
  token: invitees.token,
  invitedAt: invitees.invitedAt,
  lastRemindedAt: invitees.lastRemindedAt,
  reminderCount: invitees.reminderCount,
  unsubscribedAt: invitees.unsubscribedAt,
};
export type InviteeRecord = Pick<typeof invitees.$inferSelect, keyof typeof inviteeColumns>;

/** Respondents who reached an end: completed, screened out or over quota. */
const finishedStatuses = ['completed', 'screened_out', 'over_quota'] as const;

const hasFinished = (db: DbOrTx) =>
  exists(
    db
      .select({ one: sql`1` })
      .from(respondents)
      .where(
        and(
          eq(respondents.inviteeId, invitees.id),
          inArray(respondents.status, [...finishedStatuses]),
        ),
      ),
  );
const hasStarted = (db: DbOrTx) =>
  exists(
    db
      .select({ one: sql`1` })
      .from(respondents)
      .where(eq(respondents.inviteeId, invitees.id)),
  );
const hasCompleted = (db: DbOrTx) =>
  exists(
    db
      .select({ one: sql`1` })
      .from(respondents)
      .where(and(eq(respondents.inviteeId, invitees.id), eq(respondents.status, 'completed'))),
  );

export async function listInviteeEmails(db: DbOrTx, params: { studyId: string }) {
  const rows = await db
    .select({ email: invitees.email })
    .from(invitees)
    .where(eq(invitees.studyId, params.studyId));
  return new Set(rows.map((r) => r.email));
}

/** Inserts new invitees; an e-mail already on the study's list is skipped (unique index). */
export async function insertInvitees(
  db: DbOrTx,
  params: {
    studyId: string;
    rows: Array<{ email: string; name: string; externalId: string | null; token: string }>;
  },
) {
  let inserted = 0;
  // Chunks keep each statement well under PostgreSQL's 65535 bind-parameter limit.
  for (let i = 0; i < params.rows.length; i += 2000) {
    const chunk = params.rows.slice(i, i + 2000).map((r) => ({ ...r, studyId: params.studyId }));
    const out = await db
      .insert(invitees)
      .values(chunk)
      .onConflictDoNothing({ target: [invitees.studyId, invitees.email] })
      .returning({ id: invitees.id });
    inserted += out.length;
  }
  return inserted;
}

function stateCondition(db: DbOrTx, state: InviteeState) {
  switch (state) {
    case 'unsubscribed':
      return isNotNull(invitees.unsubscribedAt);
    case 'not_sent':
      return and(isNull(invitees.unsubscribedAt), isNull(invitees.invitedAt));
    case 'completed':
      return and(isNull(invitees.unsubscribedAt), hasCompleted(db));
    case 'started':
      return and(isNull(invitees.unsubscribedAt), hasStarted(db), sql`not ${hasCompleted(db)}`);
    case 'invited':
      return and(
        isNull(invitees.unsubscribedAt),
        isNotNull(invitees.invitedAt),
        sql`not ${hasStarted(db)}`,
      );
  }
}

export async function listInvitees(
  db: DbOrTx,
  params: { studyId: string; state?: InviteeState; search?: string; limit: number; offset: number },
) {
  const where = and(
    eq(invitees.studyId, params.studyId),
    params.state ? stateCondition(db, params.state) : undefined,
    params.search
      ? or(
          ilike(invitees.email, `%${escapeLike(params.search)}%`),
          ilike(invitees.name, `%${escapeLike(params.search)}%`),
          ilike(invitees.externalId, `%${escapeLike(params.search)}%`),
        )
      : undefined,
  );
  const [rows, [{ n }]] = await Promise.all([
    db
      .select({
        ...inviteeColumns,
        started: hasStarted(db).mapWith(Boolean),
        completed: hasCompleted(db).mapWith(Boolean),
        mail: latestMailOfInvitee,
      })
      .from(invitees)
      .where(where)
      .orderBy(asc(invitees.createdAt), asc(invitees.email))
      .limit(params.limit)
      .offset(params.offset),
    db.select({ n: count() }).from(invitees).where(where),
  ]);
  return { rows, total: Number(n) };
}

function escapeLike(s: string): string {
  return s.replace(/[\\%_]/g, (c) => `\\${c}`);
}

export async function deleteInvitee(db: DbOrTx, params: { id: string; studyId: string }) {
  const rows = await db
    .delete(invitees)
    .where(and(eq(invitees.id, params.id), eq(invitees.studyId, params.studyId)))
    .returning({ id: invitees.id });
  return rows.length > 0;
}

/**
 * Claims the study's invitees (all, or those of `ids`) not unsubscribed that meet `conditions`:
 * writes `set` to them and returns them.
 */
function claimInvitees(
  db: DbOrTx,
  params: { studyId: string; ids?: string[] },
  set: PgUpdateSetSource<typeof invitees>,
  ...conditions: (SQL | undefined)[]
) {
  return db
    .update(invitees)
    .set(set)
    .where(
      and(
        eq(invitees.studyId, params.studyId),
        params.ids ? inArray(invitees.id, params.ids) : undefined,
        isNull(invitees.unsubscribedAt),
        ...conditions,
      ),
    )
    .returning(inviteeColumns);
}

/** Claims invitees for a first invitation: not yet invited and not unsubscribed. */
export async function claimForInvitation(
  db: DbOrTx,
  params: { studyId: string; ids?: string[]; now: Date },
) {
  return claimInvitees(db, params, { invitedAt: params.now }, isNull(invitees.invitedAt));
}

/** Makes an invitee "not sent" again after their invitation failed for good. */
export async function clearInvitation(db: DbOrTx, id: string) {
  await db.update(invitees).set({ invitedAt: null }).where(eq(invitees.id, id));
}

/**
 * Claims invitees for a reminder: invited, not unsubscribed, not finished (completed, screened
 * out, over quota), and not reminded since `notSince` (guards against double clicks).
 */
export async function claimForReminder(
  db: DbOrTx,
  params: { studyId: string; ids?: string[]; now: Date; notSince: Date },
) {
  return claimInvitees(
    db,
    params,
    { lastRemindedAt: params.now, reminderCount: sql`${invitees.reminderCount} + 1` },
    isNotNull(invitees.invitedAt),
    or(isNull(invitees.lastRemindedAt), lt(invitees.lastRemindedAt, params.notSince)),
    sql`not ${hasFinished(db)}`,
  );
}

/** Looks an invitee up by the token of the personal link, with the study's name. */
export async function getInviteeByToken(db: DbOrTx, params: { token: string }) {
  const [row] = await db
    .select({ ...inviteeColumns, studyName: studies.name })
    .from(invitees)
    .innerJoin(studies, eq(studies.id, invitees.studyId))
    .where(eq(invitees.token, params.token));
  return row ?? null;
}

export async function markUnsubscribed(db: DbOrTx, params: { id: string; now: Date }) {
  await db
    .update(invitees)
    .set({ unsubscribedAt: params.now })
    .where(and(eq(invitees.id, params.id), isNull(invitees.unsubscribedAt)));
}

/** Counts for the Fieldwork section's invitations summary. */
export async function countInvitees(db: DbOrTx, params: { studyId: string }) {
  const [row] = await db
    .select({
      total: count(),
      sent: count(invitees.invitedAt),
      reminded: sql<number>`count(*) filter (where ${invitees.reminderCount} > 0)`.mapWith(Number),
      unsubscribed: count(invitees.unsubscribedAt),
      started: sql<number>`count(*) filter (where ${hasStarted(db)})`.mapWith(Number),
      completed: sql<number>`count(*) filter (where ${hasCompleted(db)})`.mapWith(Number),
    })
    .from(invitees)
    .where(eq(invitees.studyId, params.studyId));
  return {
    total: Number(row.total),
    sent: Number(row.sent),
    reminded: row.reminded,
    unsubscribed: Number(row.unsubscribed),
    started: row.started,
    completed: row.completed,
  };
}
