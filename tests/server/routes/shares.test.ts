import { describe, expect, it } from 'vitest';
import ExcelJS from 'exceljs';
import { parse } from 'csv-parse/sync';
import {
  computeScenarioShares,
  prepareShareModel,
} from '../../../shared/engine/shares/share-model';
import { useTestApp } from '../../support/test-app';
import {
  billMean,
  N,
  riverGood,
  scenarioLevels,
  useTastesStudy,
  taskOneChoice,
} from './tastes-fixture';

const t = useTestApp({}, { signIn: 'team' });

const study = useTastesStudy(t, 'shares/simulate');

const levels = scenarioLevels;

describe('POST /shares/simulate', () => {
  it('gives two identical packages equal shares (every role may simulate)', async () => {
    for (const role of ['owner', 'editor', 'analyst', 'viewer'] as const) {
      const res = await t.team.agents[role]
        .post(study.base)
        .send({
          runId: study.runId,
          includeFixed: false,
          alternatives: [
            { name: 'A', levels: levels('good') },
            { name: 'B', levels: levels('good') },
          ],
        })
        .expect(200);
      expect(res.body.method).toBe('conditional_means');
      expect(res.body.respondents).toBe(N);
      // Without the status quo there is nothing to measure welfare against: said, not hidden.
      expect(res.body.welfare).toBeNull();
      expect(res.body.welfareNote).toMatch(/^Include “Current service”/);
      expect(res.body.alternatives.map((a: { share: number }) => a.share)).toEqual([
        expect.closeTo(0.5, 12),
        expect.closeTo(0.5, 12),
      ]);
    }
  });

  it('averages each respondent’s logit probabilities over their own conditional means', async () => {
    // Only river health differs (good vs fair; the run has no fair coefficient, so it codes
    // as 0): P_n(good) = 1/(1+exp(−β_n)) with β_n = n (logit formula), averaged over n.
    const res = await t.team.agents.viewer
      .post(study.base)
      .send({
        runId: study.runId,
        includeFixed: false,
        alternatives: [
          { name: 'Good river', levels: levels('good') },
          { name: 'Fair river', levels: levels('fair') },
        ],
      })
      .expect(200);
    let expected = 0;
    for (let n = 0; n < N; n++) expected += 1 / (1 + Math.exp(-riverGood(n)));
    expected /= N;
    expect(res.body.alternatives[0].share).toBeCloseTo(expected, 12);
  });

  it('adds the status quo with its constant and splits shares by segment', async () => {
    const res = await t.team.agents.analyst
      .post(study.base)
      .send({
        runId: study.runId,
        alternatives: [
          { name: 'A', levels: levels('good', 'b10') },
          { name: 'B', levels: levels('poor', 'b0') },
        ],
        segmentBy: { groupBy: 'question', question: 'age_band' },
      })
      .expect(200);
    const names = res.body.alternatives.map((a: { name: string }) => a.name);
    expect(names).toEqual(['A', 'B', 'Current service']);
    // Respondent n: V_A = 10·bill_n + river_n, V_B = 0, V_SQ = asc = −0.4 (status quo codes
    // bill 0 and river poor), so P_SQ = e^−0.4 / (e^{V_A} + 1 + e^−0.4).
    let sq = 0;
    for (let n = 0; n < N; n++) {
      const a = Math.exp(10 * billMean(n) + riverGood(n));
      sq += Math.exp(-0.4) / (a + 1 + Math.exp(-0.4));
    }
    expect(res.body.alternatives[2].share).toBeCloseTo(sq / N, 12);
    const total = res.body.alternatives.reduce((s: number, a: { share: number }) => s + a.share, 0);
    expect(total).toBeCloseTo(1, 12);
    // Welfare (log-sum, Train 2009 eq. 3.10): CV_n = [ln(e^{V_A} + e^0 + e^−0.4) + 0.4]/(−bill_n),
    // averaged over respondents; every bill coefficient is negative, so nobody is left out.
    let cv = 0;
    for (let n = 0; n < N; n++) {
      const logsum = Math.log(Math.exp(10 * billMean(n) + riverGood(n)) + 1 + Math.exp(-0.4));
      cv += (logsum + 0.4) / -billMean(n);
    }
    expect(res.body.welfareNote).toBeNull();
    expect(res.body.welfare).toMatchObject({
      baseline: 'Current service',
      mean: expect.closeTo(cv / N, 10),
      interval: 'respondent_resampling',
      respondents: N,
      withheld: 0,
    });
    expect(res.body.welfare.lower).toBeLessThanOrEqual(res.body.welfare.mean);
    expect(res.body.welfare.upper).toBeGreaterThanOrEqual(res.body.welfare.mean);
    expect(res.body.segments.label).toBe('Your age band');
    expect(
      res.body.segments.groups.map((g: { label: string; count: number }) => [g.label, g.count]),
    ).toEqual([
      ['18–34', 3],
      ['35–64', 3],
    ]);
  });

  it.each([
    [{ alternatives: [{ name: 'Only', levels: levels('good') }] }, 'alternatives'],
    [
      {
        alternatives: [
          { name: 'A', levels: { ...levels('good'), river: undefined } },
          { name: 'B', levels: levels('good') },
        ],
      },
      'alternatives.0.levels.river',
    ],
    [
      {
        alternatives: [
          { name: 'A', levels: levels('purple') },
          { name: 'B', levels: levels('good') },
        ],
      },
      'alternatives.0.levels.river',
    ],
    [
      {
        alternatives: [
          { name: 'A', levels: levels('good') },
          { name: 'B', levels: levels('good') },
        ],
        segmentBy: { groupBy: 'task' },
      },
      'segmentBy.task',
    ],
  ])('when the body is %o, returns 400 naming %s', async (body, field) => {
    const res = await t.team.agents.analyst
      .post(study.base)
      .send({ runId: study.runId, ...body })
      .expect(400);
    expect(res.body.error.fields.map((f: { path: string }) => f.path)).toContain(field);
  });

  it('returns 404 to an outsider, 401 without a session and 409 for an unfinished run', async () => {
    const body = {
      runId: study.runId,
      alternatives: [
        { name: 'A', levels: levels('good') },
        { name: 'B', levels: levels('fair') },
      ],
    };
    await t.team.outsider.post(study.base).send(body).expect(404);
    await t.request().post(study.base).send(body).expect(401);
    await t.team.agents.analyst
      .post(study.base)
      .send({ ...body, runId: study.runningRunId })
      .expect(409);
  });
});

