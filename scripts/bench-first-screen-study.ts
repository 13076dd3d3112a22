/**
 * The study the first-screen benchmark opens: the Larkspur Valley Water demo study (its
 * definition, seeded D-efficient design and demo questionnaire), put live in a scratch database.
 */
import type { Db } from '../db/client';
import { insertTeam } from '../db/queries/memberships';
import { insertUser } from '../db/queries/users';
import { getStudyById } from '../db/queries/studies';
import { demoDefinition, ensureDemoStudy } from '../server/seed/demo-study';
import type { AppDeps } from '../server/deps';
import { goLive } from '../server/services/lifecycle';
import { saveQuestionnaire } from '../server/services/questionnaire';
import { demoQuestionnaire } from '../shared/schemas/questionnaire-defaults';

export async function createFirstScreenStudy(db: Db): Promise<{ publicId: string }> {
  // Only the database is used by these services; the benchmark needs no mail or logger here.
  const deps = { db } as unknown as AppDeps;
  const team = await insertTeam(db, { name: 'Bench team' });
  const owner = await insertUser(db, {
    email: `bench-${team.id}@example.invalid`,
    name: 'Bench',
    passwordHash: 'not-a-hash',
  });
  const studyId = await ensureDemoStudy(db, { teamId: team.id, ownerId: owner.id });
  await saveQuestionnaire(deps, team.id, studyId, demoQuestionnaire(demoDefinition));
  await goLive(deps, team.id, studyId);
  const study = await getStudyById(db, { id: studyId, teamId: team.id });
  return { publicId: study!.publicId };
}
