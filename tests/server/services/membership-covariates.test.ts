/**
 * Coding of background answers for the latent class membership model (membership-covariates.ts):
 * dummies against the first option chosen, numbers as given, and the missing-indicator rule
 * (Cohen & Cohen 1983, §7.4) for respondents who did not answer.
 */
import { describe, expect, it } from 'vitest';
import {
  buildMembershipCovariates,
  resolveMembershipQuestions,
  type MembershipQuestion,
} from '../../../server/services/estimation/membership-covariates';
import { StudyDataError } from '../../../server/services/estimation/study-data-error';

const tap: MembershipQuestion = {
  key: 'tap',
  text: 'Do you filter your tap water?',
  type: 'single',
  options: [
    { id: 'always', label: 'Always' },
    { id: 'sometimes', label: 'Sometimes' },
    { id: 'never', label: 'Never' },
  ],
};
const size: MembershipQuestion = {
  key: 'size',
  text: 'Household size',
  type: 'number',
  options: [],
};
const ids = ['a', 'b', 'c', 'd'];
const answers = (rows: Record<string, Record<string, unknown>>) =>
  new Map(Object.entries(rows).map(([id, a]) => [id, new Map(Object.entries(a))]));
const columns = (c: { names: string[]; values: Float64Array }) =>
  c.names.map((_, m) => ids.map((__, n) => c.values[n * c.names.length + m]));

describe('buildMembershipCovariates', () => {
  it('codes a single choice as 0/1 columns against the first option chosen, skipping unchosen ones', () => {
    const c = buildMembershipCovariates(
      [tap],
      ids,
      answers({
        a: { tap: { kind: 'single', optionId: 'sometimes' } },
        b: { tap: { kind: 'single', optionId: 'never' } },
        c: { tap: { kind: 'single', optionId: 'sometimes' } },
        d: { tap: { kind: 'single', optionId: 'never' } },
      }),
    );
    // Nobody chose "always", so "sometimes" is the base level.
    expect(c.names).toEqual(['tap: Never']);
    expect(columns(c)).toEqual([[0, 1, 0, 1]]);
  });

  it('adds a "not answered" column for a missing single choice', () => {
    const c = buildMembershipCovariates(
      [tap],
      ids,
      answers({
        a: { tap: { kind: 'single', optionId: 'always' } },
        b: { tap: { kind: 'single', optionId: 'never' } },
        d: { tap: { kind: 'single', optionId: 'always' } },
      }),
    );
    expect(c.names).toEqual(['tap: Never', 'tap: not answered']);
    expect(columns(c)).toEqual([
      [0, 1, 0, 0],
      [0, 0, 1, 0],
    ]);
  });

  it('uses a number as given, the mean of the answers where missing, and a "not answered" column', () => {
    const c = buildMembershipCovariates(
      [size],
      ids,
      answers({
        a: { size: { kind: 'number', number: 1 } },
        b: { size: { kind: 'number', number: 4 } },
        c: { size: { kind: 'number', number: 4 } },
      }),
    );
    expect(c.names).toEqual(['size', 'size: not answered']);
    expect(columns(c)).toEqual([
      [1, 4, 4, 3],
      [0, 0, 0, 1],
    ]);
  });

  it('refuses a question everyone answered alike, or nobody answered', () => {
    const same = answers(
      Object.fromEntries(ids.map((id) => [id, { size: { kind: 'number', number: 2 } }])),
    );
    expect(() => buildMembershipCovariates([size], ids, same)).toThrow(StudyDataError);
    expect(() => buildMembershipCovariates([size], ids, answers({}))).toThrow(/Nobody/);
    expect(() => buildMembershipCovariates([tap], ids, answers({}))).toThrow(/same answer/);
  });
});

describe('resolveMembershipQuestions', () => {
  it('names the position of the first question it cannot use', () => {
    const text: MembershipQuestion = {
      key: 'note',
      text: 'Anything else?',
      type: 'text',
      options: [],
    };
    expect(() => resolveMembershipQuestions([tap, text], ['tap', 'note'])).toThrow(
      expect.objectContaining({ fields: [expect.objectContaining({ path: 'spec.membership.1' })] }),
    );
    expect(resolveMembershipQuestions([tap, size], ['size', 'tap'])).toEqual([size, tap]);
  });
});
