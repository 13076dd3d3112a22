/**
 * Writes of a study created from a choice file. Respondents and answers go in as batched
 * `INSERT … SELECT FROM unnest(…)`: one statement per batch with one array parameter per
 * column, so a million rows cost a few dozen round trips instead of a million.
 * Tenant: writes only, for the study the caller has just created in its team; every row carries
 * that study's id.
 */
import { sql } from 'drizzle-orm';
import type { DbOrTx } from '../client';
import { studies } from '../schema/studies';
import { studyColumns } from './studies';

/** Rows per statement: large enough to amortise the round trip, small enough for the timeout. */
const BATCH = 20_000;

export async function insertImportedStudy(
  db: DbOrTx,
  params: {
    teamId: string;
    publicId: string;
    name: string;
    description: string;
    definition: unknown;
    questionnaire: unknown;
    createdBy: string;
  },
) {
  const [row] = await db
    .insert(studies)
    .values({
      ...params,
      publicTitle: params.name,
      status: 'closed',
      source: 'imported',
      currentVersion: 1,
    })
    .returning(studyColumns);
  return row;
}

export interface ImportedRespondentRow {
  id: string;
  externalId: string;
  sessionToken: string;
  plan: unknown;
  startedAt: Date;
}

export async function insertImportedRespondents(
  db: DbOrTx,
  params: { studyId: string; versionId: string; rows: readonly ImportedRespondentRow[] },
) {
  for (let from = 0; from < params.rows.length; from += BATCH) {
    const part = params.rows.slice(from, from + BATCH);
    await db.execute(sql`
      insert into respondents
        (id, study_id, version_id, session_token, external_id, block, plan, status,
         started_at, finished_at, included)
      select u.id, ${params.studyId}::uuid, ${params.versionId}::uuid, u.token, u.external_id, 1,
             u.plan::jsonb, 'completed', u.started_at, u.started_at, true
      from unnest(${sql.param(part.map((r) => r.id))}::uuid[],
                  ${sql.param(part.map((r) => r.sessionToken))}::text[],
                  ${sql.param(part.map((r) => r.externalId))}::text[],
                  ${sql.param(part.map((r) => JSON.stringify(r.plan)))}::text[],
                  ${sql.param(part.map((r) => r.startedAt.toISOString()))}::timestamptz[])
        as u(id, token, external_id, plan, started_at)`);
  }
}

/** Answers in columns: choice tasks carry task and chosen alternative, questions a value. */
export interface ImportedAnswerColumns {
  respondentId: string[];
  screenKey: string[];
  taskNumber: (number | null)[];
  chosen: (number | null)[];
  value: string[];
}

export async function insertImportedAnswers(
  db: DbOrTx,
  params: { studyId: string; answers: ImportedAnswerColumns },
) {
  const a = params.answers;
  for (let from = 0; from < a.respondentId.length; from += BATCH) {
    const part = <T>(xs: T[]) => sql.param(xs.slice(from, from + BATCH));
    await db.execute(sql`
      insert into answers
        (respondent_id, study_id, client_id, screen_key, task_number, chosen_alternative,
         chosen_position, value)
      select u.respondent_id, ${params.studyId}::uuid, 'import:' || u.screen_key, u.screen_key,
             u.task_number, u.chosen, u.chosen, u.value::jsonb
      from unnest(${part(a.respondentId)}::uuid[], ${part(a.screenKey)}::text[],
                  ${part(a.taskNumber)}::int[], ${part(a.chosen)}::int[],
                  ${part(a.value)}::text[])
        as u(respondent_id, screen_key, task_number, chosen, value)`);
  }
}
