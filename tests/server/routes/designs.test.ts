import { beforeAll, describe, expect, it } from 'vitest';
import { eq } from 'drizzle-orm';
import { useTestApp } from '../../support/test-app';
import { createTeamWithAllRoles } from '../../support/factories';
import { createStudyVia, makeSmallDefinition } from './study-fixtures';
import { runDesignJob } from '../../../server/jobs/design-job';
import { useDesignPool } from '../../support/engine-pools';
import { getStudyById } from '../../../db/queries/studies';
import { designJobs, studies } from '../../../db/schema/studies';
import type { Role } from '../../../shared/permissions';

const t = useTestApp();
let team: Awaited<ReturnType<typeof createTeamWithAllRoles>>;
const sent: Array<{ name: string; data: { designJobId: string } }> = [];
const pool = useDesignPool();

beforeAll(async () => {
  // The queue is replaced by a recorder; tests run the handler in-process.
  t.deps.jobs = {
    send: async (name, data) => {
      sent.push({ name, data: data as { designJobId: string } });
    },
  };
  team = await createTeamWithAllRoles(t);
});

const designUrl = (studyId: string) => `/api/teams/${team.teamId}/studies/${studyId}/design`;
const randomSpec = { method: 'random', tasks: 6, blocks: 2, seed: 7 };
const HEADER = 'block,task,alternative,Monthly bill increase,River health rating';

async function draftWithAttributes() {
  return createStudyVia(team.agents.owner, team.teamId, { definition: makeSmallDefinition() });
}

describe('POST /design/jobs', () => {
  it.each<Role>(['owner', 'editor'])('as %s, queues a job and returns 202', async (role) => {
    const { id } = await draftWithAttributes();
    const res = await team.agents[role]
      .post(`${designUrl(id)}/jobs`)
      .send(randomSpec)
      .expect(202);
    expect(res.body).toMatchObject({ status: 'queued', spec: { method: 'random', tasks: 6 } });
    expect(sent.at(-1)).toEqual({ name: 'design-generation', data: { designJobId: res.body.id } });
  });

  it.each<Role>(['analyst', 'viewer'])('as %s, returns 403 and queues nothing', async (role) => {
    const { id } = await draftWithAttributes();
    const before = sent.length;
    await team.agents[role]
      .post(`${designUrl(id)}/jobs`)
      .send(randomSpec)
      .expect(403);
    expect(sent.length).toBe(before);
  });

  it('for someone outside the team, returns 404', async () => {
    const { id } = await draftWithAttributes();
    await team.outsider
      .post(`${designUrl(id)}/jobs`)
      .send(randomSpec)
      .expect(404);
    await team.outsider.get(designUrl(id)).expect(404);
  });

  it('when tasks are not a multiple of blocks, returns 400 with the field', async () => {
    const { id } = await draftWithAttributes();
    const res = await team.agents.owner
      .post(`${designUrl(id)}/jobs`)
      .send({ ...randomSpec, tasks: 7 })
      .expect(400);
    expect(res.body.error.fields).toEqual([expect.objectContaining({ path: 'blocks' })]);
  });

  it('when a prior names an unknown coded column, returns 400 and queues nothing', async () => {
    const { id } = await draftWithAttributes();
    const before = sent.length;
    const res = await team.agents.owner
      .post(`${designUrl(id)}/jobs`)
      .send({
        method: 'd_efficient',
        tasks: 6,
        priors: { kind: 'fixed', columns: [{ key: 'attr:nothing', mean: -1 }] },
      })
      .expect(400);
    expect(res.body.error.code).toBe('invalid_spec');
    expect(sent.length).toBe(before);
  });

  it('when the S-estimate is asked for with zero priors, returns 400 with the criterion field', async () => {
    const { id } = await draftWithAttributes();
    const before = sent.length;
    const res = await team.agents.owner
      .post(`${designUrl(id)}/jobs`)
      .send({ method: 'd_efficient', tasks: 6, criterion: 's_estimate' })
      .expect(400);
    expect(res.body.error).toMatchObject({
      code: 'invalid_spec',
      fields: [{ path: 'criterion', message: expect.stringMatching(/non-zero mean/) }],
    });
    expect(sent.length).toBe(before);
  });

  it('when the criterion is unknown, returns 400 with the field', async () => {
    const { id } = await draftWithAttributes();
    const res = await team.agents.owner
      .post(`${designUrl(id)}/jobs`)
      .send({ method: 'd_efficient', tasks: 6, criterion: 'e_error' })
      .expect(400);
    expect(res.body.error.fields).toEqual([expect.objectContaining({ path: 'criterion' })]);
  });

  it('when an earlier generator version is asked for, returns 400 with the field and queues nothing', async () => {
    const { id } = await draftWithAttributes();
    const before = sent.length;
    const res = await team.agents.owner
      .post(`${designUrl(id)}/jobs`)
      .send({ ...randomSpec, generatorVersion: 1 })
      .expect(400);
    expect(res.body.error.fields).toEqual([expect.objectContaining({ path: 'generatorVersion' })]);
    expect(sent.length).toBe(before);
  });

  it('when a job is already running for the study, returns 409', async () => {
    const { id } = await draftWithAttributes();
    await team.agents.owner
      .post(`${designUrl(id)}/jobs`)
      .send(randomSpec)
      .expect(202);
    const res = await team.agents.owner
      .post(`${designUrl(id)}/jobs`)
      .send(randomSpec)
      .expect(409);
    expect(res.body.error.code).toBe('job_running');
  });

  it('when the study is closed, returns 409 study_frozen', async () => {
    const { id } = await draftWithAttributes();
    await t.deps.db.update(studies).set({ status: 'closed' }).where(eq(studies.id, id));
    const res = await team.agents.owner
      .post(`${designUrl(id)}/jobs`)
      .send(randomSpec)
      .expect(409);
    expect(res.body.error.code).toBe('study_frozen');
  });
});

