import { beforeAll, describe, expect, it } from 'vitest';
import { eq } from 'drizzle-orm';
import { useTestApp } from '../../support/test-app';
import { createTeamWithAllRoles } from '../../support/factories';
import { createStudyVia, makeSmallDefinition } from './study-fixtures';
import { getStudyById } from '../../../db/queries/studies';
import { studies, studyVersions } from '../../../db/schema/studies';
import { respondents } from '../../../db/schema/fieldwork';
import { insertDesign } from '../../../db/queries/designs';
import type { Role } from '../../../shared/permissions';

const t = useTestApp();
let team: Awaited<ReturnType<typeof createTeamWithAllRoles>>;
beforeAll(async () => {
  team = await createTeamWithAllRoles(t);
});

const base = () => `/api/teams/${team.teamId}/studies`;
const writers: Role[] = ['owner', 'editor'];
const readers: Role[] = ['analyst', 'viewer'];

/** Stores a random design of `blocks` blocks (one two-alternative task each) as the study's current design. */
async function insertCurrentDesign(studyId: string, blocks: number) {
  const design = await insertDesign(t.deps.db, {
    studyId,
    teamId: team.teamId,
    method: 'random',
    spec: {},
    design: {
      blocks,
      tasks: Array.from({ length: blocks }, (_, i) => ({
        block: i + 1,
        task: i + 1,
        alternatives: [
          { levels: { bill: 'b0', river: 'poor' } },
          { levels: { bill: 'b10', river: 'good' } },
        ],
      })),
    },
    diagnostics: {},
    createdBy: null,
  });
  await t.deps.db
    .update(studies)
    .set({ currentDesignId: design.id })
    .where(eq(studies.id, studyId));
  return design;
}

describe('POST /api/teams/:teamId/studies', () => {
  it.each(writers)(
    'as %s, creates a draft with an empty definition and a public id',
    async (role) => {
      const res = await team.agents[role]
        .post(base())
        .send({ name: 'Service packages', description: 'Next five years' })
        .expect(201);
      expect(res.body).toMatchObject({
        name: 'Service packages',
        status: 'draft',
        definition: { attributes: [], alternatives: { count: 2 } },
        counts: { attributes: 0, tasks: 0, blocks: 0, respondents: 0 },
      });
      expect(res.body.publicId).toMatch(/^[A-Za-z0-9_-]{16}$/);
    },
  );

  it.each(readers)('as %s, returns 403 and creates nothing', async (role) => {
    const name = `forbidden-${role}`;
    await team.agents[role].post(base()).send({ name }).expect(403);
    const list = await team.agents.owner.get(base()).expect(200);
    expect(list.body.some((s: { name: string }) => s.name === name)).toBe(false);
  });

  it('for someone outside the team, returns 404', async () => {
    await team.outsider.post(base()).send({ name: 'x' }).expect(404);
  });

  it('when the name is empty, returns 400 with the field', async () => {
    const res = await team.agents.owner.post(base()).send({ name: '  ' }).expect(400);
    expect(res.body.error.fields).toEqual([expect.objectContaining({ path: 'name' })]);
  });
});

describe('GET /api/teams/:teamId/studies and /:studyId', () => {
  it.each([...writers, ...readers])('as %s, lists and reads studies with counts', async (role) => {
    const { id } = await createStudyVia(team.agents.owner, team.teamId, {
      name: `Readable by ${role}`,
      definition: makeSmallDefinition(),
    });
    const list = await team.agents[role].get(base()).expect(200);
    expect(list.body.find((s: { id: string }) => s.id === id)).toMatchObject({
      counts: { attributes: 2 },
    });
    const one = await team.agents[role].get(`${base()}/${id}`).expect(200);
    expect(one.body.definition.attributes).toHaveLength(2);
  });

  it('counts tasks, blocks and completed respondents of each study separately', async () => {
    const { id } = await createStudyVia(team.agents.owner, team.teamId, {
      name: 'Counted',
      definition: makeSmallDefinition(),
    });
    const other = await createStudyVia(team.agents.owner, team.teamId, { name: 'Other' });
    await insertCurrentDesign(id, 2);
    const [version] = await t.deps.db
      .insert(studyVersions)
      .values({ studyId: id, version: 1, definition: {}, design: {}, questionnaire: {} })
      .returning({ id: studyVersions.id });
    await t.deps.db.insert(respondents).values(
      (['completed', 'completed', 'in_progress'] as const).map((status, i) => ({
        studyId: id,
        versionId: version.id,
        sessionToken: `count-test-${id}-${i}`,
        block: 1,
        plan: {},
        status,
      })),
    );
    const list = await team.agents.viewer.get(base()).expect(200);
    const counted = list.body.find((s: { id: string }) => s.id === id);
    expect(counted.counts).toEqual({ attributes: 2, tasks: 2, blocks: 2, respondents: 2 });
    const untouched = list.body.find((s: { id: string }) => s.id === other.id);
    expect(untouched.counts).toEqual({ attributes: 0, tasks: 0, blocks: 0, respondents: 0 });
  });

  it('for someone outside the team, returns 404 on list and on the study', async () => {
    const { id } = await createStudyVia(team.agents.owner, team.teamId);
    await team.outsider.get(base()).expect(404);
    await team.outsider.get(`${base()}/${id}`).expect(404);
  });

  it('when the study id is unknown, returns 404', async () => {
    await team.agents.owner.get(`${base()}/00000000-0000-4000-8000-000000000000`).expect(404);
  });
});

