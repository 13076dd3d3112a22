/** Answers: one row per (respondent, screen); the client-made id makes retries harmless. */
import { and, asc, eq } from 'drizzle-orm';
import type { DbOrTx } from '../client';
import { answers } from '../schema/fieldwork';

export const answerColumns = {
  id: answers.id,
  respondentId: answers.respondentId,
  clientId: answers.clientId,
  screenKey: answers.screenKey,
  taskNumber: answers.taskNumber,
  chosenAlternative: answers.chosenAlternative,
  chosenPosition: answers.chosenPosition,
  value: answers.value,
  responseMs: answers.responseMs,
  createdAt: answers.createdAt,
};

export async function getAnswerByClientId(
  db: DbOrTx,
  params: { respondentId: string; clientId: string },
) {
  const [row] = await db
    .select(answerColumns)
    .from(answers)
    .where(
      and(eq(answers.respondentId, params.respondentId), eq(answers.clientId, params.clientId)),
    );
  return row ?? null;
}

export async function listAnswers(db: DbOrTx, params: { respondentId: string }) {
  return db
    .select(answerColumns)
    .from(answers)
    .where(eq(answers.respondentId, params.respondentId))
    .orderBy(asc(answers.createdAt), asc(answers.id));
}

export async function listAnsweredKeys(db: DbOrTx, params: { respondentId: string }) {
  const rows = await db
    .select({ screenKey: answers.screenKey })
    .from(answers)
    .where(eq(answers.respondentId, params.respondentId));
  return new Set(rows.map((r) => r.screenKey));
}

/** Returns null when the screen or client id already has a row (nothing written). */
export async function insertAnswer(
  db: DbOrTx,
  params: {
    respondentId: string;
    studyId: string;
    clientId: string;
    screenKey: string;
    taskNumber: number | null;
    chosenAlternative: number | null;
    chosenPosition: number | null;
    value: unknown;
    responseMs: number | null;
    createdAt?: Date;
  },
) {
  const [row] = await db
    .insert(answers)
    .values(params)
    .onConflictDoNothing()
    .returning(answerColumns);
  return row ?? null;
}

/** Many answers at once (demo data); conflicts are skipped. */
export async function insertAnswers(db: DbOrTx, rows: Parameters<typeof insertAnswer>[1][]) {
  if (rows.length === 0) return 0;
  const inserted = await db
    .insert(answers)
    .values(rows)
    .onConflictDoNothing()
    .returning({ id: answers.id });
  return inserted.length;
}
