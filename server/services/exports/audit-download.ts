/** Records a download that holds personal data in the audit trail (file name, never contents). */
import type { AppDeps } from '../../deps';
import { recordAudit } from '../audit';
import type { Actor } from '../actor';
import type { Download } from './download';

export async function auditPersonalDownload(
  deps: AppDeps,
  actor: Actor,
  studyId: string,
  file: Download,
): Promise<void> {
  if (!file.personal) return;
  await recordAudit(deps.db, {
    teamId: actor.teamId,
    studyId,
    actor,
    action: 'export.personal_data',
    details: { file: file.filename },
  });
}
