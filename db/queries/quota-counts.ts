/**
 * Completes per answer of one screening question, for segment quotas
 * (server/services/segment-quotas.ts classifies the answers into cells). Scoped to one study:
 * the caller names it from the respondent's own study.
 * Tenant: the study.
 */
import { and, count, eq } from 'drizzle-orm';
import type { DbOrTx } from '../client';
import { answers, respondents } from '../schema/fieldwork';
import type { AnswerValue } from '../../shared/schemas/respondent';

export async function countCompletesByAnswer(
  db: DbOrTx,
  params: { studyId: string; screenKey: string },
): Promise<{ value: AnswerValue; n: number }[]> {
  const rows = await db
    .select({ value: answers.value, n: count() })
    .from(answers)
    .innerJoin(respondents, eq(respondents.id, answers.respondentId))
    .where(
      and(
        eq(answers.studyId, params.studyId),
        eq(answers.screenKey, params.screenKey),
        eq(respondents.studyId, params.studyId),
        eq(respondents.status, 'completed'),
      ),
    )
    .groupBy(answers.value);
  return rows.map((r) => ({ value: r.value as AnswerValue, n: Number(r.n) }));
}
