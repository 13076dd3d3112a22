/**
 * Segment quota cells must partition the accepted answers. The property test builds random
 * integer ranges cut into cells, then checks the verdict against a brute-force count of how
 * many cells take each accepted answer (the definition of a partition; common practice, no source).
 */
import { describe, expect, it } from 'vitest';
import fc from 'fast-check';
import type { QuotaCell, ScreeningPage } from '../../../shared/schemas/questionnaire';
import { quotaCellOf, quotaProblems } from '../../../shared/survey/quota-cells';
import { requiredSingleQuestion } from '../../../shared/schemas/required-single-question';

const cell = (id: string, over: Partial<QuotaCell>): QuotaCell => ({
  id,
  label: id,
  optionIds: [],
  from: null,
  to: null,
  target: 10,
  ...over,
});

function ageGroupPage(cells: QuotaCell[]): ScreeningPage {
  return {
    id: 'p1',
    kind: 'screening',
    question: requiredSingleQuestion('age_group', 'Your age group?', [
      { id: 'u18', label: 'Under 18' },
      { id: 'a', label: '18 to 34' },
      { id: 'b', label: '35 to 54' },
      { id: 'c', label: '55 or older' },
    ]),
    screenOutOptionIds: ['u18'],
    acceptMin: null,
    acceptMax: null,
    quotaCells: cells,
  };
}

function agePage(cells: QuotaCell[], acceptMin: number | null = 18): ScreeningPage {
  return {
    id: 'p2',
    kind: 'screening',
    question: {
      type: 'number',
      key: 'age',
      text: 'How old are you?',
      help: '',
      required: true,
      min: 0,
      max: 120,
      integer: true,
      unit: 'years',
    },
    screenOutOptionIds: [],
    acceptMin,
    acceptMax: 99,
    quotaCells: cells,
  };
}

describe('quota cells on a single-choice screening question', () => {
  it('accepts cells that take every accepted answer once', () => {
    const page = ageGroupPage([
      cell('young', { optionIds: ['a'] }),
      cell('older', { optionIds: ['b', 'c'] }),
    ]);
    expect(quotaProblems(page)).toEqual([]);
    expect(quotaCellOf(page, { kind: 'single', optionId: 'c' })?.id).toBe('older');
    expect(quotaCellOf(page, { kind: 'single', optionId: 'u18' })).toBeNull();
  });

  it('names the answer left out and the answer counted twice', () => {
    const gap = quotaProblems(
      ageGroupPage([cell('young', { optionIds: ['a'] }), cell('mid', { optionIds: ['b'] })]),
    );
    expect(gap.map((p) => p.message)).toEqual(['The answer "55 or older" is in no quota cell']);
    const overlap = quotaProblems(
      ageGroupPage([
        cell('young', { optionIds: ['a', 'b'] }),
        cell('older', { optionIds: ['b', 'c'] }),
      ]),
    );
    expect(overlap.map((p) => p.message)).toEqual([
      'The answer "35 to 54" is in more than one quota cell (young, older)',
    ]);
  });

  it('refuses a screen-out answer in a cell, and an optional question', () => {
    const page = ageGroupPage([cell('all', { optionIds: ['u18', 'a', 'b', 'c'] })]);
    expect(quotaProblems(page)[0]).toEqual({
      path: [0, 'optionIds'],
      message: '"all" takes an answer that screens respondents out',
    });
    const optional = ageGroupPage([cell('all', { optionIds: ['a', 'b', 'c'] })]);
    optional.question.required = false;
    expect(quotaProblems(optional).map((p) => p.message)).toEqual([
      'A screening question with quotas must be required',
    ]);
  });
});

describe('quota cells on a number screening question', () => {
  it('shows the gap and the overlap as ranges of answers', () => {
    expect(
      quotaProblems(
        agePage([cell('a', { from: 18, to: 29 }), cell('b', { from: 35, to: 99 })]),
      ).map((p) => p.message),
    ).toEqual(['Answers 30 to 34 fall in no quota cell']);
    expect(
      quotaProblems(
        agePage([cell('a', { from: 18, to: 44 }), cell('b', { from: 40, to: 99 })]),
      ).map((p) => p.message),
    ).toEqual(['Answers 40 to 44 fall in two quota cells (a, b)']);
    expect(quotaProblems(agePage([cell('a', { from: 18, to: 98 })])).map((p) => p.message)).toEqual(
      ['Answer 99 falls in no quota cell'],
    );
  });

  it('refuses a cell outside the accepted answers, and decimals', () => {
    expect(quotaProblems(agePage([cell('a', { from: 10, to: 99 })]))[0].message).toBe(
      '"a" reaches outside the accepted answers (18 to 99)',
    );
    const decimals = agePage([cell('a', { from: 18, to: 99 })]);
    if (decimals.question.type === 'number') decimals.question.integer = false;
    expect(quotaProblems(decimals)[0].message).toBe(
      'Quotas on a number question need whole numbers',
    );
  });

  it('accepts exactly the cuts that take every accepted number once (property)', () => {
    const cuts = fc.array(
      fc.record({ from: fc.integer({ min: 18, max: 99 }), len: fc.integer({ min: 0, max: 40 }) }),
      { minLength: 1, maxLength: 6 },
    );
    fc.assert(
      fc.property(cuts, (raw) => {
        const cells = raw.map((r, i) =>
          cell(`c${i}`, { from: r.from, to: Math.min(99, r.from + r.len) }),
        );
        const page = agePage(cells);
        let partition = true;
        for (let n = 18; n <= 99; n++) {
          const holders = cells.filter((c) => c.from! <= n && n <= c.to!);
          if (holders.length !== 1) partition = false;
          else expect(quotaCellOf(page, { kind: 'number', number: n })?.id).toBe(holders[0].id);
        }
        expect(quotaProblems(page).length === 0).toBe(partition);
      }),
      { seed: 20261203, numRuns: 400 },
    );
  });
});
