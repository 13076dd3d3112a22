/**
 * The Fieldwork section: sample flow, timing, completes per block and version, where
 * unfinished respondents stopped (Bridges et al. 2011, item 7.1; docs/methods.md: invited / started / completed, dropout
 * by task, quotas) and the invitations summary.
 */
import type { AppDeps } from '../deps';
import { loadStudy } from './study-access';
import {
  countByBlock,
  countByVersion,
  countDaily,
  countDesignTasksAnswered,
  countReachedByScreen,
  countRespondentsByStatus,
  listUnfinishedProgress,
  medianCompletedDuration,
} from '../../db/queries/fieldwork-stats';
import { getLatestVersion } from '../../db/queries/versions';
import { countInvitees } from '../../db/queries/invitees';
import { designSchema } from '../../shared/schemas/design';
import {
  pageKindLabels,
  questionnaireSchema,
  screenKeys,
} from '../../shared/schemas/questionnaire';
import type { DropOffStep, FieldworkStats, QuotaProgress } from '../../shared/schemas/fieldwork';
import type { DbOrTx } from '../../db/client';
import { completesPerCell, quotaPagesOf } from './segment-quotas';

export type ScreenSlot = { key: string; label: string };

const taskSlotKey = (k: number) => `tasks#${k}`;
const shorten = (s: string, n = 60) => (s.length > n ? `${s.slice(0, n - 1)}…` : s);

/**
 * The answerable screens of a version in order. Design tasks appear as "the k-th task shown",
 * since every respondent sees their block's tasks in an order of their own.
 */
export function listScreenSlots(questionnaire: unknown, design: unknown): ScreenSlot[] {
  const q = questionnaireSchema.safeParse(questionnaire);
  if (!q.success) return [];
  const d = designSchema.safeParse(design);
  const perBlock = new Map<number, number>();
  if (d.success)
    for (const t of d.data.tasks) perBlock.set(t.block, (perBlock.get(t.block) ?? 0) + 1);
  const tasksShown = Math.max(0, ...perBlock.values());
  const slots: ScreenSlot[] = [];
  for (const p of q.data.pages) {
    switch (p.kind) {
      case 'consent':
        slots.push({ key: screenKeys.consent(), label: pageKindLabels.consent });
        break;
      case 'screening':
      case 'question':
        slots.push({
          key: screenKeys.question(p.question.key),
          label: `${p.kind === 'screening' ? 'Screening: ' : ''}${shorten(p.question.text)}`,
        });
        break;
      case 'instructions':
        slots.push({ key: screenKeys.instructions(p.id), label: shorten(p.title) });
        break;
      case 'tasks':
        for (let k = 1; k <= tasksShown; k++)
          slots.push({ key: taskSlotKey(k), label: `Choice task ${k}` });
        break;
      case 'warmup':
      case 'holdout':
      case 'repeat':
      case 'dominance':
        slots.push({ key: screenKeys.special(p.kind, p.id), label: pageKindLabels[p.kind] });
        break;
      case 'end':
        break;
    }
  }
  return slots;
}

/**
 * Reached and stopped counts per screen. `tasksAnswered` maps k -> respondents who answered
 * exactly k design tasks; `unfinished` gives each unfinished respondent's latest screen.
 */
export function buildDropOff(
  slots: readonly ScreenSlot[],
  reachedByKey: ReadonlyMap<string, number>,
  tasksAnswered: ReadonlyMap<number, number>,
  unfinished: ReadonlyArray<{ lastKey: string | null; tasksDone: number }>,
): DropOffStep[] {
  const steps: DropOffStep[] = slots.map((s) => {
    const m = /^tasks#(\d+)$/.exec(s.key);
    let reached = 0;
    if (m) {
      const k = Number(m[1]);
      for (const [done, n] of tasksAnswered) if (done >= k) reached += n;
    } else reached = reachedByKey.get(s.key) ?? 0;
    return { key: s.key, label: s.label, reached, stoppedHere: 0 };
  });
  const index = new Map(steps.map((s, i) => [s.key, i]));
  // Screens only older versions had: listed after the current ones, so nothing is hidden.
  for (const [key, reached] of reachedByKey)
    if (!index.has(key)) {
      index.set(key, steps.length);
      steps.push({ key, label: key, reached, stoppedHere: 0 });
    }
  for (const u of unfinished) {
    let next = 0;
    if (u.lastKey !== null) {
      const at = u.lastKey.startsWith('task:')
        ? index.get(taskSlotKey(u.tasksDone))
        : index.get(u.lastKey);
      if (at === undefined) continue;
      next = at + 1;
    }
    if (next < steps.length) steps[next].stoppedHere++;
  }
  return steps;
}

/** Completes per quota cell of the latest version's screening questions. */
async function quotaProgress(
  db: DbOrTx,
  studyId: string,
  questionnaire: unknown,
): Promise<QuotaProgress[]> {
  const q = questionnaireSchema.safeParse(questionnaire);
  if (!q.success) return [];
  return Promise.all(
    quotaPagesOf(q.data).map(async (page) => {
      const counts = await completesPerCell(db, { studyId, page });
      return {
        question: page.question.text,
        cells: page.quotaCells.map((c) => ({
          id: c.id,
          label: c.label,
          target: c.target,
          completed: counts.get(c.id) ?? 0,
        })),
      };
    }),
  );
}

export async function getFieldworkStats(
  deps: AppDeps,
  teamId: string,
  studyId: string,
): Promise<FieldworkStats> {
  const study = await loadStudy(deps, teamId, studyId);
  const db = deps.db;
  const [byStatus, median, byBlock, byVersion, reached, tasks, unfinished, daily, latest, inv] =
    await Promise.all([
      countRespondentsByStatus(db, { studyId }),
      medianCompletedDuration(db, { studyId }),
      countByBlock(db, { studyId }),
      countByVersion(db, { studyId }),
      countReachedByScreen(db, { studyId }),
      countDesignTasksAnswered(db, { studyId }),
      listUnfinishedProgress(db, { studyId }),
      countDaily(db, { studyId }),
      getLatestVersion(db, { studyId }),
      countInvitees(db, { studyId }),
    ]);
  const counts = {
    inProgress: byStatus.get('in_progress') ?? 0,
    completed: byStatus.get('completed') ?? 0,
    screenedOut: byStatus.get('screened_out') ?? 0,
    overQuota: byStatus.get('over_quota') ?? 0,
    starts: 0,
  };
  counts.starts = counts.inProgress + counts.completed + counts.screenedOut + counts.overQuota;
  const eligible = counts.starts - counts.screenedOut - counts.overQuota;
  const slots = latest ? listScreenSlots(latest.questionnaire, latest.design) : [];
  return {
    status: study.status,
    currentVersion: study.currentVersion,
    generatedAt: new Date().toISOString(),
    counts,
    completionRate: eligible > 0 ? counts.completed / eligible : null,
    medianDurationMs: median === null ? null : Math.round(median),
    byBlock,
    byVersion,
    dropOff: buildDropOff(slots, reached, tasks, unfinished),
    quotas: latest ? await quotaProgress(db, studyId, latest.questionnaire) : [],
    daily,
    invitations: inv,
  };
}
