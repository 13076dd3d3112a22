/** Each respondent's taste profile from a run (one row per respondent). */
import { asc, eq } from 'drizzle-orm';
import type { DbOrTx } from '../client';
import { tasteProfiles } from '../schema/models';

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

/** Profiles of a run; the caller has already checked that the run belongs to the team. */
export async function listTasteProfiles(db: DbOrTx, params: { runId: string }) {
  return db
    .select({
      respondentId: tasteProfiles.respondentId,
      mean: tasteProfiles.mean,
      sd: tasteProfiles.sd,
      wtp: tasteProfiles.wtp,
      effectiveDraws: tasteProfiles.effectiveDraws,
      extra: tasteProfiles.extra,
    })
    .from(tasteProfiles)
    .where(eq(tasteProfiles.runId, params.runId))
    .orderBy(asc(tasteProfiles.respondentId));
}
