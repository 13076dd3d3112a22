/** Records a download that holds personal data in the audit trail (file name, never contents). */
import type { AppDeps } from '../../deps';
import { recordAudit, type Actor } from '../audit';
import type { Member } from '../tastes/run-context';
import type { Download } from './download';

export async function auditPersonalDownload(
  deps: AppDeps,
  member: Member,
  actor: Actor,
  studyId: string,
  file: Download,
): Promise<void> {
  if (!file.personal) return;
  await recordAudit(deps.db, {
    teamId: member.teamId,
    studyId,
    actor,
    action: 'export.personal_data',
    details: { file: file.filename },
  });
}
