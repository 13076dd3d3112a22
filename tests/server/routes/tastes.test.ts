import { describe, expect, it } from 'vitest';
import type supertest from 'supertest';
import { useTestApp } from '../../support/test-app';
import type { Role } from '../../../shared/permissions';
import { eq } from 'drizzle-orm';
import { runs } from '../../../db/schema/models';
import {
  ageBand,
  effectiveDraws,
  externalIds,
  N,
  riverGood,
  makeResults,
  useTastesStudy,
  spec,
} from './tastes-fixture';

const t = useTestApp({}, { signIn: 'team' });

const study = useTastesStudy(t, 'tastes');

const as = (role: Role): supertest.Agent => t.team.agents[role];

describe('GET /tastes/runs', () => {
  it('lists finished runs with their profile counts for every role', async () => {
    for (const role of ['owner', 'editor', 'analyst', 'viewer'] as const) {
      const res = await as(role).get(`${study.base}/runs`).expect(200);
      expect(res.body).toEqual([
        expect.objectContaining({ id: study.runId, profiles: N, profileDraws: 500 }),
      ]);
    }
  });

  it('returns 404 to an outsider and 401 without a session', async () => {
    await t.team.outsider.get(`${study.base}/runs`).expect(404);
    await t.request().get(`${study.base}/runs`).expect(401);
  });

  it('says why a run gives no WTP, so Exports can grey its WTP download', async () => {
    const [noCost] = await t.deps.db
      .insert(runs)
      .values({
        studyId: study.studyId,
        teamId: t.team.teamId,
        name: 'No cost coefficient',
        model: 'mnl',
        spec: { ...spec, model: 'mnl', cost: null },
        dataHash: 'cd'.repeat(32),
        status: 'done',
        results: { ...makeResults(), wtp: [] },
        finishedAt: new Date(Date.now() - 60_000),
      })
      .returning({ id: runs.id });
    const res = await as('viewer').get(`${study.base}/runs`).expect(200);
    const byId = new Map(
      (res.body as { id: string; wtpUnavailable: string | null }[]).map((r) => [r.id, r]),
    );
    expect(byId.get(study.runId)?.wtpUnavailable).toBeNull();
    expect(byId.get(noCost.id)?.wtpUnavailable).toBe(
      'This run has no cost coefficient, so it gives no WTP.',
    );
    // The download refuses with the same reason.
    const exportsBase = `/api/teams/${t.team.teamId}/studies/${study.studyId}/exports`;
    const refused = await as('viewer')
      .get(`${exportsBase}/estimates.csv?runId=${noCost.id}&table=wtp`)
      .expect(409);
    expect(refused.body.error.code).toBe('wtp_unavailable');
    expect(refused.body.error.message).toBe(byId.get(noCost.id)?.wtpUnavailable);
    await t.deps.db.delete(runs).where(eq(runs.id, noCost.id));
  });
});

