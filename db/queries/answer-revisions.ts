/**
 * Revised answers: the current answer stays in `answers` (one row per respondent and screen),
 * every answer it replaced moves to `answer_revisions` with the time it was replaced. So an
 * answer is never lost and never counted twice.
 * Tenant: a respondent's own answers by the respondent id their session token resolved
 * (answers.ts); the study-wide downloads filter on the study, which the caller loaded for the team.
 */
import { and, asc, eq, sql } from 'drizzle-orm';
import type { DbOrTx } from '../client';
import { answerRevisions, answers } from '../schema/fieldwork';
import { answerColumns } from './answers';
import { answerFieldsOf } from './study-answers';

export async function getCurrentAnswer(
  db: DbOrTx,
  params: { respondentId: string; screenKey: string },
) {
  const [row] = await db
    .select({
      ...answerColumns,
      revisionCount: answers.revisionCount,
      revisedAt: answers.revisedAt,
    })
    .from(answers)
    .where(
      and(eq(answers.respondentId, params.respondentId), eq(answers.screenKey, params.screenKey)),
    );
  return row ?? null;
}
export type CurrentAnswer = NonNullable<Awaited<ReturnType<typeof getCurrentAnswer>>>;

/** The screen an earlier (replaced) answer with this client id belonged to, if any. */
export async function findReplacedByClientId(
  db: DbOrTx,
  params: { respondentId: string; clientId: string },
) {
  const [row] = await db
    .select({ screenKey: answerRevisions.screenKey })
    .from(answerRevisions)
    .where(
      and(
        eq(answerRevisions.respondentId, params.respondentId),
        eq(answerRevisions.clientId, params.clientId),
      ),
    );
  return row ?? null;
}

/** Moves the current answer to the history and writes the new one in its place. */
export async function replaceAnswer(
  db: DbOrTx,
  params: {
    current: CurrentAnswer;
    studyId: string;
    next: {
      clientId: string;
      taskNumber: number | null;
      chosenAlternative: number | null;
      chosenPosition: number | null;
      value: unknown;
      responseMs: number | null;
    };
    now: Date;
  },
) {
  const { current, next, now } = params;
  await db.insert(answerRevisions).values({
    answerId: current.id,
    respondentId: current.respondentId,
    studyId: params.studyId,
    screenKey: current.screenKey,
    clientId: current.clientId,
    taskNumber: current.taskNumber,
    chosenAlternative: current.chosenAlternative,
    chosenPosition: current.chosenPosition,
    value: current.value,
    responseMs: current.responseMs,
    answeredAt: current.revisedAt ?? current.createdAt,
    replacedAt: now,
  });
  const [row] = await db
    .update(answers)
    .set({
      ...next,
      revisionCount: sql`${answers.revisionCount} + 1`,
      revisedAt: now,
    })
    .where(eq(answers.id, current.id))
    .returning({ id: answers.id, revisionCount: answers.revisionCount });
  return row;
}

/**
 * The current answers that replaced earlier ones, per study (the answer-history download and
 * the revised_screens column), each respondent's by screen key: one per screen, so the order
 * is the same on every read (answers written together share their created_at).
 */
export async function listRevisedAnswers(db: DbOrTx, params: { studyId: string }) {
  return db
    .select({
      ...answerFieldsOf(answers),
      answeredAt: sql<Date>`coalesce(${answers.revisedAt}, ${answers.createdAt})`.mapWith(
        answers.createdAt,
      ),
      revisionCount: answers.revisionCount,
    })
    .from(answers)
    .where(and(eq(answers.studyId, params.studyId), sql`${answers.revisionCount} > 0`))
    .orderBy(asc(answers.respondentId), asc(answers.screenKey));
}

/** Every replaced answer of a study, each screen's oldest first (the answer-history download). */
export async function listAnswerHistory(db: DbOrTx, params: { studyId: string }) {
  return db
    .select({
      ...answerFieldsOf(answerRevisions),
      answeredAt: answerRevisions.answeredAt,
      replacedAt: answerRevisions.replacedAt,
    })
    .from(answerRevisions)
    .where(eq(answerRevisions.studyId, params.studyId))
    .orderBy(
      asc(answerRevisions.respondentId),
      asc(answerRevisions.screenKey),
      asc(answerRevisions.replacedAt),
      asc(answerRevisions.id),
    );
}
