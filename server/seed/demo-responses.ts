/**
 * Fills the demo study with synthetic respondents simulated from DEMO_TRUTH, through the same
 * services as real fieldwork: the study goes live, each respondent gets a session (block,
 * randomised plan) from createRespondent and answers screen by screen through saveAnswer with
 * client-made ids, then the study is closed. Idempotent: a closed study with the full panel is
 * left alone; an interrupted earlier run is removed and redone.
 */
import type { Db } from '../../db/client';
import type { AppDeps } from '../deps';
import { closeStudy, goLive } from '../services/lifecycle';
import { createRespondent } from '../services/respondent-session';
import { saveAnswer } from '../services/answers';
import { resetBlockCounts } from '../../db/queries/respondent-blocks';
import { deleteTombstones } from '../../db/queries/erasure';
import { saveQuestionnaire } from '../services/questionnaire';
import { buildScreens, loadFrozenVersion } from '../services/respondent-screens';
import { createRespondentPlan } from '../services/respondent-plan';
import { createPrng } from '../engine/draws/prng';
import { randomIndex } from '../engine/draws/random-index';
import { getLatestVersion } from '../../db/queries/versions';
import {
  countSimulatedRespondents,
  deleteSimulatedRespondents,
  getStudyForSeed,
} from '../../db/queries/responses';
import { createPage, demoQuestionnaire } from '../../shared/schemas/questionnaire-defaults';
import { questionnaireSchema } from '../../shared/schemas/questionnaire';
import {
  respondentPlanSchema,
  type AnswerValue,
  type RespondentPlan,
} from '../../shared/schemas/respondent';
import { studyDefinitionSchema } from '../../shared/schemas/study-definition';
import { DEMO_TRUTH, mapDemoDefinition, simulateChoice, type DemoCoding } from './simulate-choices';
import { backgroundAnswer, planDemoPeople, screenTimeMs, type DemoPerson } from './demo-people';

export { DEMO_TRUTH } from './simulate-choices';

const DAY = 86_400_000;
/** Respondents answering at the same time while seeding (each one's answers stay in order). */
const CONCURRENCY = 6;

/** The lifecycle services only touch the database; the seed has no mailer or logger to give. */
const depsFor = (db: Db) => ({ db }) as unknown as AppDeps;

/** Fieldwork ran for three weeks, ending a fortnight before the seed first ran. */
function fieldworkWindow(now = new Date()) {
  const start = new Date(Math.floor(now.getTime() / DAY) * DAY - 35 * DAY);
  return { start, end: new Date(start.getTime() + 21 * DAY + 23 * 3_600_000) };
}

/**
 * The demo questionnaire (consent, instructions, tasks, the three background questions, end)
 * when the draft study has none yet, plus a dominance test after the tasks: the demo panel
 * includes respondents who fail it.
 */
async function ensureDemoQuestionnaire(
  db: Db,
  study: { id: string; teamId: string; definition: unknown; questionnaire: unknown },
) {
  const definition = studyDefinitionSchema.parse(study.definition);
  const parsed = questionnaireSchema.safeParse(study.questionnaire);
  const q = parsed.success ? parsed.data : demoQuestionnaire(definition);
  if (parsed.success && q.pages.some((p) => p.kind === 'dominance')) return;
  const page = { ...createPage('dominance', definition), id: 'dominance' };
  const tasksAt = q.pages.findIndex((p) => p.kind === 'tasks');
  const pages = q.pages.some((p) => p.kind === 'dominance')
    ? q.pages
    : [...q.pages.slice(0, tasksAt + 1), page, ...q.pages.slice(tasksAt + 1)];
  await saveQuestionnaire(
    depsFor(db),
    study.teamId,
    study.id,
    questionnaireSchema.parse({ pages }),
  );
}

async function answerAll(
  db: Db,
  studyId: string,
  person: DemoPerson,
  sessionToken: string,
  screens: ReturnType<typeof buildScreens>,
  coding: DemoCoding,
) {
  const random = createPrng(person.truth.seed ^ 0x5bd1e995);
  let now = person.startedAt.getTime();
  let taskIndex = 0;
  const last = person.stopAfter ?? screens.length;
  for (const [i, screen] of screens.slice(0, last).entries()) {
    let value: AnswerValue;
    if (screen.kind === 'consent') value = { kind: 'consent', agreed: true };
    else if (screen.kind === 'instructions') value = { kind: 'ack' };
    else if (screen.kind === 'question') value = backgroundAnswer(screen, random);
    else value = { kind: 'choice', position: simulateChoice(person.truth, screen, coding) };
    const responseMs = screenTimeMs(person, screen, taskIndex, random);
    if (screen.kind === 'task' && screen.taskKind === 'design') taskIndex++;
    now += responseMs + 300 + randomIndex(random, 900);
    await saveAnswer(db, {
      studyId,
      sessionToken,
      answer: { clientId: `demo-${person.n}-${i}`, screenKey: screen.key, value, responseMs },
      now: new Date(now),
    });
  }
}

export async function ensureDemoResponses(
  db: Db,
  params: { studyId: string },
): Promise<{ created: number; total: number }> {
  const { studyId } = params;
  let study = await getStudyForSeed(db, { studyId });
  if (!study) throw new Error(`Demo study ${studyId} not found`);
  const total = DEMO_TRUTH.completes + DEMO_TRUTH.dropouts;
  const existing = await countSimulatedRespondents(db, { studyId });
  if (existing === total && study.status === 'closed') return { created: 0, total };
  if (existing > 0) {
    await deleteSimulatedRespondents(db, { studyId });
    await resetBlockCounts(db, { studyId });
    // Respondents erased from the demo come back simulated: their tombstones would shift numbers.
    await deleteTombstones(db, { studyId });
  }

  const deps = depsFor(db);
  const { start, end } = fieldworkWindow();
  if (study.status === 'draft') await ensureDemoQuestionnaire(db, study);
  if (study.status !== 'live') await goLive(deps, study.teamId, studyId, { now: start });
  study = (await getStudyForSeed(db, { studyId }))!;
  const coding = mapDemoDefinition(studyDefinitionSchema.parse(study.definition));

  const latest = await getLatestVersion(db, { studyId });
  const version = await loadFrozenVersion(db, { id: latest!.id, studyId });
  const screenCount = buildScreens(
    version,
    createRespondentPlan({ ...version, block: 1, seed: 1 }),
  ).length;
  const people = planDemoPeople(start, screenCount);
  // Sessions one after another, so blocks go to the least-filled one in arrival order.
  const sessions: Array<{ person: DemoPerson; sessionToken: string; plan: RespondentPlan }> = [];
  for (const person of people) {
    const { respondent, sessionToken } = await createRespondent(db, {
      studyId,
      seed: person.truth.seed,
      startedAt: person.startedAt,
      externalId: person.externalId,
      device: person.device,
      simulatedTruth: person.truth,
    });
    sessions.push({ person, sessionToken, plan: respondentPlanSchema.parse(respondent.plan) });
  }
  let next = 0;
  const worker = async () => {
    while (next < sessions.length) {
      const s = sessions[next++];
      await answerAll(db, studyId, s.person, s.sessionToken, buildScreens(version, s.plan), coding);
    }
  };
  await Promise.all(Array.from({ length: CONCURRENCY }, worker));
  await closeStudy(deps, study.teamId, studyId, end);
  return { created: people.length, total };
}
