/**
 * Latent class runs with class membership by background answers (POST /runs with
 * spec.membership, then the job): single-choice questions become 0/1 columns against the first
 * option chosen, numbers are used as they are, a missing answer gets a "not answered" column (a
 * number the mean of the answers); the run shows each class's membership coefficients with SEs
 * and the methods sheet of the profile export carries them. Bad questions are refused with 400
 * naming spec.membership.<i> before anything is queued; only owners and analysts start runs.
 */
import { beforeAll, describe, expect, it } from 'vitest';
import { eq } from 'drizzle-orm';
import { useTestApp } from '../../support/test-app';
import { downloadXlsx } from '../../support/download-xlsx';
import { answers } from '../../../db/schema/fieldwork';
import { studyVersions } from '../../../db/schema/studies';
import { runEstimationJob } from '../../../server/jobs/estimation-job';
import {
  FIXED_COEFFICIENTS,
  makeQuestionnaire,
  seedRunStudy,
  TRUE_MNL,
  type SeededStudy,
} from '../jobs/run-fixtures';

const t = useTestApp({}, { signIn: 'team', recordJobs: true });
let study: SeededStudy;
let base: string;

const coefficients = FIXED_COEFFICIENTS;
const question = (key: string, type: string, extra: object = {}) => ({
  id: `p_${key}`,
  kind: 'question',
  question: { key, type, text: `About ${key}`, ...extra },
});
const options = (n: number) =>
  Array.from({ length: n }, (_, i) => ({ id: `o${i}`, label: `Option ${i}` }));

beforeAll(async () => {
  // Two classes: every third respondent filters the tap water and cares more about the river
  // and less about the bill, so filter_tap explains class membership.
  study = await seedRunStudy(t.deps.db, {
    teamId: t.team.teamId,
    respondents: 90,
    filterBeta: { ...TRUE_MNL, 'attr:bill': -0.03, 'attr:river:good': 2.2 },
  });
  base = `/api/teams/${t.team.teamId}/studies/${study.studyId}/runs`;
  // The frozen questionnaire gains background questions of every kind after the consent page.
  const q = makeQuestionnaire();
  (q.pages as unknown[]).splice(
    2,
    0,
    question('household_size', 'number', { min: 1, max: 12 }),
    question('comments', 'text', { maxLength: 500 }),
    question('sources', 'multiple', { options: options(3) }),
    question('district', 'single', { options: options(12) }),
  );
  await t.deps.db
    .update(studyVersions)
    .set({ questionnaire: q })
    .where(eq(studyVersions.id, study.versionId));
  // Household size answered by all but every 4th respondent (n = 1, 5, 9, …). Respondent ids
  // follow simulation order, so the people without an answer are always the same: about as
  // many of them in the second class (n = 9, 21, 33, … and 1, 41, 61, 81) as in the study
  // overall. If the people without an answer all fell in one class, the "not answered"
  // membership coefficient would run off to infinity, the observed information would be
  // singular and every SE null: quasi-separation in the membership logit (the run then warns
  // membership_separated), not a fault of the coding.
  await t.deps.db.insert(answers).values(
    study.respondentIds
      .filter((_, n) => n % 4 !== 1)
      .map((id, n) => ({
        respondentId: id,
        studyId: study.studyId,
        clientId: `hh-${n}`,
        screenKey: 'q:household_size',
        value: { kind: 'number', number: 1 + (n % 5) },
      })),
  );
}, 120_000);

const lc = (membership: string[]) => ({
  spec: { model: 'latent_class', coefficients, classes: 2, starts: 2, membership },
});
const listRuns = async () => (await t.team.agents.viewer.get(base).expect(200)).body as unknown[];

