/**
 * Go-live checks: everything a study needs before respondents can see it, reported as a list
 * of problems (never just the first one) so the editor can fix them in one pass.
 */
import type { z } from 'zod';
import { designSchema, type Design } from '../../shared/schemas/design';
import { questionnaireSchema, type Questionnaire } from '../../shared/schemas/questionnaire';
import { CONSENT_PLACEHOLDER } from '../../shared/schemas/questionnaire-defaults';
import type { FieldworkSettings, ReadinessProblem } from '../../shared/schemas/study-lifecycle';
import { studyDefinitionSchema, type StudyDefinition } from '../../shared/schemas/study-definition';
import { checkConsentIdentifiability, type Identifiability } from './consent-checks';
import { checkLevelLabel, getLevelLabel } from '../../shared/study/level-labels';
import { formatCompact } from '../../shared/format';
import { listUnshownLevels } from '../engine/design/diagnostics/level-balance';
import type { StudyLanguages } from '../../shared/languages/study-texts';
import { checkStudyTexts } from './readiness-texts';

type Input = {
  /** Whether answers can be traced to a person (personal links, panel ids sent back). */
  identifiability?: Identifiability;
  definition: unknown;
  /** The title respondents see, and the languages every text must exist in. */
  publicTitle?: string;
  languages?: StudyLanguages;
  design: unknown | null;
  questionnaire: unknown;
  settings: FieldworkSettings;
  completes: number;
  now: Date;
};

const fromZod = (prefix: string, code: string, error: z.ZodError): ReadinessProblem[] =>
  error.issues.map((i) => ({
    code,
    path: [prefix, ...i.path].join('.'),
    message: i.message,
  }));

function checkDesign(definition: StudyDefinition, design: Design): ReadinessProblem[] {
  const { count, labeled, labels } = definition.alternatives;
  const levels = new Map(
    definition.attributes.map((a) => [a.id, new Set(a.levels.map((l) => l.id))]),
  );
  const bad = design.tasks.find(
    (t) =>
      t.alternatives.length !== count ||
      t.alternatives.some((alt, j) => {
        const omitted = new Set(labeled ? (labels[j]?.omittedAttributeIds ?? []) : []);
        return definition.attributes.some(
          (a) => !omitted.has(a.id) && !levels.get(a.id)!.has(alt.levels[a.id] ?? ''),
        );
      }),
  );
  const problems: ReadinessProblem[] = [];
  if (bad)
    problems.push({
      code: 'design_mismatch',
      path: 'design',
      message: `Task ${bad.task} of the design does not match the attributes and alternatives. Generate the design again.`,
    });
  for (const { attribute, level } of listUnshownLevels(definition, design))
    problems.push({
      code: 'level_never_shown',
      path: 'design',
      message: `${attribute.name}: the level “${getLevelLabel(attribute, level)}” never appears in the choice tasks. Generate the design again, or remove the level.`,
    });
  for (let b = 1; b <= design.blocks; b++)
    if (!design.tasks.some((t) => t.block === b))
      problems.push({ code: 'empty_block', path: 'design', message: `Block ${b} has no tasks.` });
  return problems;
}

/**
 * Numeric levels whose own label does not write the coded value (and that the researcher did
 * not confirm for that value): respondents would read one number while the model codes another.
 */
function checkLevelLabels(definition: StudyDefinition): ReadinessProblem[] {
  return definition.attributes.flatMap((a, i) =>
    a.levels.flatMap((l, k) =>
      checkLevelLabel(a, l) === 'drifted'
        ? [
            {
              code: 'level_label_mismatch',
              path: `definition.attributes.${i}.levels.${k}.label`,
              message: `${a.name}: the level shown as “${l.label.trim()}” is coded as ${formatCompact(l.value!)}. Correct or clear the label on Attributes, or confirm it is meant for this value.`,
            },
          ]
        : [],
    ),
  );
}

