import { describe, expect, it } from 'vitest';
import { eq } from 'drizzle-orm';
import { useTestApp } from '../../support/test-app';
import { respondents, answers } from '../../../db/schema/fieldwork';
import { studies } from '../../../db/schema/studies';
import { closeDueStudies } from '../../../server/services/lifecycle';
import {
  completeRespondent,
  definition,
  fullQuestionnaire,
  insertInvitee,
  insertStudy,
} from './respond-fixtures';
import { defaultQuestionnaire } from '../../../shared/schemas/questionnaire-defaults';

const t = useTestApp({}, { signIn: 'team' });

const url = (studyId: string, path = '') =>
  `/api/teams/${t.team.teamId}/studies/${studyId}/lifecycle${path}`;

describe('GET /lifecycle/readiness', () => {
  it('lists every problem of an unfinished study at once', async () => {
    const s = await insertStudy(t, t.team.teamId, { questionnaire: null, withDesign: false });
    await t.deps.db
      .update(studies)
      .set({ definition: { attributes: [], alternatives: { count: 2 } } })
      .where(eq(studies.id, s.id));
    const res = await t.team.agents.viewer.get(url(s.id, '/readiness')).expect(200);
    expect(res.body.ready).toBe(false);
    const codes = res.body.problems.map((p: { code: string }) => p.code);
    expect(codes).toEqual(
      expect.arrayContaining(['no_attributes', 'no_design', 'no_questionnaire']),
    );
  });

  it('when the consent page still has the placeholder note, asks for the study details', async () => {
    const s = await insertStudy(t, t.team.teamId, {
      questionnaire: defaultQuestionnaire(definition),
    });
    const res = await t.team.agents.editor.get(url(s.id, '/readiness')).expect(200);
    expect(res.body.problems).toEqual([
      expect.objectContaining({ code: 'consent_placeholder', path: 'questionnaire.pages.0' }),
    ]);
  });

  it('when personal links make answers traceable, asks the consent page to say so', async () => {
    const q = fullQuestionnaire();
    const consent = q.pages[0];
    if (consent.kind !== 'consent') throw new Error('consent first');
    consent.body = 'Taking part is voluntary. We do not ask for your name.';
    const s = await insertStudy(t, t.team.teamId, { questionnaire: q });
    await insertInvitee(t, s.id);
    const res = await t.team.agents.editor.get(url(s.id, '/readiness')).expect(200);
    expect(res.body.problems).toEqual([
      expect.objectContaining({ code: 'consent_identifiable', path: 'questionnaire.pages.0' }),
    ]);
    consent.body += '\n\nYour answers are linked to the personal link we e-mailed to you.';
    await t.deps.db.update(studies).set({ questionnaire: q }).where(eq(studies.id, s.id));
    const after = await t.team.agents.editor.get(url(s.id, '/readiness')).expect(200);
    expect(after.body).toEqual({ ready: true, problems: [], warnings: [] });
  });

  it('when the study is complete, says it is ready', async () => {
    const s = await insertStudy(t, t.team.teamId);
    const res = await t.team.agents.analyst.get(url(s.id, '/readiness')).expect(200);
    expect(res.body).toEqual({ ready: true, problems: [], warnings: [] });
  });
});

