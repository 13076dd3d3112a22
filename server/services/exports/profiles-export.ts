/**
 * Downloads built on a run's taste profiles: the per-respondent table as CSV and XLSX, and the
 * printable run report (which counts the profiles with few effective draws).
 */
import type { AppDeps } from '../../deps';
import { listQuestionAnswers } from '../../../db/queries/study-answers';
import { listRunProfiles } from '../../../db/queries/taste-profiles';
import { loadRunContext } from '../tastes/run-context';
import { indexAnswers } from '../tastes/background-answers';
import { writeCsv } from '../../lib/safe-csv';
import { buildProfileTable } from './profile-table';
import { writeProfilesXlsx } from './profiles-xlsx';
import { renderRunReport } from './run-report';
import { loadReportScenarios } from './report-scenarios';
import { makeDownload, type RunExporter } from './download';
import type { Actor } from '../actor';

async function loadProfileTable(deps: AppDeps, actor: Actor, studyId: string, runId: string) {
  const ctx = await loadRunContext(deps, actor, studyId, runId);
  const profiles = await listRunProfiles(deps.db, { runId, studyId });
  const answers = indexAnswers(await listQuestionAnswers(deps.db, { studyId }));
  return {
    ctx,
    profiles,
    table: buildProfileTable(ctx.header, profiles, answers, ctx.results.classes?.length ?? 0),
  };
}

/** The per-respondent table as a CSV file or an XLSX workbook (with its about sheet). */
function exportProfileTable(format: 'csv' | 'xlsx'): RunExporter {
  return async (deps, actor, studyId, runId, at = new Date()) => {
    const { ctx, table } = await loadProfileTable(deps, actor, studyId, runId);
    const body =
      format === 'csv'
        ? writeCsv(table.header, table.rows)
        : await writeProfilesXlsx(ctx, table, at);
    return makeDownload(ctx.study.name, 'taste-profiles', format, at, body, ctx.personal);
  };
}

export const exportProfilesCsv = exportProfileTable('csv');
export const exportProfilesXlsx = exportProfileTable('xlsx');

export const exportRunReport: RunExporter = async (
  deps,
  actor,
  studyId,
  runId,
  at = new Date(),
) => {
  const { ctx, profiles } = await loadProfileTable(deps, actor, studyId, runId);
  const lowDraws = profiles.filter((p) => p.effectiveDraws < ctx.header.lowDrawsThreshold).length;
  return makeDownload(
    ctx.study.name,
    'run-report',
    'html',
    at,
    renderRunReport(
      ctx,
      { count: profiles.length, lowDraws },
      at,
      await loadReportScenarios(deps, actor, studyId, runId),
    ),
  );
};
