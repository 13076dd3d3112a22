import { describe, expect, it } from 'vitest';
import type supertest from 'supertest';
import { useTestApp } from '../../support/test-app';
import type { Role } from '../../../shared/permissions';
import { listRuns } from '../../../db/queries/runs';
import { seedTapFilter, useRunStudy } from '../jobs/run-fixtures';

const t = useTestApp({}, { signIn: 'team', recordJobs: true });

const mnlSpec = {
  model: 'mnl',
  coefficients: [
    { name: 'bill', column: 'attr:bill' },
    { name: 'interruptions', column: 'attr:interrupt' },
    { name: 'sq', column: 'asc:fixed' },
  ],
  cost: 'bill',
};

const study = useRunStudy(t, 6);

const start = (agent: supertest.Agent, body: object = { spec: mnlSpec }) =>
  agent.post(study.base).send(body);

describe('POST /runs', () => {
  it.each<Role>(['owner', 'analyst'])(
    'as %s, queues the run and enqueues its job',
    async (role) => {
      const res = await start(t.team.agents[role]).expect(201);
      expect(res.body).toMatchObject({
        status: 'queued',
        model: 'mnl',
        name: 'Multinomial logit',
        respondents: { filterId: null },
      });
      expect(res.body.spec.coefficients[0]).toMatchObject({ name: 'bill', column: 'attr:bill' });
      expect(t.sent).toEqual([{ name: 'estimation-run', data: { runId: res.body.id } }]);
    },
  );

  it.each<Role>(['editor', 'viewer'])('as %s, returns 403 and creates nothing', async (role) => {
    const before = (await listRuns(t.deps.db, { teamId: t.team.teamId, studyId: study.studyId }))
      .length;
    const res = await start(t.team.agents[role]).expect(403);
    expect(res.body.error.code).toBe('forbidden');
    const after = await listRuns(t.deps.db, { teamId: t.team.teamId, studyId: study.studyId });
    expect(after).toHaveLength(before);
    expect(t.sent).toEqual([]);
  });

  it('for someone outside the team, returns 404', async () => {
    await start(t.team.outsider).expect(404);
  });

  it('when the spec is invalid, returns 400 with the field and creates nothing', async () => {
    const before = (await listRuns(t.deps.db, { teamId: t.team.teamId, studyId: study.studyId }))
      .length;
    const res = await start(t.team.agents.analyst, {
      spec: {
        model: 'mnl',
        coefficients: [{ name: 'bill', column: 'attr:bill', distribution: 'normal' }],
      },
    }).expect(400);
    expect(res.body.error.fields).toEqual(
      expect.arrayContaining([
        expect.objectContaining({ path: 'spec.coefficients.0.distribution' }),
      ]),
    );
    const res2 = await start(t.team.agents.analyst, {
      spec: { ...mnlSpec, draws: { count: 3 } },
    }).expect(400);
    expect(res2.body.error.fields[0].path).toBe('spec.draws.count');
    const after = await listRuns(t.deps.db, { teamId: t.team.teamId, studyId: study.studyId });
    expect(after).toHaveLength(before);
    expect(t.sent).toEqual([]);
  });

  it('when a coefficient names a column the study does not have, returns 400 with the field', async () => {
    const res = await start(t.team.agents.analyst, {
      spec: { model: 'mnl', coefficients: [{ name: 'x', column: 'attr:nothing' }] },
    }).expect(400);
    expect(res.body.error.fields).toEqual([
      { path: 'spec.coefficients.0.column', message: 'The study has no coded column attr:nothing' },
    ]);
    expect(t.sent).toEqual([]);
  });

  it('accepts column codes as well as keys, and a saved filter', async () => {
    const filterId = await seedTapFilter(t.deps.db, study.studyId);
    const res = await start(t.team.agents.analyst, {
      name: 'Tap filterers',
      spec: {
        model: 'mixed',
        coefficients: [
          { name: 'bill', column: 'monthly_bill_increase', distribution: 'neg_lognormal' },
          { name: 'river_good', column: 'river_health_good', distribution: 'normal' },
        ],
        draws: { count: 50, seed: 3 },
      },
      respondents: { filterId },
    }).expect(201);
    expect(res.body.spec.coefficients.map((c: { column: string }) => c.column)).toEqual([
      'attr:bill',
      'attr:river:good',
    ]);
    expect(res.body).toMatchObject({ seed: 3, respondents: { filterId }, name: 'Tap filterers' });
  });

  it('when the mixed logit would not fit the memory limit, returns 400 with the estimate and the limit, and queues nothing', async () => {
    const spec = {
      model: 'mixed',
      coefficients: [
        { name: 'bill', column: 'attr:bill', distribution: 'neg_lognormal' },
        { name: 'interruptions', column: 'attr:interrupt', distribution: 'normal' },
      ],
      draws: { count: 20_000 },
    };
    const limit = t.deps.env.ESTIMATION_MEMORY_LIMIT_MB;
    // The setting's own floor is 64 MB; a tiny study needs a tinier limit to be refused.
    t.deps.env.ESTIMATION_MEMORY_LIMIT_MB = 2;
    try {
      const before = await listRuns(t.deps.db, { teamId: t.team.teamId, studyId: study.studyId });
      const res = await start(t.team.agents.analyst, { spec }).expect(400);
      expect(res.body.error.code).toBe('model_too_large');
      expect(res.body.error.message).toMatch(/needs about \d+ MB .* limit of 2 MB/);
      expect(res.body.error.fields[0].path).toBe('spec.draws.count');
      const after = await listRuns(t.deps.db, { teamId: t.team.teamId, studyId: study.studyId });
      expect(after).toHaveLength(before.length);
      expect(t.sent).toEqual([]);
    } finally {
      t.deps.env.ESTIMATION_MEMORY_LIMIT_MB = limit;
    }
    await start(t.team.agents.analyst, { spec }).expect(201);
  });

  it('when the saved filter does not exist, returns 400 with the field', async () => {
    const res = await start(t.team.agents.analyst, {
      spec: mnlSpec,
      respondents: { filterId: '00000000-0000-4000-8000-000000000000' },
    }).expect(400);
    expect(res.body.error.fields[0].path).toBe('respondents.filterId');
  });
});

