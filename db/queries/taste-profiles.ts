/**
 * Each respondent's taste profile from a run (one row per respondent). Tenant: profiles have no
 * team column; every read joins the respondent and filters on the study, and callers pass a run
 * and study they have already loaded for the team (getRunById). Writes come from the
 * estimation worker, which knows the run from the job queue.
 */
import { and, asc, eq } from 'drizzle-orm';
import type { DbOrTx } from '../client';
import { tasteProfiles } from '../schema/models';
import { respondents } from '../schema/fieldwork';
import { respondentNumber } from './respondent-number';

export type TasteProfileInsert = {
  respondentId: string;
  mean: Record<string, number>;
  sd: Record<string, number>;
  wtp: Record<string, number> | null;
  effectiveDraws: number;
  /** Family fields: HB intervals, latent class probabilities (null for MNL and mixed logit). */
  extra?: TasteProfileExtra | null;
};

export type TasteProfileExtra = {
  lower?: Record<string, number>;
  upper?: Record<string, number>;
  wtpSd?: Record<string, number>;
  wtpLower?: Record<string, number>;
  wtpUpper?: Record<string, number>;
  classProbabilities?: number[];
  likeliestClass?: number;
};

const BATCH = 500;

/** Replaces the run's profiles (a retried run writes them again). */
export async function replaceTasteProfiles(
  db: DbOrTx,
  params: { runId: string; profiles: TasteProfileInsert[] },
) {
  await db.delete(tasteProfiles).where(eq(tasteProfiles.runId, params.runId));
  for (let i = 0; i < params.profiles.length; i += BATCH) {
    await db
      .insert(tasteProfiles)
      .values(params.profiles.slice(i, i + BATCH).map((p) => ({ ...p, runId: params.runId })));
  }
}

export const profileColumns = {
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
  /** HB intervals, latent class probabilities (TasteProfileExtra). */
  extra: unknown;
};

/** Every profile of a run in respondent order (exports, segments, shares, density charts). */
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

/** How many profiles the run stored; the caller has loaded the run for the team. */
export async function countRunProfiles(db: DbOrTx, params: { runId: string }) {
  return db.$count(tasteProfiles, eq(tasteProfiles.runId, params.runId));
}
