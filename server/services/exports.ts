/**
 * Export use cases ('exports:read', checked by the route): per-respondent estimates as CSV and
 * XLSX, the long-format choice data (the format `npm run estimate` reads), the design, the
 * background answers and a printable run report. Personal columns (external ids, free-text
 * answers) only for roles with 'personal:read'; everything else is the same for every role.
 */
import { getLatestVersion } from '../../db/queries/versions';
import type { AppDeps } from '../deps';
import { ConflictError, NotFoundError } from '../lib/errors';
import { loadStudy } from './study-access';
import { getRunOfStudy, listQuestionAnswers, listRunProfiles } from '../../db/queries/tastes';
import { listStudyRespondents } from '../../db/queries/exports';
import { roleCan } from '../../shared/permissions';
import type { ExportManifest } from '../../shared/schemas/exports';
import type { StudyDefinition } from '../../shared/schemas/study-definition';
import type { Design } from '../../shared/schemas/design';
import { loadStudyChoiceData, toLongCsvRows } from './choice-data-from-study';
import { exportDesignCsv } from '../engine/design/export-design-csv';
import { loadRunContext, type Member } from './tastes/run-context';
import { getBackgroundQuestions, indexAnswers, formatAnswer } from './tastes/background-answers';
import { getFlagNames } from './tastes/taste-rows';
import { buildProfileTable } from './exports/profile-table';
import { writeProfilesXlsx } from './exports/profiles-xlsx';
import { renderRunReport } from './exports/run-report';
import { buildCovarianceTable, type CovarianceKind } from './exports/covariance-table';
import { writeCsv } from '../lib/safe-csv';
import { recordAudit, type Actor } from './audit';
import { listAnswerHistory, listRevisedAnswers } from '../../db/queries/answer-revisions';
import {
  answerHistoryHeader,
  buildAnswerHistory,
  revisedScreensOf,
} from './exports/answer-history';

export type Download = {
  filename: string;
  contentType: string;
  body: string | Buffer;
  /** Holds personal columns (external ids, personal answers): the download is audited. */
  personal?: boolean;
};

export const CSV = 'text/csv; charset=utf-8';

export function fileName(studyName: string, kind: string, ext: string, at: Date): string {
  const slug = studyName
    .toLowerCase()
    .replace(/[^a-z0-9]+/g, '-')
    .replace(/^-|-$/g, '')
    .slice(0, 60);
  return `${slug || 'study'}-${kind}-${at.toISOString().slice(0, 10)}.${ext}`;
}

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

async function loadProfileTable(deps: AppDeps, member: Member, studyId: string, runId: string) {
  const ctx = await loadRunContext(deps, member, studyId, runId);
  const profiles = await listRunProfiles(deps.db, { runId, studyId });
  const answers = indexAnswers(await listQuestionAnswers(deps.db, { studyId }));
  return {
    ctx,
    profiles,
    table: buildProfileTable(ctx.header, profiles, answers, ctx.results.classes?.length ?? 0),
  };
}

export async function exportProfilesCsv(
  deps: AppDeps,
  member: Member,
  studyId: string,
  runId: string,
  at = new Date(),
): Promise<Download> {
  const { ctx, table } = await loadProfileTable(deps, member, studyId, runId);
  return {
    filename: fileName(ctx.study.name, 'taste-profiles', 'csv', at),
    contentType: CSV,
    body: writeCsv(table.header, table.rows),
    personal: ctx.personal,
  };
}

export async function exportProfilesXlsx(
  deps: AppDeps,
  member: Member,
  studyId: string,
  runId: string,
  at = new Date(),
): Promise<Download> {
  const { ctx, table } = await loadProfileTable(deps, member, studyId, runId);
  return {
    filename: fileName(ctx.study.name, 'taste-profiles', 'xlsx', at),
    contentType: 'application/vnd.openxmlformats-officedocument.spreadsheetml.sheet',
    body: await writeProfilesXlsx(ctx, table, at),
    personal: ctx.personal,
  };
}

/** The run's classical or robust covariance matrix of the estimates (user units). */
export async function exportCovarianceCsv(
  deps: AppDeps,
  member: Member,
  studyId: string,
  runId: string,
  kind: CovarianceKind,
  at = new Date(),
): Promise<Download> {
  const ctx = await loadRunContext(deps, member, studyId, runId);
  const table = buildCovarianceTable(ctx.results, kind);
  if (!table)
    throw new ConflictError(
      'covariance_unavailable',
      kind === 'robust' && ctx.results.covariance?.method === 'bhhh'
        ? 'This run used the BHHH covariance, which has no robust (sandwich) form.'
        : 'This run has no stored covariance matrix of this kind; run it again to get one.',
    );
  return {
    filename: fileName(ctx.study.name, `covariance-${kind}`, 'csv', at),
    contentType: CSV,
    body: writeCsv(table.header, table.rows),
  };
}

