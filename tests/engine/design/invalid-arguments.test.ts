/**
 * Invalid requests are refused before any numerics, with a DesignError code and field.
 */
import { describe, expect, it } from 'vitest';
import { checkDesignSpec } from '../../../server/engine/design/check-design-spec';
import { DesignError } from '../../../server/engine/design/design-errors';
import { generateDesign } from '../../../server/engine/design/generate-design';
import { codeAlternative } from '../../../shared/engine/coding/code-alternative';
import { buildCodingPlan } from '../../../shared/engine/coding/coding-plan';
import { makeStudyDefinition } from '../../../scripts/lib/study-factory/definition';
import { makeSymmetricDefinition } from './design-fixtures';

function catchDesignError(run: () => unknown): DesignError {
  try {
    run();
  } catch (error) {
    if (error instanceof DesignError) return error;
    throw error;
  }
  throw new Error('expected a DesignError');
}

describe('checkDesignSpec', () => {
  const def = makeSymmetricDefinition([3, 3], 2);

  it('rejects an unknown method with the field', () => {
    const error = catchDesignError(() => checkDesignSpec(def, { method: 'orthogonal', tasks: 6 }));
    expect(error.code).toBe('invalid_spec');
    expect(Object.keys(error.fields!)).toContain('method');
  });

  it('requires tasks for random and D-efficient designs', () => {
    const error = catchDesignError(() => checkDesignSpec(def, { method: 'random' }));
    expect(error.fields).toHaveProperty('tasks');
  });

  it('requires tasks to be a multiple of blocks', () => {
    const error = catchDesignError(() =>
      checkDesignSpec(def, { method: 'random', tasks: 10, blocks: 3 }),
    );
    expect(error.fields).toHaveProperty('blocks');
  });

  it('refuses fewer tasks than the parameters need', () => {
    // 4 parameters, pairs add one direction each: at least 4 tasks.
    const error = catchDesignError(() => checkDesignSpec(def, { method: 'd_efficient', tasks: 3 }));
    expect(error.fields!.tasks).toMatch(/At least 4 tasks/);
  });

  it('refuses priors with an unknown column, a duplicate or a missing one', () => {
    const keys = buildCodingPlan(def).columns.map((c) => c.key);
    const columns = keys.map((key) => ({ key, mean: 0.1 }));
    const spec = (cols: unknown) => ({
      method: 'd_efficient',
      tasks: 6,
      priors: { kind: 'fixed', columns: cols },
    });
    expect(
      catchDesignError(() => checkDesignSpec(def, spec([...columns, { key: 'attr:x', mean: 1 }])))
        .message,
    ).toMatch(/Unknown coded column/);
    expect(
      catchDesignError(() => checkDesignSpec(def, spec([...columns, columns[0]]))).message,
    ).toMatch(/given twice/);
    expect(catchDesignError(() => checkDesignSpec(def, spec(columns.slice(1)))).message).toMatch(
      /missing/,
    );
  });

  it('refuses a negative prior SD and too few draws', () => {
    const columns = buildCodingPlan(def).columns.map((c) => ({ key: c.key, mean: 0, sd: -1 }));
    const error = catchDesignError(() =>
      checkDesignSpec(def, {
        method: 'd_efficient',
        tasks: 6,
        priors: { kind: 'bayesian', columns, draws: 5 },
      }),
    );
    expect(Object.keys(error.fields!).some((k) => k.startsWith('priors'))).toBe(true);
  });

  it('refuses an invalid study definition and one without attributes', () => {
    expect(
      catchDesignError(() =>
        checkDesignSpec({ attributes: 'none' }, { method: 'random', tasks: 4 }),
      ).message,
    ).toMatch(/study definition/);
    const empty = { attributes: [], alternatives: { count: 2 } };
    expect(
      catchDesignError(() => checkDesignSpec(empty, { method: 'random', tasks: 4 })).fields,
    ).toHaveProperty('definition.attributes');
  });

  it('refuses a full factorial that is too large', () => {
    const big = makeSymmetricDefinition([12, 12, 12, 12], 2);
    expect(catchDesignError(() => checkDesignSpec(big, { method: 'full_factorial' })).code).toBe(
      'too_large',
    );
  });
});

describe('generateDesign full-factorial size', () => {
  it('refuses a task count that differs from the number of feasible profiles', () => {
    const error = catchDesignError(() =>
      generateDesign(makeSymmetricDefinition([3, 3], 2), {
        method: 'full_factorial',
        tasks: 6,
        blocks: 2,
      }),
    );
    expect(error.fields!.tasks).toBe('The full factorial has 9 tasks');
  });

  it('refuses a full factorial with more profiles than a design may hold', () => {
    const def = makeSymmetricDefinition([12, 12, 12, 2], 2); // 3456 profiles
    expect(catchDesignError(() => generateDesign(def, { method: 'full_factorial' })).code).toBe(
      'too_large',
    );
  });
});

describe('generateDesign infeasible requests', () => {
  it('says so when excluded pairs leave no valid alternatives', () => {
    const def = makeSymmetricDefinition([2, 2], 2, 'effects', {
      excludedCombinations: [
        {
          id: 'p1',
          kind: 'pair',
          a: { attributeId: 'a0', levelId: 'a0l0' },
          b: { attributeId: 'a1', levelId: 'a1l0' },
        },
        {
          id: 'p2',
          kind: 'pair',
          a: { attributeId: 'a0', levelId: 'a0l0' },
          b: { attributeId: 'a1', levelId: 'a1l1' },
        },
        {
          id: 'p3',
          kind: 'pair',
          a: { attributeId: 'a0', levelId: 'a0l1' },
          b: { attributeId: 'a1', levelId: 'a1l0' },
        },
      ],
    });
    expect(catchDesignError(() => generateDesign(def, { method: 'random', tasks: 4 })).code).toBe(
      'infeasible',
    );
  });
});

describe('coding invalid arguments', () => {
  const plan = buildCodingPlan(makeStudyDefinition());
  it('rejects an alternative index outside the study', () => {
    expect(() => codeAlternative(plan, 5, {})).toThrow(/does not exist/);
  });
  it('rejects the fixed alternative when the study has none', () => {
    const none = buildCodingPlan(makeStudyDefinition({ fixedAlternative: null }));
    expect(() => codeAlternative(none, 'fixed', {})).toThrow(/does not exist|no opt-out/);
  });
});
