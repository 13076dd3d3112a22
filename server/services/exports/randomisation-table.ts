/**
 * The randomisation record: for every respondent, the order in which they saw the design tasks
 * and, for each choice screen, which alternative stood at each position from left to right
 * (read back from the stored plan, server/services/respondent-plan.ts), with the seed and plan
 * generator version that rebuild it. Lets a researcher check or model order and position
 * effects.
 */
import { respondentPlanSchema } from '../../../shared/schemas/respondent';
import type { CellValue } from '../../lib/safe-csv';

export const randomisationHeader = [
  'respondent',
  'number',
  'block',
  'seed',
  'plan_generator',
  'screen',
  'task',
  'task_shown_as',
  'alternatives_left_to_right',
  'attributes_top_to_bottom',
];

/** Alternative names as in the design download: 1-based design numbers, "none" for the opt-out. */
const altName = (j: number) => (j < 0 ? 'none' : String(j + 1));

/**
 * `attributeNames` (id -> name) names the attributes of a respondent whose plan randomised
 * their order; the column is empty when the study shows attributes as defined.
 */
export function buildRandomisationRows(
  respondents: readonly { id: string; number: number; plan: unknown }[],
  attributeNames: ReadonlyMap<string, string> = new Map(),
): CellValue[][] {
  const rows: CellValue[][] = [];
  for (const r of respondents) {
    const parsed = respondentPlanSchema.safeParse(r.plan);
    if (!parsed.success) continue;
    const plan = parsed.data;
    const attributeOrder =
      plan.attributeOrder?.map((id) => attributeNames.get(id) ?? id).join(' | ') ?? null;
    for (const [screen, order] of Object.entries(plan.positions)) {
      const task = screen.startsWith('task:') ? Number(screen.slice('task:'.length)) : null;
      const shownAs = task === null ? null : plan.taskOrder.indexOf(task) + 1;
      rows.push([
        r.id,
        r.number,
        plan.block,
        plan.seed,
        // The seed rebuilds the plan only with its generator (docs/methods.md "Plan generator versions").
        plan.generatorVersion ?? 1,
        screen,
        task,
        shownAs,
        order.map(altName).join(' '),
        attributeOrder,
      ]);
    }
  }
  return rows;
}
