/**
 * The per-respondent XLSX (exceljs): sheet 1 "About" states the model, the data (study,
 * version, respondents, data hash), the date and the cautions; sheet 2 "Profiles" holds the
 * table; sheet 3 "Methods" how the numbers were made (priors, sampler and diagnostics for HB;
 * the class-count table and class estimates for latent class); then "Population" the estimated
 * population moments, "Estimates" and the full covariance matrices of the estimates, classical
 * and robust. Text goes in as text cells,
 * which spreadsheet programs never evaluate as formulas, so no quote prefix is needed here.
 */
import type { RunContext } from '../tastes/run-context';
import type { Table } from './profile-table';
import { buildCovarianceTable, describeCovariance } from './covariance-table';
import { getRunSummary } from './run-summary';
import { getMethodsSections } from './methods-sections';
import { createResultsWorkbook } from './documented-xlsx';

export const PROFILES_SHEET = 'Profiles';
export const METHODS_SHEET = 'Methods';

export async function writeProfilesXlsx(
  ctx: RunContext,
  table: Table,
  exportedAt: Date,
): Promise<Buffer> {
  const workbook = createResultsWorkbook(exportedAt, getRunSummary(ctx, exportedAt));

  const profiles = workbook.addWorksheet(PROFILES_SHEET, {
    views: [{ state: 'frozen', ySplit: 1 }],
  });
  profiles.addRow(table.header).font = { bold: true };
  for (const row of table.rows) profiles.addRow(row.map((v) => (v === undefined ? null : v)));

  const methods = workbook.addWorksheet(METHODS_SHEET);
  methods.getColumn(1).width = 40;
  for (const section of getMethodsSections(ctx)) {
    methods.addRow([section.title]).font = { bold: true, size: 12 };
    methods.addRow(section.head).font = { bold: true };
    for (const row of section.rows) methods.addRow(row);
    methods.addRow([]);
  }

  const population = workbook.addWorksheet('Population');
  population.addRow([
    'coefficient',
    'label',
    'distribution',
    'population_mean',
    'population_sd',
    'location',
    'spread',
  ]).font = { bold: true };
  for (const c of ctx.header.coefficients)
    population.addRow([
      c.name,
      c.label,
      c.distribution,
      c.populationMean,
      c.populationSd,
      c.location,
      c.spread,
    ]);
  const estimates = workbook.addWorksheet('Estimates');
  // HB: posterior means and SDs over the kept draws (no sandwich SE).
  estimates.addRow(
    ctx.spec.model === 'hb'
      ? ['parameter', 'posterior_mean', 'posterior_sd', 'robust_se']
      : ['parameter', 'estimate', 'se', 'robust_se'],
  ).font = { bold: true };
  for (const e of ctx.results.estimates) estimates.addRow([e.name, e.estimate, e.se, e.robustSe]);
  for (const kind of ['classical', 'robust'] as const) {
    const table = buildCovarianceTable(ctx.results, kind);
    const sheet = workbook.addWorksheet(`Covariance ${kind}`);
    sheet.addRow([`Covariance of the estimates: ${describeCovariance(ctx.results, kind)}`]);
    if (!table) {
      sheet.addRow(['Not available for this run.']);
      continue;
    }
    sheet.addRow(table.header).font = { bold: true };
    for (const row of table.rows) sheet.addRow(row);
  }
  return Buffer.from(await workbook.xlsx.writeBuffer());
}
