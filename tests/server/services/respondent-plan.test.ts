import { describe, expect, it } from 'vitest';
import { createRespondentPlan, repeatedTaskNumber } from '../../../server/services/respondent-plan';
import {
  buildScreens,
  buildDominanceAlternatives,
} from '../../../server/services/respondent-screens';
import { buildSurveyView } from '../../../server/services/survey-view';
import { createPage } from '../../../shared/schemas/questionnaire-defaults';
import type { Questionnaire, QuestionnairePage } from '../../../shared/schemas/questionnaire';

type DominancePage = Extract<QuestionnairePage, { kind: 'dominance' }>;
type WarmupPage = Extract<QuestionnairePage, { kind: 'warmup' }>;
import { makeStudyDefinition } from '../../../scripts/lib/study-factory/definition';
import { definition, design, fullQuestionnaire } from '../routes/respond-fixtures';

const withSpecials = (): Questionnaire => {
  const q = fullQuestionnaire();
  const end = q.pages.pop()!;
  const repeat: QuestionnairePage = { id: 'rep', kind: 'repeat', title: 'Again', repeatOf: 2 };
  const dominance: QuestionnairePage = {
    ...(createPage('dominance', definition) as DominancePage),
    id: 'dom',
  };
  const warmup: QuestionnairePage = {
    ...(createPage('warmup', definition) as WarmupPage),
    id: 'warm',
  };
  const tasksAt = q.pages.findIndex((p) => p.kind === 'tasks');
  q.pages.splice(tasksAt, 0, warmup);
  return { ...q, pages: [...q.pages, repeat, dominance, end] };
};

describe('createRespondentPlan', () => {
  const base = { definition, design, questionnaire: withSpecials(), block: 1 };

  it('is reproducible from its seed and differs across seeds', () => {
    const a = createRespondentPlan({ ...base, seed: 42 });
    expect(createRespondentPlan({ ...base, seed: 42 })).toEqual(a);
    const orders = new Set(
      Array.from({ length: 40 }, (_, s) =>
        JSON.stringify(createRespondentPlan({ ...base, seed: s }).positions),
      ),
    );
    expect(orders.size).toBeGreaterThan(1);
  });

  it("orders exactly the block's tasks and shuffles the order across respondents", () => {
    const seen = new Set<string>();
    for (let seed = 0; seed < 40; seed++) {
      const plan = createRespondentPlan({ ...base, block: 2, seed });
      expect([...plan.taskOrder].sort()).toEqual([3, 4]);
      seen.add(plan.taskOrder.join(','));
    }
    expect(seen).toEqual(new Set(['3,4', '4,3']));
  });

  it('shuffles unlabeled alternatives and keeps the status quo last', () => {
    const firsts = new Set<number>();
    for (let seed = 0; seed < 40; seed++) {
      const p = createRespondentPlan({ ...base, seed }).positions['task:1'];
      expect([...p].sort()).toEqual([-1, 0, 1]);
      expect(p[2]).toBe(-1);
      firsts.add(p[0]);
    }
    expect(firsts).toEqual(new Set([0, 1]));
  });

  it('keeps labeled alternatives in their order', () => {
    const labeled = makeStudyDefinition({
      alternatives: {
        count: 2,
        labeled: true,
        labels: [
          { id: 'north', name: 'North plan', omittedAttributeIds: [] },
          { id: 'south', name: 'South plan', omittedAttributeIds: [] },
        ],
      },
    });
    for (let seed = 0; seed < 10; seed++)
      expect(
        createRespondentPlan({ ...base, definition: labeled, seed }).positions['task:2'],
      ).toEqual([0, 1, -1]);
  });

  it('repeats the chosen task with its designed alternatives in swapped positions', () => {
    for (let seed = 0; seed < 10; seed++) {
      const plan = createRespondentPlan({ ...base, seed });
      const original = repeatedTaskNumber(plan, 2);
      expect(original).toBe(plan.taskOrder[1]);
      const shown = plan.positions[`task:${original}`];
      expect(plan.positions['repeat:rep']).toEqual([shown[1], shown[0], -1]);
    }
  });

  it('refuses a block without tasks', () => {
    expect(() => createRespondentPlan({ ...base, block: 3, seed: 1 })).toThrow(
      /Block 3 has no tasks/,
    );
  });
});