describe('PATCH /api/teams/:teamId/studies/:studyId', () => {
  it('renames and describes for an editor; a viewer gets 403 and nothing changes', async () => {
    const { id } = await createStudyVia(team.agents.owner, team.teamId, { name: 'Before' });
    await team.agents.viewer.patch(`${base()}/${id}`).send({ name: 'Nope' }).expect(403);
    const res = await team.agents.editor
      .patch(`${base()}/${id}`)
      .send({ name: 'After', description: 'Reworded' })
      .expect(200);
    expect(res.body).toMatchObject({ name: 'After', description: 'Reworded' });
  });
});

describe('the public title', () => {
  it('starts as the name, changes apart from it, and is what the respondent link shows', async () => {
    const { id } = await createStudyVia(team.agents.owner, team.teamId, { name: 'Pilot W-3' });
    const created = await team.agents.owner.get(`${base()}/${id}`).expect(200);
    expect(created.body).toMatchObject({ name: 'Pilot W-3', publicTitle: 'Pilot W-3' });
    const res = await team.agents.editor
      .patch(`${base()}/${id}`)
      .send({ publicTitle: 'Your water services' })
      .expect(200);
    expect(res.body).toMatchObject({ name: 'Pilot W-3', publicTitle: 'Your water services' });
  });

  it('when the public title is empty, returns 400 with the field and changes nothing', async () => {
    const { id } = await createStudyVia(team.agents.owner, team.teamId, { name: 'Pilot W-4' });
    const res = await team.agents.editor
      .patch(`${base()}/${id}`)
      .send({ publicTitle: ' ' })
      .expect(400);
    expect(res.body.error.fields).toEqual([expect.objectContaining({ path: 'publicTitle' })]);
    const after = await team.agents.owner.get(`${base()}/${id}`).expect(200);
    expect(after.body.publicTitle).toBe('Pilot W-4');
  });

  it('is copied when a study is duplicated', async () => {
    const { id } = await createStudyVia(team.agents.owner, team.teamId, { name: 'Pilot W-5' });
    await team.agents.owner.patch(`${base()}/${id}`).send({ publicTitle: 'Water at home' });
    const copy = await team.agents.owner.post(`${base()}/${id}/duplicate`).expect(201);
    expect(copy.body).toMatchObject({ name: 'Pilot W-5 (copy)', publicTitle: 'Water at home' });
  });
});

