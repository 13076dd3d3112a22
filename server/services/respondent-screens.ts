/**
 * The screens one respondent walks through, built from the frozen version and their plan:
 * questionnaire pages in order, the block's design tasks where the task block stands, and the
 * special tasks (warm-up, holdout, repeat, dominance) with their alternatives in display order.
 */
import type { DbOrTx } from '../../db/client';
import { getVersionById } from '../../db/queries/versions';
import { NotFoundError } from '../lib/errors';
import { designSchema, type Design } from '../../shared/schemas/design';
import {
  questionnaireSchema,
  screenKeys,
  type CertaintyScale,
  type Questionnaire,
  type QuestionnairePage,
} from '../../shared/schemas/questionnaire';
import { showIfOf } from '../../shared/survey/skip-logic';
import type {
  DisplayAlternative,
  RespondentPlan,
  RespondentScreen,
  TaskKind,
} from '../../shared/schemas/respondent';
import { studyDefinitionSchema, type StudyDefinition } from '../../shared/schemas/study-definition';
import { repeatedTaskNumber } from './respondent-plan';
import { storedTranslationsSchema } from '../../shared/schemas/study-texts';
import {
  englishInterfaceTexts,
  fillText,
  type InterfaceTexts,
} from '../../shared/languages/interface-texts';
import type { Translations } from '../../shared/languages/study-texts';

export type FrozenVersion = {
  id: string;
  studyId: string;
  version: number;
  definition: StudyDefinition;
  design: Design;
  questionnaire: Questionnaire;
  /** The study's languages (the first is the source) and their texts; absent: English only. */
  languages?: string[];
  translations?: Translations;
  /** Set on a copy written in one language (respondent-language.ts): which, and the app's words. */
  language?: string;
  ui?: InterfaceTexts;
};

/** Versions never change once written, so parsed copies are kept (bounded) per process. */
const cache = new Map<string, FrozenVersion>();
const CACHE_LIMIT = 200;

export async function loadFrozenVersion(
  db: DbOrTx,
  params: { id: string; studyId: string },
): Promise<FrozenVersion> {
  const hit = cache.get(params.id);
  if (hit && hit.studyId === params.studyId) return hit;
  const row = await getVersionById(db, params);
  if (!row) throw new NotFoundError('Study version');
  const version: FrozenVersion = {
    id: row.id,
    studyId: row.studyId,
    version: row.version,
    definition: studyDefinitionSchema.parse(row.definition),
    design: designSchema.parse(row.design),
    questionnaire: questionnaireSchema.parse(row.questionnaire),
    languages: row.languages,
    translations: storedTranslationsSchema.parse(row.translations),
  };
  if (cache.size >= CACHE_LIMIT) cache.delete(cache.keys().next().value!);
  cache.set(row.id, version);
  return version;
}

/** Level choices that make alternative 0 better than the others on every attribute. */
export function buildDominanceAlternatives(
  definition: StudyDefinition,
  bestLevels: Record<string, string>,
): Array<Record<string, string>> {
  return Array.from({ length: definition.alternatives.count }, (_, k) =>
    Object.fromEntries(
      definition.attributes.map((a) => {
        const best = bestLevels[a.id] ?? a.levels[a.levels.length - 1].id;
        if (k === 0) return [a.id, best];
        const worse = a.levels.filter((l) => l.id !== best);
        return [a.id, worse[(k - 1) % worse.length].id];
      }),
    ),
  );
}

function fixedDisplay(definition: StudyDefinition): DisplayAlternative {
  const fx = definition.fixedAlternative!;
  return {
    index: -1,
    label: fx.label,
    levels: fx.kind === 'status_quo' ? { ...fx.levels } : {},
    fixed: true,
  };
}

function displayAlternatives(
  definition: StudyDefinition,
  order: number[],
  levelsOf: (index: number) => Record<string, string>,
  ui: InterfaceTexts,
): DisplayAlternative[] {
  const { labeled, labels } = definition.alternatives;
  const named = (letter: string) => fillText(ui['ui.unlabeled_alternative'], { letter });
  let unlabeled = 0;
  return order.map((index) => {
    if (index < 0) return fixedDisplay(definition);
    const label = labeled
      ? (labels[index]?.name ?? named(String(index + 1)))
      : named(String.fromCharCode(65 + unlabeled++));
    return { index, label, levels: { ...levelsOf(index) }, fixed: false };
  });
}

type TaskTemplate = Omit<Extract<RespondentScreen, { kind: 'task' }>, 'taskIndex' | 'taskCount'>;

