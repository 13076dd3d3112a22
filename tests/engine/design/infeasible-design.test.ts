/**
 * When the rules leave too few candidates, the refusal names the rule that binds (the one
 * whose removal alone would allow a design), or every rule when they bind only together.
 */
import { describe, expect, it } from 'vitest';
import { DesignError } from '../../../server/engine/design/design-errors';
import { generateDesign } from '../../../server/engine/design/generate-design';
import type { DesignSpecInput } from '../../../shared/schemas/design-spec';
import type { StudyDefinition } from '../../../shared/schemas/study-definition';
import { makeSymmetricDefinition } from './design-fixtures';

function refusal(definition: StudyDefinition, spec: DesignSpecInput): string {
  try {
    generateDesign(definition, spec);
  } catch (error) {
    expect(error).toBeInstanceOf(DesignError);
    expect((error as DesignError).code).toBe('infeasible');
    return (error as DesignError).message;
  }
  throw new Error('expected the design to be refused');
}

const fixedPriors = (columns: Record<string, number>) => ({
  kind: 'fixed' as const,
  columns: Object.entries(columns).map(([key, mean]) => ({ key, mean })),
});

describe('an infeasible design names the rule that binds', () => {
  it('excluded pairs that leave one alternative: each pair, dropped alone, would do', () => {
    const pair = (id: string, a: number, b: number) => ({
      id,
      kind: 'pair' as const,
      a: { attributeId: 'a0', levelId: `a0l${a}` },
      b: { attributeId: 'a1', levelId: `a1l${b}` },
    });
    const def = makeSymmetricDefinition([2, 2], 2, 'effects', {
      excludedCombinations: [pair('p1', 0, 0), pair('p2', 0, 1), pair('p3', 1, 0)],
    });
    const message = refusal(def, { method: 'random', tasks: 4 });
    expect(message).toMatch(/^Only 1 level combination of one alternative keeps/);
    expect(message).toMatch(/The rule that binds: “Never .+\(without it, 2 alternatives qualify\)/);
  });

  it('a rule against the status quo that leaves an attribute no level', () => {
    const def = makeSymmetricDefinition([2, 2], 2, 'dummy', {
      fixedAlternative: { kind: 'status_quo', label: 'Today', levels: { a0: 'a0l0', a1: 'a1l0' } },
      excludedCombinations: [
        { id: 'v1', kind: 'versus_status_quo', attributeId: 'a0', relation: 'same' },
        { id: 'v2', kind: 'versus_status_quo', attributeId: 'a0', relation: 'different' },
      ],
    });
    const message = refusal(def, { method: 'random', tasks: 4 });
    expect(message).toMatch(
      /^No level of .+ can appear in a designed alternative\. The rule that binds: “/,
    );
  });

  it('more required appearances than the design has places', () => {
    const def = makeSymmetricDefinition([3, 2], 2);
    const message = refusal(def, {
      method: 'random',
      tasks: 4,
      balance: { minAppearances: 3 },
    });
    expect(message).toMatch(
      /has 8 places .+ need 9 appearances\. The rule that binds: at least 3 appearances/,
    );
  });

  it('dominance between designed alternatives when one attribute has a known order', () => {
    const def = makeSymmetricDefinition([2], 2, 'dummy');
    const message = refusal(def, {
      method: 'd_efficient',
      tasks: 2,
      starts: 1,
      priors: fixedPriors({ 'attr:a0:a0l1': 0.5 }),
    });
    expect(message).toMatch(/The rule that binds: “no designed alternative may dominate another”/);
  });

  it('a rule on single alternatives that, with a rule between alternatives, leaves no task', () => {
    // a0 must equal the status quo's level and a1 must agree across the two alternatives, so
    // both alternatives would be identical; dropping the status-quo rule alone frees it.
    const def = makeSymmetricDefinition([3, 3], 2, 'dummy', {
      fixedAlternative: { kind: 'status_quo', label: 'Today', levels: { a0: 'a0l1', a1: 'a1l1' } },
      excludedCombinations: [
        { id: 'v1', kind: 'versus_status_quo', attributeId: 'a0', relation: 'same' },
        {
          id: 'b1',
          kind: 'between_alternatives',
          attributeId: 'a1',
          first: 0,
          relation: 'same',
          second: 1,
        },
      ],
    });
    const message = refusal(def, { method: 'random', tasks: 6 });
    expect(message).toMatch(/^No choice task of 2 alternatives keeps every rule at once\./);
    expect(message).toMatch(/The rule that binds: .*the same as the status quo’s/);
  });
});
