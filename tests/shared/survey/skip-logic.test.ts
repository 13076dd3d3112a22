import { describe, expect, it } from 'vitest';
import type { QuestionnairePage, ShowIf } from '../../../shared/schemas/questionnaire';
import type { RespondentScreen } from '../../../shared/schemas/respondent';
import { nextShownIndex, ruleMatches, skipRuleProblems } from '../../../shared/survey/skip-logic';

const rule = (over: Partial<ShowIf>): ShowIf => ({
  questionKey: 'k',
  optionIds: [],
  min: null,
  max: null,
  ...over,
});

const ask = (key: string, type: 'single' | 'multiple' | 'number' | 'text'): QuestionnairePage => ({
  id: key,
  kind: 'question',
  question:
    type === 'number'
      ? { type, key, text: key, help: '', required: true, min: 0, max: 10, integer: true, unit: '' }
      : type === 'text'
        ? { type, key, text: key, help: '', required: true, maxLength: 100 }
        : {
            type,
            key,
            text: key,
            help: '',
            required: true,
            options: [
              { id: 'a', label: 'A' },
              { id: 'b', label: 'B' },
            ],
          },
});
const shown = (showIf: ShowIf): QuestionnairePage => ({
  id: 'p',
  kind: 'instructions',
  title: 'T',
  body: '',
  showIf,
});

describe('ruleMatches', () => {
  it('matches one of the options, any of several ticked, or a number within bounds', () => {
    expect(ruleMatches(rule({ optionIds: ['a'] }), { kind: 'single', optionId: 'a' })).toBe(true);
    expect(ruleMatches(rule({ optionIds: ['a'] }), { kind: 'single', optionId: null })).toBe(false);
    expect(
      ruleMatches(rule({ optionIds: ['b'] }), { kind: 'multiple', optionIds: ['a', 'b'] }),
    ).toBe(true);
    expect(ruleMatches(rule({ min: 3 }), { kind: 'number', number: 3 })).toBe(true);
    expect(ruleMatches(rule({ min: 3, max: 5 }), { kind: 'number', number: 6 })).toBe(false);
    // A question that was itself skipped shows nothing that depends on it.
    expect(ruleMatches(rule({ optionIds: ['a'] }), { kind: 'skipped' })).toBe(false);
    expect(ruleMatches(rule({ optionIds: ['a'] }), undefined)).toBe(false);
  });
});

describe('skipRuleProblems', () => {
  it('names a rule on a later, missing or free-text question, and one without answers', () => {
    const check = (pages: QuestionnairePage[]) =>
      skipRuleProblems(
        pages,
        pages.findIndex((p) => p.id === 'p'),
      ).map((x) => x.message);
    expect(
      check([shown(rule({ questionKey: 'k', optionIds: ['a'] })), ask('k', 'single')]),
    ).toEqual(['"k" comes after this page: a page can depend only on earlier questions']);
    expect(check([shown(rule({ questionKey: 'zz' }))])).toEqual(['There is no question "zz"']);
    expect(check([ask('k', 'text'), shown(rule({}))])).toEqual([
      'A page cannot depend on a free-text answer',
    ]);
    expect(check([ask('k', 'single'), shown(rule({}))])).toEqual([
      'Choose the answers that show this page',
    ]);
    expect(check([ask('k', 'number'), shown(rule({ min: 5, max: 2 }))])).toEqual([
      'The highest answer must not be below the lowest',
    ]);
    expect(check([ask('k', 'multiple'), shown(rule({ optionIds: ['a'] }))])).toEqual([]);
  });
});

describe('nextShownIndex', () => {
  it('goes past consecutive pages that do not apply', () => {
    const page = (key: string, showIf?: ShowIf): RespondentScreen => ({
      key,
      kind: 'instructions',
      title: key,
      body: '',
      ...(showIf ? { showIf } : {}),
    });
    const screens = [
      page('page:1'),
      page('page:2', rule({ optionIds: ['a'] })),
      page('page:3', rule({ optionIds: ['b'] })),
      page('page:4'),
    ];
    const given = { 'q:k': { kind: 'single', optionId: 'b' } as const };
    expect(nextShownIndex(screens, 1, given)).toBe(2);
    expect(nextShownIndex(screens, 1, {})).toBe(3);
    expect(nextShownIndex(screens, 4, {})).toBe(4);
  });
});
