/**
 * The answer path's one statement: stores an answer (and, when it ends the session, the
 * respondent's final status and, for a screened-out respondent, their block place) only if
 * every condition of a plain in-order answer holds, and reads back what the service needs
 * either way. Anything else — a retry, a closed or closing study, a quota, an answer out of
 * order — writes nothing here and is decided by the full path (server/services/answers.ts).
 *
 * It is sent as a named prepared statement on the pool: PostgreSQL parses and plans it once
 * per connection, and the process builds no SQL per answer (the busiest statement of a panel
 * launch). The text is fixed; every value travels as a parameter.
 * Tenant: the survey's public id and the respondent's session token, both in the statement,
 * are the scope (respondents have no team).
 */
import type { Db } from '../client';
import type { insertAnswerAndFinish } from './answers';

type AnswerRow = Omit<Parameters<typeof insertAnswerAndFinish>[1], 'finish'> & {
  createdAt: Date;
};

const STATEMENT = 'answer_fast_path_v3';

/*
 * Conditions (all must hold, or nothing is written):
 * - the study is live and not archived, and its closing date (if any) is still ahead;
 * - the respondent is still answering, and exactly the screens before this one are answered
 *   (the count matches and no answered key lies outside that prefix);
 * - an answer that completes the session does so in a study without a quota of completes
 *   (those take the quota lock on the full path).
 * The unique indexes on (respondent, screen) and (respondent, client id) still decide between
 * two concurrent writers, as on the full path.
 *
 * When nothing was written, the row stored under this client id (if any), the respondent's
 * status and the screens they have answered come back too, so that a retry (a phone that
 * lost the reply) is recognised without another round trip. Those reads run only then
 * (PostgreSQL skips a subquery whose one-time condition is false).
 *
 * The study's settings (for the redirect at the end) come back only for an answer that ends
 * the session or one that wrote nothing: for every other answer the server would parse them
 * as JSON and drop them.
 */
const TEXT = `
with ctx as (
  select r.status, s.settings, s.archived_at is not null as archived,
         (s.status = 'live' and s.archived_at is null
          and (s.settings->>'closeAt' is null or (s.settings->>'closeAt')::timestamptz > $10)
          and ($12::text <> 'completed'
               or jsonb_typeof(s.settings->'quotaCompletes') is distinct from 'number')
          and r.status = 'in_progress'
          and (select count(*) from answers a where a.respondent_id = r.id) = cardinality($11::text[])
          and not exists (select 1 from answers a
                           where a.respondent_id = r.id and a.screen_key <> all($11::text[]))
         ) as open
    from respondents r join studies s on s.id = r.study_id
   where r.id = $1 and s.id = $2
),
ins as (
  insert into answers (respondent_id, study_id, client_id, screen_key, task_number,
                       chosen_alternative, chosen_position, value, response_ms, created_at)
  select $1::uuid, $2::uuid, $3::text, $4::text, $5::int, $6::int, $7::int, $8::jsonb, $9::int,
         $10::timestamptz
    from ctx where ctx.open
  on conflict do nothing
  returning id
),
fin as (
  update respondents set status = $12::respondent_status, finished_at = $10, duration_ms = $13
   where id = $1 and $12::text <> 'in_progress' and status = 'in_progress'
     and exists (select 1 from ins)
  returning id
),
freed as (
  update respondent_block_counts
     set filling[$14::int] = greatest(filling[$14::int] - 1, 0)
   where version_id = $15 and $12::text in ('screened_out', 'over_quota')
     and exists (select 1 from fin)
)
select (select id from ins) as id,
       case when $12::text <> 'in_progress' or not exists (select 1 from ins)
            then ctx.settings end as settings,
       ctx.status, ctx.archived,
       mine.screen_key as mine_screen_key, mine.value as mine_value,
       case when mine.screen_key is not null then
         (select array_agg(a.screen_key) from answers a where a.respondent_id = $1) end as answered
  from ctx
  left join lateral (select a.screen_key, a.value from answers a
                      where not exists (select 1 from ins)
                        and a.respondent_id = $1 and a.client_id = $3) mine on true`;

/** What the statement read when it wrote nothing, for telling a retry from everything else. */
export type NothingWritten = {
  status: string;
  archived: boolean;
  /** The answer already stored under this client id, or null. */
  mine: { screenKey: string; value: unknown } | null;
  /** Screen keys answered so far (read only when `mine` is set). */
  answered: string[];
};

/** One answer for the statements below. */
export type FastAnswer = AnswerRow & {
  /** Screen keys that must be exactly the ones answered so far. */
  answeredBefore: string[];
  status: 'in_progress' | 'completed' | 'screened_out';
  durationMs: number;
};

/**
 * The new id and the study's settings (null for a stored answer that continues the session);
 * `id` is null when nothing was written (then `refused` says what was found). The whole
 * result is null when the respondent or study is gone.
 */
export type FastAnswerResult = {
  id: string | null;
  settings: unknown;
  refused: NothingWritten | null;
};

type ResultRow = {
  id: string | null;
  settings: unknown;
  status: string;
  archived: boolean;
  mine_screen_key: string | null;
  mine_value: unknown;
  answered: string[] | null;
};