describe('PUT /api/teams/:teamId/studies/:studyId/definition', () => {
  it('saves a valid definition for an editor', async () => {
    const { id } = await createStudyVia(team.agents.owner, team.teamId);
    const res = await team.agents.editor
      .put(`${base()}/${id}/definition`)
      .send({ definition: makeSmallDefinition() })
      .expect(200);
    expect(res.body.counts.attributes).toBe(2);
  });

  it.each(readers)('as %s, returns 403 and leaves the definition', async (role) => {
    const { id } = await createStudyVia(team.agents.owner, team.teamId);
    await team.agents[role]
      .put(`${base()}/${id}/definition`)
      .send({ definition: makeSmallDefinition() })
      .expect(403);
    const row = await getStudyById(t.deps.db, { id, teamId: team.teamId });
    expect((row!.definition as { attributes: unknown[] }).attributes).toEqual([]);
  });

  const bad: Array<[string, () => unknown, string]> = [
    [
      'a level has an empty label',
      () => {
        const d = makeSmallDefinition();
        d.attributes[1].levels[1].label = ' ';
        return d;
      },
      'definition.attributes.1.levels.1.label',
    ],
    [
      'an attribute has one level',
      () => {
        const d = makeSmallDefinition();
        d.attributes[1].levels = [d.attributes[1].levels[0]];
        d.attributes[1].referenceLevelId = undefined;
        return d;
      },
      'definition.attributes.1.levels',
    ],
    [
      'there are 6 alternatives per task',
      () => makeSmallDefinition({ alternatives: { count: 6, labeled: false, labels: [] } }),
      'definition.alternatives.count',
    ],
    [
      'a status quo misses the level of an attribute',
      () =>
        makeSmallDefinition({
          fixedAlternative: { kind: 'status_quo', label: 'Today', levels: { bill: 'b0' } },
        }),
      'definition.fixedAlternative.levels.river',
    ],
  ];
  it.each(bad)(
    'when %s, returns 400 with the field and changes nothing',
    async (_name, make, path) => {
      const { id } = await createStudyVia(team.agents.owner, team.teamId, {
        definition: makeSmallDefinition(),
      });
      const before = await getStudyById(t.deps.db, { id, teamId: team.teamId });
      const res = await team.agents.editor
        .put(`${base()}/${id}/definition`)
        .send({ definition: make() })
        .expect(400);
      expect(res.body.error.code).toBe('invalid_input');
      expect(res.body.error.fields.map((f: { path: string }) => f.path)).toContain(path);
      const after = await getStudyById(t.deps.db, { id, teamId: team.teamId });
      expect(after!.definition).toEqual(before!.definition);
      expect(after!.updatedAt).toEqual(before!.updatedAt);
    },
  );

  it('when the study is live, returns 409 study_frozen and changes nothing', async () => {
    const { id } = await createStudyVia(team.agents.owner, team.teamId);
    await t.deps.db.update(studies).set({ status: 'live' }).where(eq(studies.id, id));
    const res = await team.agents.owner
      .put(`${base()}/${id}/definition`)
      .send({ definition: makeSmallDefinition() })
      .expect(409);
    expect(res.body.error).toMatchObject({ code: 'study_frozen' });
    expect(res.body.error.message).toMatch(/live/);
  });

  it('keeps a design that still fits and detaches one that no longer does', async () => {
    const definition = makeSmallDefinition();
    const { id } = await createStudyVia(team.agents.owner, team.teamId, { definition });
    const design = await insertCurrentDesign(id, 1);
    definition.attributes[0].name = 'Bill increase';
    const kept = await team.agents.owner
      .put(`${base()}/${id}/definition`)
      .send({ definition })
      .expect(200);
    expect(kept.body).toMatchObject({ designDetached: false, currentDesignId: design.id });
    definition.attributes[0].levels.pop();
    const detached = await team.agents.owner
      .put(`${base()}/${id}/definition`)
      .send({ definition })
      .expect(200);
    expect(detached.body).toMatchObject({ designDetached: true, currentDesignId: null });
  });
});

describe('POST /api/teams/:teamId/studies/:studyId/duplicate', () => {
  it('copies definition and design into a new draft for an editor', async () => {
    const { id } = await createStudyVia(team.agents.owner, team.teamId, {
      name: 'Original',
      definition: makeSmallDefinition(),
    });
    await t.deps.db.update(studies).set({ status: 'closed' }).where(eq(studies.id, id));
    const res = await team.agents.editor.post(`${base()}/${id}/duplicate`).expect(201);
    expect(res.body).toMatchObject({ name: 'Original (copy)', status: 'draft' });
    expect(res.body.id).not.toBe(id);
    expect(res.body.definition).toEqual(makeSmallDefinition());
  });

  it('returns 403 for an analyst', async () => {
    const { id } = await createStudyVia(team.agents.owner, team.teamId);
    await team.agents.analyst.post(`${base()}/${id}/duplicate`).expect(403);
  });
});

describe('PUT /api/teams/:teamId/studies/:studyId/archived', () => {
  it('archives and unarchives; archived studies leave the default list', async () => {
    const { id } = await createStudyVia(team.agents.owner, team.teamId, { name: 'To archive' });
    await team.agents.viewer.put(`${base()}/${id}/archived`).send({ archived: true }).expect(403);
    const archived = await team.agents.editor
      .put(`${base()}/${id}/archived`)
      .send({ archived: true })
      .expect(200);
    expect(archived.body.archivedAt).not.toBeNull();
    const active = await team.agents.owner.get(base()).expect(200);
    expect(active.body.some((s: { id: string }) => s.id === id)).toBe(false);
    const old = await team.agents.owner.get(`${base()}?archived=true`).expect(200);
    expect(old.body.some((s: { id: string }) => s.id === id)).toBe(true);
    await team.agents.editor.put(`${base()}/${id}/archived`).send({ archived: false }).expect(200);
  });

  it('refuses to archive a live study', async () => {
    const { id } = await createStudyVia(team.agents.owner, team.teamId);
    await t.deps.db.update(studies).set({ status: 'live' }).where(eq(studies.id, id));
    const res = await team.agents.owner
      .put(`${base()}/${id}/archived`)
      .send({ archived: true })
      .expect(409);
    expect(res.body.error.code).toBe('study_live');
  });
});
