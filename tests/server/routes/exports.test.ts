import { describe, expect, it } from 'vitest';
import { parse } from 'csv-parse/sync';
import type supertest from 'supertest';
import { downloadXlsx } from '../../support/download-xlsx';
import { useTestApp } from '../../support/test-app';
import type { Role } from '../../../shared/permissions';
import { shareScenarios } from '../../../db/schema/shares';
import { N, scenarioLevels, useTastesStudy } from './tastes-fixture';

const t = useTestApp({}, { signIn: 'team' });

const study = useTastesStudy(t, 'exports');

const as = (role: Role): supertest.Agent => t.team.agents[role];

async function loadXlsx(agent: supertest.Agent) {
  return downloadXlsx(agent, `${study.base}/taste-profiles.xlsx`, { runId: study.runId });
}

describe('GET /exports/taste-profiles.csv', () => {
  it('gives an analyst one row per respondent with external ids, escaped text and SDs beside means', async () => {
    const res = await as('analyst')
      .get(`${study.base}/taste-profiles.csv`)
      .query({ runId: study.runId })
      .expect(200);
    expect(res.headers['content-type']).toMatch(/text\/csv/);
    expect(res.headers['content-disposition']).toMatch(
      /attachment; filename=".*taste-profiles.*\.csv"/,
    );
    expect(res.headers['cache-control']).toBe('no-store');
    const rows = parse(res.text, { columns: true }) as Record<string, string>[];
    expect(rows).toHaveLength(N);
    const header = Object.keys(rows[0]);
    expect(header).toEqual([
      'respondent',
      'number',
      'external_id',
      'block',
      'included',
      'quality_flags',
      'effective_draws',
      'low_effective_draws',
      'mean_bill',
      'sd_bill',
      'mean_river_good',
      'sd_river_good',
      'mean_asc_sq',
      'sd_asc_sq',
      'wtp_river_good',
      'wtp_asc_sq',
      'age_band',
      'household_size',
      'comments',
    ]);
    expect(rows[0]).toMatchObject({
      external_id: `'=HYPERLINK("http://x")`,
      comments: "'+call me on 555",
      mean_bill: '-0.1',
      sd_river_good: '0.5',
      low_effective_draws: 'true',
      age_band: '18–34',
    });
  });

  it('gives a viewer the same rows without external ids or free text', async () => {
    const res = await as('viewer')
      .get(`${study.base}/taste-profiles.csv`)
      .query({ runId: study.runId })
      .expect(200);
    const rows = parse(res.text, { columns: true }) as Record<string, string>[];
    expect(rows).toHaveLength(N);
    expect(Object.keys(rows[0])).not.toContain('external_id');
    expect(Object.keys(rows[0])).not.toContain('comments');
    expect(res.text).not.toContain('EXT-');
    expect(res.text).not.toContain('HYPERLINK');
  });

  it('returns 404 to an outsider, 401 without a session and 400 without a run', async () => {
    await t.team.outsider
      .get(`${study.base}/taste-profiles.csv`)
      .query({ runId: study.runId })
      .expect(404);
    await t
      .request()
      .get(`${study.base}/taste-profiles.csv`)
      .query({ runId: study.runId })
      .expect(401);
    const res = await as('analyst').get(`${study.base}/taste-profiles.csv`).expect(400);
    expect(res.body.error.fields[0].path).toBe('runId');
  });
});

describe('GET /exports/taste-profiles.xlsx', () => {
  it('states the model, the data, the date and the cautions on its first sheet', async () => {
    const { res, workbook } = await loadXlsx(as('analyst'));
    expect(res.headers['content-type']).toMatch(/spreadsheetml/);
    const [about, profiles] = workbook.worksheets;
    expect(about.name).toBe('About');
    const facts = new Map<string, string>();
    about.eachRow((row) => facts.set(String(row.getCell(1).value), String(row.getCell(2).value)));
    expect(facts.get('Study')).toBe('Larkspur Valley Water packages');
    expect(facts.get('Study version')).toBe('1');
    expect(facts.get('Model')).toMatch(
      /^Panel mixed logit: bill \(neg_lognormal\), river_good \(normal\)/,
    );
    expect(facts.get('Respondents')).toBe(String(N));
    expect(facts.get('Data hash (SHA-256 of the long-format choice data)')).toBe('ab'.repeat(32));
    expect(facts.get('Exported')).toMatch(/^\d{4}-\d\d-\d\dT/);
    expect(facts.get('Caution 1')).toMatch(/stated, hypothetical choices/);
    expect(facts.get('Caution 2')).toMatch(/shrunk toward the population/);
    expect(profiles.name).toBe('Profiles');
    expect(profiles.rowCount).toBe(N + 1);
    const header = (profiles.getRow(1).values as unknown[]).slice(1);
    expect(header).toContain('external_id');
    expect(profiles.getRow(2).getCell(header.indexOf('mean_bill') + 1).value).toBe(-0.1);
  });

  it('leaves personal columns out for a viewer and says so', async () => {
    const { workbook } = await loadXlsx(as('viewer'));
    const [about, profiles] = workbook.worksheets;
    const header = (profiles.getRow(1).values as unknown[]).slice(1);
    expect(header).not.toContain('external_id');
    expect(header).not.toContain('comments');
    let personal = '';
    about.eachRow((row) => {
      if (row.getCell(1).value === 'Personal data') personal = String(row.getCell(2).value);
    });
    expect(personal).toMatch(/^Left out/);
  });
});