function checkPagesAgainstStudy(
  q: Questionnaire,
  definition: StudyDefinition,
  design: Design | null,
): ReadinessProblem[] {
  const problems: ReadinessProblem[] = [];
  const attrs = new Map(definition.attributes.map((a) => [a.id, a]));
  const minTasks = design
    ? Math.min(
        ...Array.from(
          { length: design.blocks },
          (_, b) => design.tasks.filter((t) => t.block === b + 1).length,
        ),
      )
    : 0;
  q.pages.forEach((page, i) => {
    const path = `questionnaire.pages.${i}`;
    if (page.kind === 'consent' && page.body.includes(CONSENT_PLACEHOLDER))
      problems.push({
        code: 'consent_placeholder',
        path,
        message:
          'Replace the note for the research team on the consent page: who runs the study, the ethics approval, data keeping and a contact.',
      });
    if (page.kind === 'warmup' || page.kind === 'holdout') {
      const name = page.kind === 'warmup' ? 'warm-up' : 'holdout';
      if (page.alternatives.length !== definition.alternatives.count)
        problems.push({
          code: 'hand_set_task_mismatch',
          path,
          message: `The ${name} task needs ${definition.alternatives.count} alternatives.`,
        });
      page.alternatives.forEach((alt, j) => {
        const omitted = new Set(
          definition.alternatives.labeled
            ? (definition.alternatives.labels[j]?.omittedAttributeIds ?? [])
            : [],
        );
        for (const a of definition.attributes)
          if (!omitted.has(a.id) && !a.levels.some((l) => l.id === alt.levels[a.id]))
            problems.push({
              code: 'hand_set_task_mismatch',
              path,
              message: `Choose a level of ${a.name} for alternative ${j + 1} of the ${name} task.`,
            });
      });
    }
    if (page.kind === 'dominance')
      for (const a of attrs.values())
        if (!a.levels.some((l) => l.id === page.bestLevels[a.id]))
          problems.push({
            code: 'dominance_mismatch',
            path,
            message: `Choose the best level of ${a.name} for the dominance test.`,
          });
    if (page.kind === 'repeat' && design && page.repeatOf > minTasks)
      problems.push({
        code: 'repeat_out_of_range',
        path,
        message: `The repeated task refers to task ${page.repeatOf}, but a block has only ${minTasks} tasks.`,
      });
  });
  return problems;
}

/** Every problem that keeps the study from going live; an empty list means ready. */
export function checkReadiness(input: Input): ReadinessProblem[] {
  const problems: ReadinessProblem[] = [];
  const def = studyDefinitionSchema.safeParse(input.definition);
  if (!def.success) problems.push(...fromZod('definition', 'invalid_definition', def.error));
  const definition = def.success ? def.data : null;
  if (definition && definition.attributes.length === 0)
    problems.push({
      code: 'no_attributes',
      path: 'definition.attributes',
      message: 'Add at least one attribute.',
    });
  if (definition) problems.push(...checkLevelLabels(definition));
  definition?.attributes.forEach((a, i) => {
    if (a.levels.length < 2)
      problems.push({
        code: 'too_few_levels',
        path: `definition.attributes.${i}`,
        message: `${a.name} needs at least 2 levels.`,
      });
  });

  let design: Design | null = null;
  if (input.design === null)
    problems.push({
      code: 'no_design',
      path: 'design',
      message: 'Create or import a design on the Tasks section.',
    });
  else {
    const parsed = designSchema.safeParse(input.design);
    if (!parsed.success) problems.push(...fromZod('design', 'invalid_design', parsed.error));
    else {
      design = parsed.data;
      if (definition) problems.push(...checkDesign(definition, design));
    }
  }

  const stored = input.questionnaire as { pages?: unknown } | null;
  if (!stored || !Array.isArray(stored.pages))
    problems.push({
      code: 'no_questionnaire',
      path: 'questionnaire',
      message: 'Review and save the questionnaire, including the consent page.',
    });
  else {
    const q = questionnaireSchema.safeParse(stored);
    if (!q.success) problems.push(...fromZod('questionnaire', 'invalid_questionnaire', q.error));
    else {
      if (definition) problems.push(...checkPagesAgainstStudy(q.data, definition, design));
      if (input.identifiability)
        problems.push(...checkConsentIdentifiability(q.data, input.identifiability));
      if (definition && input.languages)
        problems.push(
          ...checkStudyTexts(
            { publicTitle: input.publicTitle ?? '', definition, questionnaire: q.data },
            input.languages,
          ),
        );
    }
  }

  const { closeAt, quotaCompletes } = input.settings;
  if (closeAt && new Date(closeAt) <= input.now)
    problems.push({
      code: 'close_date_past',
      path: 'settings.closeAt',
      message: 'The close date has passed. Choose a later date or remove it.',
    });
  if (quotaCompletes !== null && input.completes >= quotaCompletes)
    problems.push({
      code: 'quota_reached',
      path: 'settings.quotaCompletes',
      message: `The quota of ${quotaCompletes} completes is reached. Raise it or remove it.`,
    });
  return problems;
}