export async function exportRunReport(
  deps: AppDeps,
  member: Member,
  studyId: string,
  runId: string,
  at = new Date(),
): Promise<Download> {
  const { ctx, profiles } = await loadProfileTable(deps, member, studyId, runId);
  const lowDraws = profiles.filter((p) => p.effectiveDraws < ctx.header.lowDrawsThreshold).length;
  return {
    filename: fileName(ctx.study.name, 'run-report', 'html', at),
    contentType: 'text/html; charset=utf-8',
    body: renderRunReport(ctx, { count: profiles.length, lowDraws }, at),
  };
}

/** Long-format choice data of every included respondent; with a run, only its columns. */
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

/** The design of the newest live version (else the study's current draft design). */
export async function exportDesign(
  deps: AppDeps,
  member: Member,
  studyId: string,
  at = new Date(),
): Promise<Download> {
  const study = await loadStudy(deps, member.teamId, studyId);
  const version = await getLatestVersion(deps.db, { studyId });
  if (!version) throw new NotFoundError('Frozen design');
  return {
    filename: fileName(study.name, 'design', 'csv', at),
    contentType: CSV,
    body: exportDesignCsv(version.definition as StudyDefinition, version.design as Design),
  };
}

/** The study's respondents and the background questions this role may read. */
async function loadRespondentTable(deps: AppDeps, member: Member, studyId: string) {
  const study = await loadStudy(deps, member.teamId, studyId);
  const personal = roleCan(member.role, 'personal:read');
  const version = await getLatestVersion(deps.db, { studyId });
  const questions = getBackgroundQuestions(version?.questionnaire ?? study.questionnaire).filter(
    (q) => personal || !q.personal,
  );
  const respondents = await listStudyRespondents(deps.db, { studyId });
  return { study, personal, questions, respondents };
}

/** Every respondent with their status and background answers. */
export async function exportAnswersCsv(
  deps: AppDeps,
  member: Member,
  studyId: string,
  at = new Date(),
): Promise<Download> {
  const { study, personal, questions, respondents } = await loadRespondentTable(
    deps,
    member,
    studyId,
  );
  const answers = indexAnswers(await listQuestionAnswers(deps.db, { studyId }));
  const revised = new Map<string, { screenKey: string; revisionCount: number }[]>();
  for (const r of await listRevisedAnswers(deps.db, { studyId }))
    revised.set(r.respondentId, [...(revised.get(r.respondentId) ?? []), r]);
  const header = [
    'respondent',
    'number',
    ...(personal ? ['external_id'] : []),
    'block',
    'status',
    'included',
    'quality_flags',
    'revised_screens',
    ...questions.map((q) => q.key),
  ];
  const rows = respondents.map((r) => [
    r.id,
    r.number,
    ...(personal ? [r.externalId] : []),
    r.block,
    r.status,
    r.included,
    getFlagNames(r.flags).join('; '),
    revisedScreensOf(revised.get(r.id) ?? []),
    ...questions.map((q) => formatAnswer(q, answers.get(r.id)?.get(q.key))),
  ]);
  return {
    filename: fileName(study.name, 'background-answers', 'csv', at),
    contentType: CSV,
    body: writeCsv(header, rows),
    personal,
  };
}

/**
 * Every answer of every screen a respondent went back to and changed, oldest first, the
 * current one marked (answers of questions the role may not read are left out).
 */
export async function exportAnswerHistoryCsv(
  deps: AppDeps,
  member: Member,
  studyId: string,
  at = new Date(),
): Promise<Download> {
  const { study, personal, questions, respondents } = await loadRespondentTable(
    deps,
    member,
    studyId,
  );
  const numbers = new Map(respondents.map((r) => [r.id, r.number]));
  const [current, replaced] = await Promise.all([
    listRevisedAnswers(deps.db, { studyId }),
    listAnswerHistory(deps.db, { studyId }),
  ]);
  const rows = buildAnswerHistory(
    [...current.map((r) => ({ ...r, replacedAt: null })), ...replaced],
    numbers,
    questions,
  );
  return {
    filename: fileName(study.name, 'answer-history', 'csv', at),
    contentType: CSV,
    body: writeCsv(answerHistoryHeader, rows),
    personal,
  };
}

/** Records a download that holds personal data in the audit trail (file name, never contents). */
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
