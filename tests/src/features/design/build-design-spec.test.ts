import { describe, expect, it } from 'vitest';
import type { CodedColumn } from '@shared/engine/coding/coded-columns';
import {
  buildDesignSpec,
  defaultDesignForm,
  formValuesFromSpec,
} from '@/features/design/utils/build-design-spec';

const columns: CodedColumn[] = [
  { key: 'attr:bill', name: 'Monthly bill increase (€)', kind: 'linear', attributeId: 'bill' },
  {
    key: 'attr:river:good',
    name: 'River: Good',
    kind: 'level',
    attributeId: 'river',
    levelId: 'good',
  },
];

describe('buildDesignSpec', () => {
  it('when tasks are not a multiple of blocks, reports the blocks field', () => {
    const out = buildDesignSpec({ ...defaultDesignForm, tasks: '7', blocks: '2' }, columns);
    expect(out.ok).toBe(false);
    if (!out.ok) expect(out.errors.get('blocks')).toMatch(/multiple/);
  });

  it('builds Bayesian priors for every coded column, zero where left empty', () => {
    const out = buildDesignSpec(
      {
        ...defaultDesignForm,
        priorsKind: 'bayesian',
        draws: '100',
        priors: { 'attr:bill': { mean: '-0.1', sd: '0.05' } },
      },
      columns,
    );
    expect(out).toEqual({
      ok: true,
      spec: expect.objectContaining({
        method: 'd_efficient',
        tasks: 12,
        blocks: 2,
        priors: {
          kind: 'bayesian',
          draws: 100,
          columns: [
            { key: 'attr:bill', mean: -0.1, sd: 0.05 },
            { key: 'attr:river:good', mean: 0, sd: 0 },
          ],
        },
      }),
    });
  });

  it('reads priors and settings typed with a decimal comma as with a point', () => {
    const typed = (mean: string, sd: string, tValue: string) =>
      buildDesignSpec(
        {
          ...defaultDesignForm,
          priorsKind: 'bayesian',
          criterion: 's_estimate',
          tValue,
          draws: '100',
          priors: { 'attr:bill': { mean, sd } },
        },
        columns,
      );
    const comma = typed('-0,1', '0,05', '1,96');
    expect(comma.ok).toBe(true);
    expect(comma).toEqual(typed('-0.1', '0.05', '1.96'));
  });

  it('when a prior SD is negative or a mean is not a number, names that column', () => {
    const out = buildDesignSpec(
      {
        ...defaultDesignForm,
        priorsKind: 'bayesian',
        priors: { 'attr:river:good': { mean: 'x', sd: '-1' } },
      },
      columns,
    );
    expect(out.ok).toBe(false);
    if (!out.ok) {
      expect([...out.errors.keys()]).toEqual(
        expect.arrayContaining(['priors.columns.1.mean', 'priors.columns.1.sd']),
      );
    }
  });

  it('random designs ignore the priors, and the form refills from a stored spec', () => {
    const out = buildDesignSpec(
      { ...defaultDesignForm, method: 'random', priorsKind: 'fixed', tasks: '6', blocks: '3' },
      columns,
    );
    expect(out.ok && out.spec.priors).toEqual({ kind: 'zero' });
    if (out.ok) {
      const again = buildDesignSpec(formValuesFromSpec(out.spec), columns);
      expect(again).toEqual(out);
    }
  });

  it('carries the dominance and level rules, and refills them from a stored spec', () => {
    const out = buildDesignSpec(
      {
        ...defaultDesignForm,
        dominance: { betweenDesigned: true, overFixed: false, byFixed: true },
        minAppearances: '2',
        levelBalance: true,
        maxOverlap: '1',
      },
      columns,
    );
    expect(out.ok && out.spec.dominance).toEqual({
      betweenDesigned: true,
      overFixed: false,
      byFixed: true,
    });
    expect(out.ok && out.spec.balance).toEqual({
      minAppearances: 2,
      levelBalance: true,
      maxOverlap: 1,
    });
    if (out.ok) expect(buildDesignSpec(formValuesFromSpec(out.spec), columns)).toEqual(out);
  });

  it('when the minimum appearances is not a whole number, names that field', () => {
    const out = buildDesignSpec({ ...defaultDesignForm, minAppearances: '1.5' }, columns);
    expect(out.ok).toBe(false);
    if (!out.ok) expect(out.errors.has('balance.minAppearances')).toBe(true);
  });
});
