/**
 * Starting a session: the study lookup brings the latest version with it (no round trip of
 * its own); a new respondent's plan is used as it was built (it is not read back
 * from the database or checked again), so what is stored must be exactly what the phone was
 * shown: a resume in another process rebuilds the screens from the stored plan.
 */
import { describe, expect, it } from 'vitest';
import { eq } from 'drizzle-orm';
import { useTestApp } from '../../support/test-app';
import { respondentBlockCounts, respondents } from '../../../db/schema/fieldwork';
import { studies, studyVersions } from '../../../db/schema/studies';
import {
  getRespondentByToken,
  getStudyByPublicId,
  insertRespondent,
  insertStartedRespondents,
  type StartedRespondent,
} from '../../../db/queries/respondents';
import { readSessionStart } from '../../../db/queries/session-start';
import { respondentPlanSchema } from '../../../shared/schemas/respondent';
import { buildScreens, loadFrozenVersion } from '../../../server/services/respondent-screens';
import { createSessionToken } from '../../../server/services/respondent-session';
import { readSettings } from '../../../server/services/lifecycle';
import { completeRespondent, insertInvitee, insertStudy } from '../routes/respond-fixtures';

const t = useTestApp({}, { signIn: 'owner' });

async function liveStudy(settings?: unknown) {
  const study = await insertStudy(t, t.teamId, { settings });
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

/** The places taken in each block of the study's (one) version. */
async function filling(studyId: string): Promise<number[]> {
  const rows = await t.deps.db
    .select({ filling: respondentBlockCounts.filling })
    .from(respondentBlockCounts)
    .innerJoin(studyVersions, eq(studyVersions.id, respondentBlockCounts.versionId))
    .where(eq(studyVersions.studyId, studyId));
  return rows[0]?.filling ?? [];
}

const respondentsOf = (studyId: string) =>
  t.deps.db
    .select({ id: respondents.id })
    .from(respondents)
    .where(eq(respondents.studyId, studyId));

const start = (publicId: string, body: object) =>
  t.request().post(`/api/r/${publicId}/sessions`).send(body);

const setSettings = (studyId: string, settings: object) =>
  t.deps.db.update(studies).set({ settings }).where(eq(studies.id, studyId));

describe('POST /api/r/:publicId/sessions (block places taken by the first statement)', () => {
  it('takes one place per new respondent, balanced, and none for a session that resumes', async () => {
    const s = await liveStudy();
    const invitee = await insertInvitee(t, s.id);
    const first = (await start(s.publicId, {}).expect(201)).body;
    await start(s.publicId, {}).expect(201);
    // Resumes: this phone's token, a panel id and a personal link each on their second visit.
    await start(s.publicId, { sessionToken: first.sessionToken }).expect(201);
    await start(s.publicId, { params: { pid: 'P-1' } }).expect(201);
    await start(s.publicId, { params: { pid: 'P-1' } }).expect(201);
    await start(s.publicId, { params: { inv: invitee.token } }).expect(201);
    await start(s.publicId, { params: { inv: invitee.token } }).expect(201);
    expect(await respondentsOf(s.id)).toHaveLength(4);
    // Four respondents in two blocks: least-filled first (the counter's rule), two each.
    expect(await filling(s.id)).toEqual([2, 2]);
  });

  it('when a personal link is unknown, answers 404 invitation_not_found and takes no place', async () => {
    const s = await liveStudy();
    await start(s.publicId, {}).expect(201);
    const res = await start(s.publicId, { params: { inv: 'no-such-invitation-token' } }).expect(
      404,
    );
    expect(res.body.error.code).toBe('invitation_not_found');
    expect(await filling(s.id)).toEqual([1, 0]);
  });

  it('when the closing date has passed, closes the study, answers 410 and gives the place back', async () => {
    const s = await liveStudy();
    await start(s.publicId, {}).expect(201);
    await setSettings(s.id, { closeAt: '2020-01-01T00:00:00Z' });
    const res = await start(s.publicId, {}).expect(410);
    expect(res.body.error.code).toBe('survey_closed');
    expect(await filling(s.id)).toEqual([1, 0]);
    expect(await respondentsOf(s.id)).toHaveLength(1);
  });

  it('when the quota of completes is reached, counts it in the same read, answers 410 over_quota and gives the place back', async () => {
    const s = await liveStudy();
    await completeRespondent(t, s.publicId);
    // The quota is set after the complete, so only the start's own count can see it is full.
    await setSettings(s.id, { quotaCompletes: 1 });
    const read = await readSessionStart(t.deps.db, {
      publicId: s.publicId,
      sessionToken: null,
      inviteToken: null,
      linkParams: {},
    });
    expect(read?.completes).toBe(1);
    expect(read?.block).not.toBeNull();
    // The read above took a place as a start would; this start gives its own back.
    const before = await filling(s.id);
    const res = await start(s.publicId, {}).expect(410);
    expect(res.body.error.code).toBe('over_quota');
    expect(await filling(s.id)).toEqual(before);
    const [row] = await t.deps.db
      .select({ status: studies.status })
      .from(studies)
      .where(eq(studies.id, s.id));
    expect(row.status).toBe('closed');
  });
});

describe('readSessionStart', () => {
  const read = (publicId: string, linkParams: Record<string, string>) =>
    readSessionStart(t.deps.db, { publicId, sessionToken: null, inviteToken: null, linkParams });

  it("looks the panel id up under the study's own parameter name, and not when de-duplication is off", async () => {
    const own = await liveStudy({ panelParam: 'rid' });
    expect((await read(own.publicId, { rid: 'R-7', pid: 'P-7' }))?.panelKey).toBe('R-7');
    const off = await liveStudy({ dedupePanelIds: false });
    expect((await read(off.publicId, { pid: 'P-7' }))?.panelKey).toBeNull();
    const empty = await liveStudy();
    expect((await read(empty.publicId, { pid: '' }))?.panelKey).toBeNull();
  });

  it('takes no place in a study that is not live, and finds nothing for an unknown link', async () => {
    const draft = await insertStudy(t, t.teamId, {});
    const r = await read(draft.publicId, {});
    expect(r?.study.status).toBe('draft');
    expect(r?.block).toBeNull();
    expect(await read('no-such-public-id', {})).toBeNull();
  });
});

describe('createSessionToken', () => {
  it('gives 24 random bytes in base64url, never the same twice across refills of its pool', () => {
    // 1,000 tokens span several refills of the 256-token pool.
    const tokens = Array.from({ length: 1000 }, createSessionToken);
    for (const token of tokens) expect(token).toMatch(/^[A-Za-z0-9_-]{32}$/);
    expect(new Set(tokens).size).toBe(tokens.length);
  });
});

describe('readSettings', () => {
  it("validates a row's settings once, and another row's settings on their own", () => {
    const row = { quotaCompletes: 5 };
    const first = readSettings(row);
    expect(readSettings(row)).toBe(first);
    expect(first.quotaCompletes).toBe(5);
    const other = readSettings({ quotaCompletes: 7 });
    expect(other.quotaCompletes).toBe(7);
    // Invalid settings read as the defaults, as before.
    expect(readSettings({ quotaCompletes: 'many' }).quotaCompletes).toBeNull();
    expect(readSettings(null).panelParam).toBe('pid');
  });
});

/** A live study and a maker of session-start rows for its version. */
async function startedRows() {
  const study = await liveStudy();
  const [version] = await t.deps.db
    .select({ id: studyVersions.id })
    .from(studyVersions)
    .where(eq(studyVersions.studyId, study.id));
  const row = (over: Partial<StartedRespondent> = {}): StartedRespondent => ({
    studyId: study.id,
    versionId: version.id,
    sessionToken: createSessionToken(),
    inviteeId: null,
    externalId: null,
    panelKey: null,
    block: 1,
    plan: {},
    device: 'phone',
    language: 'en',
    ...over,
  });
  return { study, row };
}

describe('insertStartedRespondents (many session starts in one statement)', () => {
  it('returns each row as the one-start insert does and as it is stored, in the order given', async () => {
    const { study, row } = await startedRows();
    const rowOf = (i: number) =>
      row({
        externalId: i % 2 ? `X-${i}` : null,
        panelKey: i % 2 ? `X-${i}` : null,
        block: 1 + (i % 2),
        plan: { taskOrder: [i, 0], positions: [[1, 0]] },
        device: i % 3 ? 'phone' : 'desktop',
      });
    const alone = await insertRespondent(t.deps.db, rowOf(0));
    const rows = [1, 2, 3, 4, 5].map(rowOf);
    const together = await insertStartedRespondents(t.deps.db, rows);
    expect(together.map((r) => r.sessionToken)).toEqual(rows.map((r) => r.sessionToken));
    for (const made of [alone, ...together]) {
      const stored = await getRespondentByToken(t.deps.db, {
        studyId: study.id,
        sessionToken: made.sessionToken,
      });
      expect(made).toEqual(stored);
    }
    // The same keys either way (the batch row is built as the one-start row is).
    expect(Object.keys(together[0]).sort()).toEqual(Object.keys(alone).sort());
  });

  it('refuses the whole statement when a unique index refuses one row', async () => {
    const { study, row } = await startedRows();
    const panel = (key: string) => row({ externalId: key, panelKey: key });
    await expect(
      insertStartedRespondents(t.deps.db, [panel('A'), panel('B'), panel('A')]),
    ).rejects.toThrow();
    const stored = await t.deps.db
      .select({ id: respondents.id })
      .from(respondents)
      .where(eq(respondents.studyId, study.id));
    expect(stored).toHaveLength(0);
  });
});