/*
 * A task screen depends only on its version, its page, the design task it shows and the order
 * of its alternatives on screen, and a version never changes: so each is built once per process
 * and shared by every respondent who sees it in that order (a per-respondent copy adds only its
 * place in the sequence). Building every task card for every start cost about 0.2 ms of the web
 * process's CPU per start (bench:session-start profile). Screens are never modified once built.
 * Bounded per version: the orders of a study's alternatives are few, the cap only guards.
 */
const taskTemplates = new WeakMap<FrozenVersion, Map<string, TaskTemplate>>();
const TEMPLATES_PER_VERSION = 20_000;

export function buildScreens(version: FrozenVersion, plan: RespondentPlan): RespondentScreen[] {
  const { definition, design, questionnaire } = version;
  const taskByNumber = new Map(design.tasks.map((t) => [t.task, t]));
  let templates = taskTemplates.get(version);
  if (!templates) taskTemplates.set(version, (templates = new Map()));
  const tasks: TaskTemplate[] = [];
  const screens: Array<RespondentScreen | { pendingTask: number }> = [];
  let pageIndex = 0;
  const pushTask = (
    key: string,
    taskKind: TaskKind,
    title: string,
    /** The design task whose alternatives are shown (0: the page's own). */
    shown: number,
    levelsOf: (i: number) => Record<string, string>,
    certainty?: CertaintyScale,
  ) => {
    const order = plan.positions[key];
    if (!order) throw new RangeError(`The plan has no positions for ${key}`);
    screens.push({ pendingTask: tasks.length });
    const templateKey = `${pageIndex}:${key}:${shown}:${order.join(',')}`;
    let template = templates.get(templateKey);
    if (!template) {
      template = {
        key,
        kind: 'task',
        taskKind,
        title,
        alternatives: displayAlternatives(
          definition,
          order,
          levelsOf,
          version.ui ?? englishInterfaceTexts,
        ),
        ...(certainty ? { certainty } : {}),
      };
      if (templates.size < TEMPLATES_PER_VERSION) templates.set(templateKey, template);
    }
    tasks.push(template);
  };
  // Questions a later page's skip rule reads: their answers stand once given.
  const decidingKeys = new Set(questionnaire.pages.map((p) => showIfOf(p)?.questionKey));
  const rule = (p: QuestionnairePage) => {
    const showIf = showIfOf(p);
    return showIf ? { showIf } : {};
  };
  for (const page of questionnaire.pages) {
    pageIndex++;
    switch (page.kind) {
      case 'consent':
        screens.push({
          key: screenKeys.consent(),
          kind: 'consent',
          ...pick(page, 'title', 'body', 'agreeLabel'),
        });
        break;
      case 'instructions':
        screens.push({
          key: screenKeys.instructions(page.id),
          kind: 'instructions',
          ...pick(page, 'title', 'body'),
          ...rule(page),
        });
        break;
      case 'question':
      case 'screening':
        screens.push({
          key: screenKeys.question(page.question.key),
          kind: 'question',
          question: page.question,
          screening: page.kind === 'screening',
          ...rule(page),
          ...(decidingKeys.has(page.question.key) ? { decidesSkips: true as const } : {}),
        });
        break;
      case 'tasks':
        for (const n of plan.taskOrder)
          pushTask(
            screenKeys.task(n),
            'design',
            page.title,
            n,
            (i) => taskByNumber.get(n)!.alternatives[i].levels,
            page.certainty,
          );
        break;
      case 'warmup':
      case 'holdout':
        pushTask(
          screenKeys.special(page.kind, page.id),
          page.kind,
          page.title,
          0,
          (i) => page.alternatives[i].levels,
        );
        break;
      case 'repeat': {
        const n = repeatedTaskNumber(plan, page.repeatOf);
        pushTask(
          screenKeys.special('repeat', page.id),
          'repeat',
          page.title,
          n,
          (i) => taskByNumber.get(n)!.alternatives[i].levels,
        );
        break;
      }
      case 'dominance': {
        pushTask(
          screenKeys.special('dominance', page.id),
          'dominance',
          page.title,
          0,
          (i) => buildDominanceAlternatives(definition, page.bestLevels)[i],
        );
        break;
      }
      case 'end':
        break;
    }
  }
  return screens.map((s) =>
    'pendingTask' in s
      ? { ...tasks[s.pendingTask], taskIndex: s.pendingTask + 1, taskCount: tasks.length }
      : s,
  );
}

export function pick<T extends object, K extends keyof T>(o: T, ...keys: K[]): Pick<T, K> {
  return Object.fromEntries(keys.map((k) => [k, o[k]])) as Pick<T, K>;
}