describe('POST /runs with spec.membership', () => {
  it.each([
    ['an unknown question', ['no_such_question'], 0, /has no background question no_such_question/],
    ['a free-text question', ['comments'], 0, /free-text/],
    ['a multiple-choice question', ['filter_tap', 'sources'], 1, /several answers/],
    ['a single choice with too many options', ['district'], 0, /12 answer options; .* at most 10/],
  ])('when it names %s, returns 400 with the field and queues nothing', async (_, keys, i, msg) => {
    const before = (await listRuns()).length;
    const res = await t.team.agents.analyst.post(base).send(lc(keys)).expect(400);
    expect(res.body.error.code).toBe('invalid_input');
    expect(res.body.error.message).toMatch(msg);
    expect(res.body.error.fields[0].path).toBe(`spec.membership.${i}`);
    expect(t.sent).toHaveLength(0);
    expect(await listRuns()).toHaveLength(before);
  });

  it('when a question is listed twice, returns 400 on the second', async () => {
    const res = await t.team.agents.analyst
      .post(base)
      .send(lc(['filter_tap', 'filter_tap']))
      .expect(400);
    expect(res.body.error.fields[0].path).toBe('spec.membership.1');
    expect(t.sent).toHaveLength(0);
  });

  it.each([
    ['editor', 403],
    ['viewer', 403],
  ] as const)('as %s, returns %i', async (role, status) => {
    await t.team.agents[role]
      .post(base)
      .send(lc(['filter_tap']))
      .expect(status);
    expect(t.sent).toHaveLength(0);
  });

  it('for another team, returns 404', async () => {
    await t.team.outsider
      .post(base)
      .send(lc(['filter_tap']))
      .expect(404);
  });

  it('as owner, queues the run', async () => {
    await t.team.agents.owner
      .post(base)
      .send(lc(['filter_tap']))
      .expect(201);
    expect(t.sent).toHaveLength(1);
  });
});

describe('a latent class run with membership by background answers', () => {
  let runId = '';

  it('fits membership coefficients with SEs for each coded column', async () => {
    const res = await t.team.agents.analyst
      .post(base)
      .send(lc(['filter_tap', 'household_size']))
      .expect(201);
    runId = res.body.id;
    await runEstimationJob(t.deps, runId, { threads: 1 });
    const run = (await t.team.agents.viewer.get(`${base}/${runId}`).expect(200)).body;
    expect(run.error).toBeNull();
    expect(run.status).toBe('done');
    // "yes" is the base level (first option); 23 of 90 did not give their household size.
    expect(run.results.membership).toEqual([
      'filter_tap: No',
      'household_size',
      'household_size: not answered',
    ]);
    const second = run.results.classes[1];
    expect(second.membership.map((e: { name: string }) => e.name)).toEqual([
      'constant',
      ...run.results.membership,
    ]);
    for (const e of second.membership) {
      expect(Number.isFinite(e.estimate)).toBe(true);
      expect(e.se).toBeGreaterThan(0);
    }
    // The class of the tap-water filterers is told apart by filter_tap, far beyond 2 SE.
    const tap = second.membership[1];
    expect(Math.abs(tap.estimate / tap.se)).toBeGreaterThan(2);
    // The first class is the reference of the membership logit.
    expect(run.results.classes[0].membership).toEqual([]);
  }, 180_000);

  it('carries the membership coefficients and the coding into the methods sheet', async () => {
    const { workbook } = await downloadXlsx(
      t.team.agents.viewer,
      `/api/teams/${t.team.teamId}/studies/${study.studyId}/exports/taste-profiles.xlsx`,
      { runId },
    );
    const rows: unknown[][] = [];
    workbook.getWorksheet('Methods')!.eachRow((r) => rows.push((r.values as unknown[]).slice(1)));
    const text = rows.map((r) => r.join(' | '));
    expect(text).toContain(
      'Membership variables | filter_tap: No, household_size, household_size: not answered',
    );
    expect(text.some((r) => r.startsWith('Membership coding |'))).toBe(true);
    const row = rows.find((r) => r[0] === 'membership household_size')!;
    expect(typeof row[1]).toBe('number');
    expect(typeof row[2]).toBe('number');
  });
});
