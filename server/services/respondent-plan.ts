/**
 * Per-respondent randomisation: the order of the block's tasks and the on-screen position of
 * every alternative (the block itself comes from db/queries/respondent-blocks.ts). Everything
 * comes from one stored seed and the plan generator version, so a plan can be rebuilt and
 * checked; the plan itself is stored in respondents.plan.
 */
import { createPrng } from '../engine/draws/prng';
import { randomIndex, shuffleWith } from '../engine/draws/random-index';
import { createLegacySfc32Index } from '../engine/draws/legacy-sfc32';
import type { Design } from '../../shared/schemas/design';
import type { Questionnaire } from '../../shared/schemas/questionnaire';
import { screenKeys } from '../../shared/schemas/questionnaire';
import {
  PLAN_GENERATOR_VERSION,
  type PlanGeneratorVersion,
  type RespondentPlan,
} from '../../shared/schemas/respondent';
import type { StudyDefinition } from '../../shared/schemas/study-definition';

/** xoshiro stream of respondent plans (version 2), apart from the design's and the draws'. */
export const PLAN_STREAM = 0x9a17;

type PickIndex = (n: number) => number;

/** Version 2 draws from the one seeded generator; version 1 only rebuilds stored plans. */
function indexSource(seed: number, version: PlanGeneratorVersion): PickIndex {
  if (version === 1) return createLegacySfc32Index(seed);
  const prng = createPrng(seed, PLAN_STREAM);
  return (n) => randomIndex(prng, n);
}

function shuffled(pick: PickIndex, values: number[]): number[] {
  const out = [...values];
  shuffleWith(pick, out);
  return out;
}

const range = (n: number) => Array.from({ length: n }, (_, i) => i);

export type PlanInput = {
  definition: StudyDefinition;
  design: Design;
  questionnaire: Questionnaire;
  block: number;
  seed: number;
  /** The generator to draw with: the current one unless a stored plan is rebuilt. */
  generatorVersion?: PlanGeneratorVersion;
};

/**
 * Builds the plan, as far as the questionnaire's options ask: task order shuffled per
 * respondent; unlabeled alternatives shuffled per task (labeled ones keep their order, since
 * their label is part of what is chosen), with the opt-out / status quo always last; and, when
 * asked, one attribute order per respondent, kept on every task so respondents are not made to
 * re-read each card. Randomising these orders and storing what was shown follows Bridges et
 * al. 2011 (ISPOR checklist, items 6 and 10.2); the details are common practice, no source. The repeated task shows the original task's designed alternatives in reverse
 * order; the dominance test always puts its dominant alternative (index 0) at a random
 * position, or it would not test attention. Draws are taken in a fixed sequence (tasks,
 * alternatives, dominance, attributes), so a stored seed and version rebuild the same plan.
 */
export function createRespondentPlan(input: PlanInput): RespondentPlan {
  const { definition, design, questionnaire, block, seed } = input;
  const generatorVersion = input.generatorVersion ?? PLAN_GENERATOR_VERSION;
  const random = indexSource(seed, generatorVersion);
  const tasks = design.tasks.filter((t) => t.block === block).map((t) => t.task);
  if (tasks.length === 0) throw new RangeError(`Block ${block} has no tasks`);
  const { shuffleTasks, shuffleAlternatives, shuffleAttributes } = questionnaire.options;
  const taskOrder = shuffleTasks ? shuffled(random, tasks) : tasks;
  const J = definition.alternatives.count;
  const fixed = definition.fixedAlternative ? [-1] : [];
  const keepOrder = definition.alternatives.labeled || !shuffleAlternatives;
  const order = () => (keepOrder ? range(J) : shuffled(random, range(J)));
  const positions: Record<string, number[]> = {};
  for (const task of taskOrder) positions[screenKeys.task(task)] = [...order(), ...fixed];
  for (const page of questionnaire.pages) {
    if (page.kind === 'warmup' || page.kind === 'holdout')
      positions[screenKeys.special(page.kind, page.id)] = [
        ...range(page.alternatives.length),
        ...fixed,
      ];
    if (page.kind === 'repeat') {
      const original = taskOrder[Math.min(page.repeatOf, taskOrder.length) - 1];
      const shown = positions[screenKeys.task(original)].filter((j) => j >= 0);
      positions[screenKeys.special('repeat', page.id)] = [...shown.reverse(), ...fixed];
    }
    if (page.kind === 'dominance')
      positions[screenKeys.special('dominance', page.id)] = shuffled(random, range(J));
  }
  // Version-1 plans were stored without the key: rebuilt, they stay byte for byte the same.
  const plan: RespondentPlan =
    generatorVersion === 1
      ? { seed, block, taskOrder, positions }
      : { seed, generatorVersion, block, taskOrder, positions };
  if (shuffleAttributes) {
    const ids = definition.attributes.map((a) => a.id);
    plan.attributeOrder = shuffled(random, range(ids.length)).map((i) => ids[i]);
  }
  return plan;
}

/** The design task a repeat page repeats for this respondent. */
export function repeatedTaskNumber(plan: RespondentPlan, repeatOf: number): number {
  return plan.taskOrder[Math.min(repeatOf, plan.taskOrder.length) - 1];
}
