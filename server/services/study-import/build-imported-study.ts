/**
 * What an import stores, built from a problem-free analysis: the study definition (attribute
 * and level ids made from their order), the imported design (one task per distinct choice
 * set, one block), a questionnaire with one question page per background column, and per
 * respondent the plan (their tasks in file order, alternatives in alt order) and the answers
 * as the respondent app would have stored them.
 */
import { defaultQuestionnaire } from '../../../shared/schemas/questionnaire-defaults';
import {
  questionnaireSchema,
  type Questionnaire,
  type QuestionnairePage,
} from '../../../shared/schemas/questionnaire';
import type { Design } from '../../../shared/schemas/design';
import type { RespondentPlan } from '../../../shared/schemas/respondent';
import {
  studyDefinitionSchema,
  type StudyDefinition,
} from '../../../shared/schemas/study-definition';
import type { ImportAttribute } from '../../../shared/schemas/study-import';
import { ValidationError } from '../../lib/errors';
import type { ImportAnalysis } from './analyse-import';
import type { BackgroundColumn } from './read-background-file';

const attributeId = (a: number) => `a${a + 1}`;
const levelId = (a: number, l: number) => `a${a + 1}l${l + 1}`;

/** The study definition; a set-up the definition rules refuse is a 400 naming the field. */
export function toStudyDefinition(
  attributes: readonly ImportAttribute[],
  alternatives: number,
): StudyDefinition {
  const parsed = studyDefinitionSchema.safeParse({
    attributes: attributes.map((a, i) => ({
      id: attributeId(i),
      name: a.name,
      kind: a.kind,
      unit: a.unit,
      isCost: a.isCost,
      coding: a.coding,
      referenceLevelId:
        a.coding === 'dummy' && a.referenceRaw !== undefined
          ? levelId(
              i,
              Math.max(
                0,
                a.levels.findIndex((l) => l.raw === a.referenceRaw),
              ),
            )
          : undefined,
      levels: a.levels.map((l, k) => ({
        id: levelId(i, k),
        label: a.kind === 'categorical' && l.label === '' ? l.raw : l.label,
        ...(a.kind === 'numeric' ? { value: l.value ?? Number(l.raw) } : {}),
      })),
    })),
    alternatives: { count: alternatives, labeled: false, labels: [] },
    fixedAlternative: null,
    excludedCombinations: [],
  });
  if (!parsed.success)
    throw new ValidationError(
      'The attribute set-up cannot become a study: fix the fields named.',
      parsed.error.issues.map((issue) => ({
        path: ['setup', ...issue.path].join('.'),
        message: issue.message,
      })),
    );
  return parsed.data;
}

function backgroundPage(column: BackgroundColumn, k: number): QuestionnairePage {
  const base = { key: column.key, text: column.text, help: '', required: false };
  return {
    id: `background${k + 1}`,
    kind: 'question',
    question:
      column.type === 'number'
        ? {
            ...base,
            type: 'number',
            min: column.min,
            max: column.max > column.min ? column.max : column.min + 1,
            integer: column.integer,
            unit: '',
          }
        : {
            ...base,
            type: 'single',
            options: column.options.map((label, o) => ({ id: `o${o + 1}`, label })),
          },
  } as QuestionnairePage;
}

export function toQuestionnaire(
  definition: StudyDefinition,
  background: readonly BackgroundColumn[],
): Questionnaire {
  const base = defaultQuestionnaire(definition);
  const tasksAt = base.pages.findIndex((p) => p.kind === 'tasks');
  const pages = [...base.pages];
  pages.splice(tasksAt + 1, 0, ...background.map(backgroundPage));
  return questionnaireSchema.parse({
    ...base,
    pages,
    options: { ...base.options, shuffleTasks: false, shuffleAlternatives: false },
  });
}

export function toDesign(analysis: ImportAnalysis): Design {
  return {
    blocks: 1,
    tasks: analysis.grouped.sets.map((set, s) => ({
      block: 1,
      task: s + 1,
      alternatives: set.map((alternative) => ({
        levels: Object.fromEntries(alternative.map((l, a) => [attributeId(a), levelId(a, l)])),
      })),
    })),
  };
}

export interface ImportedRespondent {
  externalId: string;
  plan: RespondentPlan;
  /** Design task numbers in file order, and the alternative chosen in each. */
  tasks: number[];
  chosen: number[];
}

export function toRespondents(analysis: ImportAnalysis): ImportedRespondent[] {
  const { scan, grouped, alternativesPerTask } = analysis;
  const positions = Array.from({ length: alternativesPerTask }, (_, j) => j);
  const out: ImportedRespondent[] = scan.respondents.map((externalId) => ({
    externalId,
    plan: { seed: 0, block: 1, taskOrder: [], positions: {} },
    tasks: [],
    chosen: [],
  }));
  for (let t = 0; t < scan.taskId.length; t++) {
    const r = out[scan.taskRespondent[t]];
    const task = grouped.taskSet[t] + 1;
    r.plan.taskOrder.push(task);
    r.plan.positions[`task:${task}`] = positions;
    r.tasks.push(task);
    r.chosen.push(grouped.taskChosen[t]);
  }
  return out;
}
