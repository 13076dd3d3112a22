/**
 * Plan generator versions (docs/methods.md "Plan generator versions"): plans stored without a
 * version were drawn by version 1 (sfc32) and their seeds still rebuild them byte for byte;
 * new respondents get version 2 (xoshiro128** with unbiased integers), which says so in the plan.
 */
import { describe, expect, it } from 'vitest';
import { createRespondentPlan } from '../../../server/services/respondent-plan';
import { createPage } from '../../../shared/schemas/questionnaire-defaults';
import type { Questionnaire, QuestionnairePage } from '../../../shared/schemas/questionnaire';
import { PLAN_GENERATOR_VERSION, respondentPlanSchema } from '../../../shared/schemas/respondent';
import { definition, design, fullQuestionnaire } from '../routes/respond-fixtures';

type DominancePage = Extract<QuestionnairePage, { kind: 'dominance' }>;

/** Every randomised part switched on: tasks, alternatives, dominance test and attributes. */
function everythingShuffled(): Questionnaire {
  const q = fullQuestionnaire();
  const end = q.pages.pop()!;
  const dominance = { ...(createPage('dominance', definition) as DominancePage), id: 'dom' };
  const repeat: QuestionnairePage = { id: 'rep', kind: 'repeat', title: 'Again', repeatOf: 2 };
  return {
    pages: [...q.pages, repeat, dominance, end],
    options: { ...q.options, shuffleAttributes: true },
  };
}

/** Eight tasks in one block (the fixture's two, repeated), so task orders have room to differ. */
const eightTasks = {
  ...design,
  tasks: Array.from({ length: 8 }, (_, i) => ({ ...design.tasks[i % 2], task: i + 1, block: 1 })),
};

describe('plan generator version 1', () => {
  const questionnaire = everythingShuffled();

  it('rebuilds the plans version 1 drew for these seeds, byte for byte', () => {
    // Regression values: computed on main with the version-1 generator before version 2 existed
    // (2026-12-03), the plans as stored in respondents.plan. No outside source.
    const before = [
      '{"seed":5,"block":1,"taskOrder":[1,2],"positions":{"task:1":[0,1,-1],"task:2":[0,1,-1],"repeat:rep":[1,0,-1],"dominance:dom":[0,1]},"attributeOrder":["renew","river","bill","warn","interrupt"]}',
      '{"seed":1234567,"block":2,"taskOrder":[4,3],"positions":{"task:4":[0,1,-1],"task:3":[1,0,-1],"repeat:rep":[0,1,-1],"dominance:dom":[0,1]},"attributeOrder":["river","bill","warn","renew","interrupt"]}',
      '{"seed":2147483646,"block":1,"taskOrder":[1,2],"positions":{"task:1":[1,0,-1],"task:2":[1,0,-1],"repeat:rep":[0,1,-1],"dominance:dom":[0,1]},"attributeOrder":["warn","bill","interrupt","renew","river"]}',
      '{"seed":0,"block":2,"taskOrder":[3,4],"positions":{"task:3":[0,1,-1],"task:4":[1,0,-1],"repeat:rep":[0,1,-1],"dominance:dom":[0,1]},"attributeOrder":["river","interrupt","renew","warn","bill"]}',
    ];
    for (const [i, [block, seed]] of [
      [1, 5],
      [2, 1234567],
      [1, 2147483646],
      [2, 0],
    ].entries())
      expect(
        JSON.stringify(
          createRespondentPlan({
            definition,
            design,
            questionnaire,
            block,
            seed,
            generatorVersion: 1,
          }),
        ),
      ).toBe(before[i]);
  });

  it('rebuilds longer task orders too', () => {
    // Regression values as above (computed on main before version 2), eight tasks in one block.
    const before = [
      '{"seed":77,"block":1,"taskOrder":[2,8,5,1,6,4,3,7],"positions":{"task:2":[0,1,-1],"task:8":[1,0,-1],"task:5":[1,0,-1],"task:1":[1,0,-1],"task:6":[1,0,-1],"task:4":[0,1,-1],"task:3":[0,1,-1],"task:7":[1,0,-1],"repeat:rep":[0,1,-1],"dominance:dom":[0,1]},"attributeOrder":["interrupt","warn","river","bill","renew"]}',
      '{"seed":99991,"block":1,"taskOrder":[5,2,1,8,3,4,6,7],"positions":{"task:5":[1,0,-1],"task:2":[1,0,-1],"task:1":[0,1,-1],"task:8":[1,0,-1],"task:3":[0,1,-1],"task:4":[0,1,-1],"task:6":[0,1,-1],"task:7":[0,1,-1],"repeat:rep":[0,1,-1],"dominance:dom":[0,1]},"attributeOrder":["interrupt","renew","bill","warn","river"]}',
    ];
    for (const [i, seed] of [77, 99991].entries())
      expect(
        JSON.stringify(
          createRespondentPlan({
            definition,
            design: eightTasks,
            questionnaire,
            block: 1,
            seed,
            generatorVersion: 1,
          }),
        ),
      ).toBe(before[i]);
  });

  it('reads a stored plan without a version as version 1', () => {
    const stored = respondentPlanSchema.parse(
      JSON.parse(
        '{"seed":5,"block":1,"taskOrder":[1,2],"positions":{"task:1":[0,1,-1],"task:2":[0,1,-1],"repeat:rep":[1,0,-1],"dominance:dom":[0,1]},"attributeOrder":["renew","river","bill","warn","interrupt"]}',
      ),
    );
    expect(stored.generatorVersion ?? 1).toBe(1);
  });
});

describe('plan generator version 2', () => {
  const questionnaire = everythingShuffled();
  const input = { definition, design: eightTasks, questionnaire, block: 1 };

  it('is what a plan is drawn with unless a stored version is asked for, and the plan says so', () => {
    expect(PLAN_GENERATOR_VERSION).toBe(2);
    const plan = createRespondentPlan({ ...input, seed: 77 });
    expect(plan.generatorVersion).toBe(2);
    expect(respondentPlanSchema.parse(plan)).toEqual(plan);
    expect(createRespondentPlan({ ...input, seed: 77, generatorVersion: 2 })).toEqual(plan);
  });

  it('repeats its plan for a seed, and draws other orders than version 1 from the same seeds', () => {
    let differs = 0;
    for (let seed = 0; seed < 20; seed++) {
      const v2 = createRespondentPlan({ ...input, seed });
      expect(createRespondentPlan({ ...input, seed })).toEqual(v2);
      const v1 = createRespondentPlan({ ...input, seed, generatorVersion: 1 });
      if (v1.taskOrder.join() !== v2.taskOrder.join()) differs++;
    }
    // 8! task orders: two independent generators agree on a seed with chance 1/40320.
    expect(differs).toBeGreaterThanOrEqual(19);
  });

  it('puts each task first equally often over many respondents (χ², 0.1 % level)', () => {
    const counts = new Array(8).fill(0);
    const n = 4000;
    for (let seed = 0; seed < n; seed++)
      counts[createRespondentPlan({ ...input, seed }).taskOrder[0] - 1]++;
    const chi2 = counts.reduce((s, c) => s + (c - n / 8) ** 2 / (n / 8), 0);
    // χ²(7) upper 0.1 % point 24.322 (Pearson & Hartley, Biometrika Tables, Table 8).
    expect(chi2).toBeLessThan(24.322);
  });
});
