/** Saved share scenarios: CRUD per role, bad input (status, code, message, field), tenancy. */
import { describe, expect, it } from 'vitest';
import { useTestApp } from '../../support/test-app';
import { scenarioLevels, useTastesStudy } from './tastes-fixture';

const t = useTestApp({}, { signIn: 'team' });
const study = useTastesStudy(t, 'shares/scenarios');

const body = (name: string, river = 'good') => ({
  name,
  includeFixed: true,
  alternatives: [
    { name: 'Better river', levels: scenarioLevels(river, 'b10') },
    { name: 'Cheaper', levels: scenarioLevels('fair', 'b0') },
  ],
});

describe('POST /shares/scenarios', () => {
  it('saves a named scenario for owners, editors and analysts; every role reads it', async () => {
    for (const role of ['owner', 'editor', 'analyst'] as const) {
      const res = await t.team.agents[role]
        .post(study.base)
        .send(body(`By ${role}`))
        .expect(201);
      expect(res.body).toMatchObject({
        name: `By ${role}`,
        includeFixed: true,
        alternatives: [{ name: 'Better river', alternative: 0 }, { name: 'Cheaper' }],
      });
      expect(res.body.createdBy).toEqual(expect.any(String));
    }
    const list = await t.team.agents.viewer.get(study.base).expect(200);
    expect(list.body.map((s: { name: string }) => s.name)).toEqual([
      'By analyst',
      'By editor',
      'By owner',
    ]);
  });

  it('when a viewer saves, returns 403 and stores nothing', async () => {
    const res = await t.team.agents.viewer.post(study.base).send(body('Viewer try')).expect(403);
    expect(res.body.error.code).toBe('forbidden');
    const list = await t.team.agents.viewer.get(study.base).expect(200);
    expect(list.body.map((s: { name: string }) => s.name)).not.toContain('Viewer try');
  });

  it.each([
    [{ ...body(''), name: '' }, 'name', 'Name the scenario'],
    [{ ...body('x'.repeat(81)) }, 'name', 'At most 80 characters'],
    [
      { ...body('One'), alternatives: body('One').alternatives.slice(0, 1) },
      'alternatives',
      'Define at least 2 alternatives',
    ],
    [body('Purple', 'purple'), 'alternatives.0.levels.river', 'Choose a level of River health'],
    [
      {
        ...body('Labeled'),
        alternatives: body('L').alternatives.map((a) => ({ ...a, alternative: 3 })),
      },
      'alternatives.0.alternative',
      'Unknown alternative',
    ],
  ])(
    'when the body is invalid (%#), returns 400 naming %s and stores nothing',
    async (bad, field, message) => {
      const before = (await t.team.agents.owner.get(study.base).expect(200)).body.length;
      const res = await t.team.agents.owner.post(study.base).send(bad).expect(400);
      expect(res.body.error.code).toBe('invalid_input');
      expect(res.body.error.message).toEqual(expect.any(String));
      const issue = res.body.error.fields.find((f: { path: string }) => f.path === field);
      expect(issue?.message).toContain(message);
      expect((await t.team.agents.owner.get(study.base).expect(200)).body.length).toBe(before);
    },
  );

  it('when the name is taken, returns 409 naming the field', async () => {
    await t.team.agents.owner.post(study.base).send(body('Twice')).expect(201);
    const res = await t.team.agents.editor.post(study.base).send(body('Twice')).expect(409);
    expect(res.body.error).toMatchObject({
      code: 'scenario_name_taken',
      fields: [{ path: 'name', message: 'Choose another name' }],
    });
  });

  it('returns 404 to another team and 401 without a session', async () => {
    await t.team.outsider.post(study.base).send(body('Outsider')).expect(404);
    await t.team.outsider.get(study.base).expect(404);
    await t.request().post(study.base).send(body('Anonymous')).expect(401);
  });
});

describe('PUT and DELETE /shares/scenarios/:scenarioId', () => {
  it('renames and edits for writers; a viewer gets 403 and nothing changes', async () => {
    const saved = (await t.team.agents.analyst.post(study.base).send(body('Draft A')).expect(201))
      .body;
    await t.team.agents.viewer
      .put(`${study.base}/${saved.id}`)
      .send(body('Viewer rename'))
      .expect(403);
    const res = await t.team.agents.editor
      .put(`${study.base}/${saved.id}`)
      .send({ ...body('Final A', 'fair'), includeFixed: false })
      .expect(200);
    expect(res.body).toMatchObject({ id: saved.id, name: 'Final A', includeFixed: false });
    expect(res.body.alternatives[0].levels.river).toBe('fair');
    await t.team.agents.viewer.delete(`${study.base}/${saved.id}`).expect(403);
    await t.team.agents.owner.delete(`${study.base}/${saved.id}`).expect(204);
    await t.team.agents.owner.delete(`${study.base}/${saved.id}`).expect(404);
    await t.team.agents.owner.put(`${study.base}/${saved.id}`).send(body('Gone')).expect(404);
  });

  it('when the scenario id is not a uuid, returns 400 naming scenarioId', async () => {
    const res = await t.team.agents.owner.put(`${study.base}/nope`).send(body('X')).expect(400);
    expect(res.body.error.fields.map((f: { path: string }) => f.path)).toEqual(['scenarioId']);
  });

  it('when a rename takes another scenario’s name, returns 409 and keeps both', async () => {
    await t.team.agents.owner.post(study.base).send(body('Keep 1')).expect(201);
    const two = (await t.team.agents.owner.post(study.base).send(body('Keep 2')).expect(201)).body;
    await t.team.agents.owner.put(`${study.base}/${two.id}`).send(body('Keep 1')).expect(409);
    const names = (await t.team.agents.owner.get(study.base).expect(200)).body.map(
      (s: { name: string }) => s.name,
    );
    expect(names).toEqual(expect.arrayContaining(['Keep 1', 'Keep 2']));
  });
});
