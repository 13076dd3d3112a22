/**
 * Segments use case: one coefficient's individual means grouped by the alternative chosen in
 * a design task, by the answer to a single-choice or number question, or (latent class runs) by
 * the likeliest class, summarised by
 * summarizeSegments (server/services/segments.ts).
 */
import type { AppDeps } from '../../deps';
import { ValidationError } from '../../lib/errors';
import { listQuestionAnswers, listTaskChoices } from '../../../db/queries/study-answers';
import { listRunProfiles } from '../../../db/queries/taste-profiles';
import type { Segments, SegmentsQuery, TasteQuestion } from '../../../shared/schemas/tastes';
import { summarizeSegments } from '../segments';
import { formatPercent } from '../../../shared/format';
import { loadRunContext, type RunContext } from './run-context';
import { getAnswerKey } from './background-answers';
import { getAlternativeIndexes, getAlternativeLabel } from './alternative-labels';
import type { Actor } from '../actor';

export type Grouping = {
  label: string;
  groupOf: Map<string, string>;
  order: string[];
  labelOf: (key: string) => string;
};

/** Numbers with more than this many distinct answers are grouped into quartile ranges. */
const MAX_NUMBER_GROUPS = 12;

async function groupByTask(deps: AppDeps, ctx: RunContext, task: number): Promise<Grouping> {
  if (!ctx.header.tasks.some((t) => t.task === task))
    throw new ValidationError('The design has no such task.', [
      { path: 'task', message: 'Unknown task' },
    ]);
  const rows = await listTaskChoices(deps.db, { studyId: ctx.study.id, task });
  const groupOf = new Map<string, string>();
  for (const r of rows) if (r.chosen !== null) groupOf.set(r.respondentId, String(r.chosen));
  const order = getAlternativeIndexes(ctx.definition).map(String);
  return {
    label: `Choice in task ${task}`,
    groupOf,
    order,
    labelOf: (key) => getAlternativeLabel(ctx.definition, Number(key)),
  };
}

function groupNumbers(values: Map<string, number>): Pick<Grouping, 'groupOf' | 'order'> {
  const distinct = [...new Set(values.values())].sort((a, b) => a - b);
  const groupOf = new Map<string, string>();
  if (distinct.length <= MAX_NUMBER_GROUPS) {
    for (const [id, v] of values) groupOf.set(id, String(v));
    return { groupOf, order: distinct.map(String) };
  }
  const sorted = [...values.values()].sort((a, b) => a - b);
  const cut = [0.25, 0.5, 0.75].map((p) => sorted[Math.floor(p * (sorted.length - 1))]);
  const bounds = [sorted[0], ...cut, sorted[sorted.length - 1]];
  const names = [0, 1, 2, 3].map((i) => `${bounds[i]}–${bounds[i + 1]}`);
  for (const [id, v] of values) {
    const i = v <= cut[0] ? 0 : v <= cut[1] ? 1 : v <= cut[2] ? 2 : 3;
    groupOf.set(id, names[i]);
  }
  return { groupOf, order: names };
}

async function groupByQuestion(deps: AppDeps, ctx: RunContext, key: string): Promise<Grouping> {
  const question: TasteQuestion | undefined = ctx.header.questions.find((q) => q.key === key);
  if (!question)
    throw new ValidationError('Unknown question.', [
      { path: 'question', message: 'Unknown question' },
    ]);
  if (question.type !== 'single' && question.type !== 'number')
    throw new ValidationError('Group by a single-choice or number question.', [
      { path: 'question', message: 'Choose a single-choice or number question' },
    ]);
  const rows = (await listQuestionAnswers(deps.db, { studyId: ctx.study.id })).filter(
    (r) => r.screenKey === `q:${key}`,
  );
  if (question.type === 'single') {
    const groupOf = new Map<string, string>();
    for (const r of rows) {
      const k = getAnswerKey(r.value);
      if (k !== null) groupOf.set(r.respondentId, k);
    }
    return {
      label: question.text,
      groupOf,
      order: question.options.map((o) => o.id),
      labelOf: (id) => question.options.find((o) => o.id === id)?.label ?? id,
    };
  }
  const values = new Map<string, number>();
  for (const r of rows) {
    const k = getAnswerKey(r.value);
    if (k !== null) values.set(r.respondentId, Number(k));
  }
  return { label: question.text, ...groupNumbers(values), labelOf: (k) => k };
}

/** Latent class runs: each respondent's likeliest class (largest posterior probability). */
async function groupByClass(deps: AppDeps, ctx: RunContext): Promise<Grouping> {
  const classes = ctx.results.classes ?? [];
  if (ctx.run.model !== 'latent_class' || classes.length === 0)
    throw new ValidationError('Only a latent class run has classes to group by.', [
      { path: 'groupBy', message: 'Choose a latent class run to group by class' },
    ]);
  const profiles = await listRunProfiles(deps.db, { runId: ctx.run.id, studyId: ctx.study.id });
  const groupOf = new Map<string, string>();
  for (const p of profiles) {
    const c = (p.extra as { likeliestClass?: number } | null)?.likeliestClass;
    if (c !== undefined) groupOf.set(p.respondentId, String(c));
  }
  const share = new Map(classes.map((c) => [String(c.class), c.share]));
  return {
    label: 'Likeliest latent class',
    groupOf,
    order: classes.map((c) => String(c.class)),
    labelOf: (key) => `Class ${key} (${formatPercent(share.get(key), 0)})`,
  };
}

/** The grouping a segment request names (400 when the task, question or run cannot group). */
export function resolveGrouping(
  deps: AppDeps,
  ctx: RunContext,
  by: { groupBy: 'task' | 'question' | 'class'; task?: number; question?: string },
): Promise<Grouping> {
  if (by.groupBy === 'class') return groupByClass(deps, ctx);
  return by.groupBy === 'task'
    ? groupByTask(deps, ctx, by.task!)
    : groupByQuestion(deps, ctx, by.question!);
}

export async function getSegments(
  deps: AppDeps,
  actor: Actor,
  studyId: string,
  query: SegmentsQuery,
): Promise<Segments> {
  const ctx = await loadRunContext(deps, actor, studyId, query.runId);
  const coefficient = ctx.header.coefficients.find((c) => c.name === query.coefficient);
  if (!coefficient)
    throw new ValidationError(`The run has no coefficient ${query.coefficient}.`, [
      { path: 'coefficient', message: 'Unknown coefficient' },
    ]);
  const grouping = await resolveGrouping(deps, ctx, query);
  const profiles = await listRunProfiles(deps.db, { runId: ctx.run.id, studyId });
  const values: number[] = [];
  const groups: (string | null)[] = [];
  for (const p of profiles) {
    const v = (p.mean as Record<string, number>)[coefficient.name];
    if (typeof v !== 'number' || !Number.isFinite(v)) continue;
    values.push(v);
    groups.push(grouping.groupOf.get(p.respondentId) ?? null);
  }
  const summary = summarizeSegments(values, groups, { bins: query.bins, order: grouping.order });
  return {
    coefficient,
    groupLabel: grouping.label,
    edges: summary.edges,
    groups: summary.groups.map((g) => ({ ...g, label: grouping.labelOf(g.key) })),
    ungrouped: groups.filter((g) => g === null).length,
  };
}