describe('GET /tastes (profile table)', () => {
  it('shows an analyst the external ids and free-text answers beside means and SDs', async () => {
    const res = await as('analyst').get(study.base).query({ runId: study.runId }).expect(200);
    expect(res.body.total).toBe(N);
    expect(res.body.personalColumns).toBe(true);
    expect(res.body.questions.map((q: { key: string }) => q.key)).toEqual([
      'age_band',
      'household_size',
      'comments',
    ]);
    const first = res.body.rows[0];
    expect(first).toMatchObject({
      number: 1,
      externalId: externalIds[0],
      mean: { river_good: 0, bill: -0.1 },
      sd: { river_good: 0.5 },
      effectiveDraws: 10,
      lowDraws: true,
      answers: { age_band: '18–34', household_size: '1', comments: '+call me on 555' },
    });
    expect(res.body.coefficients[1]).toMatchObject({
      name: 'river_good',
      label: 'River health: good',
      populationMean: 2.5,
    });
    expect(res.body.wtp).toEqual(['river_good', 'asc_sq']);
  });

  it('shows a viewer the results without external ids or free-text answers', async () => {
    const res = await as('viewer').get(study.base).query({ runId: study.runId }).expect(200);
    expect(res.body.personalColumns).toBe(false);
    expect(res.body.questions.map((q: { key: string }) => q.key)).toEqual([
      'age_band',
      'household_size',
    ]);
    for (const row of res.body.rows) {
      expect(row).not.toHaveProperty('externalId');
      expect(row.answers).not.toHaveProperty('comments');
    }
    expect(JSON.stringify(res.body)).not.toContain('EXT-');
    expect(JSON.stringify(res.body)).not.toContain('call me');
  });

  it('returns 404 to an outsider and 401 without a session', async () => {
    await t.team.outsider.get(study.base).query({ runId: study.runId }).expect(404);
    await t.request().get(study.base).query({ runId: study.runId }).expect(401);
  });

  it('pages in SQL: page 2 of size 4 holds the last two rows and the total stays 6', async () => {
    const res = await as('viewer')
      .get(study.base)
      .query({ runId: study.runId, page: 2, pageSize: 4 })
      .expect(200);
    expect(res.body).toMatchObject({ page: 2, pageSize: 4, total: N });
    expect(res.body.rows.map((r: { number: number }) => r.number)).toEqual([5, 6]);
    const beyond = await as('viewer')
      .get(study.base)
      .query({ runId: study.runId, page: 9, pageSize: 4 })
      .expect(200);
    expect(beyond.body.rows).toEqual([]);
  });

  it('sorts by a conditional mean and by effective draws, both directions', async () => {
    const byMean = await as('viewer')
      .get(study.base)
      .query({ runId: study.runId, sort: 'mean:river_good', dir: 'desc' })
      .expect(200);
    expect(
      byMean.body.rows.map((r: { mean: { river_good: number } }) => r.mean.river_good),
    ).toEqual([5, 4, 3, 2, 1, 0].map(riverGood));
    const byDraws = await as('viewer')
      .get(study.base)
      .query({ runId: study.runId, sort: 'effectiveDraws' })
      .expect(200);
    expect(byDraws.body.rows.map((r: { effectiveDraws: number }) => r.effectiveDraws)).toEqual(
      [...effectiveDraws].sort((a, b) => a - b),
    );
    const byWtp = await as('viewer')
      .get(study.base)
      .query({ runId: study.runId, sort: 'wtp:river_good', dir: 'asc' })
      .expect(200);
    expect(byWtp.body.rows[0].number).toBe(1);
  });

  it('filters by low effective draws, quality flags and a background answer', async () => {
    const q = (extra: Record<string, string>) =>
      as('viewer')
        .get(study.base)
        .query({ runId: study.runId, ...extra })
        .expect(200);
    expect((await q({ lowDraws: 'true' })).body.total).toBe(2);
    expect((await q({ lowDraws: 'false' })).body.total).toBe(4);
    const flagged = await q({ flagged: 'true' });
    expect(flagged.body.total).toBe(1);
    expect(flagged.body.rows[0].flags).toEqual(['speeder']);
    const young = await q({ question: 'age_band', answer: 'a18' });
    expect(young.body.total).toBe(ageBand.filter((a) => a === 'a18').length);
    const size3 = await q({ question: 'household_size', answer: '3' });
    expect(size3.body.rows.map((r: { number: number }) => r.number)).toEqual([3]);
  });

  it.each([
    [{ pageSize: '500' }, 'pageSize'],
    [{ page: '0' }, 'page'],
    [{ page: 'two' }, 'page'],
    [{ sort: 'drop table' }, 'sort'],
    [{ sort: 'mean:nope' }, 'sort'],
    [{ sort: 'wtp:bill' }, 'sort'],
    [{ dir: 'sideways' }, 'dir'],
    [{ lowDraws: 'maybe' }, 'lowDraws'],
    [{ question: 'age_band' }, 'answer'],
    [{ question: 'comments', answer: 'x' }, 'question'],
  ])('when the query has %o, returns 400 naming %s', async (extra, field) => {
    // A viewer may not filter by the free-text question: it is unknown to them.
    const res = await as('viewer')
      .get(study.base)
      .query({ runId: study.runId, ...extra })
      .expect(400);
    expect(res.body.error.fields.map((f: { path: string }) => f.path)).toContain(field);
  });

  it('returns 400 without a run, 404 for an unknown run and 409 for an unfinished one', async () => {
    await as('analyst').get(study.base).expect(400);
    await as('analyst').get(study.base).query({ runId: crypto.randomUUID() }).expect(404);
    const res = await as('analyst')
      .get(study.base)
      .query({ runId: study.runningRunId })
      .expect(409);
    expect(res.body.error.code).toBe('run_not_finished');
  });
});

