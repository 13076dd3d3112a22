/**
 * Creating a study from choice data collected elsewhere. The preview reads the files, infers
 * the attributes (or checks the set-up sent) and lists every problem with its line and column;
 * it saves nothing. The save reads the files again with the confirmed set-up and, only when
 * there is no problem at all, stores in one transaction a closed study marked as imported,
 * its one frozen version, and the respondents and answers in the same tables as fielded data
 * (so Models, Tastes, Shares and Exports read them the one way they read any study).
 */
import { randomUUID } from 'node:crypto';
import { nanoid } from 'nanoid';
import type { AppDeps } from '../deps';
import { AppError } from '../lib/errors';
import { recordAudit } from './audit';
import { createSessionToken } from './respondent-session';
import {
  insertImportedAnswers,
  insertImportedRespondents,
  insertImportedStudy,
  type ImportedAnswerColumns,
} from '../../db/queries/study-import';
import { insertVersion } from '../../db/queries/versions';
import type { ImportPreview, ImportResult, ImportSetup } from '../../shared/schemas/study-import';
import { analyseImport, toImportPreview, type ImportFiles } from './study-import/analyse-import';
import {
  toDesign,
  toQuestionnaire,
  toRespondents,
  toStudyDefinition,
} from './study-import/build-imported-study';
import type { BackgroundScan } from './study-import/read-background-file';
import type { Actor } from './actor';

export async function previewStudyImport(
  files: ImportFiles,
  setup: Pick<ImportSetup, 'attributes'> | null,
): Promise<ImportPreview> {
  return toImportPreview(await analyseImport(files, setup));
}

export async function saveStudyImport(
  deps: AppDeps,
  actor: Actor,
  files: ImportFiles,
  setup: ImportSetup,
): Promise<ImportResult> {
  const analysis = await analyseImport(files, setup);
  const { scan } = analysis;
  if (scan.problems.count === 0 && scan.rows === 0)
    scan.problems.add({
      file: 'choices',
      line: null,
      column: null,
      code: 'unreadable',
      message: 'The file has a header but no data lines.',
    });
  if (scan.problems.count > 0)
    throw new AppError(
      422,
      'import_problems',
      `The files have ${scan.problems.count.toLocaleString('en')} problem${scan.problems.count === 1 ? '' : 's'}; nothing was saved. Fix them and upload again.`,
      scan.problems.listed().map((p) => ({
        path: `${p.file}${p.line !== null ? `[line ${p.line}]` : ''}${p.column !== null ? `.${p.column}` : ''}`,
        message: p.message,
      })),
    );
  const definition = toStudyDefinition(setup.attributes, analysis.alternativesPerTask);
  const background = analysis.background?.columns ?? [];
  const questionnaire = toQuestionnaire(definition, background);
  const design = toDesign(analysis);
  const respondents = toRespondents(analysis).map((r, i) => ({
    ...r,
    id: randomUUID(),
    sessionToken: createSessionToken(),
    // Respondent numbers follow the order of starting: keep the file's order.
    startedAt: new Date(Date.now() + i),
  }));
  const answers = toAnswerColumns(respondents, analysis.background);
  return deps.db.transaction(async (tx) => {
    const study = await insertImportedStudy(tx, {
      teamId: actor.teamId,
      publicId: nanoid(16),
      name: setup.name,
      description: setup.description,
      definition,
      questionnaire,
      createdBy: actor.userId,
    });
    const version = await insertVersion(tx, {
      studyId: study.id,
      version: 1,
      definition,
      design,
      questionnaire,
    });
    await insertImportedRespondents(tx, {
      studyId: study.id,
      versionId: version.id,
      rows: respondents,
    });
    await insertImportedAnswers(tx, { studyId: study.id, answers });
    await recordAudit(tx, {
      teamId: actor.teamId,
      studyId: study.id,
      actor,
      action: 'study.imported',
      details: { study: setup.name, respondents: respondents.length, rows: scan.rows },
    });
    return {
      studyId: study.id,
      respondents: respondents.length,
      tasks: scan.taskId.length,
      rows: scan.rows,
    };
  });
}

/** Choice answers as the respondent app stores them, then background answers as q:<key>. */
function toAnswerColumns(
  respondents: readonly { id: string; tasks: number[]; chosen: number[] }[],
  background: BackgroundScan | null,
): ImportedAnswerColumns {
  const out: ImportedAnswerColumns = {
    respondentId: [],
    screenKey: [],
    taskNumber: [],
    chosen: [],
    value: [],
  };
  respondents.forEach((r, i) => {
    r.tasks.forEach((task, k) => {
      out.respondentId.push(r.id);
      out.screenKey.push(`task:${task}`);
      out.taskNumber.push(task);
      out.chosen.push(r.chosen[k]);
      out.value.push(JSON.stringify({ kind: 'choice', position: r.chosen[k], taskKind: 'design' }));
    });
    const given = background?.answers.get(i);
    if (!given || !background) return;
    background.columns.forEach((column, c) => {
      const raw = given[c];
      if (raw === '') return;
      out.respondentId.push(r.id);
      out.screenKey.push(`q:${column.key}`);
      out.taskNumber.push(null);
      out.chosen.push(null);
      out.value.push(
        JSON.stringify(
          column.type === 'number'
            ? { kind: 'number', number: Number(raw) }
            : { kind: 'single', optionId: `o${column.options.indexOf(raw) + 1}` },
        ),
      );
    });
  });
  return out;
}
