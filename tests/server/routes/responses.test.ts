import { describe, expect, it } from 'vitest';
import { eq } from 'drizzle-orm';
import { useTestApp } from '../../support/test-app';
import { eightChoices, insertRespondent, insertStudy } from './fieldwork-fixtures';
import { invitees, respondents } from '../../../db/schema/fieldwork';
import { studies } from '../../../db/schema/studies';
import type { Role } from '../../../shared/permissions';

const t = useTestApp({}, { signIn: 'team' });

const base = (studyId: string) => `/api/teams/${t.team.teamId}/studies/${studyId}/responses`;
const statusQuoStudy = { fixedAlternative: { kind: 'status_quo', label: 'No change', levels: {} } };

/**
 * Twelve completes of 1..12 minutes (median 6.5 min, so ½ cuts at 3.25 min: the 1, 2 and 3
 * minute respondents are speeders), varied choices except: #5 always position 0, #6 always the
 * status quo, #7 fails the dominance test, #8 answers the repeated task differently; one
 * unfinished respondent. #1 came through a personal link, #2 has a panel id.
 */
async function arrangeStudy(settings: object = {}) {
  const { studyId, versionId } = await insertStudy(t.deps.db, {
    teamId: t.team.teamId,
    definition: statusQuoStudy,
    settings,
  });
  const [inv] = await t.deps.db
    .insert(invitees)
    .values({ studyId, email: `private-${studyId.slice(0, 8)}@example.test`, token: studyId })
    .returning({ id: invitees.id });
  const ids: string[] = [];
  for (let n = 1; n <= 12; n++) {
    const choices =
      n === 5
        ? eightChoices((k) => k % 2).map((c) => ({ ...c, chosenPosition: 0 }))
        : n === 6
          ? eightChoices(() => -1).map((c) => ({ ...c, chosenPosition: 2 }))
          : eightChoices((k) => (k + n) % 3).map((c) => ({
              ...c,
              chosenAlternative: c.chosenPosition === 2 ? -1 : c.chosenPosition,
            }));
    const special = [
      {
        screenKey: 'dominance:dom1',
        chosenAlternative: n === 7 ? 1 : 0,
        value: { taskKind: 'dominance', dominantChosen: n !== 7 },
      },
      {
        screenKey: 'repeat:rep1',
        chosenAlternative:
          n === 8 ? (choices[1].chosenAlternative === 0 ? 1 : 0) : choices[1].chosenAlternative,
        value: { taskKind: 'repeat', repeatOfTask: 2 },
      },
    ];
    ids.push(
      await insertRespondent(t.deps.db, {
        studyId,
        versionId,
        durationMs: n * 60_000,
        choices,
        special,
        inviteeId: n === 1 ? inv.id : null,
        externalId: n === 2 ? 'PANEL-7781' : null,
      }),
    );
  }
  const open = await insertRespondent(t.deps.db, {
    studyId,
    versionId,
    status: 'in_progress',
    choices: eightChoices(() => 0).slice(0, 2),
  });
  return { studyId, ids, open };
}

const flagsOf = async (id: string) =>
  (await t.deps.db.select().from(respondents).where(eq(respondents.id, id)))[0];

