/**
 * Every text a respondent can see, under a stable key made of ids (never positions), so that
 * reordering pages, attributes or levels keeps every translation in place:
 *   study.title · attribute.<attributeId>.name|description · level.<attributeId>.<levelId>
 *   alternative.<alternativeId>.name · fixed.label
 *   page.<pageId>.title|body|agree|question|help|unit · page.<pageId>.option.<optionId>
 *   page.<pageId>.certainty.question|low|high · ui.* (the app's own words, interface-texts.ts)
 * One traversal (mapStudyTexts) both lists the texts and writes a language into a copy.
 */
import type { Questionnaire, QuestionnairePage } from '../schemas/questionnaire';
import type { StudyDefinition } from '../schemas/study-definition';
import { getLevelLabel } from '../study/level-labels';
import { pageKindLabels } from '../schemas/questionnaire';

export type StudyDocuments = {
  publicTitle: string;
  definition: StudyDefinition;
  questionnaire: Questionnaire;
};

export type StudyTextEntry = {
  key: string;
  /** Where the respondent meets the text, for translators. */
  where: string;
  /** The text in the source language (the study's own documents). */
  source: string;
  /** A paragraph rather than a line. */
  long: boolean;
};

type Visit = (entry: StudyTextEntry) => string;

const quote = (s: string) => `“${s.length > 40 ? `${s.slice(0, 39)}…` : s}”`;

function mapPage(page: QuestionnairePage, n: number, visit: Visit): QuestionnairePage {
  const k = (part: string) => `page.${page.id}.${part}`;
  const where = (part: string) => `Page ${n} (${pageKindLabels[page.kind]}): ${part}`;
  const text = (part: string, label: string, source: string, long = false) =>
    visit({ key: k(part), where: where(label), source, long });
  const optional = (part: string, label: string, source: string, long = false) =>
    source.trim() ? text(part, label, source, long) : source;
  switch (page.kind) {
    case 'consent':
      return {
        ...page,
        title: text('title', 'title', page.title),
        body: text('body', 'text', page.body, true),
        agreeLabel: text('agree', 'agree button', page.agreeLabel),
      };
    case 'instructions':
    case 'end':
      return {
        ...page,
        title: text('title', 'title', page.title),
        body: optional('body', 'text', page.body, true),
      };
    case 'question':
    case 'screening': {
      const q = page.question;
      const question = {
        ...q,
        text: text('question', 'question', q.text, true),
        help: optional('help', 'help', q.help, true),
      };
      if (question.type === 'number' && q.type === 'number')
        question.unit = optional('unit', 'unit', q.unit);
      if ((question.type === 'single' || question.type === 'multiple') && 'options' in q)
        question.options = q.options.map((o) => ({
          ...o,
          label: text(`option.${o.id}`, `answer ${quote(o.label)}`, o.label),
        }));
      return { ...page, question } as QuestionnairePage;
    }
    case 'tasks':
      return {
        ...page,
        title: text('title', 'title', page.title),
        ...(page.certainty
          ? {
              certainty: {
                ...page.certainty,
                question: text('certainty.question', 'certainty question', page.certainty.question),
                lowLabel: text(
                  'certainty.low',
                  'certainty scale, low end',
                  page.certainty.lowLabel,
                ),
                highLabel: text(
                  'certainty.high',
                  'certainty scale, high end',
                  page.certainty.highLabel,
                ),
              },
            }
          : {}),
      };
    default:
      return { ...page, title: text('title', 'title', page.title) };
  }
}

function mapDefinition(d: StudyDefinition, visit: Visit): StudyDefinition {
  return {
    ...d,
    attributes: d.attributes.map((a) => {
      const description = a.description?.trim()
        ? visit({
            key: `attribute.${a.id}.description`,
            where: `Attribute ${quote(a.name)}: help text`,
            source: a.description,
            long: true,
          })
        : a.description;
      return {
        ...a,
        name: visit({
          key: `attribute.${a.id}.name`,
          where: `Attribute ${quote(a.name)}: name`,
          source: a.name,
          long: false,
        }),
        ...(description !== undefined ? { description } : {}),
        levels: a.levels.map((l) => ({
          ...l,
          label: visit({
            key: `level.${a.id}.${l.id}`,
            where: `Attribute ${quote(a.name)}: level`,
            source: getLevelLabel(a, l),
            long: false,
          }),
        })),
      };
    }),
    alternatives: {
      ...d.alternatives,
      labels: d.alternatives.labels.map((alt) => ({
        ...alt,
        name: visit({
          key: `alternative.${alt.id}.name`,
          where: 'Labeled alternative: name',
          source: alt.name,
          long: false,
        }),
      })),
    },
    fixedAlternative: d.fixedAlternative
      ? {
          ...d.fixedAlternative,
          label: visit({
            key: 'fixed.label',
            where: d.fixedAlternative.kind === 'opt_out' ? 'Opt-out: label' : 'Status quo: label',
            source: d.fixedAlternative.label,
            long: false,
          }),
        }
      : null,
  };
}

/** A copy of the documents with every respondent-visible text replaced by `visit`'s answer. */
export function mapStudyTexts(docs: StudyDocuments, visit: Visit): StudyDocuments {
  return {
    publicTitle: visit({
      key: 'study.title',
      where: 'Survey title (every screen)',
      source: docs.publicTitle,
      long: false,
    }),
    definition: mapDefinition(docs.definition, visit),
    questionnaire: {
      ...docs.questionnaire,
      pages: docs.questionnaire.pages.map((p, i) => mapPage(p, i + 1, visit)),
    },
  };
}

/** Every respondent-visible text of the documents, in the order respondents meet them. */
export function listDocumentTexts(docs: StudyDocuments): StudyTextEntry[] {
  const entries: StudyTextEntry[] = [];
  mapStudyTexts(docs, (e) => {
    entries.push(e);
    return e.source;
  });
  return entries;
}
