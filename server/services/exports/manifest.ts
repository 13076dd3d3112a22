/** Which downloads a study offers now, and whether the caller's files hold personal columns. */
import { getLatestVersion } from '../../../db/queries/versions';
import type { AppDeps } from '../../deps';
import { loadStudy } from '../study-access';
import { roleCan } from '../../../shared/permissions';
import type { ExportManifest } from '../../../shared/schemas/exports';
import type { Member } from '../tastes/run-context';

export async function getExportManifest(
  deps: AppDeps,
  member: Member,
  studyId: string,
): Promise<ExportManifest> {
  const study = await loadStudy(deps, member.teamId, studyId);
  const version = await getLatestVersion(deps.db, { studyId });
  return {
    personalColumns: roleCan(member.role, 'personal:read'),
    designAvailable: version !== null || study.currentDesignId !== null,
    choicesAvailable: version !== null,
  };
}
