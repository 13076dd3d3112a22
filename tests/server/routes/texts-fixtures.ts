/** Studies in several languages for the texts, translation-file and staleness route tests. */
import type { TeamApp } from '../../support/owner-app';
import { insertStudy } from './respond-fixtures';

export const textsUrl = (app: TeamApp, studyId: string, path = '') =>
  `/api/teams/${app.team.teamId}/studies/${studyId}/texts${path}`;

/** A draft written in English with German added (no German text yet). */
export async function draftInGerman(app: TeamApp) {
  const s = await insertStudy(app.t, app.team.teamId);
  await app.team.agents.editor
    .put(textsUrl(app, s.id, '/languages'))
    .send({ languages: ['en', 'de'] })
    .expect(200);
  return s;
}
