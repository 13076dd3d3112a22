/**
 * The live study the fieldwork benchmarks answer: consent and a number of choice tasks per
 * respondent (three attributes, two unlabeled packages; ten unless asked otherwise), in two
 * blocks, written straight to the database and put live through the lifecycle service.
 */
import { randomBytes } from 'node:crypto';
import { sql } from 'drizzle-orm';
import type { Db } from '../../db/client';
import { insertTeam } from '../../db/queries/memberships';
import { makeStudyDefinition, numericLevels } from './study-factory/definition';
import { makeStudyDesign } from './study-factory/design';
import { insertStudyRow } from './study-factory/insert-study';

/**
 * Three attributes of three levels (the bill at €0, €5 and €10, interruptions, river health),
 * two unlabeled packages and no status quo: a small task card, so the server's work per
 * answer dominates.
 */
const definition = makeStudyDefinition({
  only: ['bill', 'interrupt', 'river'],
  attributes: { bill: { levels: numericLevels('b', [0, 5, 10], (v) => `€${v}`) } },
  fixedAlternative: null,
});

const questionnaire = {
  pages: [
    {
      id: 'consent',
      kind: 'consent',
      title: 'Welcome',
      body: 'A load test.',
      agreeLabel: 'I agree',
    },
    { id: 'tasks', kind: 'tasks', title: 'Which package would you choose?' },
    { id: 'end', kind: 'end', title: 'Thank you', body: 'Done.' },
  ],
};

/** In a team of its own, or in `teamId` (so that its members can manage it through the API). */
export async function createBenchStudy(
  db: Db,
  options: { teamId?: string; tasksPerRespondent?: number } = {},
): Promise<{ publicId: string; studyId: string }> {
  const { teamId, tasksPerRespondent = 10 } = options;
  const team = teamId ? { id: teamId } : await insertTeam(db, { name: 'Bench team' });
  const { studyId, publicId } = await insertStudyRow(db, {
    teamId: team.id,
    publicId: randomBytes(9).toString('base64url'),
    name: 'Bench study',
    publicTitle: 'Bench study',
    definition,
    design: makeStudyDesign(definition, { tasksPerBlock: tasksPerRespondent, seed: 3 }),
    questionnaire,
    goLive: true,
  });
  return { publicId, studyId };
}

/** Every answer stored for the study: client id, and whether any (respondent, screen) repeats. */
export async function readStoredAnswers(db: Db, studyId: string) {
  const r = await db.execute<{ client_id: string; respondent_id: string; screen_key: string }>(
    sql`select client_id, respondent_id, screen_key from answers where study_id = ${studyId}`,
  );
  const screens = new Set(r.rows.map((x) => `${x.respondent_id} ${x.screen_key}`));
  return {
    rows: r.rows.length,
    clientIds: new Set(r.rows.map((x) => x.client_id)),
    repeatedScreens: r.rows.length - screens.size,
  };
}

/**
 * Answers acknowledged by the server but not stored (lost), and stored beyond one per
 * acknowledged answer (duplicated: a second row, or a row nobody was told about).
 */
export function reconcile(
  acknowledged: Array<{ clientId: string }>,
  stored: Awaited<ReturnType<typeof readStoredAnswers>>,
) {
  const acked = new Set(acknowledged.map((a) => a.clientId));
  let lost = 0;
  for (const id of acked) if (!stored.clientIds.has(id)) lost++;
  let unacknowledged = 0;
  for (const id of stored.clientIds) if (!acked.has(id)) unacknowledged++;
  return {
    sent: acked.size,
    stored: stored.rows,
    lost,
    duplicated: stored.repeatedScreens + (stored.rows - stored.clientIds.size),
    storedButUnacknowledged: unacknowledged,
  };
}