describe('POST /lifecycle/go-live', () => {
  it('when the study has problems, returns 422 with each problem and stays a draft', async () => {
    const s = await insertStudy(t, t.team.teamId, { questionnaire: null, withDesign: false });
    const res = await t.team.agents.editor.post(url(s.id, '/go-live')).expect(422);
    expect(res.body.error.code).toBe('not_ready');
    expect(res.body.error.fields).toEqual(
      expect.arrayContaining([
        { path: 'design', message: 'Create or import a design on the Tasks section.' },
        expect.objectContaining({ path: 'questionnaire' }),
      ]),
    );
    const [row] = await t.deps.db.select().from(studies).where(eq(studies.id, s.id));
    expect(row.status).toBe('draft');
    expect(row.currentVersion).toBe(0);
  });

  it('when a warm-up task refers to a level that does not exist, names it', async () => {
    const s = await insertStudy(t, t.team.teamId);
    const [row] = await t.deps.db.select().from(studies).where(eq(studies.id, s.id));
    const q = row.questionnaire as { pages: Array<Record<string, unknown>> };
    q.pages.splice(2, 0, {
      id: 'warm',
      kind: 'warmup',
      title: 'Practice',
      alternatives: [{ levels: { bill: 'b3' } }, { levels: { bill: 'nope' } }],
    });
    await t.deps.db.update(studies).set({ questionnaire: q }).where(eq(studies.id, s.id));
    const res = await t.team.agents.owner.post(url(s.id, '/go-live')).expect(422);
    expect(res.body.error.fields.map((f: { message: string }) => f.message)).toContain(
      'Choose a level of Supply interruptions per year for alternative 1 of the warm-up task.',
    );
  });

  it('when a numeric label no longer writes its coded value, refuses until that level is confirmed', async () => {
    const s = await insertStudy(t, t.team.teamId);
    const [row] = await t.deps.db.select().from(studies).where(eq(studies.id, s.id));
    const drifted = structuredClone(row.definition) as typeof definition;
    const bill = drifted.attributes.find((a) => a.id === 'bill')!;
    const level = bill.levels.find((l) => l.id === 'b6')!;
    // The researcher typed "€6" and later changed the value to 8.
    level.label = '€6';
    level.value = 8;
    await t.deps.db.update(studies).set({ definition: drifted }).where(eq(studies.id, s.id));
    const res = await t.team.agents.editor.post(url(s.id, '/go-live')).expect(422);
    const index = bill.levels.indexOf(level);
    expect(res.body.error.fields).toEqual([
      {
        path: `definition.attributes.0.levels.${index}.label`,
        message:
          'Monthly bill increase: the level shown as “€6” is coded as 8. Correct or clear the label on Attributes, or confirm it is meant for this value.',
      },
    ]);
    // A confirmation for another value or label does not count; one for this pair does.
    level.labelConfirmed = { value: 6, label: '€6' };
    await t.deps.db.update(studies).set({ definition: drifted }).where(eq(studies.id, s.id));
    await t.team.agents.editor.post(url(s.id, '/go-live')).expect(422);
    level.labelConfirmed = { value: 8, label: '€6' };
    await t.deps.db.update(studies).set({ definition: drifted }).where(eq(studies.id, s.id));
    await t.team.agents.editor.post(url(s.id, '/go-live')).expect(200);
  });

  it('only owners and editors may go live, close and reopen', async () => {
    const s = await insertStudy(t, t.team.teamId);
    for (const role of ['analyst', 'viewer'] as const) {
      const res = await t.team.agents[role].post(url(s.id, '/go-live')).expect(403);
      expect(res.body.error.code).toBe('forbidden');
    }
    await t.team.outsider.post(url(s.id, '/go-live')).expect(404);
    await t.request().post(url(s.id, '/go-live')).expect(401);
    await t.team.agents.editor.post(url(s.id, '/go-live')).expect(200);
    await t.team.agents.viewer.post(url(s.id, '/close')).expect(403);
    await t.team.agents.analyst.post(url(s.id, '/close')).expect(403);
    await t.team.agents.owner.post(url(s.id, '/close')).expect(200);
    await t.team.agents.viewer.post(url(s.id, '/reopen')).expect(403);
    await t.team.agents.editor.post(url(s.id, '/reopen')).expect(200);
    await t.team.agents.analyst
      .patch(url(s.id, '/settings'))
      .send({ quotaCompletes: 5 })
      .expect(403);
  });

  it('freezes version 1, keeps it on an unchanged reopen, and freezes version 2 after an edit', async () => {
    const s = await insertStudy(t, t.team.teamId);
    const live = await t.team.agents.editor.post(url(s.id, '/go-live')).expect(200);
    expect(live.body).toMatchObject({ status: 'live', currentVersion: 1 });
    await t.team.agents.editor.post(url(s.id, '/go-live')).expect(409);
    const first = (
      await t.request().post(`/api/r/${live.body.publicId}/sessions`).send({}).expect(201)
    ).body;

    await t.team.agents.editor.post(url(s.id, '/close')).expect(200);
    const reopened = await t.team.agents.editor.post(url(s.id, '/reopen')).expect(200);
    expect(reopened.body.currentVersion).toBe(1);

    await t.team.agents.editor.post(url(s.id, '/close')).expect(200);
    await t.team.agents.editor.post(url(s.id, '/return-to-draft')).expect(200);
    const q = (
      await t.team.agents.editor
        .get(`/api/teams/${t.team.teamId}/studies/${s.id}/questionnaire`)
        .expect(200)
    ).body.questionnaire;
    q.pages[0].title = 'Welcome back';
    await t.team.agents.editor
      .put(`/api/teams/${t.team.teamId}/studies/${s.id}/questionnaire`)
      .send({ questionnaire: q })
      .expect(200);
    const again = await t.team.agents.editor.post(url(s.id, '/go-live')).expect(200);
    expect(again.body.currentVersion).toBe(2);
    const second = (
      await t.request().post(`/api/r/${live.body.publicId}/sessions`).send({}).expect(201)
    ).body;
    expect(second.screens[0].title).toBe('Welcome back');
    expect(first.screens[0].title).not.toBe('Welcome back');

    const versions = await t.team.agents.viewer.get(url(s.id, '/versions')).expect(200);
    expect(
      versions.body.map((v: { version: number; respondents: number }) => [
        v.version,
        v.respondents,
      ]),
    ).toEqual([
      [1, 1],
      [2, 1],
    ]);
    // The earlier respondent keeps the version they saw.
    const rows = await t.deps.db.select().from(respondents).where(eq(respondents.studyId, s.id));
    expect(new Set(rows.map((r) => r.versionId)).size).toBe(2);
  });
});

