/**
 * The audit trail: owners only read and download it (every other role 403, outsiders 404,
 * anonymous 401); study status changes, exclusions, personal-data downloads land in it with the
 * acting member; no route changes or deletes a row, and the table itself refuses it.
 */
import { describe, expect, it } from 'vitest';
import { sql } from 'drizzle-orm';
import { useTestApp } from '../../support/test-app';
import { insertStudy } from './respond-fixtures';
import {
  eightChoices,
  insertRespondent,
  insertStudy as insertLiveStudy,
} from './fieldwork-fixtures';
import { roles, type Role } from '../../../shared/permissions';

const t = useTestApp({}, { signIn: 'team' });

const audit = (path = '') => `/api/teams/${t.team.teamId}/audit${path}`;
const agentOf = (role: Role) => t.team.agents[role];

type Event = { action: string; actorEmail: string | null; details: Record<string, unknown> };
async function events(query = ''): Promise<Event[]> {
  return (await agentOf('owner').get(audit(query)).expect(200)).body.events;
}

describe('GET /audit and /audit/export.csv, per role', () => {
  it.each(roles)('as %s', async (role) => {
    const want = role === 'owner' ? 200 : 403;
    const page = await agentOf(role).get(audit());
    expect(page.status).toBe(want);
    const csv = await agentOf(role).get(audit('/export.csv'));
    expect(csv.status).toBe(want);
    if (want === 403) {
      expect(page.body.error.code).toBe('forbidden');
      expect(csv.body.error.code).toBe('forbidden');
    } else {
      expect(csv.headers['content-type']).toMatch(/^text\/csv/);
      expect(csv.headers['cache-control']).toBe('no-store');
    }
  });

  it('as a member of another team, 404; anonymous, 401', async () => {
    expect((await t.team.outsider.get(audit())).status).toBe(404);
    expect((await t.team.outsider.get(audit('/export.csv'))).status).toBe(404);
    expect((await t.request().get(audit())).status).toBe(401);
  });

  it('when a filter is invalid, returns 400 naming it', async () => {
    const res = await agentOf('owner').get(audit('?action=nonsense&limit=0')).expect(400);
    expect(res.body.error.code).toBe('invalid_input');
    const paths = res.body.error.fields.map((f: { path: string }) => f.path);
    expect(paths).toEqual(expect.arrayContaining(['action', 'limit']));
  });
});

describe('what the trail records', () => {
  it('going live, closing, reopening and returning to draft, with who did it', async () => {
    const s = await insertStudy(t, t.team.teamId);
    const lifecycle = (p: string) => `/api/teams/${t.team.teamId}/studies/${s.id}/lifecycle${p}`;
    await agentOf('editor').post(lifecycle('/go-live')).expect(200);
    await agentOf('owner').post(lifecycle('/close')).expect(200);
    await agentOf('editor').post(lifecycle('/reopen')).expect(200);
    await agentOf('editor').post(lifecycle('/close')).expect(200);
    await agentOf('editor').post(lifecycle('/return-to-draft')).expect(200);
    const mine = (await events(`?action=study&studyId=${s.id}`)).reverse();
    expect(mine.map((e) => e.action)).toEqual([
      'study.went_live',
      'study.closed',
      'study.reopened',
      'study.closed',
      'study.returned_to_draft',
    ]);
    expect(mine[0]!.details).toMatchObject({ version: 1, newVersion: true });
    expect(mine[1]!.actorEmail).toMatch(/^owner-/);
    expect(mine[1]!.details).toMatchObject({ reason: 'manual' });
    expect(mine[2]!.actorEmail).toMatch(/^editor-/);
  });

  it('a refused change records nothing', async () => {
    const s = await insertStudy(t, t.team.teamId);
    await agentOf('viewer')
      .post(`/api/teams/${t.team.teamId}/studies/${s.id}/lifecycle/go-live`)
      .expect(403);
    expect(await events(`?studyId=${s.id}`)).toEqual([]);
  });

  it('exclusions and inclusions name the respondent by id, never personal data', async () => {
    const { studyId, versionId } = await insertLiveStudy(t.deps.db, { teamId: t.team.teamId });
    const id = await insertRespondent(t.deps.db, {
      studyId,
      versionId,
      externalId: 'PANEL-SECRET-42',
      choices: eightChoices((k) => k % 2),
    });
    const inclusion = `/api/teams/${t.team.teamId}/studies/${studyId}/responses/${id}/inclusion`;
    await agentOf('analyst')
      .put(inclusion)
      .send({ included: false, reason: 'Too fast' })
      .expect(200);
    await agentOf('analyst').put(inclusion).send({ included: true }).expect(200);
    const mine = (await events(`?action=respondent&studyId=${studyId}`)).reverse();
    expect(mine.map((e) => e.action)).toEqual(['respondent.excluded', 'respondent.included']);
    expect(mine[0]!.details).toEqual({ respondent: id.slice(0, 8), reason: 'Too fast' });
    expect(JSON.stringify(mine)).not.toContain('PANEL-SECRET-42');
  });

  it('a download with personal columns is recorded; the same file without them is not', async () => {
    const { studyId } = await insertLiveStudy(t.deps.db, { teamId: t.team.teamId });
    const file = `/api/teams/${t.team.teamId}/studies/${studyId}/exports/background-answers.csv`;
    await agentOf('viewer').get(file).expect(200);
    await agentOf('analyst').get(file).expect(200);
    const mine = await events(`?action=export&studyId=${studyId}`);
    expect(mine).toHaveLength(1);
    expect(mine[0]).toMatchObject({ action: 'export.personal_data' });
    expect(mine[0]!.actorEmail).toMatch(/^analyst-/);
  });

  it('downloading the trail is itself recorded, and the CSV holds the events', async () => {
    const res = await agentOf('owner').get(audit('/export.csv?action=study')).expect(200);
    expect(res.text.split('\n')[0]).toContain('id,at,action,actor_id,actor_email');
    expect(res.text).toContain('study.went_live');
    const [last] = await events('?action=audit');
    expect(last).toMatchObject({ action: 'audit.downloaded' });
  });
});

describe('the trail cannot be changed', () => {
  it('has no route that changes or deletes an event', async () => {
    const [first] = await events();
    for (const method of ['put', 'patch', 'delete'] as const) {
      const res = await agentOf('owner')[method](audit(`/${first!.action}`));
      expect([404, 405]).toContain(res.status);
    }
  });

  it('the table refuses UPDATE and DELETE, even from the application role', async () => {
    await expect(t.deps.db.execute(sql`update audit_events set action = 'x'`)).rejects.toThrow();
    await expect(t.deps.db.execute(sql`delete from audit_events`)).rejects.toThrow();
    expect((await events()).length).toBeGreaterThan(0);
  });
});
