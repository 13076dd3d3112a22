/**
 * The respondent app's own words (buttons, prompts, the screen-out and full-survey pages): part
 * of every study's texts under `ui.*` keys, so each language of a study has them too. These
 * English wordings are the source for studies whose source language is English; a study in
 * another source language writes its own. `{n}`, `{total}` and `{letter}` are filled in.
 */
export const interfaceTexts = {
  'ui.next': { where: 'Button: go to the next screen', en: 'Next' },
  'ui.continue': { where: 'Button: continue after reading a page', en: 'Continue' },
  'ui.back': { where: 'Button: back to the previous screen', en: 'Back' },
  'ui.choose': { where: 'Choice task: button on a card', en: 'Choose' },
  'ui.chosen': { where: 'Choice task: the chosen card', en: 'Chosen' },
  'ui.choose_prompt': {
    where: 'Choice task: before a choice',
    en: 'Choose one option to continue.',
  },
  'ui.can_change': {
    where: 'Choice task: after a choice',
    en: 'You can still change your choice.',
  },
  'ui.task_progress': {
    where: 'Choice task: which task of how many ({n}, {total})',
    en: 'Choice {n} of {total}',
  },
  'ui.unlabeled_alternative': {
    where: 'Choice task: name of an unlabeled alternative ({letter})',
    en: 'Option {letter}',
  },
  'ui.what_is_this': { where: 'Choice task: open an attribute’s help', en: 'What is this?' },
  'ui.hide': { where: 'Choice task: close an attribute’s help', en: 'Hide' },
  'ui.answer_required': { where: 'Question: no answer given', en: 'Choose an answer.' },
  'ui.number_required': { where: 'Question: no number given', en: 'Enter a number.' },
  'ui.text_required': { where: 'Question: no text written', en: 'Write an answer.' },
  'ui.screened_out_title': {
    where: 'Screen-out page: title',
    en: 'Thank you for your interest',
  },
  'ui.screened_out_body': {
    where: 'Screen-out page: text',
    en: 'Based on your answers, this survey is not for you. Nothing more is needed from you; you can close this page.',
    long: true,
  },
  'ui.over_quota_title': { where: 'Survey full page: title', en: 'This survey is full' },
  'ui.over_quota_body': {
    where: 'Survey full page: text',
    en: 'The survey has all the answers it needs. Thank you for your time; you can close this page.',
    long: true,
  },
  'ui.saving': { where: 'End page: while answers are sent', en: 'Saving your last answers…' },
} as const satisfies Record<string, { where: string; en: string; long?: boolean }>;

export type InterfaceTextKey = keyof typeof interfaceTexts;
export type InterfaceTexts = Record<InterfaceTextKey, string>;

export const interfaceTextKeys = Object.keys(interfaceTexts) as InterfaceTextKey[];

/** The English wordings, as the app shows them when a study has no other language. */
export const englishInterfaceTexts = Object.fromEntries(
  interfaceTextKeys.map((k) => [k, interfaceTexts[k].en]),
) as InterfaceTexts;

/** Fills `{name}` placeholders: fill('Choice {n} of {total}', { n: 2, total: 8 }). */
export function fillText(text: string, values: Record<string, string | number>): string {
  return text.replace(/\{(\w+)\}/g, (whole, name: string) =>
    name in values ? String(values[name]) : whole,
  );
}
