/**
 * Starting questionnaires and page templates built from a study definition. Used by the
 * editor (new pages), the studies service (a new study's questionnaire) and the seed.
 */
import { nanoid } from 'nanoid';
import type { StudyDefinition } from './study-definition';
import {
  defaultQuestionnaireOptions,
  type Questionnaire,
  type QuestionnairePage,
} from './questionnaire';
import { questionKeyFromText } from './question-keys';
import { requiredSingleQuestion } from './required-single-question';
import { createTemplatePage } from './questionnaire-templates';

const id = () => nanoid(10);

/** Marks the paragraph researchers must replace; go-live refuses a consent page that still has it. */
export const CONSENT_PLACEHOLDER = 'Note for the research team (replace this paragraph)';

const consentIntro = [
  'Thank you for taking part. This survey asks you to choose between options described by a few features, and a few questions about you. It takes about 10 minutes.',
  'We record your answers, the time you spend on each screen and the kind of device you use. We do not ask for your name. Your answers are stored securely, used only for this research and reported only in summaries.',
  'Taking part is voluntary. You may stop at any time by closing this page, without giving a reason.',
];

export const defaultConsentBody = [
  ...consentIntro,
  `${CONSENT_PLACEHOLDER}: state who runs the study, the ethics approval reference, how long the data are kept, the legal basis under your data-protection law and how to contact you. Follow your ethics board and local law.`,
].join('\n\n');

/** Attributes shown in designed alternative j (labeled alternatives can omit some). */
function shownAttributes(definition: StudyDefinition, j: number) {
  const omitted = new Set(
    definition.alternatives.labeled
      ? (definition.alternatives.labels[j]?.omittedAttributeIds ?? [])
      : [],
  );
  return definition.attributes.filter((a) => !omitted.has(a.id));
}

/** Alternatives that differ on every attribute: alternative j takes level (j + a) mod L. */
export function buildHandSetTaskAlternatives(definition: StudyDefinition) {
  return Array.from({ length: definition.alternatives.count }, (_, j) => ({
    levels: Object.fromEntries(
      shownAttributes(definition, j).map((a) => {
        const index = definition.attributes.indexOf(a);
        return [a.id, a.levels[(j + index) % a.levels.length].id];
      }),
    ),
  }));
}

/**
 * Best level of each attribute, assuming levels are listed from least to most preferred,
 * except the cost attribute, where the lowest value is best. Researchers adjust it in the editor.
 */
export function buildBestLevels(definition: StudyDefinition): Record<string, string> {
  return Object.fromEntries(
    definition.attributes.map((a) => {
      if (a.isCost) {
        const cheapest = [...a.levels].sort((x, y) => (x.value ?? 0) - (y.value ?? 0))[0];
        return [a.id, cheapest.id];
      }
      return [a.id, a.levels[a.levels.length - 1].id];
    }),
  );
}

/** A new page of `kind`; question keys are slugs of the text, unique among `takenKeys`. */
export function createPage(
  kind: QuestionnairePage['kind'],
  definition: StudyDefinition,
  takenKeys: Iterable<string> = [],
): QuestionnairePage {
  /** A required single-choice question keyed by a slug of its text. */
  const keyedQuestion = (text: string, options: Parameters<typeof requiredSingleQuestion>[2]) =>
    requiredSingleQuestion(questionKeyFromText(text, takenKeys), text, options);
  switch (kind) {
    case 'consent':
      return {
        id: id(),
        kind,
        title: 'Welcome',
        body: defaultConsentBody,
        agreeLabel: 'I have read this and agree to take part',
      };
    case 'screening':
      return {
        id: id(),
        kind,
        question: keyedQuestion('Are you 18 or older?', [
          { id: 'yes', label: 'Yes' },
          { id: 'no', label: 'No' },
        ]),
        screenOutOptionIds: ['no'],
        acceptMin: null,
        acceptMax: null,
        quotaCells: [],
      };
    case 'question':
      return {
        id: id(),
        kind,
        question: keyedQuestion('New question', [
          { id: 'a', label: 'First option' },
          { id: 'b', label: 'Second option' },
        ]),
      };
    case 'instructions':
      return {
        id: id(),
        kind,
        title: 'How the choices work',
        body: 'On the next screens you will see a few options side by side. Each is described by the same features. Pick the one you would choose if these were the only options. There are no right or wrong answers.',
      };
    case 'tasks':
      return { id: id(), kind, title: 'Which option would you choose?' };
    case 'warmup':
      return {
        id: id(),
        kind,
        title: 'A first practice choice',
        alternatives: buildHandSetTaskAlternatives(definition),
      };
    case 'holdout':
      return {
        id: id(),
        kind,
        title: 'Which option would you choose?',
        alternatives: buildHandSetTaskAlternatives(definition),
      };
    case 'repeat':
      return { id: id(), kind, title: 'Which option would you choose?', repeatOf: 1 };
    case 'dominance':
      return {
        id: id(),
        kind,
        title: 'Which option would you choose?',
        bestLevels: buildBestLevels(definition),
      };
    case 'end':
      return {
        id: id(),
        kind,
        title: 'Thank you',
        body: 'Your answers have been saved. You can close this page now.',
      };
  }
}

