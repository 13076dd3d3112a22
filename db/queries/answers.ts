/**
 * A respondent's own answers: one row per (respondent, screen); the client-made id makes retries
 * harmless. Tenant: the respondent's session token (checked by getAnswerContext) is the scope;
 * researchers' reads of a study's answers are in study-answers.ts.
 */
import { and, eq, sql } from 'drizzle-orm';
import type { DbOrTx } from '../client';
import { answers, respondentBlockCounts, respondents } from '../schema/fieldwork';
import { answerFieldsOf } from './study-answers';

export const answerColumns = {
  id: answers.id,
  clientId: answers.clientId,
  ...answerFieldsOf(answers),
  createdAt: answers.createdAt,
};

export async function getAnswerByClientId(
  db: DbOrTx,
  params: { respondentId: string; clientId: string },
) {
  const [row] = await db
    .select(answerColumns)
    .from(answers)
    .where(
      and(eq(answers.respondentId, params.respondentId), eq(answers.clientId, params.clientId)),
    );
  return row ?? null;
}

export async function listAnsweredKeys(db: DbOrTx, params: { respondentId: string }) {
  const rows = await db
    .select({ screenKey: answers.screenKey })
    .from(answers)
    .where(eq(answers.respondentId, params.respondentId));
  return new Set(rows.map((r) => r.screenKey));
}

/** A respondent's current answer values by screen key (Back shows them again). */
export async function listAnswerValues(db: DbOrTx, params: { respondentId: string }) {
  const rows = await db
    .select({ screenKey: answers.screenKey, value: answers.value })
    .from(answers)
    .where(eq(answers.respondentId, params.respondentId));
  return new Map(rows.map((r) => [r.screenKey, r.value]));
}

/** One answer as a respondent's request writes it. */
type NewAnswer = {
  respondentId: string;
  studyId: string;
  clientId: string;
  screenKey: string;
  taskNumber: number | null;
  chosenAlternative: number | null;
  chosenPosition: number | null;
  value: unknown;
  responseMs: number | null;
  createdAt?: Date;
};

/**
 * The answer, and when it ends the session the respondent's final status, in one statement
 * (one round trip, atomic). Returns null when the unique index on (respondent, client id) or
 * (respondent, screen) already has a row: nothing is written then. A respondent who is
 * screened out or over quota gives their block place back in the same statement.
 */
export async function insertAnswerAndFinish(
  db: DbOrTx,
  params: NewAnswer & {
    versionId: string;
    block: number;
    finish: { status: 'completed' | 'screened_out' | 'over_quota'; durationMs: number } | null;
  },
): Promise<{ id: string } | null> {
  const { finish } = params;
  const at = params.createdAt ?? new Date();
  const r = await db.execute<{ id: string | null }>(sql`
    with ins as (
      insert into ${answers} (respondent_id, study_id, client_id, screen_key, task_number,
                              chosen_alternative, chosen_position, value, response_ms, created_at)
      values (${params.respondentId}, ${params.studyId}, ${params.clientId}, ${params.screenKey},
              ${params.taskNumber}, ${params.chosenAlternative}, ${params.chosenPosition},
              ${JSON.stringify(params.value)}::jsonb, ${params.responseMs}, ${at.toISOString()})
      on conflict do nothing
      returning id
    )${
      finish
        ? sql`, fin as (
      update ${respondents} set status = ${finish.status}, finished_at = ${at.toISOString()},
             duration_ms = ${finish.durationMs}
       where id = ${params.respondentId} and status = 'in_progress' and exists (select 1 from ins)
      returning id
    )${
      finish.status === 'completed'
        ? sql``
        : sql`, freed as (
      update ${respondentBlockCounts}
         set filling[${params.block}::int] = greatest(filling[${params.block}::int] - 1, 0)
       where version_id = ${params.versionId} and exists (select 1 from fin)
    )`
    }`
        : sql``
    }
    select (select id from ins) as id`);
  const id = r.rows[0]?.id;
  return id ? { id } : null;
}