function resultOf(row: ResultRow | undefined): FastAnswerResult | null {
  if (!row) return null;
  const refused =
    row.id === null
      ? {
          status: row.status,
          archived: row.archived,
          mine:
            row.mine_screen_key === null
              ? null
              : { screenKey: row.mine_screen_key, value: row.mine_value },
          answered: row.answered ?? [],
        }
      : null;
  return { id: row.id, settings: row.settings, refused };
}

/** Stores the answer when it is a plain in-order answer of a live session. */
export async function insertAnswerIfOpen(
  db: Db,
  params: FastAnswer,
): Promise<FastAnswerResult | null> {
  const r = await db.$client.query<ResultRow>({
    name: STATEMENT,
    text: TEXT,
    values: [
      params.respondentId,
      params.studyId,
      params.clientId,
      params.screenKey,
      params.taskNumber,
      params.chosenAlternative,
      params.chosenPosition,
      JSON.stringify(params.value),
      params.responseMs,
      // pg would format a Date in local time with its own code; ISO 8601 means the same instant.
      params.createdAt.toISOString(),
      params.answeredBefore,
      params.status,
      params.durationMs,
      params.block,
      params.versionId,
    ],
  });
  return resultOf(r.rows[0]);
}

const BATCH_STATEMENT = 'answers_fast_path_batch_v1';

/*
 * The statement above for many answers at once, each of another respondent and each one that
 * continues its session (status in_progress): the same conditions per answer, read from the
 * same snapshot, and one insert for all that hold. Answers that end a session (a status, a
 * block place) keep the one-answer statement, so no row is updated twice here.
 *
 * $1: the answers as a JSON array (one parameter whatever their number; PostgreSQL turns the
 * JSON array of earlier screens into text[]). `i` is each answer's place in the batch. The
 * value travels as JSON text, so that a JSON null is stored as the one-answer statement
 * stores it (jsonb 'null', not SQL NULL).
 */
const BATCH_TEXT = `
with x as (
  select * from jsonb_to_recordset($1::jsonb) as x(
    i int, respondent_id uuid, study_id uuid, client_id text, screen_key text, task_number int,
    chosen_alternative int, chosen_position int, value_json text, response_ms int,
    created_at timestamptz, answered_before text[])
),
ctx as (
  select x.*, r.status, s.settings, s.archived_at is not null as archived,
         (s.status = 'live' and s.archived_at is null
          and (s.settings->>'closeAt' is null
               or (s.settings->>'closeAt')::timestamptz > x.created_at)
          and r.status = 'in_progress'
          and (select count(*) from answers a where a.respondent_id = r.id)
              = cardinality(x.answered_before)
          and not exists (select 1 from answers a
                           where a.respondent_id = r.id
                             and a.screen_key <> all(x.answered_before))
         ) as open
    from x
    join respondents r on r.id = x.respondent_id
    join studies s on s.id = r.study_id and s.id = x.study_id
),
ins as (
  insert into answers (respondent_id, study_id, client_id, screen_key, task_number,
                       chosen_alternative, chosen_position, value, response_ms, created_at)
  select respondent_id, study_id, client_id, screen_key, task_number, chosen_alternative,
         chosen_position, value_json::jsonb, response_ms, created_at
    from ctx where ctx.open
  on conflict do nothing
  returning id, respondent_id
)
select ctx.i, ins.id,
       case when ins.id is null then ctx.settings end as settings,
       ctx.status, ctx.archived,
       mine.screen_key as mine_screen_key, mine.value as mine_value,
       case when mine.screen_key is not null then
         (select array_agg(a.screen_key) from answers a
           where a.respondent_id = ctx.respondent_id) end as answered
  from ctx
  left join ins on ins.respondent_id = ctx.respondent_id
  left join lateral (select a.screen_key, a.value from answers a
                      where ins.id is null
                        and a.respondent_id = ctx.respondent_id
                        and a.client_id = ctx.client_id) mine on true`;

/**
 * insertAnswerIfOpen for answers of different respondents that each continue their session,
 * in one statement: one result per answer, in order (null for a respondent or study gone).
 */
export async function insertAnswersIfOpen(
  db: Db,
  batch: readonly FastAnswer[],
): Promise<(FastAnswerResult | null)[]> {
  const respondentsSeen = new Set<string>();
  for (const a of batch) {
    if (a.status !== 'in_progress')
      throw new Error('an answer that ends a session takes the one-answer statement');
    if (respondentsSeen.has(a.respondentId))
      throw new Error('a batch holds one answer per respondent');
    respondentsSeen.add(a.respondentId);
  }
  const rows = batch.map((a, i) => ({
    i,
    respondent_id: a.respondentId,
    study_id: a.studyId,
    client_id: a.clientId,
    screen_key: a.screenKey,
    task_number: a.taskNumber,
    chosen_alternative: a.chosenAlternative,
    chosen_position: a.chosenPosition,
    value_json: JSON.stringify(a.value),
    response_ms: a.responseMs,
    created_at: a.createdAt.toISOString(),
    answered_before: a.answeredBefore,
  }));
  const r = await db.$client.query<ResultRow & { i: number }>({
    name: BATCH_STATEMENT,
    text: BATCH_TEXT,
    values: [JSON.stringify(rows)],
  });
  const byPlace = new Map(r.rows.map((row) => [row.i, row]));
  return batch.map((_, i) => resultOf(byPlace.get(i)));
}