describe('close, return to draft and reopen', () => {
  it('refuses transitions that do not fit the status', async () => {
    const s = await insertStudy(t, t.team.teamId);
    expect((await t.team.agents.editor.post(url(s.id, '/close')).expect(409)).body.error.code).toBe(
      'not_live',
    );
    expect(
      (await t.team.agents.editor.post(url(s.id, '/reopen')).expect(409)).body.error.code,
    ).toBe('wrong_status');
    await t.team.agents.editor.post(url(s.id, '/go-live')).expect(200);
    expect(
      (await t.team.agents.editor.post(url(s.id, '/return-to-draft')).expect(409)).body.error.code,
    ).toBe('not_closed');
  });

  it('when the quota is already reached, reopening lists it as a problem', async () => {
    const s = await insertStudy(t, t.team.teamId, { settings: { quotaCompletes: 1 } });
    const live = (await t.team.agents.editor.post(url(s.id, '/go-live')).expect(200)).body;
    await completeRespondent(t, live.publicId);
    const state = (await t.team.agents.viewer.get(url(s.id)).expect(200)).body;
    expect(state).toMatchObject({
      status: 'closed',
      completes: 1,
      settings: { closedReason: 'quota' },
    });
    const res = await t.team.agents.editor.post(url(s.id, '/reopen')).expect(422);
    expect(res.body.error.fields).toEqual([
      expect.objectContaining({ path: 'settings.quotaCompletes' }),
    ]);
  });
});

describe('PATCH /lifecycle/settings and the periodic close check', () => {
  it('when a redirect is not a web address, returns 400 with the field and changes nothing', async () => {
    const s = await insertStudy(t, t.team.teamId);
    const res = await t.team.agents.editor
      .patch(url(s.id, '/settings'))
      .send({ redirects: { complete: 'javascript:alert(1)', screenedOut: null, overQuota: null } })
      .expect(400);
    expect(res.body.error.fields[0].path).toBe('redirects.complete');
    const [row] = await t.deps.db.select().from(studies).where(eq(studies.id, s.id));
    expect(row.settings).toEqual({});
  });

  it('keeps settings it does not own and merges redirects', async () => {
    const s = await insertStudy(t, t.team.teamId, { settings: { speederFraction: 0.4 } });
    await t.team.agents.editor
      .patch(url(s.id, '/settings'))
      .send({
        panelParam: 'rid',
        redirects: { complete: 'https://p.example/c/{pid}', screenedOut: null, overQuota: null },
      })
      .expect(200);
    const res = await t.team.agents.editor
      .patch(url(s.id, '/settings'))
      .send({ quotaCompletes: 300 })
      .expect(200);
    expect(res.body.settings).toMatchObject({
      panelParam: 'rid',
      quotaCompletes: 300,
      redirects: { complete: 'https://p.example/c/{pid}' },
    });
    const [row] = await t.deps.db.select().from(studies).where(eq(studies.id, s.id));
    expect((row.settings as { speederFraction: number }).speederFraction).toBe(0.4);
  });

  it('closes a live study whose close date has passed, and its link then says closed', async () => {
    const s = await insertStudy(t, t.team.teamId);
    const live = (await t.team.agents.editor.post(url(s.id, '/go-live')).expect(200)).body;
    const soon = new Date(Date.now() + 60_000).toISOString();
    await t.team.agents.editor.patch(url(s.id, '/settings')).send({ closeAt: soon }).expect(200);
    expect(await closeDueStudies(t.deps, new Date())).toBe(0);
    expect(await closeDueStudies(t.deps, new Date(Date.now() + 120_000))).toBe(1);
    const state = (await t.team.agents.viewer.get(url(s.id)).expect(200)).body;
    expect(state.settings.closedReason).toBe('date');
    expect((await t.request().get(`/api/r/${live.publicId}`).expect(200)).body.state).toBe(
      'closed',
    );
  });

  it('closes at the quota in the periodic check too', async () => {
    const s = await insertStudy(t, t.team.teamId);
    const live = (await t.team.agents.editor.post(url(s.id, '/go-live')).expect(200)).body;
    const session = await completeRespondent(t, live.publicId);
    await t.team.agents.editor
      .patch(url(s.id, '/settings'))
      .send({ quotaCompletes: 1 })
      .expect(200);
    expect(await closeDueStudies(t.deps)).toBe(1);
    expect((await t.team.agents.viewer.get(url(s.id)).expect(200)).body.status).toBe('closed');
    const rows = await t.deps.db.select().from(answers).where(eq(answers.studyId, s.id));
    expect(rows).toHaveLength(session.screens.length);
  });
});
