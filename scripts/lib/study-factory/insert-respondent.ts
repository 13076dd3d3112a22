/**
 * A respondent of a frozen version with their answers, written straight into the tables (the
 * respondent flow itself is tested through its routes). Only what a test gives is set; the
 * rest is left to the tables' defaults, so timings and flags stay what the test says.
 */
import { randomBytes } from 'node:crypto';
import { nanoid } from 'nanoid';
import type { Db } from '../../../db/client';
import { answers, respondents } from '../../../db/schema/fieldwork';

type RespondentRow = typeof respondents.$inferInsert;
type AnswerRow = typeof answers.$inferInsert;

export type RespondentOverrides = Partial<
  Omit<RespondentRow, 'studyId' | 'versionId' | 'finishedAt'>
> & {
  studyId: string;
  versionId: string;
  /** Sets finishedAt = startedAt + durationMs unless the respondent is still answering. */
  durationMs?: number | null;
  /** Answers in order; respondent, study and a unique client id are filled in. */
  answers?: Array<Omit<AnswerRow, 'respondentId' | 'studyId' | 'clientId'> & { clientId?: string }>;
};

export async function insertRespondentRow(db: Db, o: RespondentOverrides): Promise<string> {
  const { answers: given = [], durationMs = null, ...row } = o;
  const status = row.status ?? 'completed';
  const finished = status !== 'in_progress' && durationMs !== null;
  const startedAt = row.startedAt ?? (finished ? new Date(Date.now() - durationMs) : undefined);
  const [r] = await db
    .insert(respondents)
    .values({
      sessionToken: randomBytes(24).toString('base64url'),
      block: 1,
      plan: {},
      ...row,
      status,
      startedAt,
      finishedAt: finished ? new Date(startedAt!.getTime() + durationMs) : null,
      durationMs: status === 'in_progress' ? null : durationMs,
    })
    .returning({ id: respondents.id });
  if (given.length > 0)
    await db.insert(answers).values(
      given.map((a) => ({
        clientId: `fixture-${nanoid(10)}`,
        ...a,
        respondentId: r.id,
        studyId: o.studyId,
      })),
    );
  return r.id;
}
