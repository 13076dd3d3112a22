/**
 * The live study the fieldwork benchmarks answer: consent and ten choice tasks per
 * respondent (three attributes, two unlabeled packages), in two blocks of ten tasks, written
 * straight to the database and put live through the lifecycle service.
 */
import { randomBytes } from 'node:crypto';
import { eq, sql } from 'drizzle-orm';
import type { Db } from '../../db/client';
import { insertTeam } from '../../db/queries/memberships';
import { designs, studies } from '../../db/schema/studies';
import { goLive } from '../../server/services/lifecycle';
import type { AppDeps } from '../../server/deps';

export const BENCH_TASKS_PER_RESPONDENT = 10;

const lv = (prefix: string, labels: string[], values?: number[]) =>
  labels.map((label, i) => ({
    id: `${prefix}${i}`,
    label,
    ...(values ? { value: values[i] } : {}),
  }));

const definition = {
  attributes: [
    {
      id: 'bill',
      name: 'Monthly bill increase',
      kind: 'numeric',
      unit: '€',
      isCost: true,
      coding: 'linear',
      levels: lv('b', ['€0', '€5', '€10'], [0, 5, 10]),
    },
    {
      id: 'cuts',
      name: 'Supply interruptions per year',
      kind: 'numeric',
      coding: 'linear',
      levels: lv('c', ['4', '2', '1'], [4, 2, 1]),
    },
    {
      id: 'river',
      name: 'River health',
      kind: 'categorical',
      coding: 'dummy',
      levels: lv('r', ['poor', 'fair', 'good']),
    },
  ],
  alternatives: { count: 2, labeled: false, labels: [] },
  fixedAlternative: null,
  excludedCombinations: [],
};

const design = {
  blocks: 2,
  tasks: Array.from({ length: 2 * BENCH_TASKS_PER_RESPONDENT }, (_, t) => ({
    block: t < BENCH_TASKS_PER_RESPONDENT ? 1 : 2,
    task: t + 1,
    alternatives: [0, 1].map((j) => ({
      levels: {
        bill: `b${(t + j) % 3}`,
        cuts: `c${(t + 2 * j) % 3}`,
        river: `r${(Math.floor(t / 3) + j) % 3}`,
      },
    })),
  })),
};

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
  teamId?: string,
): Promise<{ publicId: string; studyId: string }> {
  const team = teamId ? { id: teamId } : await insertTeam(db, { name: 'Bench team' });
  const publicId = randomBytes(9).toString('base64url');
  const [study] = await db
    .insert(studies)
    .values({
      teamId: team.id,
      publicId,
      name: 'Bench study',
      publicTitle: 'Bench study',
      definition,
      questionnaire,
    })
    .returning({ id: studies.id });
  const [d] = await db
    .insert(designs)
    .values({ studyId: study.id, teamId: team.id, method: 'imported', design })
    .returning({ id: designs.id });
  await db.update(studies).set({ currentDesignId: d.id }).where(eq(studies.id, study.id));
  await goLive({ db } as AppDeps, team.id, study.id);
  return { publicId, studyId: study.id };
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
