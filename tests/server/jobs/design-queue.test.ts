/**
 * The real pg-boss queue on the test database: a design job sent by the API is picked up by
 * the worker side, and a job whose worker went silent is failed by the sweep.
 */
import { describe, expect, it } from 'vitest';
import { eq } from 'drizzle-orm';
import { useTestApp } from '../../support/test-app';
import { signUpOwner } from '../../support/factories';
import { createStudyVia, makeSmallDefinition } from '../routes/study-fixtures';
import { createDesignJobKind } from '../../../server/jobs/design-job';
import { designJobs } from '../../../db/schema/studies';

const kind = createDesignJobKind();
const t = useTestApp({}, { jobQueue: { work: true, kinds: () => [kind] } });

describe('design jobs through pg-boss', () => {
  it('a job sent by the API runs in the worker and attaches a design', async () => {
    const { agent, teamId } = await signUpOwner(t);
    const { id } = await createStudyVia(agent, teamId, { definition: makeSmallDefinition() });
    const url = `/api/teams/${teamId}/studies/${id}/design`;
    const job = (
      await agent.post(`${url}/jobs`).send({ method: 'random', tasks: 4, seed: 2 }).expect(202)
    ).body;
    let status = job.status;
    for (let i = 0; i < 300 && status !== 'done' && status !== 'failed'; i++) {
      await new Promise((r) => setTimeout(r, 100));
      status = (await agent.get(`${url}/jobs/${job.id}`)).body.status;
    }
    expect(status).toBe('done');
    expect((await agent.get(url)).body.design.design.tasks).toHaveLength(4);
  });

  it('the sweep fails a running job whose worker stopped reporting', async () => {
    const { agent, teamId } = await signUpOwner(t);
    const { id } = await createStudyVia(agent, teamId, { definition: makeSmallDefinition() });
    const [row] = await t.deps.db
      .insert(designJobs)
      .values({
        studyId: id,
        teamId,
        spec: {},
        status: 'running',
        startedAt: new Date(Date.now() - 10 * 60_000),
        progress: { at: new Date(Date.now() - 10 * 60_000).toISOString() },
      })
      .returning({ id: designJobs.id });
    await kind.sweep!(t.deps);
    const [after] = await t.deps.db.select().from(designJobs).where(eq(designJobs.id, row.id));
    expect(after.status).toBe('failed');
    expect(after.error).toMatch(/stopped unexpectedly/);
    expect(after.finishedAt).not.toBeNull();
  });
});
