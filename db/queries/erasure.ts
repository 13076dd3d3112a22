/**
 * Erasure of one respondent: finding them (by number, invitee address or external id), what
 * their erasure removes, and the changes themselves. Callers run the changes in one
 * transaction; the study is part of every where-clause.
 * Tenant: the study, which the caller loaded for the team.
 */
import { and, eq, sql } from 'drizzle-orm';
import type { DbOrTx } from '../client';
import {
  answerRevisions,
  answers,
  invitees,
  respondents,
  respondentTombstones,
} from '../schema/fieldwork';
import { runs } from '../schema/models';
import { respondentNumber } from './respondent-number';

/** The respondent or tombstone holding a number (null past the last one). */
export async function findNumberHolder(db: DbOrTx, params: { studyId: string; number: number }) {
  const r = await db.execute<{ id: string; erased: boolean }>(sql`
    select id, erased from (
      select id, started_at, false as erased from ${respondents} where study_id = ${params.studyId}
      union all
      select id, started_at, true from ${respondentTombstones} where study_id = ${params.studyId}
    ) numbered
    order by started_at, id
    offset ${params.number - 1} limit 1`);
  return r.rows[0] ?? null;
}

export async function findInviteesBy(
  db: DbOrTx,
  params: { studyId: string; email?: string; externalId?: string },
) {
  return db
    .select({ id: invitees.id })
    .from(invitees)
    .where(
      and(
        eq(invitees.studyId, params.studyId),
        params.email !== undefined
          ? sql`lower(${invitees.email}) = lower(${params.email})`
          : eq(invitees.externalId, params.externalId ?? ''),
      ),
    );
}

export async function findRespondentsBy(
  db: DbOrTx,
  params: { studyId: string; externalId?: string; inviteeId?: string },
) {
  return db
    .select({ id: respondents.id })
    .from(respondents)
    .where(
      and(
        eq(respondents.studyId, params.studyId),
        params.inviteeId !== undefined
          ? eq(respondents.inviteeId, params.inviteeId)
          : eq(respondents.externalId, params.externalId ?? ''),
      ),
    );
}

/** The respondent's row, locked against concurrent answers and inclusion changes. */
export async function lockRespondent(db: DbOrTx, params: { studyId: string; id: string }) {
  const [row] = await db
    .select({
      id: respondents.id,
      number: respondentNumber.mapWith(Number),
      versionId: respondents.versionId,
      block: respondents.block,
      status: respondents.status,
      inviteeId: respondents.inviteeId,
      startedAt: respondents.startedAt,
      finishedAt: respondents.finishedAt,
    })
    .from(respondents)
    .where(and(eq(respondents.id, params.id), eq(respondents.studyId, params.studyId)))
    .for('update', { of: respondents });
  return row ?? null;
}

export type LockedRespondent = NonNullable<Awaited<ReturnType<typeof lockRespondent>>>;

export async function countRespondentData(db: DbOrTx, params: { respondentId: string }) {
  const [answerCount, revisionCount] = await Promise.all([
    db.$count(answers, eq(answers.respondentId, params.respondentId)),
    db.$count(answerRevisions, eq(answerRevisions.respondentId, params.respondentId)),
  ]);
  return { answers: answerCount, revisions: revisionCount };
}

/**
 * Runs that may have used the respondent: any run holding their taste profile, and any run
 * that started estimating after they completed (it read every completed respondent then;
 * whether they were included at that moment is not recorded, so the count errs on the side
 * of saying so).
 */
function runsUsing(params: { studyId: string; respondent: LockedRespondent }) {
  const { respondent } = params;
  const afterCompletion =
    respondent.status === 'completed' && respondent.finishedAt
      ? sql`(${runs.status} in ('done', 'running') and ${runs.startedAt} >= ${respondent.finishedAt})`
      : sql`false`;
  return and(
    eq(runs.studyId, params.studyId),
    sql`(${afterCompletion} or exists (select 1 from taste_profiles tp
          where tp.run_id = ${runs.id} and tp.respondent_id = ${respondent.id}))`,
  );
}

export async function countRunsUsing(
  db: DbOrTx,
  params: { studyId: string; respondent: LockedRespondent },
) {
  return db.$count(runs, runsUsing(params));
}

export async function markRunsUsing(
  db: DbOrTx,
  params: { studyId: string; respondent: LockedRespondent },
) {
  const rows = await db
    .update(runs)
    .set({ erasedRespondents: sql`${runs.erasedRespondents} + 1` })
    .where(runsUsing(params))
    .returning({ id: runs.id });
  return rows.length;
}

export async function countRunningRuns(db: DbOrTx, params: { studyId: string }) {
  return db.$count(runs, and(eq(runs.studyId, params.studyId), eq(runs.status, 'running')));
}

/**
 * Replaces the respondent by a tombstone (keeps the numbers of the others) and deletes the row;
 * answers, earlier answers and taste profiles go with it (foreign keys on delete cascade).
 */
export async function replaceByTombstone(
  db: DbOrTx,
  params: { studyId: string; respondent: LockedRespondent },
) {
  const { respondent } = params;
  await db.insert(respondentTombstones).values({
    id: respondent.id,
    studyId: params.studyId,
    startedAt: respondent.startedAt,
  });
  await db
    .delete(respondents)
    .where(and(eq(respondents.id, respondent.id), eq(respondents.studyId, params.studyId)));
}

/** Deletes an invitee (address, name, external id, link); their queued mail goes with them. */
export async function deleteInvitee(db: DbOrTx, params: { studyId: string; id: string }) {
  await db
    .delete(invitees)
    .where(and(eq(invitees.id, params.id), eq(invitees.studyId, params.studyId)));
}

/** Forgets a study's tombstones (the demo seed, which re-simulates every respondent). */
export async function deleteTombstones(db: DbOrTx, params: { studyId: string }) {
  await db.delete(respondentTombstones).where(eq(respondentTombstones.studyId, params.studyId));
}
