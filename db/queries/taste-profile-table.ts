/**
 * The Tastes table: one page of a run's profiles, filtered and sorted in SQL. Tenant: the run
 * and the study are in the where-clause (profiles join their respondent); the caller has loaded
 * both for the team.
 */
import { and, asc, count, eq, sql, type SQL } from 'drizzle-orm';
import type { DbOrTx } from '../client';
import { tasteProfiles } from '../schema/models';
import { respondents } from '../schema/fieldwork';
import { respondentNumber } from './respondent-number';
import { profileColumns, type ProfileRow } from './taste-profiles';

/** True when the respondent's flags (an object of flag → value, or a list) hold any flag. */
const isFlagged = sql`(case jsonb_typeof(${respondents.flags})
  when 'object' then exists (select 1 from jsonb_each(${respondents.flags}) f where f.value not in ('false'::jsonb, 'null'::jsonb, '0'::jsonb))
  when 'array' then jsonb_array_length(${respondents.flags}) > 0
  else false end)`;

export type TasteSort =
  { by: 'number' | 'effectiveDraws' } | { by: 'mean' | 'sd' | 'wtp'; coefficient: string };

export type TasteFilters = {
  lowDrawsBelow: number;
  lowDraws?: boolean;
  flagged?: boolean;
  /** Background answer: question key and option id or number (as text). */
  answer?: { key: string; value: string };
};

function sortExpression(sort: TasteSort): SQL {
  switch (sort.by) {
    case 'number':
      return respondentNumber;
    case 'effectiveDraws':
      return sql`${tasteProfiles.effectiveDraws}`;
    case 'mean':
      return sql`(${tasteProfiles.mean}->>${sort.coefficient})::float8`;
    case 'sd':
      return sql`(${tasteProfiles.sd}->>${sort.coefficient})::float8`;
    case 'wtp':
      return sql`(${tasteProfiles.wtp}->>${sort.coefficient})::float8`;
  }
}

function filterConditions(params: { runId: string; studyId: string } & TasteFilters): SQL[] {
  const where: SQL[] = [
    eq(tasteProfiles.runId, params.runId),
    eq(respondents.studyId, params.studyId),
  ];
  if (params.lowDraws !== undefined)
    where.push(
      params.lowDraws
        ? sql`${tasteProfiles.effectiveDraws} < ${params.lowDrawsBelow}`
        : sql`${tasteProfiles.effectiveDraws} >= ${params.lowDrawsBelow}`,
    );
  if (params.flagged !== undefined) where.push(params.flagged ? isFlagged : sql`not ${isFlagged}`);
  if (params.answer) {
    const { key, value } = params.answer;
    where.push(sql`exists (select 1 from answers a where a.respondent_id = ${respondents.id}
      and a.screen_key = ${`q:${key}`}
      and (a.value->>'optionId' = ${value} or coalesce(a.value->'optionIds', '[]'::jsonb) ? ${value}
        or a.value->>'number' = ${value}))`);
  }
  return where;
}

/** One page of profiles, sorted in SQL (nulls last, ties by respondent number), and the total. */
export async function listTasteRows(
  db: DbOrTx,
  params: {
    runId: string;
    studyId: string;
    sort: TasteSort;
    dir: 'asc' | 'desc';
  } & TasteFilters & {
      limit: number;
      offset: number;
    },
): Promise<{ rows: ProfileRow[]; total: number }> {
  const where = and(...filterConditions(params));
  const key = sortExpression(params.sort);
  const order = params.dir === 'asc' ? sql`${key} asc nulls last` : sql`${key} desc nulls last`;
  const rows = await db
    .select(profileColumns)
    .from(tasteProfiles)
    .innerJoin(respondents, eq(respondents.id, tasteProfiles.respondentId))
    .where(where)
    .orderBy(order, asc(respondents.startedAt), asc(respondents.id))
    .limit(params.limit)
    .offset(params.offset);
  const [{ total }] = await db
    .select({ total: count() })
    .from(tasteProfiles)
    .innerJoin(respondents, eq(respondents.id, tasteProfiles.respondentId))
    .where(where);
  return { rows, total };
}
