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

/**
 * Stores the answer when it is a plain in-order answer of a live session. Returns the new id
 * and the study's settings (null for a stored answer that continues the session); `id` is
 * null when nothing was written (then `refused` says what was found), and the whole result
 * is null when the respondent or study is gone.
 */
export async function insertAnswerIfOpen(
  db: Db,
  params: AnswerRow & {
    /** Screen keys that must be exactly the ones answered so far. */
    answeredBefore: string[];
    status: 'in_progress' | 'completed' | 'screened_out';
    durationMs: number;
  },
): Promise<{ id: string | null; settings: unknown; refused: NothingWritten | null } | null> {
  const r = await db.$client.query<{
    id: string | null;
    settings: unknown;
    status: string;
    archived: boolean;
    mine_screen_key: string | null;
    mine_value: unknown;
    answered: string[] | null;
  }>({
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
  const row = r.rows[0];
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