describe('createRespondentPlan with the randomisation options', () => {
  const withOptions = (options: Partial<Questionnaire['options']>): Questionnaire => {
    const q = withSpecials();
    return { ...q, options: { ...q.options, ...options } };
  };
  const seeds = Array.from({ length: 40 }, (_, i) => i + 1);
  const version = (questionnaire: Questionnaire) => ({
    id: 'v',
    studyId: 's',
    version: 1,
    definition,
    design,
    questionnaire,
  });

  it('keeps plans made before the options existed: the defaults draw exactly as before', () => {
    // Plans the previous plan builder (no options) gave for these seeds, so a stored seed still
    // rebuilds what a respondent was shown — and no attributeOrder key appears.
    const before = {
      3: '{"seed":3,"block":1,"taskOrder":[2,1],"positions":{"task:2":[0,1,-1],"task:1":[0,1,-1],"warmup:warm":[0,1,-1],"repeat:rep":[1,0,-1],"dominance:dom":[1,0]}}',
      8: '{"seed":8,"block":1,"taskOrder":[2,1],"positions":{"task:2":[1,0,-1],"task:1":[0,1,-1],"warmup:warm":[0,1,-1],"repeat:rep":[1,0,-1],"dominance:dom":[0,1]}}',
      21: '{"seed":21,"block":1,"taskOrder":[2,1],"positions":{"task:2":[1,0,-1],"task:1":[0,1,-1],"warmup:warm":[0,1,-1],"repeat:rep":[1,0,-1],"dominance:dom":[0,1]}}',
    };
    for (const [seed, plan] of Object.entries(before))
      expect(
        JSON.stringify(
          createRespondentPlan({
            ...version(withSpecials()),
            block: 1,
            seed: Number(seed),
            generatorVersion: 1,
          }),
        ),
      ).toBe(plan);
  });

  it('shows the tasks in design order when task shuffling is off', () => {
    const questionnaire = withOptions({ shuffleTasks: false });
    const designOrder = design.tasks.filter((t) => t.block === 1).map((t) => t.task);
    for (const seed of seeds)
      expect(
        createRespondentPlan({ definition, design, questionnaire, block: 1, seed }).taskOrder,
      ).toEqual(designOrder);
  });

  it('keeps the alternatives in design order when alternative shuffling is off, the dominance test still shuffled', () => {
    const questionnaire = withOptions({ shuffleAlternatives: false });
    const J = definition.alternatives.count;
    const inOrder = [...Array(J).keys()];
    const dominanceOrders = new Set<string>();
    for (const seed of seeds) {
      const plan = createRespondentPlan({ definition, design, questionnaire, block: 1, seed });
      for (const [key, order] of Object.entries(plan.positions)) {
        if (key.startsWith('dominance:')) dominanceOrders.add(order.join());
        else if (!key.startsWith('repeat:'))
          expect(
            order.filter((j) => j >= 0),
            key,
          ).toEqual(inOrder);
      }
    }
    // The attention check keeps its dominant alternative moving, or it would test habit.
    expect(dominanceOrders.size).toBeGreaterThan(1);
  });

  it('gives each respondent one attribute order, a permutation, used on every task card', () => {
    const questionnaire = withOptions({ shuffleAttributes: true });
    const ids = definition.attributes.map((a) => a.id);
    const orders = new Set<string>();
    for (const seed of seeds) {
      const plan = createRespondentPlan({ definition, design, questionnaire, block: 1, seed });
      expect([...plan.attributeOrder!].sort()).toEqual([...ids].sort());
      orders.add(plan.attributeOrder!.join());
      const view = buildSurveyView(version(questionnaire), plan, 'Study');
      expect(view.definition.attributes.map((a) => a.id)).toEqual(plan.attributeOrder);
      // Same respondent, same seed: the same order again (reproducible from the stored seed).
      expect(
        createRespondentPlan({ definition, design, questionnaire, block: 1, seed }).attributeOrder,
      ).toEqual(plan.attributeOrder);
    }
    // 40 respondents over the demo's attributes: far more than one order in practice.
    expect(orders.size).toBeGreaterThan(5);
  });

  it('leaves the attribute order as defined when attribute shuffling is off', () => {
    const plan = createRespondentPlan({
      definition,
      design,
      questionnaire: withSpecials(),
      block: 1,
      seed: 3,
    });
    const view = buildSurveyView(version(withSpecials()), plan, 'Study');
    expect(view.definition.attributes.map((a) => a.id)).toEqual(
      definition.attributes.map((a) => a.id),
    );
  });
});

describe('buildScreens', () => {
  it('puts the tasks where the task block stands and the special tasks where their pages are', () => {
    const questionnaire = withSpecials();
    const plan = createRespondentPlan({ definition, design, questionnaire, block: 1, seed: 7 });
    const screens = buildScreens(
      { id: 'v', studyId: 's', version: 1, definition, design, questionnaire },
      plan,
    );
    expect(screens.map((s) => s.key)).toEqual([
      'consent',
      'q:adult',
      'page:instructions',
      'warmup:warm',
      `task:${plan.taskOrder[0]}`,
      `task:${plan.taskOrder[1]}`,
      'q:household_size',
      'q:age_band',
      'q:filters_water',
      'repeat:rep',
      'dominance:dom',
    ]);
    const tasks = screens.filter((s) => s.kind === 'task');
    expect(tasks.map((s) => (s.kind === 'task' ? [s.taskIndex, s.taskCount] : null))).toEqual([
      [1, 5],
      [2, 5],
      [3, 5],
      [4, 5],
      [5, 5],
    ]);
    const first = screens[4];
    if (first.kind !== 'task') throw new Error('expected a task');
    const levels = design.tasks.find((t) => t.task === plan.taskOrder[0])!.alternatives;
    expect(first.alternatives.map((a) => a.levels)).toEqual(
      plan.positions[first.key].map((j) =>
        j < 0 ? definition.fixedAlternative!.levels : levels[j].levels,
      ),
    );
    expect(first.alternatives.map((a) => a.label)).toEqual([
      'Option A',
      'Option B',
      'Current service',
    ]);
  });
});

describe('buildDominanceAlternatives', () => {
  it('gives alternative 0 the best level of every attribute and the others a different one', () => {
    const best = { bill: 'b0', interrupt: 'i1', warn: 'w0', river: 'good', renew: 'r80' };
    const [dominant, other] = buildDominanceAlternatives(definition, best);
    expect(dominant).toEqual(best);
    for (const a of definition.attributes)
      expect(other[a.id]).not.toBe(best[a.id as keyof typeof best]);
  });
});
