/** Which downloads a study offers now, and whether the caller's files hold personal columns. */
import { getLatestVersion } from '../../../db/queries/versions';
import type { AppDeps } from '../../deps';
import { loadStudy } from '../study-access';
import { roleCan } from '../../../shared/permissions';
import type { ExportManifest } from '../../../shared/schemas/exports';
import type { Actor } from '../actor';

export async function getExportManifest(
  deps: AppDeps,
  actor: Actor,
  studyId: string,
): Promise<ExportManifest> {
  const study = await loadStudy(deps, actor.teamId, studyId);
  const version = await getLatestVersion(deps.db, { studyId });
  return {
    personalColumns: roleCan(actor.role, 'personal:read'),
    designAvailable: version !== null || study.currentDesignId !== null,
    choicesAvailable: version !== null,
  };
}
