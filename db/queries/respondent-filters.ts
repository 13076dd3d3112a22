/**
 * Saved respondent filters (which respondents a run uses). Tenant: filters belong to a study;
 * every function filters on it, and the caller has loaded the study for the team.
 */
import { and, asc, eq } from 'drizzle-orm';
import type { DbOrTx } from '../client';
import { respondentFilters } from '../schema/models';

export async function listRespondentFilters(db: DbOrTx, params: { studyId: string }) {
  return db
    .select({ id: respondentFilters.id, name: respondentFilters.name })
    .from(respondentFilters)
    .where(eq(respondentFilters.studyId, params.studyId))
    .orderBy(asc(respondentFilters.name));
}

export async function getRespondentFilter(db: DbOrTx, params: { id: string; studyId: string }) {
  const [row] = await db
    .select({
      id: respondentFilters.id,
      name: respondentFilters.name,
      definition: respondentFilters.definition,
    })
    .from(respondentFilters)
    .where(and(eq(respondentFilters.id, params.id), eq(respondentFilters.studyId, params.studyId)));
  return row ?? null;
}

export async function insertRespondentFilter(
  db: DbOrTx,
  params: { studyId: string; name: string; definition: unknown },
) {
  const [row] = await db
    .insert(respondentFilters)
    .values(params)
    .returning({ id: respondentFilters.id, name: respondentFilters.name });
  return row;
}
