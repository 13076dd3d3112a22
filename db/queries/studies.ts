import { and, eq } from 'drizzle-orm';
import type { DbOrTx } from '../client';
import { studies } from '../schema/studies';

export const studyColumns = {
  id: studies.id,
  teamId: studies.teamId,
  publicId: studies.publicId,
  name: studies.name,
  description: studies.description,
  status: studies.status,
  definition: studies.definition,
  questionnaire: studies.questionnaire,
  settings: studies.settings,
  currentDesignId: studies.currentDesignId,
  currentVersion: studies.currentVersion,
  archivedAt: studies.archivedAt,
  createdAt: studies.createdAt,
  updatedAt: studies.updatedAt,
};

/** The tenant is part of every look-up: a study id from another team finds nothing. */
export async function getStudyById(db: DbOrTx, params: { id: string; teamId: string }) {
  const [row] = await db
    .select(studyColumns)
    .from(studies)
    .where(and(eq(studies.id, params.id), eq(studies.teamId, params.teamId)));
  return row ?? null;
}