describe('the design job', () => {
  it('goes queued → running → done and attaches the design with diagnostics', async () => {
    const { id } = await draftWithAttributes();
    const job = (
      await team.agents.editor
        .post(`${designUrl(id)}/jobs`)
        .send({
          method: 'd_efficient',
          tasks: 6,
          blocks: 2,
          starts: 2,
          seed: 3,
          priors: {
            kind: 'fixed',
            columns: [
              { key: 'attr:bill', mean: -0.1 },
              { key: 'attr:river:fair', mean: 0.5 },
              { key: 'attr:river:good', mean: 1 },
            ],
          },
        })
        .expect(202)
    ).body;
    expect(job.status).toBe('queued');
    const seen: string[] = [];
    const running = runDesignJob(t.deps, pool, job.id);
    for (let i = 0; i < 200; i++) {
      const { body } = await team.agents.viewer.get(`${designUrl(id)}/jobs/${job.id}`).expect(200);
      if (seen.at(-1) !== body.status) seen.push(body.status);
      if (body.status === 'done') break;
      await new Promise((r) => setTimeout(r, 25));
    }
    await running;
    expect(seen).toEqual(expect.arrayContaining(['running', 'done']));
    const { body: state } = await team.agents.analyst.get(designUrl(id)).expect(200);
    expect(state.job).toMatchObject({ id: job.id, status: 'done', progress: { phase: 'done' } });
    expect(state.design.method).toBe('d_efficient');
    expect(state.design.design.tasks).toHaveLength(6);
    expect(state.design.design.blocks).toBe(2);
    expect(state.design.diagnostics.dError).toBeGreaterThan(0);
    expect(state.design.diagnostics.sampleSize).toBeDefined();
    // The stored spec says which generator made it (docs/methods.md "Design generator versions").
    expect(state.design.spec).toMatchObject({ seed: 3, generatorVersion: 2 });
    const study = await getStudyById(t.deps.db, { id, teamId: team.teamId });
    expect(study!.currentDesignId).toBe(state.design.id);
  });

  it('is seeded: the same spec gives the same design', async () => {
    const designs = [];
    for (let k = 0; k < 2; k++) {
      const { id } = await draftWithAttributes();
      const job = (await team.agents.owner.post(`${designUrl(id)}/jobs`).send(randomSpec)).body;
      await runDesignJob(t.deps, pool, job.id);
      designs.push((await team.agents.owner.get(designUrl(id))).body.design.design);
    }
    expect(designs[0]).toEqual(designs[1]);
  });

  it('cancelled while queued, ends cancelled without running', async () => {
    const { id } = await draftWithAttributes();
    const job = (await team.agents.owner.post(`${designUrl(id)}/jobs`).send(randomSpec)).body;
    await team.agents.viewer.post(`${designUrl(id)}/jobs/${job.id}/cancel`).expect(403);
    const res = await team.agents.editor.post(`${designUrl(id)}/jobs/${job.id}/cancel`).expect(200);
    expect(res.body.status).toBe('cancelled');
    await runDesignJob(t.deps, pool, job.id);
    const { body } = await team.agents.owner.get(designUrl(id));
    expect(body).toMatchObject({ design: null, job: { status: 'cancelled' } });
  });

  it('cancelled while running, aborts the worker and ends cancelled', async () => {
    const big = makeSmallDefinition();
    big.attributes.push(
      ...['a', 'b', 'c', 'd'].map((x) => ({
        id: `x${x}`,
        name: `Extra ${x}`,
        kind: 'categorical' as const,
        isCost: false,
        coding: 'effects' as const,
        levels: [1, 2, 3, 4].map((n) => ({ id: `${x}${n}`, label: `Level ${n}` })),
      })),
    );
    const { id } = await createStudyVia(team.agents.owner, team.teamId, { definition: big });
    const job = (
      await team.agents.owner
        .post(`${designUrl(id)}/jobs`)
        .send({
          method: 'd_efficient',
          tasks: 48,
          starts: 100,
          maxIterations: 1000,
          priors: { kind: 'zero' },
        })
        .expect(202)
    ).body;
    const running = runDesignJob(t.deps, pool, job.id);
    for (let i = 0; i < 400; i++) {
      const { body } = await team.agents.owner.get(`${designUrl(id)}/jobs/${job.id}`);
      if (body.status === 'running') break;
      await new Promise((r) => setTimeout(r, 25));
    }
    await team.agents.owner.post(`${designUrl(id)}/jobs/${job.id}/cancel`).expect(200);
    await running;
    const { body } = await team.agents.owner.get(`${designUrl(id)}/jobs/${job.id}`);
    expect(body.status).toBe('cancelled');
    expect(body.designId).toBeNull();
  });

  it('when the worker reports an engine error, ends failed with the message', async () => {
    const { id } = await draftWithAttributes();
    const job = (await team.agents.owner.post(`${designUrl(id)}/jobs`).send(randomSpec)).body;
    // A stored spec the engine refuses (a full factorial of 9 profiles cannot have 5 tasks).
    await t.deps.db
      .update(designJobs)
      .set({ spec: { method: 'full_factorial', tasks: 5, blocks: 1 } })
      .where(eq(designJobs.id, job.id));
    await runDesignJob(t.deps, pool, job.id);
    const { body } = await team.agents.owner.get(`${designUrl(id)}/jobs/${job.id}`);
    expect(body.status).toBe('failed');
    expect(body.error).toMatch(/full factorial/i);
  });
});