/**
 * Consent, instructions, the choice tasks and the end page; with a cost attribute, the
 * instructions are followed by a cheap-talk text and a budget reminder (each removable).
 */
export function defaultQuestionnaire(definition: StudyDefinition): Questionnaire {
  const hasCost = definition.attributes.some((a) => a.isCost);
  return {
    pages: [
      createPage('consent', definition),
      createPage('instructions', definition),
      ...(hasCost
        ? [
            createTemplatePage('cheap_talk', definition),
            createTemplatePage('budget_reminder', definition),
          ]
        : []),
      createPage('tasks', definition),
      createPage('end', definition),
    ],
    options: defaultQuestionnaireOptions(),
  };
}

/** The Larkspur Valley Water demo: the default pages plus the three background questions. */
export function demoQuestionnaire(definition: StudyDefinition): Questionnaire {
  const consent = createPage('consent', definition);
  const instructions = createPage('instructions', definition);
  const background: QuestionnairePage[] = [
    {
      id: 'household',
      kind: 'question',
      question: {
        type: 'number',
        key: 'household_size',
        text: 'How many people live in your household, including you?',
        help: '',
        required: true,
        min: 1,
        max: 12,
        integer: true,
        unit: 'people',
      },
    },
    {
      id: 'ageband',
      kind: 'question',
      question: requiredSingleQuestion('age_band', 'What is your age?', [
        { id: 'a18_34', label: '18–34' },
        { id: 'a35_54', label: '35–54' },
        { id: 'a55_74', label: '55–74' },
        { id: 'a75', label: '75 or older' },
      ]),
    },
    {
      id: 'filter',
      kind: 'question',
      question: requiredSingleQuestion(
        'filters_water',
        'Do you filter your tap water before drinking it?',
        [
          { id: 'yes', label: 'Yes' },
          { id: 'no', label: 'No' },
        ],
      ),
    },
  ];
  return {
    pages: [
      {
        id: 'consent',
        kind: 'consent',
        title: 'Your water services for the next five years',
        body: [
          'Larkspur Valley Water is planning its services for the next five years and would like to know what matters to your household.',
          ...consentIntro,
          'The survey is run by the Larkspur Valley Water customer research team (an invented utility used for demonstrations). Answers are kept for three years and then deleted. Questions: research@larkspur-water.example.',
        ].join('\n\n'),
        agreeLabel: consent.kind === 'consent' ? consent.agreeLabel : 'I agree to take part',
      },
      {
        id: 'instructions',
        kind: 'instructions',
        title: 'How the choices work',
        body:
          instructions.kind === 'instructions'
            ? `${instructions.body}\n\nEach package would apply to your household for the next five years. The current service is always one of the options.`
            : '',
      },
      { id: 'tasks', kind: 'tasks', title: 'Which package would you choose for your household?' },
      ...background,
      {
        id: 'end',
        kind: 'end',
        title: 'Thank you',
        body: 'Your answers have been saved. They will help Larkspur Valley Water plan its services. You can close this page now.',
      },
    ],
    options: defaultQuestionnaireOptions(),
  };
}