describe('GET /tastes/segments', () => {
  it('splits a coefficient by a background question with group means and counts', async () => {
    const res = await as('viewer')
      .get(`${study.base}/segments`)
      .query({
        runId: study.runId,
        coefficient: 'river_good',
        groupBy: 'question',
        question: 'age_band',
      })
      .expect(200);
    // river_good = 0,1,2 for 18–34 and 3,4,5 for 35–64: means 1 and 4 (by hand).
    expect(res.body.groups.map((g: object) => g)).toEqual([
      expect.objectContaining({ key: 'a18', label: '18–34', count: 3, mean: 1, median: 1 }),
      expect.objectContaining({ key: 'a35', label: '35–64', count: 3, mean: 4, median: 4 }),
    ]);
    expect(res.body.groupLabel).toBe('Your age band');
    expect(res.body.ungrouped).toBe(0);
    const binned = res.body.groups.reduce(
      (s: number, g: { histogram: number[] }) => s + g.histogram.reduce((a, b) => a + b, 0),
      0,
    );
    expect(binned).toBe(N);
  });

  it('splits by the alternative chosen in a task, status quo included', async () => {
    const res = await as('analyst')
      .get(`${study.base}/segments`)
      .query({ runId: study.runId, coefficient: 'river_good', groupBy: 'task', task: 1 })
      .expect(200);
    expect(
      res.body.groups.map((g: { label: string; count: number; mean: number }) => [
        g.label,
        g.count,
        g.mean,
      ]),
    ).toEqual([
      ['Alternative 1', 2, 0.5],
      ['Alternative 2', 2, 2.5],
      ['Current service', 2, 4.5],
    ]);
  });

  it('splits by a number question by its distinct values', async () => {
    const res = await as('analyst')
      .get(`${study.base}/segments`)
      .query({
        runId: study.runId,
        coefficient: 'bill',
        groupBy: 'question',
        question: 'household_size',
      })
      .expect(200);
    expect(res.body.groups.map((g: { key: string }) => g.key)).toEqual([
      '1',
      '2',
      '3',
      '4',
      '5',
      '6',
    ]);
  });

  it.each([
    [{ coefficient: 'river_good', groupBy: 'task' }, 'task'],
    [{ coefficient: 'river_good', groupBy: 'task', task: '99' }, 'task'],
    [{ coefficient: 'river_good', groupBy: 'question', question: 'comments' }, 'question'],
    [{ coefficient: 'nope', groupBy: 'task', task: '1' }, 'coefficient'],
    [{ coefficient: 'river_good', groupBy: 'colour' }, 'groupBy'],
  ])('when the query has %o, returns 400 naming %s', async (extra, field) => {
    const res = await as('analyst')
      .get(`${study.base}/segments`)
      .query({ runId: study.runId, ...extra })
      .expect(400);
    expect(res.body.error.fields.map((f: { path: string }) => f.path)).toContain(field);
  });

  it('returns 404 to an outsider', async () => {
    await t.team.outsider
      .get(`${study.base}/segments`)
      .query({ runId: study.runId, coefficient: 'bill', groupBy: 'task', task: 1 })
      .expect(404);
  });
});

describe('GET /tastes/runs/:runId/respondents/:respondentId', () => {
  it('shows the choices task by task beside the profile', async () => {
    const res = await as('viewer')
      .get(`${study.base}/runs/${study.runId}/respondents/${study.respondentIds[4]}`)
      .expect(200);
    expect(res.body.row).toMatchObject({ number: 5, mean: { river_good: 4 } });
    expect(res.body.row).not.toHaveProperty('externalId');
    expect(
      res.body.choices.map((c: { task: number; chosen: number }) => [c.task, c.chosen]),
    ).toEqual([
      [1, -1],
      [2, 0],
    ]);
    expect(res.body.choices[0].alternatives[2]).toMatchObject({
      label: 'Current service',
      fixed: true,
      levels: { 'River health': 'poor' },
    });
    expect(res.body.choices[0].alternatives[0].levels['Monthly bill increase']).toBe('€3');
  });

  it('returns 404 for a respondent of another study or an outsider', async () => {
    await as('viewer')
      .get(`${study.base}/runs/${study.runId}/respondents/${crypto.randomUUID()}`)
      .expect(404);
    await t.team.outsider
      .get(`${study.base}/runs/${study.runId}/respondents/${study.respondentIds[0]}`)
      .expect(404);
  });
});
