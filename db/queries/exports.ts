/** Reads for downloads that are not tied to a run: the study's respondents. */
import { and, asc, eq } from 'drizzle-orm';
import type { DbOrTx } from '../client';
import { respondentNumber } from './respondent-number';
import { respondents } from '../schema/fieldwork';

/** Every respondent of a study in order of starting, with their stable number. */
export async function listStudyRespondents(db: DbOrTx, params: { studyId: string }) {
  return db
    .select({
      id: respondents.id,
      number: respondentNumber.mapWith(Number),
      externalId: respondents.externalId,
      block: respondents.block,
      status: respondents.status,
      included: respondents.included,
      flags: respondents.flags,
      startedAt: respondents.startedAt,
      finishedAt: respondents.finishedAt,
      plan: respondents.plan,
    })
    .from(respondents)
    .where(and(eq(respondents.studyId, params.studyId)))
    .orderBy(asc(respondents.startedAt), asc(respondents.id));
}
