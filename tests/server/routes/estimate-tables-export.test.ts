/**
 * The estimate tables of a run as files to hand on: XLSX with number formats, widths and a
 * codebook; one CSV per table; the same numbers as the stored run; spreads as |s|.
 */
import { beforeAll, describe, expect, it } from 'vitest';
import { parse } from 'csv-parse/sync';
import type ExcelJS from 'exceljs';
import type supertest from 'supertest';
import { downloadXlsx } from '../../support/download-xlsx';
import { useTestApp } from '../../support/test-app';
import { createTeamWithAllRoles } from '../../support/factories';
import { runs } from '../../../db/schema/models';
import { makeResults, seedTastesStudy, spec } from './tastes-fixture';

const t = useTestApp();
let team: Awaited<ReturnType<typeof createTeamWithAllRoles>>;
let seeded: Awaited<ReturnType<typeof seedTastesStudy>>;
let base: string;
let withheldRunId: string;

beforeAll(async () => {
  team = await createTeamWithAllRoles(t);
  seeded = await seedTastesStudy(t.deps.db, team.teamId);
  base = `/api/teams/${team.teamId}/studies/${seeded.studyId}/exports`;
  const results = makeResults();
  // A spread stored with its sign flipped: the files show |s| and the interval carried over.
  results.estimates[4] = { name: 'river_good.sd', estimate: -1.7, se: 0.4, robustSe: 0.5 };
  const [run] = await t.deps.db
    .insert(runs)
    .values({
      studyId: seeded.studyId,
      teamId: team.teamId,
      name: 'WTP withheld',
      model: 'mixed',
      spec,
      dataHash: 'cd'.repeat(32),
      status: 'done',
      results: { ...results, wtp: null, wtpWithheld: 'The cost coefficient is not significant.' },
      finishedAt: new Date(),
    })
    .returning({ id: runs.id });
  withheldRunId = run.id;
});

const loadWorkbook = (agent: supertest.Agent, runId: string) =>
  downloadXlsx(agent, `${base}/estimates.xlsx`, { runId });

const header = (sheet: ExcelJS.Worksheet) => (sheet.getRow(1).values as unknown[]).slice(1);

async function csv(runId: string, table: string) {
  const res = await team.agents.viewer.get(`${base}/estimates.csv`).query({ runId, table });
  return { res, rows: res.status === 200 ? (parse(res.text) as string[][]) : [] };
}