describe('other downloads', () => {
  it('writes the background answers of every respondent, free text only for personal roles', async () => {
    const analyst = await as('analyst').get(`${study.base}/background-answers.csv`).expect(200);
    const rows = parse(analyst.text, { columns: true }) as Record<string, string>[];
    expect(rows).toHaveLength(N);
    expect(rows[0]).toMatchObject({ number: '1', age_band: '18–34', household_size: '1' });
    expect(rows[2].quality_flags).toBe('speeder');
    const viewer = await as('viewer').get(`${study.base}/background-answers.csv`).expect(200);
    const header = (parse(viewer.text) as string[][])[0];
    expect(header).not.toContain('external_id');
    expect(header).not.toContain('comments');
  });

  it('writes the frozen design with one row per designed alternative', async () => {
    const res = await as('viewer').get(`${study.base}/design.csv`).expect(200);
    const rows = parse(res.text) as string[][];
    expect(rows[0].slice(0, 3)).toEqual(['block', 'task', 'alternative']);
    expect(rows).toHaveLength(1 + 2 * 2);
    expect(rows[1]).toContain('3');
  });

  it('prints a run report with its tables and the cautions', async () => {
    const res = await as('viewer')
      .get(`${study.base}/run-report.html`)
      .query({ runId: study.runId })
      .expect(200);
    expect(res.headers['content-type']).toMatch(/text\/html/);
    expect(res.text).toContain('@media print');
    expect(res.text).toContain('Larkspur Valley Water packages');
    expect(res.text).toContain('River health: good');
    expect(res.text).toContain('stated, hypothetical choices');
    expect(res.text).toMatch(/2 of them have fewer than 30 effective draws/);
    expect(res.text).not.toContain('EXT-');
  });

  it('prints with the app fonts inlined, readable names, WTP units and charts', async () => {
    const res = await as('viewer')
      .get(`${study.base}/run-report.html`)
      .query({ runId: study.runId })
      .expect(200);
    const html = res.text;
    // IBM Plex Sans 400 and 600 and Plex Mono 400, inlined: the page needs nothing else.
    expect(html.match(/@font-face\{font-family:'IBM Plex (Sans|Mono)'/g)).toHaveLength(3);
    expect(html).toContain('src:url(data:font/woff2;base64,');
    expect(html).not.toMatch(/(src|href)="http/);
    expect(html).not.toContain('<script');
    // Parameter names are the study's labels, the code in small type below.
    expect(html).toContain('River health: good<span class="code">river_good</span>');
    // WTP: amounts through Intl with the cost unit, and the unit and basis of each row.
    expect(html).toContain('€7.30');
    expect(html).toContain('€5.40 to €9.90');
    expect(html).toContain('€ of monthly bill increase for River health: good instead of poor');
    // One WTP chart and one density chart per random coefficient (bill, river_good).
    expect(html.match(/<svg /g)).toHaveLength(3);
    expect(html).toContain('aria-label="Population distribution of River health: good"');
    expect(html).toContain('@media print');
    expect(html).toContain('@page{size:A4');
  });

  it('reports which downloads exist and whether they hold personal columns', async () => {
    expect((await as('viewer').get(study.base).expect(200)).body).toEqual({
      personalColumns: false,
      designAvailable: true,
      choicesAvailable: true,
    });
    expect((await as('owner').get(study.base).expect(200)).body.personalColumns).toBe(true);
    await t.team.outsider.get(study.base).expect(404);
    await t.request().get(study.base).expect(401);
  });
});

describe('run report: saved what-if scenarios', () => {
  const report = async () =>
    (
      await as('viewer')
        .get(`${study.base}/run-report.html`)
        .query({ runId: study.runId })
        .expect(200)
    ).text;

  it('says how to add scenarios while none is saved', async () => {
    expect(await report()).toContain('No scenario is saved for this study.');
  });

  it('prints each saved scenario with shares, intervals, a chart and the welfare line', async () => {
    const scenarios = `/api/teams/${t.team.teamId}/studies/${study.studyId}/shares/scenarios`;
    await as('analyst')
      .post(scenarios)
      .send({
        name: 'River upgrade',
        includeFixed: true,
        alternatives: [
          { name: 'Better river', levels: scenarioLevels('good', 'b10') },
          { name: 'Cheaper', levels: scenarioLevels('fair', 'b0') },
        ],
      })
      .expect(201);
    // A scenario an edited study no longer fits (level "b99" does not exist) is listed with the
    // reason instead of numbers, and the rest of the report still prints.
    await t.deps.db.insert(shareScenarios).values({
      teamId: t.team.teamId,
      studyId: study.studyId,
      name: 'Outdated',
      alternatives: [
        { name: 'Old A', alternative: 0, levels: scenarioLevels('good', 'b99') },
        { name: 'Old B', alternative: 0, levels: scenarioLevels('fair', 'b0') },
      ],
      includeFixed: true,
    });
    const html = await report();
    expect(html).toContain('<h3>River upgrade</h3>');
    expect(html).toContain('aria-label="Predicted shares of “River upgrade” with 95 % intervals"');
    // One more chart than before: the scenario's shares.
    expect(html.match(/<svg /g)).toHaveLength(4);
    // Three alternatives (the status quo included), each with a share in percent.
    const section = html.slice(html.indexOf('<h2>What-if scenarios</h2>'));
    const shares = [...section.matchAll(/<td class="n">(\d+\.\d)%<\/td>/g)].map((m) =>
      Number(m[1]),
    );
    expect(shares).toHaveLength(3);
    expect(shares.reduce((a, b) => a + b, 0)).toBeCloseTo(100, 0);
    expect(html).toContain('Intervals from draws from each respondent’s conditional distribution.');
    expect(html).toMatch(/Welfare against “Current service” \(compensating variation/);
    expect(html).toContain('<h3>Outdated</h3>');
    expect(html).toContain(
      'Not computed: the study no longer has a level this scenario uses (Choose a level of Monthly bill increase.)',
    );
  });
});
