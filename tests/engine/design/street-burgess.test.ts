/**
 * Street–Burgess optimality at β = 0 (Street & Burgess 2007, *The Construction of Optimal
 * Stated Choice Experiments*; docs/methods.md "Design check values", formula [M], values [C]).
 */
import { describe, expect, it } from 'vitest';
import { buildCodingPlan } from '../../../shared/engine/coding/coding-plan';
import {
  computeStreetBurgessEfficiency,
  getMaxDifferingPairs,
  getStreetBurgessOptimalDet,
} from '../../../server/engine/design/diagnostics/street-burgess';
import { generateDesign } from '../../../server/engine/design/generate-design';
import { makeCheckAGrid, makeFoldoverGrid, makeSymmetricDefinition } from './design-fixtures';

describe('getStreetBurgessOptimalDet', () => {
  it('gives 2^(−k²) for two-level pairs, k = 3: 1/512 (Check B)', () => {
    expect(getStreetBurgessOptimalDet([2, 2, 2], 2)).toBeCloseTo(1 / 512, 17);
  });

  it('gives (8/72)^3 = 1/729 for three two-level attributes in triples (Check C)', () => {
    // docs/methods.md "Design check values" Check C [C]: 0.0013717421124828531.
    expect(getStreetBurgessOptimalDet([2, 2, 2], 3)).toBeCloseTo(0.0013717421124828531, 17);
  });

  it('gives 3^(−18) for 3^3 in triples (Check D)', () => {
    // docs/methods.md "Design check values" Check D [C]: 2.581174791713197e−09.
    expect(getStreetBurgessOptimalDet([3, 3, 3], 3) / 2.581174791713197e-9).toBeCloseTo(1, 13);
  });

  it('counts differing pairs S_q as in docs/methods.md "Design check values"', () => {
    expect(getMaxDifferingPairs(2, 2)).toBe(1); // m²/4
    expect(getMaxDifferingPairs(2, 3)).toBe(2); // (m² − 1)/4
    expect(getMaxDifferingPairs(4, 3)).toBe(3); // l ≥ m: m(m − 1)/2
    expect(getMaxDifferingPairs(3, 5)).toBe(8); // 5 = 3·1 + 2: (25 − (3 + 4 + 2))/2
  });
});

describe('computeStreetBurgessEfficiency', () => {
  it('finds C = I/8 and 100 % for the fold-over of the 2^3 OMEP (Check B)', () => {
    const plan = buildCodingPlan(makeSymmetricDefinition([2, 2, 2], 2));
    const result = computeStreetBurgessEfficiency(plan, makeFoldoverGrid())!;
    // docs/methods.md "Design check values" Check B [C]: det C = 1/512 = 0.001953125, efficiency 1.0.
    expect(result.detC).toBeCloseTo(0.001953125, 15);
    expect(result.efficiency).toBeCloseTo(1, 12);
  });

  it('finds det C = 3^(−18), 100 %, for the Check-A design (Check D)', () => {
    const plan = buildCodingPlan(makeSymmetricDefinition([3, 3, 3], 3));
    const result = computeStreetBurgessEfficiency(plan, makeCheckAGrid())!;
    expect(result.detC / 2.581174791713197e-9).toBeCloseTo(1, 12);
    expect(result.efficiency).toBeCloseTo(1, 12);
  });

  it('does not apply when the study has an opt-out', () => {
    const plan = buildCodingPlan(
      makeSymmetricDefinition([2, 2, 2], 2, 'effects', {
        fixedAlternative: { kind: 'opt_out', label: 'Neither', levels: {} },
      }),
    );
    expect(computeStreetBurgessEfficiency(plan, makeFoldoverGrid())).toBeNull();
  });
});

describe('coordinate exchange reaches the Street–Burgess optimum', () => {
  it.each([1, 2, 3])('3 two-level attributes in 4 pairs, zero priors (seed %i)', (seed) => {
    const { diagnostics } = generateDesign(makeSymmetricDefinition([2, 2, 2], 2), {
      method: 'd_efficient',
      tasks: 4,
      starts: 5,
      seed,
    });
    // Optimum from Street & Burgess (Check B): efficiency 1. In ±1 coding each optimal pair
    // differs on every attribute, so at β = 0 I = Σ_s x_s x_s' = 4·I₃ and D₀ = 64^(−1/3) = 1/4.
    expect(diagnostics.dEfficiency!.efficiency).toBeCloseTo(1, 10);
    expect(diagnostics.dErrorZero).toBeCloseTo(0.25, 12);
  });

  it.each([1, 2, 3])(
    'still reaches it with level balance, no overlap and two appearances per level (seed %i)',
    (seed) => {
      // The optimal fold-over pairs satisfy all three rules (each level 4 times over the 8
      // designed alternatives, no attribute shared within a pair), so the rules must not keep
      // the search from the optimum (issue: "reaches the known optimum where the constraints
      // allow it").
      const { design, diagnostics } = generateDesign(makeSymmetricDefinition([2, 2, 2], 2), {
        method: 'd_efficient',
        tasks: 4,
        starts: 5,
        seed,
        balance: { levelBalance: true, maxOverlap: 0, minAppearances: 2 },
      });
      expect(diagnostics.dEfficiency!.efficiency).toBeCloseTo(1, 10);
      expect(diagnostics.dErrorZero).toBeCloseTo(0.25, 12);
      expect(design.tasks).toHaveLength(4);
    },
  );
});