describe('POST /design/import and GET /design/export.csv', () => {
  const csv = [
    HEADER,
    '1,1,1,0,Poor',
    '1,1,2,10,Good',
    '1,2,1,5,Fair',
    '1,2,2,0,Good',
    '2,3,1,10,Poor',
    '2,3,2,5,Good',
    '2,4,1,0,Fair',
    '2,4,2,10,Fair',
  ].join('\n');

  it('imports a valid CSV for an editor and exports the same rows', async () => {
    const { id } = await draftWithAttributes();
    const res = await team.agents.editor
      .post(`${designUrl(id)}/import`)
      .attach('file', Buffer.from(csv), 'design.csv')
      .expect(201);
    expect(res.body.design).toMatchObject({ method: 'imported', design: { blocks: 2 } });
    expect(res.body.design.diagnostics.levelBalance).toHaveLength(2);
    const out = await team.agents.viewer.get(`${designUrl(id)}/export.csv`).expect(200);
    expect(out.headers['content-type']).toMatch(/text\/csv/);
    expect(out.text.trim().split('\n')).toEqual(csv.split('\n'));
  });

  it('when the CSV is broken, returns 400 with row-level fields and saves nothing', async () => {
    const { id } = await draftWithAttributes();
    const broken = [HEADER, '1,1,1,0,Poor', '1,1,2,7,Splendid'].join('\n');
    const res = await team.agents.owner
      .post(`${designUrl(id)}/import`)
      .attach('file', Buffer.from(broken), 'design.csv')
      .expect(400);
    expect(res.body.error.code).toBe('invalid_csv');
    const paths = res.body.error.fields.map((f: { path: string }) => f.path);
    expect(paths).toEqual(
      expect.arrayContaining(['rows.3.Monthly bill increase', 'rows.3.River health rating']),
    );
    const { body } = await team.agents.owner.get(designUrl(id));
    expect(body.design).toBeNull();
  });

  it('when no file is sent, returns 400 naming the file field', async () => {
    const { id } = await draftWithAttributes();
    const res = await team.agents.owner.post(`${designUrl(id)}/import`).expect(400);
    expect(res.body.error.fields).toEqual([{ path: 'file', message: 'Choose a file' }]);
  });

  it.each<Role>(['analyst', 'viewer'])('as %s, import returns 403', async (role) => {
    const { id } = await draftWithAttributes();
    await team.agents[role]
      .post(`${designUrl(id)}/import`)
      .attach('file', Buffer.from(csv), 'design.csv')
      .expect(403);
  });

  it('export without a design returns 404', async () => {
    const { id } = await draftWithAttributes();
    await team.agents.owner.get(`${designUrl(id)}/export.csv`).expect(404);
  });
});
