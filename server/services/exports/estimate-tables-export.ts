/**
 * The estimate tables of a run as files to hand on: one XLSX (About, Estimates, WTP, Fit,
 * Codebook) or one CSV per table, the codebook included (estimate-tables.ts).
 */
import type { AppDeps } from '../../deps';
import { ConflictError } from '../../lib/errors';
import { writeCsv } from '../../lib/safe-csv';
import { loadRunContext, type RunContext } from '../tastes/run-context';
import { getRunSummary } from './run-summary';
import { buildEstimateTables, getWtpUnavailableReason } from './estimate-tables';
import {
  buildCodebookRows,
  codebookHeader,
  type DocumentedTable,
  writeDocumentedCsv,
} from './documented-table';
import { addCodebookSheet, addTableSheet, createResultsWorkbook } from './documented-xlsx';
import { makeDownload, type Download, type RunExporter } from './download';
import type { EstimateTableName } from '../../../shared/schemas/exports';
import type { Actor } from '../actor';

const SHEET_TITLES: Record<string, string> = { estimates: 'Estimates', wtp: 'WTP', fit: 'Fit' };

export async function writeEstimateTablesXlsx(
  ctx: RunContext,
  tables: readonly DocumentedTable[],
  at: Date,
): Promise<Buffer> {
  const workbook = createResultsWorkbook(at, getRunSummary(ctx, at));
  for (const table of tables) {
    const sheet = addTableSheet(workbook, SHEET_TITLES[table.name], table, ctx.header.costUnit);
    if (table.name === 'wtp' && table.rows.length === 0)
      sheet.addRow([ctx.results.wtpWithheld ?? 'This run gives no WTP.']);
  }
  addCodebookSheet(workbook, tables);
  return Buffer.from(await workbook.xlsx.writeBuffer());
}

export const exportEstimateTablesXlsx: RunExporter = async (
  deps,
  actor,
  studyId,
  runId,
  at = new Date(),
) => {
  const ctx = await loadRunContext(deps, actor, studyId, runId);
  return makeDownload(
    ctx.study.name,
    'estimates',
    'xlsx',
    at,
    await writeEstimateTablesXlsx(ctx, buildEstimateTables(ctx), at),
  );
};

/** One table (or the codebook of all of them) as CSV. */
export async function exportEstimateTableCsv(
  deps: AppDeps,
  actor: Actor,
  studyId: string,
  runId: string,
  name: EstimateTableName,
  at = new Date(),
): Promise<Download> {
  const ctx = await loadRunContext(deps, actor, studyId, runId);
  const tables = buildEstimateTables(ctx);
  const file = (body: string): Download =>
    makeDownload(
      ctx.study.name,
      name === 'codebook' ? 'estimates-codebook' : name,
      'csv',
      at,
      body,
    );
  if (name === 'codebook') return file(writeCsv(codebookHeader, buildCodebookRows(tables)));
  const table = tables.find((t) => t.name === name);
  const wtpUnavailable = getWtpUnavailableReason(ctx.spec, ctx.results);
  if (name === 'wtp' && (!table || table.rows.length === 0 || wtpUnavailable))
    throw new ConflictError('wtp_unavailable', wtpUnavailable ?? 'This run gives no WTP.');
  return file(writeDocumentedCsv(table!));
}
