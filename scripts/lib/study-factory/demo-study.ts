/**
 * The product's own demo study (server/seed) in a new team with its owner, for tests and
 * benchmarks that need what a fresh installation shows: the seeded D-efficient design, and on
 * request the demo questionnaire and going live, or the whole simulated fieldwork.
 */
import type { Db } from '../../../db/client';
import { insertMembership, insertTeam } from '../../../db/queries/memberships';
import { getStudyById } from '../../../db/queries/studies';
import { insertUser } from '../../../db/queries/users';
import type { AppDeps } from '../../../server/deps';
import { demoDefinition } from '../../../server/seed/demo-definition';
import { ensureDemoStudy } from '../../../server/seed/demo-study';
import { goLive } from '../../../server/services/lifecycle';
import { saveQuestionnaire } from '../../../server/services/questionnaire';
import { demoQuestionnaire } from '../../../shared/schemas/questionnaire-defaults';

export type DemoStudyOverrides = {
  teamName?: string;
  ownerEmail?: string;
  /** Save the demo questionnaire and put the study live (it stays a draft otherwise). */
  live?: boolean;
};

export async function createDemoStudy(db: Db, o: DemoStudyOverrides = {}) {
  // The seed's services only use the database: no mailer or logger is needed.
  const deps = { db } as unknown as AppDeps;
  const team = await insertTeam(db, { name: o.teamName ?? 'Larkspur Valley Water' });
  const owner = await insertUser(db, {
    email: o.ownerEmail ?? `owner-${team.id}@larkspur.example.test`,
    name: 'Demo owner',
    passwordHash: 'not-a-hash',
  });
  await insertMembership(db, { teamId: team.id, userId: owner.id, role: 'owner' });
  const studyId = await ensureDemoStudy(db, { teamId: team.id, ownerId: owner.id });
  if (o.live) {
    await saveQuestionnaire(deps, team.id, studyId, demoQuestionnaire(demoDefinition));
    await goLive(deps, team.id, studyId);
  }
  const study = await getStudyById(db, { id: studyId, teamId: team.id });
  return { teamId: team.id, ownerId: owner.id, studyId, publicId: study!.publicId };
}
