/**
 * Viewer privacy: a respondent's user agent is reduced to a device class when the session
 * starts, and the responses table shows only classes — also for rows stored before that.
 */
import { describe, expect, it } from 'vitest';
import { eq } from 'drizzle-orm';
import { useTestApp } from '../../support/test-app';
import { insertStudy } from './respond-fixtures';
import { insertRespondent, insertStudy as insertLiveStudy } from './fieldwork-fixtures';
import { respondents } from '../../../db/schema/fieldwork';

const IPHONE_UA =
  'Mozilla/5.0 (iPhone; CPU iPhone OS 17_1 like Mac OS X) AppleWebKit/605.1.15 (KHTML, like Gecko) Version/17.1 Mobile/15E148 Safari/604.1';

const t = useTestApp({}, { signIn: 'team' });

describe('respondent devices', () => {
  it('stores a class, not the user agent the browser sent', async () => {
    const study = await insertStudy(t, t.team.teamId);
    await t.team.agents.owner
      .post(`/api/teams/${t.team.teamId}/studies/${study.id}/lifecycle/go-live`)
      .expect(200);
    const res = await t
      .request()
      .post(`/api/r/${study.publicId}/sessions`)
      .send({ device: IPHONE_UA })
      .expect(201);
    const [row] = await t.deps.db
      .select({ device: respondents.device })
      .from(respondents)
      .where(eq(respondents.sessionToken, res.body.sessionToken));
    expect(row!.device).toBe('phone');
  });

  it('a viewer sees a class even for a row that still holds a raw user agent', async () => {
    const { studyId, versionId } = await insertLiveStudy(t.deps.db, { teamId: t.team.teamId });
    const id = await insertRespondent(t.deps.db, { studyId, versionId });
    await t.deps.db.update(respondents).set({ device: IPHONE_UA }).where(eq(respondents.id, id));
    const res = await t.team.agents.viewer
      .get(`/api/teams/${t.team.teamId}/studies/${studyId}/responses`)
      .expect(200);
    expect(res.body.items.map((r: { device: string }) => r.device)).toEqual(['phone']);
    expect(JSON.stringify(res.body)).not.toContain('iPhone');
  });
});
