/**
 * Loads a study for a team member. Used by every study-scoped route after requireTeam has
 * checked the role: the team id comes from the membership, so other teams' studies are 404.
 */
import type { AppDeps } from '../deps';
import { NotFoundError } from '../lib/errors';
import type { DbOrTx } from '../../db/client';
import { getStudyById } from '../../db/queries/studies';
import { lockStudy } from '../../db/queries/versions';

export async function loadStudy(deps: AppDeps, teamId: string, studyId: string) {
  const study = await getStudyById(deps.db, { id: studyId, teamId });
  if (!study) throw new NotFoundError('Study');
  return study;
}

/** Locks the team's study row for the rest of the transaction `tx` (404 when it is not theirs). */
export async function lockStudyOrThrow(tx: DbOrTx, teamId: string, studyId: string) {
  const study = await lockStudy(tx, { id: studyId, teamId });
  if (!study) throw new NotFoundError('Study');
  return study;
}
