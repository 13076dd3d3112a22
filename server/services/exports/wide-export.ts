/**
 * The wide respondent file (wide-file.ts) as CSV, its R import script, and the codebook of the
 * study's data files (long choice file and wide file).
 */
import type { AppDeps } from '../../deps';
import { listChoiceAnswers, listQuestionAnswers } from '../../../db/queries/study-answers';
import { loadVersionInputs } from '../choice-data-from-study';
import { indexAnswers } from '../tastes/background-answers';
import { writeCsv } from '../../lib/safe-csv';
import { loadRespondentTable } from './respondent-exports';
import { loadLongChoiceTable } from './choices-export';
import { buildWideTable } from './wide-file';
import { renderRImportScript } from './r-import-script';
import { buildCodebookRows, codebookHeader, writeDocumentedCsv } from './documented-table';
import { fileName, makeDownload, type StudyExporter } from './download';
import type { Actor } from '../actor';

async function loadWideTable(deps: AppDeps, actor: Actor, studyId: string) {
  const { study, personal, questions, respondents } = await loadRespondentTable(
    deps,
    actor,
    studyId,
  );
  const [versions, choices, answers] = await Promise.all([
    loadVersionInputs(deps.db, studyId),
    listChoiceAnswers(deps.db, { studyId }),
    listQuestionAnswers(deps.db, { studyId }),
  ]);
  const table = buildWideTable({
    versions,
    respondents,
    choices,
    questions,
    answers: indexAnswers(answers),
    personal,
  });
  return { study, personal, table };
}

export const exportWideCsv: StudyExporter = async (deps, actor, studyId, at = new Date()) => {
  const { study, personal, table } = await loadWideTable(deps, actor, studyId);
  return makeDownload(
    study.name,
    'respondents-wide',
    'csv',
    at,
    writeDocumentedCsv(table),
    personal,
  );
};

/** The R script for the wide CSV this role downloads on the same day (same columns). */
export const exportWideRScript: StudyExporter = async (deps, actor, studyId, at = new Date()) => {
  const { study, table } = await loadWideTable(deps, actor, studyId);
  const csvName = fileName(study.name, 'respondents-wide', 'csv', at);
  return makeDownload(
    study.name,
    'respondents-wide',
    'R',
    at,
    renderRImportScript(table, csvName, { study: study.name, exportedAt: at }),
  );
};

/** Every column of the long choice file and the wide respondent file. */
export const exportStudyCodebookCsv: StudyExporter = async (
  deps,
  actor,
  studyId,
  at = new Date(),
) => {
  const { study, table } = await loadWideTable(deps, actor, studyId);
  const long = await loadLongChoiceTable(deps, studyId);
  return makeDownload(
    study.name,
    'data-codebook',
    'csv',
    at,
    writeCsv(codebookHeader, buildCodebookRows([long, table])),
  );
};