describe('GET /shares/model', () => {
  const modelUrl = () => study.base.replace(/simulate$/, 'model');

  it('sends every role the respondents’ conditional means and SDs, in coefficient order', async () => {
    for (const role of ['owner', 'editor', 'analyst', 'viewer'] as const) {
      const res = await t.team.agents[role]
        .get(modelUrl())
        .query({ runId: study.runId })
        .expect(200);
      const m = res.body;
      expect(m.method).toBe('conditional_means');
      expect(m.interval).toBe('conditional');
      expect(m.respondents).toBe(N);
      expect(m.vectors).toBe(1);
      const K = m.coefficients.length;
      const names = m.coefficients.map((c: { name: string }) => c.name);
      const bill = names.indexOf('bill');
      const river = names.indexOf('river_good');
      expect(m.coefficients[bill].lognormal).toBe(true);
      expect(m.coefficients[river].lognormal).toBe(false);
      for (let n = 0; n < N; n++) {
        expect(m.betas[n * K + bill]).toBeCloseTo(billMean(n), 14);
        expect(m.betas[n * K + river]).toBeCloseTo(riverGood(n), 14);
        expect(m.sds[n * K + river]).toBeCloseTo(0.5 + n / 10, 14);
      }
      // No respondent ids leave the server: the model is numbers in a fixed order.
      expect(JSON.stringify(m)).not.toContain(study.respondentIds[0]);
    }
  });

  it('when the run id is not a uuid, returns 400 naming runId', async () => {
    const res = await t.team.agents.viewer.get(modelUrl()).query({ runId: 'nope' }).expect(400);
    expect(res.body.error.code).toBe('invalid_input');
    expect(res.body.error.fields.map((f: { path: string }) => f.path)).toEqual(['runId']);
  });

  it('returns 404 to an outsider, 401 without a session and 409 for an unfinished run', async () => {
    await t.team.outsider.get(modelUrl()).query({ runId: study.runId }).expect(404);
    await t.request().get(modelUrl()).query({ runId: study.runId }).expect(401);
    const res = await t.team.agents.viewer
      .get(modelUrl())
      .query({ runId: study.runningRunId })
      .expect(409);
    expect(res.body.error.code).toBe('run_not_finished');
  });
});

describe('GET /shares/groups', () => {
  const groupsUrl = () => study.base.replace(/simulate$/, 'groups');

  it('groups the model’s respondents by the alternative chosen in a task', async () => {
    const res = await t.team.agents.viewer
      .get(groupsUrl())
      .query({ runId: study.runId, groupBy: 'task', task: 1 })
      .expect(200);
    expect(res.body.label).toBe('Choice in task 1');
    // Same order as the model's respondents; the status quo's key is −1.
    const keys = res.body.of.map((g: number) => res.body.groups[g].key);
    expect(keys).toEqual(taskOneChoice.map(String));
    expect(res.body.groups.map((g: { label: string }) => g.label)).toContain('Current service');
  });

  it.each([
    [{ groupBy: 'task' }, 'task', 'invalid_input'],
    [{ groupBy: 'question' }, 'question', 'invalid_input'],
    [{ groupBy: 'colour' }, 'groupBy', 'invalid_input'],
    [{ groupBy: 'task', task: 99 }, 'task', 'invalid_input'],
    [{ groupBy: 'class' }, 'groupBy', 'invalid_input'],
  ])('when the query is %o, returns 400 naming %s', async (query, field, code) => {
    const res = await t.team.agents.analyst
      .get(groupsUrl())
      .query({ runId: study.runId, ...query })
      .expect(400);
    expect(res.body.error.code).toBe(code);
    expect(res.body.error.message).toEqual(expect.any(String));
    expect(res.body.error.fields.map((f: { path: string }) => f.path)).toContain(field);
  });
});

