/**
 * A study's answers as analysis reads them: choice answers (estimation, quality flags, long and
 * wide files), background answers (filters, segments, exports) and per-task choices (Tastes).
 * Tenant: answers carry the study, not the team; every function filters on the study, which
 * the caller has loaded for the team (loadStudy), or which the worker read from its run.
 */
import { and, asc, eq, isNotNull, like, sql } from 'drizzle-orm';
import type { DbOrTx } from '../client';
import { answerRevisions, answers, respondents } from '../schema/fieldwork';

/**
 * What a respondent answered on a screen, from the current answers or from the replaced ones
 * (answer_revisions has the same columns), for every read that lists answers.
 */
export function answerFieldsOf<T extends typeof answers | typeof answerRevisions>(t: T) {
  return {
    respondentId: t.respondentId,
    screenKey: t.screenKey,
    taskNumber: t.taskNumber,
    chosenAlternative: t.chosenAlternative,
    chosenPosition: t.chosenPosition,
    value: t.value,
    responseMs: t.responseMs,
  };
}

/**
 * Every answered choice screen of the study (design, warm-up, holdout, repeat and dominance
 * tasks), in respondent-number order (order of starting, ties by id, as
 * db/queries/respondent-number.ts counts) and screen order, so nothing read from it depends on
 * the respondents' random ids. The task kind, repeated task and dominance outcome are in
 * `value` (server/services/answer-shape.ts).
 */
export async function listChoiceAnswers(db: DbOrTx, params: { studyId: string }) {
  return db
    .select(answerFieldsOf(answers))
    .from(answers)
    .innerJoin(respondents, eq(respondents.id, answers.respondentId))
    .where(and(eq(answers.studyId, params.studyId), isNotNull(answers.chosenAlternative)))
    .orderBy(asc(respondents.startedAt), asc(respondents.id), asc(answers.screenKey));
}
export type ChoiceAnswerRow = Awaited<ReturnType<typeof listChoiceAnswers>>[number];

/** Background-question answers (screen keys q:<key>), of all or of the given respondents. */
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
