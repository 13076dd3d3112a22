/**
 * The long choice file. Without a run: every respondent who answered a choice task, with
 * inclusion, task order, positions and times (long-choice-file.ts). With a run: exactly the
 * data the run was estimated on (the included respondents of its saved filter, in its data
 * order, its columns), whose SHA-256 is the run's data hash.
 */
import type { AppDeps } from '../../deps';
import { NotFoundError } from '../../lib/errors';
import { loadStudy } from '../study-access';
import { getRunById } from '../../../db/queries/runs';
import { listChoiceAnswers } from '../../../db/queries/study-answers';
import { listStudyRespondents } from '../../../db/queries/study-respondents';
import {
  codeStudyAnswers,
  groupChoiceAnswers,
  loadRunChoiceData,
  loadVersionInputs,
  toLongCsvText,
} from '../choice-data-from-study';
import { buildLongChoiceTable } from './long-choice-file';
import { writeDocumentedCsv, type DocumentedTable } from './documented-table';
import { makeDownload, type Download } from './download';
import type { Actor } from '../actor';

/** The long choice file of every respondent (see the file comment). */
export async function loadLongChoiceTable(
  deps: AppDeps,
  studyId: string,
): Promise<DocumentedTable> {
  const versions = await loadVersionInputs(deps.db, studyId);
  const [respondents, answers] = await Promise.all([
    listStudyRespondents(deps.db, { studyId }),
    listChoiceAnswers(deps.db, { studyId }),
  ]);
  const prepared = codeStudyAnswers(versions, groupChoiceAnswers(respondents, answers));
  return buildLongChoiceTable(prepared, versions, respondents, answers);
}

export async function exportChoicesCsv(
  deps: AppDeps,
  actor: Actor,
  studyId: string,
  runId?: string,
  at = new Date(),
): Promise<Download> {
  const study = await loadStudy(deps, actor.teamId, studyId);
  const file = (kind: string, body: string): Download =>
    makeDownload(study.name, kind, 'csv', at, body);
  if (!runId) {
    const table = await loadLongChoiceTable(deps, studyId);
    return file('choices-long', writeDocumentedCsv(table));
  }
  const run = await getRunById(deps.db, { id: runId, teamId: actor.teamId, studyId });
  if (!run) throw new NotFoundError('Run');
  const { prepared, keys } = await loadRunChoiceData(deps.db, { studyId, storedSpec: run.spec });
  return file('choices-estimated', toLongCsvText(prepared, keys));
}
