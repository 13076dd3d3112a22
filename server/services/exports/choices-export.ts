/** Long-format choice data of every included respondent; with a run, only its columns. */
import type { AppDeps } from '../../deps';
import { NotFoundError } from '../../lib/errors';
import { loadStudy } from '../study-access';
import { getRunOfStudy } from '../../../db/queries/tastes';
import { loadStudyChoiceData, toLongCsvRows } from '../choice-data-from-study';
import type { Member } from '../tastes/run-context';
import { writeCsv } from '../../lib/safe-csv';
import { CSV, fileName, type Download } from './download';

export async function exportChoicesCsv(
  deps: AppDeps,
  member: Member,
  studyId: string,
  runId?: string,
  at = new Date(),
): Promise<Download> {
  const study = await loadStudy(deps, member.teamId, studyId);
  let keys: string[] | undefined;
  if (runId) {
    const run = await getRunOfStudy(deps.db, { id: runId, teamId: member.teamId, studyId });
    if (!run) throw new NotFoundError('Run');
    keys = (run.spec as { coefficients: { name: string; column?: string }[] }).coefficients.map(
      (c) => c.column ?? c.name,
    );
  }
  const prepared = await loadStudyChoiceData(deps.db, { studyId });
  const table = toLongCsvRows(prepared, keys);
  return {
    filename: fileName(study.name, 'choices-long', 'csv', at),
    contentType: CSV,
    body: writeCsv(table.header, table.rows),
  };
}