describe('GET /responses', () => {
  it('computes the quality flags, stores them, and summarises the study', async () => {
    const { studyId, ids, open } = await arrangeStudy();
    const res = await t.team.agents.analyst.get(`${base(studyId)}?pageSize=200`).expect(200);
    expect(res.body.summary).toEqual({
      respondents: 13,
      completed: 12,
      included: 13,
      excluded: 0,
      flagged: { speeder: 3, samePosition: 1, alwaysFixed: 1, dominanceFailed: 1, inconsistent: 1 },
      anyFlag: 7,
      medianDurationMs: 390_000,
      speederThresholdMs: 195_000,
    });
    expect(res.body.settings).toEqual({ speederFraction: 0.5 });
    expect((await flagsOf(ids[0])).flags).toEqual({
      speeder: true,
      samePosition: false,
      alwaysFixed: false,
      dominanceFailed: false,
      inconsistent: false,
    });
    expect((await flagsOf(ids[4])).flags).toMatchObject({ samePosition: true, speeder: false });
    expect((await flagsOf(ids[5])).flags).toMatchObject({ alwaysFixed: true, samePosition: false });
    expect((await flagsOf(ids[6])).flags).toMatchObject({ dominanceFailed: true });
    expect((await flagsOf(ids[7])).flags).toMatchObject({ inconsistent: true });
    expect((await flagsOf(open)).flags).toMatchObject({ speeder: null, samePosition: null });
  });

  it('filters by flag, status and inclusion, and sorts by duration', async () => {
    const { studyId } = await arrangeStudy();
    const agent = t.team.agents.viewer;
    const speeders = await agent.get(`${base(studyId)}?flag=speeder&sort=duration&order=asc`);
    expect(speeders.body.items.map((r: { durationMs: number }) => r.durationMs)).toEqual([
      60_000, 120_000, 180_000,
    ]);
    expect((await agent.get(`${base(studyId)}?flag=any`)).body.total).toBe(7);
    expect((await agent.get(`${base(studyId)}?status=in_progress`)).body.total).toBe(1);
    expect((await agent.get(`${base(studyId)}?included=false`)).body.total).toBe(0);
    const page = await agent.get(`${base(studyId)}?pageSize=5&page=3`).expect(200);
    expect(page.body.items).toHaveLength(3);
    await agent.get(`${base(studyId)}?flag=sleepy`).expect(400);
    await agent.get(`${base(studyId)}?pageSize=0`).expect(400);
  });

  it('gives viewers no external ids or e-mail addresses at all', async () => {
    const { studyId } = await arrangeStudy();
    const res = await t.team.agents.viewer.get(`${base(studyId)}?pageSize=200`).expect(200);
    expect(res.body.personalData).toBe(false);
    for (const item of res.body.items) {
      expect(item).not.toHaveProperty('externalId');
      expect(item).not.toHaveProperty('email');
    }
    expect(res.text).not.toContain('PANEL-7781');
    expect(res.text).not.toContain('private-');
  });

  it.each(['owner', 'editor', 'analyst'] as Role[])(
    '%s receives external ids and e-mail addresses',
    async (role) => {
      const { studyId, ids } = await arrangeStudy();
      const res = await t.team.agents[role].get(`${base(studyId)}?pageSize=200`).expect(200);
      expect(res.body.personalData).toBe(true);
      const byId = new Map(res.body.items.map((i: { id: string }) => [i.id, i]));
      expect(byId.get(ids[0])).toMatchObject({ email: expect.stringMatching(/^private-/) });
      expect(byId.get(ids[1])).toMatchObject({ externalId: 'PANEL-7781', email: null });
    },
  );

  it('a member of another team gets 404', async () => {
    const { studyId } = await arrangeStudy();
    await t.team.outsider.get(base(studyId)).expect(404);
    await t.request().get(base(studyId)).expect(401);
  });
});

describe('PUT /responses/quality-settings', () => {
  it('changes the speeder threshold and keeps the other fieldwork settings', async () => {
    const { studyId } = await arrangeStudy({ panelParam: 'rid', quotaCompletes: 300 });
    const res = await t.team.agents.analyst
      .put(`${base(studyId)}/quality-settings`)
      .send({ speederFraction: 0.3 })
      .expect(200);
    // 0.3 × 6.5 min = 1.95 min: only the 1-minute respondent.
    expect(res.body.summary.speederThresholdMs).toBe(117_000);
    expect(res.body.summary.flagged.speeder).toBe(1);
    const [row] = await t.deps.db.select().from(studies).where(eq(studies.id, studyId));
    expect(row.settings).toEqual({
      panelParam: 'rid',
      quotaCompletes: 300,
      quality: { speederFraction: 0.3 },
    });
  });

  it('when the fraction is out of range or missing, returns 400 and changes nothing', async () => {
    const { studyId } = await arrangeStudy();
    for (const body of [{ speederFraction: 0.95 }, { speederFraction: 'half' }, {}]) {
      const res = await t.team.agents.analyst
        .put(`${base(studyId)}/quality-settings`)
        .send(body)
        .expect(400);
      expect(res.body.error.fields[0].path).toBe('speederFraction');
    }
    const [row] = await t.deps.db.select().from(studies).where(eq(studies.id, studyId));
    expect(row.settings).toEqual({});
  });

  it('a viewer gets 403', async () => {
    const { studyId } = await arrangeStudy();
    await t.team.agents.viewer
      .put(`${base(studyId)}/quality-settings`)
      .send({ speederFraction: 0.3 })
      .expect(403);
  });
});

