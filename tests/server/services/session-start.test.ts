/**
 * Starting a session: the study lookup brings the latest version with it (no round trip of
 * its own); a new respondent's plan is used as it was built (it is not read back
 * from the database or checked again), so what is stored must be exactly what the phone was
 * shown: a resume in another process rebuilds the screens from the stored plan.
 */
import { describe, expect, it } from 'vitest';
import { eq } from 'drizzle-orm';
import { useTestApp } from '../../support/test-app';
import { respondents } from '../../../db/schema/fieldwork';
import { studyVersions } from '../../../db/schema/studies';
import { getStudyByPublicId } from '../../../db/queries/respondents';
import { respondentPlanSchema } from '../../../shared/schemas/respondent';
import { buildScreens, loadFrozenVersion } from '../../../server/services/respondent-screens';
import { insertStudy } from '../routes/respond-fixtures';

const t = useTestApp({}, { signIn: 'owner' });

async function liveStudy() {
  const study = await insertStudy(t, t.teamId, {});
  await t.owner.post(`/api/teams/${t.teamId}/studies/${study.id}/lifecycle/go-live`).expect(200);
  return study;
}

/** Starts a session on the study's link as a phone does; returns the reply and the stored respondent. */
async function startSession(publicId: string) {
  const started = await t
    .request()
    .post(`/api/r/${publicId}/sessions`)
    .send({ params: {}, device: 'phone' })
    .expect(201);
  const [row] = await t.deps.db
    .select({ plan: respondents.plan, block: respondents.block, versionId: respondents.versionId })
    .from(respondents)
    .where(eq(respondents.sessionToken, started.body.sessionToken));
  return { started, row };
}

describe('POST /api/r/:publicId/sessions (a new respondent)', () => {
  it('stores the plan the session was built from, and the stored plan rebuilds the same screens', async () => {
    const s = await liveStudy();
    const { started, row } = await startSession(s.publicId);
    const stored = respondentPlanSchema.parse(row.plan);
    expect(stored.block).toBe(row.block);
    const tasks = started.body.screens.filter((x: { kind: string }) => x.kind === 'task');
    // The task screens come in the stored order, with the stored on-screen positions.
    expect(tasks.map((x: { key: string }) => x.key)).toEqual(
      stored.taskOrder.map((n) => `task:${n}`),
    );
    for (const task of tasks)
      expect(task.alternatives.map((a: { index: number }) => a.index)).toEqual(
        stored.positions[task.key],
      );
    // What a resume in another process rebuilds from the stored plan.
    const version = await loadFrozenVersion(t.deps.db, { id: row.versionId, studyId: s.id });
    expect(JSON.parse(JSON.stringify(buildScreens(version, stored)))).toEqual(started.body.screens);
  });
});

describe('getStudyByPublicId', () => {
  it("reads the study's latest version with it, the one a new respondent answers", async () => {
    const s = await liveStudy();
    const [v1] = await t.deps.db
      .select()
      .from(studyVersions)
      .where(eq(studyVersions.studyId, s.id));
    const { id: _id, createdAt: _at, ...copy } = v1;
    const [v2] = await t.deps.db
      .insert(studyVersions)
      .values({ ...copy, version: 2 })
      .returning({ id: studyVersions.id });
    const study = await getStudyByPublicId(t.deps.db, { publicId: s.publicId });
    expect(study?.latestVersionId).toBe(v2.id);
    // And the next session starts on it.
    const { row } = await startSession(s.publicId);
    expect(row.versionId).toBe(v2.id);
  });
});