describe('GET /runs, GET /runs/:runId and GET /runs/options', () => {
  it.each<Role>(['owner', 'editor', 'analyst', 'viewer'])(
    'as %s, lists and reads runs',
    async (role) => {
      const created = await start(t.team.agents.analyst).expect(201);
      const list = await t.team.agents[role].get(study.base).expect(200);
      expect(list.body.map((r: { id: string }) => r.id)).toContain(created.body.id);
      const one = await t.team.agents[role].get(`${study.base}/${created.body.id}`).expect(200);
      expect(one.body).toMatchObject({ id: created.body.id, status: 'queued', progress: {} });
    },
  );

  it('lists the coded columns, respondent count and filters for the form', async () => {
    const res = await t.team.agents.viewer.get(`${study.base}/options`).expect(200);
    expect(res.body.includedRespondents).toBe(6);
    expect(res.body.columns[0]).toEqual({
      key: 'attr:bill',
      code: 'monthly_bill_increase',
      label: 'Monthly bill increase (€)',
      kind: 'linear',
      attributeId: 'bill',
      isCost: true,
    });
    expect(res.body.columns.at(-1)).toMatchObject({ key: 'asc:fixed', kind: 'constant' });
  });

  it('for someone outside the team, returns 404 for the list and the run', async () => {
    const created = await start(t.team.agents.analyst).expect(201);
    await t.team.outsider.get(study.base).expect(404);
    await t.team.outsider.get(`${study.base}/${created.body.id}`).expect(404);
  });

  it('for an unknown run, returns 404', async () => {
    await t.team.agents.viewer
      .get(`${study.base}/00000000-0000-4000-8000-000000000000`)
      .expect(404);
  });
});

describe('POST /runs/:runId/cancel', () => {
  it.each<Role>(['editor', 'viewer'])(
    'as %s, returns 403 and leaves the run queued',
    async (role) => {
      const created = await start(t.team.agents.analyst).expect(201);
      await t.team.agents[role].post(`${study.base}/${created.body.id}/cancel`).expect(403);
      const one = await t.team.agents.viewer.get(`${study.base}/${created.body.id}`).expect(200);
      expect(one.body.status).toBe('queued');
    },
  );

  it.each<Role>(['owner', 'analyst'])('as %s, cancels a queued run at once', async (role) => {
    const created = await start(t.team.agents.analyst).expect(201);
    const res = await t.team.agents[role]
      .post(`${study.base}/${created.body.id}/cancel`)
      .expect(200);
    expect(res.body).toMatchObject({ status: 'cancelled', cancelRequested: true });
  });

  it('when the run has finished, returns 409', async () => {
    const created = await start(t.team.agents.analyst).expect(201);
    await t.team.agents.analyst.post(`${study.base}/${created.body.id}/cancel`).expect(200);
    const res = await t.team.agents.analyst
      .post(`${study.base}/${created.body.id}/cancel`)
      .expect(409);
    expect(res.body.error.code).toBe('run_finished');
  });

  it('for someone outside the team, returns 404', async () => {
    const created = await start(t.team.agents.analyst).expect(201);
    await t.team.outsider.post(`${study.base}/${created.body.id}/cancel`).expect(404);
  });
});

describe('POST /runs/filters', () => {
  it.each<Role>(['owner', 'analyst'])(
    'as %s, saves a filter the form then offers',
    async (role) => {
      const res = await t.team.agents[role]
        .post(`${study.base}/filters`)
        .send({
          name: `Large households ${role}`,
          definition: { conditions: [{ question: 'household_size', values: [4, 5] }] },
        })
        .expect(201);
      const options = await t.team.agents.viewer.get(`${study.base}/options`).expect(200);
      expect(options.body.filters).toContainEqual({ id: res.body.id, name: res.body.name });
    },
  );

  it.each<Role>(['editor', 'viewer'])('as %s, returns 403', async (role) => {
    await t.team.agents[role]
      .post(`${study.base}/filters`)
      .send({ name: 'x', definition: { respondentIds: ['a'] } })
      .expect(403);
  });

  it('when the filter is empty, returns 400 with the field', async () => {
    const res = await t.team.agents.analyst
      .post(`${study.base}/filters`)
      .send({ name: '', definition: {} })
      .expect(400);
    const paths = res.body.error.fields.map((f: { path: string }) => f.path);
    expect(paths).toEqual(expect.arrayContaining(['name', 'definition']));
  });
});
