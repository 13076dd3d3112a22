/**
 * Coding checks: every expected row below was written out by hand from the coding rules
 * (dummy = 1 in the level's column, reference level all zeros; effects = base level −1 in
 * every column; linear = the numeric value) — common practice, no source.
 */
import { describe, expect, it } from 'vitest';
import { getCodedColumns } from '../../../shared/engine/coding/coded-columns';
import { buildCodingPlan } from '../../../shared/engine/coding/coding-plan';
import { codeAlternative } from '../../../shared/engine/coding/code-alternative';
import {
  makeLabeledDefinition,
  makeStudyDefinition,
} from '../../../scripts/lib/study-factory/definition';

describe('getCodedColumns', () => {
  it('names columns readably in matrix order with the status-quo constant last', () => {
    const names = getCodedColumns(makeStudyDefinition()).map((c) => c.name);
    expect(names).toEqual([
      'Monthly bill increase (€)',
      'Supply interruptions per year',
      'Taste/odour warning days: 6 days',
      'Taste/odour warning days: 2 days',
      'River health: fair',
      'River health: good',
      'Renewable pumping energy: 20 %',
      'Renewable pumping energy: 80 %',
      'Constant: Current service',
    ]);
  });

  it('gives labeled alternatives J−1 constants, the first alternative being the reference', () => {
    const def = makeStudyDefinition({
      alternatives: {
        count: 3,
        labeled: true,
        labels: [
          { id: 'basic', name: 'Basic', omittedAttributeIds: [] },
          { id: 'green', name: 'Green', omittedAttributeIds: [] },
          { id: 'prem', name: 'Premium', omittedAttributeIds: [] },
        ],
      },
    });
    const keys = getCodedColumns(def)
      .filter((c) => c.kind === 'constant')
      .map((c) => c.key);
    expect(keys).toEqual(['asc:green', 'asc:prem', 'asc:fixed']);
  });
});

describe('codeAlternative', () => {
  const plan = buildCodingPlan(makeStudyDefinition());

  it('codes a designed alternative with linear, effects and dummy parts', () => {
    const row = codeAlternative(plan, 0, {
      bill: 'b10',
      interrupt: 'i2',
      warn: 'w0', // effects base (last level): −1, −1
      river: 'good',
      renew: 'r50', // dummy reference chosen by the study: 0, 0
    });
    expect(Array.from(row)).toEqual([10, 2, -1, -1, 0, 1, 0, 0, 0]);
  });

  it('codes a non-base effects level and the dummy reference of river health', () => {
    const row = codeAlternative(plan, 1, {
      bill: 'b3',
      interrupt: 'i1',
      warn: 'w2',
      river: 'poor',
      renew: 'r80',
    });
    expect(Array.from(row)).toEqual([3, 1, 0, 1, 0, 0, 0, 1, 0]);
  });

  it('codes the status quo with its fixed levels plus its constant', () => {
    const row = codeAlternative(plan, 'fixed', {});
    expect(Array.from(row)).toEqual([0, 4, 1, 0, 0, 0, 1, 0, 1]);
  });

  it('codes the opt-out as zero on attribute columns with its constant', () => {
    const optOut = buildCodingPlan(
      makeStudyDefinition({
        fixedAlternative: { kind: 'opt_out', label: 'Neither', levels: {} },
      }),
    );
    expect(Array.from(codeAlternative(optOut, 'fixed', {}))).toEqual([0, 0, 0, 0, 0, 0, 0, 0, 1]);
  });

  it('codes omitted attributes of a labeled alternative as zero and sets its constant', () => {
    const labeled = buildCodingPlan(makeLabeledDefinition(['river', 'warn']));
    const levels = { bill: 'b6', interrupt: 'i4', warn: 'w6', river: 'fair', renew: 'r20' };
    expect(Array.from(codeAlternative(labeled, 0, levels))).toEqual([6, 4, 1, 0, 1, 0, 1, 0, 0]);
    expect(Array.from(codeAlternative(labeled, 1, levels))).toEqual([6, 4, 0, 0, 0, 0, 1, 0, 1]);
  });

  it('rejects an unknown level id', () => {
    expect(() => codeAlternative(plan, 0, { bill: 'b7' })).toThrow(/Unknown level "b7"/);
  });
});
