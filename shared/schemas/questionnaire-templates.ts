/**
 * Follow-up templates for the questionnaire: debrief questions and scripts that good practice
 * in stated-preference surveys asks for. Each builds an ordinary page (a question or an
 * instructions page) marked with its template, so the editor can name the published source
 * in its help text; docs/methods.md has the full references. The wording is our own.
 */
import { nanoid } from 'nanoid';
import type { StudyDefinition } from './study-definition';
import type { QuestionnairePage, TemplateKind } from './questionnaire';
import { questionKeyFromText } from './question-keys';
import { requiredSingleQuestion } from './required-single-question';

export const templateLabels: Record<TemplateKind, string> = {
  consequentiality: 'Consequentiality question',
  attendance: 'Attribute-attendance question',
  cheap_talk: 'Cheap-talk text',
  budget_reminder: 'Budget reminder',
};

/** Help shown in the editor: what the template is for, and its published source. */
export const templateHelp: Record<TemplateKind, string> = {
  consequentiality:
    'Asks whether the respondent believes the results can influence the decision. Respondents who see no consequence are often analysed apart. Source: Vossler, Doyon & Rondeau (2012), American Economic Journal: Microeconomics 4(4); Johnston et al. (2017), JAERE 4(2).',
  attendance:
    'Asks which features the respondent ignored when choosing (stated attribute non-attendance), for models that allow for it. Source: Hensher, Rose & Greene (2005), Transportation 32(3).',
  cheap_talk:
    'A short text before the tasks asking respondents to choose as if they really had to pay, because hypothetical answers tend to overstate what people would pay. Source: Cummings & Taylor (1999), American Economic Review 89(3); Ladenburg & Olsen (2014), Resource and Energy Economics 37.',
  budget_reminder:
    'Reminds respondents before the tasks that money spent here is not available for other things. Source: Loomis, Gonzalez-Caban & Gregory (1994), Land Economics 70(4); Johnston et al. (2017), JAERE 4(2).',
};

const id = () => nanoid(10);

/** Which templates make sense for this study (the budget reminder needs a cost attribute). */
export function availableTemplates(definition: StudyDefinition): TemplateKind[] {
  const hasCost = definition.attributes.some((a) => a.isCost);
  return (['cheap_talk', 'budget_reminder', 'consequentiality', 'attendance'] as const).filter(
    (t) => hasCost || (t !== 'budget_reminder' && t !== 'cheap_talk'),
  );
}

export function createTemplatePage(
  template: TemplateKind,
  definition: StudyDefinition,
  takenKeys: Iterable<string> = [],
): QuestionnairePage {
  const cost = definition.attributes.find((a) => a.isCost);
  const costName = cost ? cost.name.toLowerCase() : 'the cost';
  switch (template) {
    case 'cheap_talk':
      return {
        id: id(),
        kind: 'instructions',
        template,
        title: 'Please choose as if it were real',
        body: `In surveys like this one, people often pick options that they would not pay for in real life, because no money changes hands. The results are only useful if you choose as you would if you really had to pay.\n\nSo please take the ${costName} seriously: for each choice, ask yourself whether your household would really pay that amount.`,
      };
    case 'budget_reminder':
      return {
        id: id(),
        kind: 'instructions',
        template,
        title: 'Keep your budget in mind',
        body: `Any money you agree to pay here would come out of your household's budget, so it would not be available for other things you need or enjoy.\n\nPlease think about your income and your other expenses when you look at the ${costName}.`,
      };
    case 'consequentiality': {
      const text =
        'How likely do you think it is that the results of this survey will be taken into account in the decision?';
      return {
        id: id(),
        kind: 'question',
        template,
        question: requiredSingleQuestion(
          questionKeyFromText('Results taken into account', takenKeys),
          text,
          [
            { id: 'very_likely', label: 'Very likely' },
            { id: 'likely', label: 'Quite likely' },
            { id: 'unlikely', label: 'Quite unlikely' },
            { id: 'very_unlikely', label: 'Very unlikely' },
            { id: 'dont_know', label: 'I do not know' },
          ],
        ),
      };
    }
    case 'attendance':
      return {
        id: id(),
        kind: 'question',
        template,
        question: {
          type: 'multiple',
          key: questionKeyFromText('Features ignored', takenKeys),
          text: 'When you made your choices, were there features you did not take into account? Tick all that you ignored.',
          help: 'If you took every feature into account, tick the last option.',
          required: true,
          options: [
            ...definition.attributes.map((a) => ({ id: a.id, label: a.name })),
            { id: 'none_ignored', label: 'None: I took every feature into account' },
          ],
        },
      };
  }
}
