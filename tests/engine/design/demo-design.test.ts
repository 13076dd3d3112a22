/**
 * The demo study's design, as the seed generates it: under the default dominance screening no
 * package dominates "Keep the current service" or another package, nor is dominated by the
 * current service, every package costs more than the current service, and every level is
 * shown. Dominance is re-checked here by hand from the priors' signs, independently of the
 * engine's tables: with fixed priors a sign is known whenever the prior is not zero.
 */
import { describe, expect, it } from 'vitest';
import { demoDefinition } from '../../../server/seed/demo-definition';
import { getDemoDesignSpec } from '../../../server/seed/demo-study';
import { generateDesign } from '../../../server/engine/design/generate-design';

/** Utility of each level under the demo priors, per attribute (signs are what matter). */
const direction: Record<string, (levelId: string) => number> = {
  bill: (id) => -Number(id.split('-')[1]),
  interruptions: (id) => -Number(id.split('-')[1]),
  warnings: (id) => -Number(id.split('-')[1]),
  river: (id) => ({ 'river-poor': 0, 'river-fair': 1, 'river-good': 2 })[id]!,
  renewable: (id) => Number(id.split('-')[1]),
};

/** 1: p dominates q, −1: q dominates p, 0: identical, 2: neither. */
function compare(p: Record<string, string>, q: Record<string, string>): number {
  let better = false;
  let worse = false;
  for (const [attribute, utility] of Object.entries(direction)) {
    const d = utility(p[attribute]) - utility(q[attribute]);
    if (d > 0) better = true;
    if (d < 0) worse = true;
  }
  if (better && worse) return 2;
  return better ? 1 : worse ? -1 : 0;
}

describe('demo design', () => {
  const generated = generateDesign(demoDefinition, getDemoDesignSpec());
  const current = demoDefinition.fixedAlternative!.levels;

  it('has no dominated or dominating package, and every package costs more than today', () => {
    expect(generated.design.tasks).toHaveLength(16);
    for (const task of generated.design.tasks) {
      const [a, b] = task.alternatives.map((x) => x.levels);
      expect(Math.abs(compare(a, b))).toBe(2);
      for (const alternative of [a, b]) {
        expect(compare(alternative, current)).toBe(2);
        expect(alternative.bill).not.toBe('bill-0');
      }
    }
  });

  it('reports every dominance rule as on with no case, and no level left unshown', () => {
    const { rules, errors } = generated.diagnostics;
    expect(rules.dominanceKnown).toBe(true);
    for (const rule of rules.dominance)
      expect(rule).toMatchObject({ active: true, applies: true, tasks: 0, alternatives: 0 });
    expect(rules.excludedCombinations).toEqual([
      expect.objectContaining({ id: 'bill-above-current', breaches: 0 }),
    ]);
    expect(errors).toEqual([]);
  });
});