describe('PUT /responses/:respondentId/inclusion', () => {
  it('an analyst excludes with a reason and includes again', async () => {
    const { studyId, ids } = await arrangeStudy();
    const url = `${base(studyId)}/${ids[2]}/inclusion`;
    const res = await t.team.agents.analyst
      .put(url)
      .send({ included: false, reason: 'Answered in 3 minutes' })
      .expect(200);
    expect(res.body).toEqual({
      id: ids[2],
      included: false,
      exclusionReason: 'Answered in 3 minutes',
    });
    expect(await flagsOf(ids[2])).toMatchObject({
      included: false,
      exclusionReason: 'Answered in 3 minutes',
    });
    await t.team.agents.editor.put(url).send({ included: true }).expect(200);
    expect(await flagsOf(ids[2])).toMatchObject({ included: true, exclusionReason: null });
  });

  it('when the reason is missing, returns 400 and changes nothing', async () => {
    const { studyId, ids } = await arrangeStudy();
    const url = `${base(studyId)}/${ids[0]}/inclusion`;
    const res = await t.team.agents.analyst.put(url).send({ included: false }).expect(400);
    expect(res.body.error.fields[0].path).toBe('reason');
    await t.team.agents.analyst.put(url).send({ included: 'no' }).expect(400);
    expect((await flagsOf(ids[0])).included).toBe(true);
  });

  it('a viewer gets 403; an unknown or foreign respondent 404', async () => {
    const { studyId, ids } = await arrangeStudy();
    const other = await arrangeStudy();
    const body = { included: false, reason: 'Test reason' };
    await t.team.agents.viewer
      .put(`${base(studyId)}/${ids[0]}/inclusion`)
      .send(body)
      .expect(403);
    await t.team.agents.analyst
      .put(`${base(studyId)}/${other.ids[0]}/inclusion`)
      .send(body)
      .expect(404);
    await t.team.outsider
      .put(`${base(studyId)}/${ids[0]}/inclusion`)
      .send(body)
      .expect(404);
    expect((await flagsOf(ids[0])).included).toBe(true);
    expect((await flagsOf(other.ids[0])).included).toBe(true);
  });
});

describe('POST /responses/exclude-flagged', () => {
  it('excludes every included respondent with one of the chosen flags', async () => {
    const { studyId, ids } = await arrangeStudy();
    const res = await t.team.agents.analyst
      .post(`${base(studyId)}/exclude-flagged`)
      .send({ flags: ['speeder', 'dominanceFailed'], reason: 'Quality rules of the protocol' })
      .expect(200);
    expect(res.body).toEqual({ excluded: 4 });
    const excluded = (await t.deps.db.select().from(respondents))
      .filter((r) => r.studyId === studyId && !r.included)
      .map((r) => r.id)
      .sort();
    expect(excluded).toEqual([ids[0], ids[1], ids[2], ids[6]].sort());
    const again = await t.team.agents.analyst
      .post(`${base(studyId)}/exclude-flagged`)
      .send({ flags: ['speeder'], reason: 'Quality rules of the protocol' })
      .expect(200);
    expect(again.body.excluded).toBe(0);
  });

  it('when the flags are unknown or the reason empty, returns 400 and excludes nobody', async () => {
    const { studyId } = await arrangeStudy();
    await t.team.agents.analyst
      .post(`${base(studyId)}/exclude-flagged`)
      .send({ flags: ['bored'], reason: 'x y z' })
      .expect(400);
    await t.team.agents.analyst
      .post(`${base(studyId)}/exclude-flagged`)
      .send({ flags: [], reason: '' })
      .expect(400);
    await t.team.agents.viewer
      .post(`${base(studyId)}/exclude-flagged`)
      .send({ flags: ['speeder'], reason: 'Quality rules' })
      .expect(403);
    const res = await t.team.agents.analyst.get(base(studyId)).expect(200);
    expect(res.body.summary.excluded).toBe(0);
  });
});
