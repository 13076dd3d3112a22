/**
 * Reads for the Tastes, Shares and Exports sections: finished runs, taste profiles joined to
 * their respondents (paged and sorted in SQL), background answers and task choices. The team
 * and study are part of every where-clause.
 */
import { and, asc, count, desc, eq, like, sql, type SQL } from 'drizzle-orm';
import { respondentNumber } from './respondent-number';
import type { DbOrTx } from '../client';
import { runs, tasteProfiles } from '../schema/models';
import { answers, respondents } from '../schema/fieldwork';

export const runColumns = {
  id: runs.id,
  studyId: runs.studyId,
  name: runs.name,
  model: runs.model,
  spec: runs.spec,
  status: runs.status,
  results: runs.results,
  dataHash: runs.dataHash,
  erasedRespondents: runs.erasedRespondents,
  createdAt: runs.createdAt,
  finishedAt: runs.finishedAt,
};

export async function getRunOfStudy(
  db: DbOrTx,
  params: { id: string; teamId: string; studyId: string },
) {
  const [row] = await db
    .select(runColumns)
    .from(runs)
    .where(
      and(eq(runs.id, params.id), eq(runs.teamId, params.teamId), eq(runs.studyId, params.studyId)),
    );
  return row ?? null;
}

/** Finished runs of a study, newest first, with how many taste profiles each stored. */
export async function listFinishedRuns(db: DbOrTx, params: { teamId: string; studyId: string }) {
  const profiles = sql<number>`(select count(*)::int from taste_profiles tp where tp.run_id = ${runs.id})`;
  return db
    .select({ ...runColumns, profiles: profiles.mapWith(Number) })
    .from(runs)
    .where(
      and(
        eq(runs.teamId, params.teamId),
        eq(runs.studyId, params.studyId),
        eq(runs.status, 'done'),
      ),
    )
    .orderBy(desc(runs.finishedAt), desc(runs.createdAt));
}

const profileColumns = {
  respondentId: tasteProfiles.respondentId,
  number: respondentNumber.mapWith(Number),
  externalId: respondents.externalId,
  block: respondents.block,
  flags: respondents.flags,
  included: respondents.included,
  versionId: respondents.versionId,
  mean: tasteProfiles.mean,
  sd: tasteProfiles.sd,
  wtp: tasteProfiles.wtp,
  effectiveDraws: tasteProfiles.effectiveDraws,
  extra: tasteProfiles.extra,
};
export type ProfileRow = {
  respondentId: string;
  number: number;
  externalId: string | null;
  block: number;
  flags: unknown;
  included: boolean;
  versionId: string;
  mean: unknown;
  sd: unknown;
  wtp: unknown;
  effectiveDraws: number;
  /** HB intervals, latent class probabilities (db/queries/taste-profiles.ts TasteProfileExtra). */
  extra: unknown;
};

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

/** Every profile of a run in respondent order (exports, segments, shares). */
export async function listRunProfiles(
  db: DbOrTx,
  params: { runId: string; studyId: string },
): Promise<ProfileRow[]> {
  return db
    .select(profileColumns)
    .from(tasteProfiles)
    .innerJoin(respondents, eq(respondents.id, tasteProfiles.respondentId))
    .where(and(eq(tasteProfiles.runId, params.runId), eq(respondents.studyId, params.studyId)))
    .orderBy(asc(respondents.startedAt), asc(respondents.id));
}

export async function getRunProfile(
  db: DbOrTx,
  params: { runId: string; studyId: string; respondentId: string },
): Promise<ProfileRow | null> {
  const [row] = await db
    .select(profileColumns)
    .from(tasteProfiles)
    .innerJoin(respondents, eq(respondents.id, tasteProfiles.respondentId))
    .where(
      and(
        eq(tasteProfiles.runId, params.runId),
        eq(tasteProfiles.respondentId, params.respondentId),
        eq(respondents.studyId, params.studyId),
      ),
    );
  return row ?? null;
}

/** Background-question answers (screen keys q:<key>) of a study's respondents. */
export async function listQuestionAnswers(
  db: DbOrTx,
  params: { studyId: string; respondentIds?: readonly string[] },
) {
  const where = [eq(answers.studyId, params.studyId), like(answers.screenKey, 'q:%')];
  if (params.respondentIds) {
    if (params.respondentIds.length === 0) return [];
    where.push(sql`${answers.respondentId} in ${params.respondentIds}`);
  }
  return db
    .select({
      respondentId: answers.respondentId,
      screenKey: answers.screenKey,
      value: answers.value,
    })
    .from(answers)
    .where(and(...where));
}

/** The alternative each respondent chose in one design task. */
export async function listTaskChoices(db: DbOrTx, params: { studyId: string; task: number }) {
  return db
    .select({ respondentId: answers.respondentId, chosen: answers.chosenAlternative })
    .from(answers)
    .where(
      and(
        eq(answers.studyId, params.studyId),
        eq(answers.screenKey, `task:${params.task}`),
        eq(answers.taskNumber, params.task),
      ),
    );
}

/** A respondent's design-task answers in the order they were given. */
export async function listRespondentTaskAnswers(
  db: DbOrTx,
  params: { studyId: string; respondentId: string },
) {
  return db
    .select({
      task: answers.taskNumber,
      chosen: answers.chosenAlternative,
      responseMs: answers.responseMs,
      createdAt: answers.createdAt,
    })
    .from(answers)
    .where(
      and(
        eq(answers.studyId, params.studyId),
        eq(answers.respondentId, params.respondentId),
        sql`${answers.taskNumber} is not null`,
      ),
    )
    .orderBy(asc(answers.createdAt));
}

export async function countRunProfiles(db: DbOrTx, params: { runId: string }) {
  const [{ total }] = await db
    .select({ total: count() })
    .from(tasteProfiles)
    .where(eq(tasteProfiles.runId, params.runId));
  return total;
}
