/**
 * What an estimation run reads: a study's frozen versions, its included and completed
 * respondents, their choice answers, and its saved respondent filters. Read-only.
 */
import { and, asc, eq, isNotNull } from 'drizzle-orm';
import type { DbOrTx } from '../client';
import { studyVersions } from '../schema/studies';
import { answers, respondents } from '../schema/fieldwork';
import { respondentFilters } from '../schema/models';

export async function listStudyVersions(db: DbOrTx, params: { studyId: string }) {
  return db
    .select({
      id: studyVersions.id,
      version: studyVersions.version,
      definition: studyVersions.definition,
      design: studyVersions.design,
      questionnaire: studyVersions.questionnaire,
    })
    .from(studyVersions)
    .where(eq(studyVersions.studyId, params.studyId))
    .orderBy(asc(studyVersions.version));
}

/** Respondents who completed the questionnaire and are not excluded. */
export async function listIncludedRespondents(db: DbOrTx, params: { studyId: string }) {
  return db
    .select({ id: respondents.id, versionId: respondents.versionId, flags: respondents.flags })
    .from(respondents)
    .where(
      and(
        eq(respondents.studyId, params.studyId),
        eq(respondents.status, 'completed'),
        eq(respondents.included, true),
      ),
    )
    .orderBy(asc(respondents.id));
}

/** Every choice answer (design, warm-up and holdout tasks) of the study's respondents. */
export async function listChoiceAnswers(db: DbOrTx, params: { studyId: string }) {
  return db
    .select({
      respondentId: answers.respondentId,
      screenKey: answers.screenKey,
      taskNumber: answers.taskNumber,
      chosenAlternative: answers.chosenAlternative,
      chosenPosition: answers.chosenPosition,
      responseMs: answers.responseMs,
      value: answers.value,
    })
    .from(answers)
    .where(and(eq(answers.studyId, params.studyId), isNotNull(answers.chosenAlternative)))
    .orderBy(asc(answers.respondentId), asc(answers.screenKey));
}

/** Background answers (q:<key>) of the study, for saved filters. */
export async function listQuestionAnswers(db: DbOrTx, params: { studyId: string }) {
  return db
    .select({
      respondentId: answers.respondentId,
      screenKey: answers.screenKey,
      value: answers.value,
    })
    .from(answers)
    .where(eq(answers.studyId, params.studyId));
}

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
