/**
 * HB and latent class runs the data cannot carry are refused before anything is queued, with a
 * 400 naming the form field: too few choice tasks per respondent for HB, more classes than the
 * respondents can identify. Feasible runs of the same study are still queued (membership
 * questions: run-membership.test.ts).
 */
import { describe, expect, it } from 'vitest';
import { and, eq, gt } from 'drizzle-orm';
import { useTestApp } from '../../support/test-app';
import { answers } from '../../../db/schema/fieldwork';
import { FIXED_COEFFICIENTS, useRunStudy } from '../jobs/run-fixtures';

const t = useTestApp({}, { signIn: 'team', recordJobs: true });

const coefficients = FIXED_COEFFICIENTS;

// 15 completed respondents with 8 design tasks each.
const study = useRunStudy(t, 15, 120_000);

const listRuns = async () =>
  (await t.team.agents.viewer.get(study.base).expect(200)).body as unknown[];

describe('latent class: classes the data can identify', () => {
  it('refuses 2 classes for 15 respondents (at least 10 per class) on the classes field', async () => {
    const before = (await listRuns()).length;
    const res = await t.team.agents.analyst
      .post(study.base)
      .send({ spec: { model: 'latent_class', coefficients, classes: [1, 2] } })
      .expect(400);
    expect(res.body.error.code).toBe('too_little_data');
    expect(res.body.error.fields[0].path).toBe('spec.classes');
    expect(res.body.error.message).toMatch(
      /2 classes need .* at least 20 respondents; the data have 15/,
    );
    expect(t.sent).toHaveLength(0);
    expect(await listRuns()).toHaveLength(before);
  });

  it('queues one class of the same study', async () => {
    await t.team.agents.analyst
      .post(study.base)
      .send({ spec: { model: 'latent_class', coefficients, classes: 1 } })
      .expect(201);
    expect(t.sent).toHaveLength(1);
  });
});

describe('hierarchical Bayes: choice tasks per respondent', () => {
  const hb = {
    model: 'hb',
    coefficients: coefficients.map((c) => ({
      ...c,
      distribution: c.name === 'sq' ? 'fixed' : 'normal',
    })),
    mcmc: { iterations: 200, thin: 1 },
  };

  it('queues HB when every respondent has 8 tasks', async () => {
    await t.team.agents.analyst.post(study.base).send({ spec: hb }).expect(201);
    expect(t.sent).toHaveLength(1);
  });

  it('refuses HB on the model field once one respondent has only 2 tasks', async () => {
    // Keep the respondent's first two design tasks (their block decides which they are).
    const id = study.respondentIds[0];
    const tasks = (await t.deps.db.select().from(answers).where(eq(answers.respondentId, id)))
      .map((a) => a.taskNumber)
      .filter((n): n is number => n !== null)
      .sort((a, b) => a - b);
    expect(tasks).toHaveLength(8);
    await t.deps.db
      .delete(answers)
      .where(and(eq(answers.respondentId, id), gt(answers.taskNumber, tasks[1])));
    const res = await t.team.agents.analyst.post(study.base).send({ spec: hb }).expect(400);
    expect(res.body.error.code).toBe('too_little_data');
    expect(res.body.error.fields[0].path).toBe('spec.model');
    expect(res.body.error.message).toMatch(
      /at least 3 choice tasks per respondent.*1 of 15 respondents have fewer/,
    );
    expect(t.sent).toHaveLength(0);
  });
});