describe('POST /shares/export', () => {
  const exportUrl = () => study.base.replace(/simulate$/, 'export');
  const modelUrl = () => study.base.replace(/simulate$/, 'model');
  const scenario = {
    alternatives: [
      { name: 'A', alternative: 0, levels: levels('good', 'b10') },
      { name: 'B', alternative: 0, levels: levels('fair', 'b3') },
    ],
    includeFixed: true,
  };
  const binary = (res: NodeJS.ReadableStream, cb: (e: Error | null, b: Buffer) => void) => {
    const chunks: Buffer[] = [];
    res.on('data', (c: Buffer) => chunks.push(c));
    res.on('end', () => cb(null, Buffer.concat(chunks)));
  };

  it('writes the shares the browser computes from the share model (one implementation)', async () => {
    const model = (
      await t.team.agents.viewer.get(modelUrl()).query({ runId: study.runId }).expect(200)
    ).body;
    const expected = computeScenarioShares(prepareShareModel(model), scenario);
    const res = await t.team.agents.viewer
      .post(exportUrl())
      .send({ runId: study.runId, ...scenario, format: 'csv' })
      .expect(200);
    expect(res.headers['content-type']).toMatch(/^text\/csv/);
    expect(res.headers['content-disposition']).toMatch(/shares-\d{4}-\d{2}-\d{2}\.csv"$/);
    const rows = parse(res.text, { columns: true }) as Record<string, string>[];
    expect(rows.map((r) => r.alternative)).toEqual(['A', 'B', 'Current service']);
    rows.forEach((r, j) => {
      expect(Number(r.share)).toBeCloseTo(expected.shares[j], 12);
      expect(Number(r.lower95)).toBeCloseTo(expected.lower![j], 12);
      expect(Number(r.upper95)).toBeCloseTo(expected.upper![j], 12);
    });
    expect(rows.reduce((s, r) => s + Number(r.share), 0)).toBeCloseTo(1, 12);
  });

  it('writes a demand curve as CSV and the whole scenario as XLSX', async () => {
    const sweep = { alternative: 0, attributeId: 'bill', points: 16 };
    const csv = await t.team.agents.analyst
      .post(exportUrl())
      .send({ runId: study.runId, ...scenario, sweep, format: 'csv' })
      .expect(200);
    expect(csv.headers['content-disposition']).toMatch(/demand-curve-/);
    const curve = parse(csv.text, { columns: true }) as Record<string, string>[];
    expect(curve.map((r) => Number(r.value))).toEqual(Array.from({ length: 16 }, (_, i) => i));
    // Every bill coefficient is negative: the share falls as the bill rises.
    for (let i = 1; i < curve.length; i++)
      expect(Number(curve[i].share)).toBeLessThan(Number(curve[i - 1].share));
    const xlsx = await t.team.agents.owner
      .post(exportUrl())
      .send({
        runId: study.runId,
        ...scenario,
        name: 'River first',
        sweep,
        segmentBy: { groupBy: 'task', task: 1 },
        format: 'xlsx',
      })
      .buffer(true)
      .parse(binary as never)
      .expect(200);
    const workbook = new ExcelJS.Workbook();
    await workbook.xlsx.load(xlsx.body as Parameters<typeof workbook.xlsx.load>[0]);
    expect(workbook.worksheets.map((w) => w.name)).toEqual([
      'About',
      'Shares',
      'Segments',
      'Demand curve',
      'Codebook',
    ]);
    expect(workbook.getWorksheet('Demand curve')!.rowCount).toBe(17);
    const about = workbook.getWorksheet('About')!.getColumn(2).values.join(' ');
    expect(about).toContain('River first');
    expect(about).toMatch(/conditional distribution/);
  });

  it.each([
    [{}, 'format'],
    [{ format: 'pdf' }, 'format'],
    [{ format: 'csv', sweep: { alternative: 0, attributeId: 'colour' } }, 'sweep.attributeId'],
    [{ format: 'csv', sweep: { alternative: 4, attributeId: 'bill' } }, 'sweep.alternative'],
    [
      { format: 'csv', sweep: { alternative: 0, attributeId: 'bill', points: 500 } },
      'sweep.points',
    ],
  ])('when the body adds %o, returns 400 naming %s', async (extra, field) => {
    const res = await t.team.agents.analyst
      .post(exportUrl())
      .send({ runId: study.runId, ...scenario, ...extra })
      .expect(400);
    expect(res.body.error.code).toBe('invalid_input');
    expect(res.body.error.message).toEqual(expect.any(String));
    expect(res.body.error.fields.map((f: { path: string }) => f.path)).toContain(field);
  });

  it('returns 404 to an outsider and 401 without a session', async () => {
    const body = { runId: study.runId, ...scenario, format: 'csv' };
    await t.team.outsider.post(exportUrl()).send(body).expect(404);
    await t.request().post(exportUrl()).send(body).expect(401);
  });
});
