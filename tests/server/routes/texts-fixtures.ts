/** Studies in several languages for the texts, translation-file and staleness route tests. */
import type { FileTestApp } from '../../support/test-app';
import { insertStudy } from './respond-fixtures';

type TeamApp = FileTestApp<'team'>;

export const textsUrl = (t: TeamApp, studyId: string, path = '') =>
  `/api/teams/${t.team.teamId}/studies/${studyId}/texts${path}`;

/** A draft written in English with German added (no German text yet). */
export async function draftInGerman(t: TeamApp) {
  const s = await insertStudy(t, t.team.teamId);
  await t.team.agents.editor
    .put(textsUrl(t, s.id, '/languages'))
    .send({ languages: ['en', 'de'] })
    .expect(200);
  return s;
}
