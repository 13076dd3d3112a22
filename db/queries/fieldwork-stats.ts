/**
 * Aggregates for the Fieldwork section, computed in the database so the live page stays cheap
 * however many answers there are.
 * Tenant: every aggregate filters on the study, which the caller loaded for the team.
 */
import { and, asc, count, eq, isNotNull, sql } from 'drizzle-orm';
import type { DbOrTx } from '../client';
import { answers, respondents } from '../schema/fieldwork';
import { studyVersions } from '../schema/studies';

const isCompleted =
  sql<number>`count(*) filter (where ${respondents.status} = 'completed')`.mapWith(Number);

export async function countRespondentsByStatus(db: DbOrTx, params: { studyId: string }) {
  const rows = await db
    .select({ status: respondents.status, n: count() })
    .from(respondents)
    .where(eq(respondents.studyId, params.studyId))
    .groupBy(respondents.status);
  return new Map(rows.map((r) => [r.status, Number(r.n)]));
}

export async function medianCompletedDuration(db: DbOrTx, params: { studyId: string }) {
  const [row] = await db
    .select({
      median: sql<
        number | null
      >`percentile_cont(0.5) within group (order by ${respondents.durationMs})`.mapWith((v) =>
        v === null ? null : Number(v),
      ),
    })
    .from(respondents)
    .where(
      and(
        eq(respondents.studyId, params.studyId),
        eq(respondents.status, 'completed'),
        isNotNull(respondents.durationMs),
      ),
    );
  return row?.median ?? null;
}

export async function countByBlock(db: DbOrTx, params: { studyId: string }) {
  const rows = await db
    .select({ block: respondents.block, starts: count(), completed: isCompleted })
    .from(respondents)
    .where(eq(respondents.studyId, params.studyId))
    .groupBy(respondents.block)
    .orderBy(asc(respondents.block));
  return rows.map((r) => ({ ...r, starts: Number(r.starts) }));
}

export async function countByVersion(db: DbOrTx, params: { studyId: string }) {
  const rows = await db
    .select({ version: studyVersions.version, starts: count(), completed: isCompleted })
    .from(respondents)
    .innerJoin(studyVersions, eq(studyVersions.id, respondents.versionId))
    .where(eq(respondents.studyId, params.studyId))
    .groupBy(studyVersions.version)
    .orderBy(asc(studyVersions.version));
  return rows.map((r) => ({ ...r, starts: Number(r.starts) }));
}

/** Respondents with an answer on each non-task screen. */
export async function countReachedByScreen(db: DbOrTx, params: { studyId: string }) {
  const rows = await db
    .select({ key: answers.screenKey, n: count() })
    .from(answers)
    .where(and(eq(answers.studyId, params.studyId), sql`${answers.screenKey} not like 'task:%'`))
    .groupBy(answers.screenKey);
  return new Map(rows.map((r) => [r.key, Number(r.n)]));
}

/** How many respondents answered exactly k design tasks, for every k seen. */
export async function countDesignTasksAnswered(db: DbOrTx, params: { studyId: string }) {
  const perRespondent = db
    .select({ k: count().as('k') })
    .from(answers)
    .where(and(eq(answers.studyId, params.studyId), sql`${answers.screenKey} like 'task:%'`))
    .groupBy(answers.respondentId)
    .as('per_respondent');
  const rows = await db
    .select({ k: perRespondent.k, n: count() })
    .from(perRespondent)
    .groupBy(perRespondent.k);
  return new Map(rows.map((r) => [Number(r.k), Number(r.n)]));
}

/** Unfinished respondents: their latest answered screen and how many design tasks they did. */
export async function listUnfinishedProgress(db: DbOrTx, params: { studyId: string }) {
  const result = await db.execute<{ last_key: string | null; tasks_done: string }>(sql`
    select
      (select a.screen_key from ${answers} a where a.respondent_id = r.id
        order by a.created_at desc, a.id desc limit 1) as last_key,
      (select count(*) from ${answers} a where a.respondent_id = r.id
        and a.screen_key like 'task:%') as tasks_done
    from ${respondents} r
    where r.study_id = ${params.studyId} and r.status = 'in_progress'`);
  return result.rows.map((r) => ({ lastKey: r.last_key, tasksDone: Number(r.tasks_done) }));
}

/** Starts and completes per UTC day. */
export async function countDaily(db: DbOrTx, params: { studyId: string }) {
  const result = await db.execute<{ day: string; starts: string; completed: string }>(sql`
    with days as (
      select to_char(${respondents.startedAt} at time zone 'UTC', 'YYYY-MM-DD') as day,
             1 as started, 0 as completed
        from ${respondents} where ${respondents.studyId} = ${params.studyId}
      union all
      select to_char(${respondents.finishedAt} at time zone 'UTC', 'YYYY-MM-DD'), 0, 1
        from ${respondents}
       where ${respondents.studyId} = ${params.studyId}
         and ${respondents.status} = 'completed' and ${respondents.finishedAt} is not null
    )
    select day, sum(started) as starts, sum(completed) as completed
      from days group by day order by day`);
  return result.rows.map((r) => ({
    date: r.day,
    starts: Number(r.starts),
    completed: Number(r.completed),
  }));
}
