/**
 * A study's respondents as analysis and downloads read them. Tenant: respondents carry the
 * study, not the team; the caller has loaded the study for the team (or the worker its run).
 */
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
      language: respondents.language,
      status: respondents.status,
      included: respondents.included,
      exclusionReason: respondents.exclusionReason,
      versionId: respondents.versionId,
      durationMs: respondents.durationMs,
      flags: respondents.flags,
      startedAt: respondents.startedAt,
      finishedAt: respondents.finishedAt,
      plan: respondents.plan,
    })
    .from(respondents)
    .where(eq(respondents.studyId, params.studyId))
    .orderBy(asc(respondents.startedAt), asc(respondents.id));
}

/**
 * Respondents who completed the questionnaire and are not excluded (what a run estimates on),
 * in respondent-number order (order of starting, ties by id: db/queries/respondent-number.ts).
 */
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
    .orderBy(asc(respondents.startedAt), asc(respondents.id));
}
