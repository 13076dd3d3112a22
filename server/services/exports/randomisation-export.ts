/** The randomisation-record download (exports/randomisation-table.ts): no personal columns. */
import type { AppDeps } from '../../deps';
import { loadStudy } from '../study-access';
import type { Member } from '../tastes/run-context';
import { listStudyRespondents } from '../../../db/queries/exports';
import { writeCsv } from '../../lib/safe-csv';
import { CSV, fileName, type Download } from './download';
import { buildRandomisationRows, randomisationHeader } from './randomisation-table';

export async function exportRandomisationCsv(
  deps: AppDeps,
  member: Member,
  studyId: string,
  at = new Date(),
): Promise<Download> {
  const study = await loadStudy(deps, member.teamId, studyId);
  const respondents = await listStudyRespondents(deps.db, { studyId });
  return {
    filename: fileName(study.name, 'randomisation', 'csv', at),
    contentType: CSV,
    body: writeCsv(randomisationHeader, buildRandomisationRows(respondents)),
  };
}