describe('GET /exports/estimates.xlsx', () => {
  it('holds About, Estimates, WTP, Fit and Codebook sheets with number formats and widths', async () => {
    const { res, workbook } = await loadWorkbook(team.agents.viewer, seeded.runId);
    expect(res.headers['content-type']).toMatch(/spreadsheetml/);
    expect(res.headers['content-disposition']).toMatch(/estimates-\d{4}-\d\d-\d\d\.xlsx"/);
    expect(workbook.worksheets.map((s) => s.name)).toEqual([
      'About',
      'Estimates',
      'WTP',
      'Fit',
      'Codebook',
    ]);
    const estimates = workbook.getWorksheet('Estimates')!;
    const cols = header(estimates);
    expect(cols).toEqual([
      'parameter',
      'label',
      'part',
      'estimate',
      'se',
      'robust_se',
      't',
      'p',
      'ci95_lower',
      'ci95_upper',
    ]);
    // One row per stored estimate, values as stored.
    expect(estimates.rowCount).toBe(1 + makeResults().estimates.length);
    const river = estimates.getRow(3);
    expect(river.getCell(1).value).toBe('river_good');
    expect(river.getCell(2).value).toBe('River health: good');
    expect(river.getCell(4).value).toBe(2.5);
    expect(river.getCell(4).numFmt).toBe('0.0000');
    // t = 2.5 / 0.6 (robust SE); 95 % interval 2.5 ± 1.959964 × 0.6.
    expect(river.getCell(7).value).toBeCloseTo(2.5 / 0.6, 12);
    expect(river.getCell(9).value).toBeCloseTo(2.5 - 1.959964 * 0.6, 12);
    expect(estimates.getColumn(2).width).toBeGreaterThanOrEqual('River health: good'.length);

    const wtp = workbook.getWorksheet('WTP')!;
    expect(header(wtp)).toEqual([
      'coefficient',
      'label',
      'statistic',
      'unit_basis',
      'wtp',
      'se',
      'delta_lower',
      'delta_upper',
      'sim_lower',
      'sim_upper',
    ]);
    expect(wtp.rowCount).toBe(2);
    const row = wtp.getRow(2);
    expect(row.getCell(3).value).toBe('Population mean WTP');
    expect(row.getCell(4).value).toBe(
      '€ of monthly bill increase for River health: good instead of poor',
    );
    expect(row.getCell(5).value).toBe(7.3);
    // Money cells carry the cost unit as a number format, not as text.
    expect(row.getCell(5).numFmt).toBe('"€"#,##0.00;-"€"#,##0.00');

    const fit = workbook.getWorksheet('Fit')!;
    const stats = new Map<string, unknown>();
    fit.eachRow((r, i) => i > 1 && stats.set(String(r.getCell(1).value), r.getCell(2).value));
    expect(stats.get('loglik')).toBe(-40.5);
    expect(stats.get('observations')).toBe(12);
    expect(stats.get('bic')).toBe(93);
  });

  it('documents every column of every sheet in the codebook, with a unit', async () => {
    const { workbook } = await loadWorkbook(team.agents.analyst, seeded.runId);
    const codebook = workbook.getWorksheet('Codebook')!;
    expect(header(codebook)).toEqual(['file', 'column', 'meaning', 'unit', 'coding']);
    const documented = new Set<string>();
    codebook.eachRow((r, i) => {
      if (i === 1) return;
      documented.add(`${r.getCell(1).value}/${r.getCell(2).value}`);
      expect(String(r.getCell(3).value).length).toBeGreaterThan(5);
      expect(String(r.getCell(4).value).length).toBeGreaterThan(0);
    });
    const expected = (['Estimates', 'WTP', 'Fit'] as const).flatMap((name) =>
      header(workbook.getWorksheet(name)!).map((c) => `${name.toLowerCase()}/${String(c)}`),
    );
    expect([...documented].sort()).toEqual(expected.sort());
  });

  it('shows a spread stored with a negative sign as |s|, and says why WTP is withheld', async () => {
    const { workbook } = await loadWorkbook(team.agents.viewer, withheldRunId);
    const estimates = workbook.getWorksheet('Estimates')!;
    const spread = estimates.getRow(6);
    expect(spread.getCell(1).value).toBe('river_good.sd');
    expect(spread.getCell(3).value).toBe('spread (SD)');
    expect(spread.getCell(4).value).toBe(1.7);
    // −1.7 ± 1.959964 × 0.5 excludes 0, so the interval is mirrored onto |s|.
    expect(spread.getCell(9).value).toBeCloseTo(1.7 - 1.959964 * 0.5, 12);
    expect(spread.getCell(10).value).toBeCloseTo(1.7 + 1.959964 * 0.5, 12);
    const wtp = workbook.getWorksheet('WTP')!;
    expect(wtp.getRow(2).getCell(1).value).toBe('The cost coefficient is not significant.');
  });
});

describe('GET /exports/estimates.csv', () => {
  it('writes each table with the same header and rows as the XLSX', async () => {
    const { workbook } = await loadWorkbook(team.agents.viewer, seeded.runId);
    for (const name of ['Estimates', 'WTP', 'Fit'] as const) {
      const { res, rows } = await csv(seeded.runId, name.toLowerCase());
      expect(res.status).toBe(200);
      expect(res.headers['content-disposition']).toContain(`-${name.toLowerCase()}-`);
      const sheet = workbook.getWorksheet(name)!;
      expect(rows[0]).toEqual(header(sheet));
      expect(rows).toHaveLength(sheet.rowCount);
    }
    const { rows } = await csv(seeded.runId, 'estimates');
    expect(rows[1]).toEqual([
      'bill',
      'Monthly bill increase (€)',
      '',
      '-1.2',
      '0.2',
      '0.25',
      expect.any(String),
      expect.any(String),
      expect.any(String),
      expect.any(String),
    ]);
    expect(Number(rows[1][6])).toBeCloseTo(-1.2 / 0.25, 12);
  });

  it('writes the codebook of all tables as its own CSV', async () => {
    const { rows } = await csv(seeded.runId, 'codebook');
    expect(rows[0]).toEqual(['file', 'column', 'meaning', 'unit', 'coding']);
    expect(rows.filter((r) => r[0] === 'estimates')).toHaveLength(10);
    expect(rows.find((r) => r[0] === 'wtp' && r[1] === 'wtp')?.[3]).toBe('€');
  });

  it('refuses WTP with the reason, an unknown table with the field, and outsiders', async () => {
    const withheld = await csv(withheldRunId, 'wtp');
    expect(withheld.res.status).toBe(409);
    expect(withheld.res.body.error.message).toBe('The cost coefficient is not significant.');
    const bad = await csv(seeded.runId, 'pie');
    expect(bad.res.status).toBe(400);
    expect(bad.res.body.error.fields[0].path).toBe('table');
    await team.outsider
      .get(`${base}/estimates.csv`)
      .query({ runId: seeded.runId, table: 'fit' })
      .expect(404);
    await t.request().get(`${base}/estimates.xlsx`).query({ runId: seeded.runId }).expect(401);
    await team.agents.viewer
      .get(`${base}/estimates.xlsx`)
      .query({ runId: seeded.runningRunId })
      .expect(409);
  });
});
