/**
 * D-error checks against the Huber & Zwerina (1996) formula on designs whose information
 * matrix is known in closed form.
 */
import { describe, expect, it } from 'vitest';
import { buildCodingPlan } from '../../../shared/engine/coding/coding-plan';
import { buildDesignMatrix } from '../../../server/engine/design/design-grid';
import { computeDError } from '../../../server/engine/design/design-criteria';
import { computeInformationMatrix } from '../../../server/engine/design/mnl-information';
import { studyDefinitionSchema } from '../../../shared/schemas/study-definition';
import { makeCheckAGrid, makeGrid, makeSymmetricDefinition } from './design-fixtures';

describe('computeDError', () => {
  const plan = buildCodingPlan(makeSymmetricDefinition([3, 3, 3], 3));
  const x = buildDesignMatrix(plan, makeCheckAGrid());

  it('gives 3^(−3/2) for the Check-A design at β = 0', () => {
    // docs/methods.md "Design check values" Check A [C]: det I = 3^9, K = 6, D-error = 0.19245008972987526
    // (Huber & Zwerina 1996 report 0.192 for their 3^3/3/9 design [M]).
    const d = computeDError(6, 9, 3, x, new Float64Array(6));
    expect(d).toBeCloseTo(0.19245008972987526, 14);
  });

  it('gives the Check-A′ value with level utilities (−1, 0, +1) per attribute', () => {
    // docs/methods.md "Design check values" Check A′ [C]: effects parameters (−1, 0) per attribute -> 0.3771383902767846.
    const beta = Float64Array.from([-1, 0, -1, 0, -1, 0]);
    expect(computeDError(6, 9, 3, x, beta)).toBeCloseTo(0.3771383902767846, 13);
  });

  it('matches a one-task case with an opt-out computed by hand', () => {
    // By hand (this file): rows (0,0), (1,0), (2,0) and the opt-out (0,1), β = 0, P = 1/4 each.
    // x̄ = (3/4, 1/4); I = ¼Σxx' − x̄x̄' = [[0.6875, −0.1875], [−0.1875, 0.1875]];
    // det I = 0.09375, D-error = 0.09375^(−1/2) = 3.265986323710904.
    const def = studyDefinitionSchema.parse({
      attributes: [
        {
          id: 'bill',
          name: 'Monthly bill increase',
          kind: 'numeric',
          coding: 'linear',
          levels: [0, 1, 2].map((v) => ({ id: `b${v}`, label: String(v), value: v })),
        },
      ],
      alternatives: { count: 3, labeled: false, labels: [] },
      fixedAlternative: { kind: 'opt_out', label: 'None of these', levels: {} },
    });
    const p = buildCodingPlan(def);
    const xm = buildDesignMatrix(p, makeGrid([[[0], [1], [2]]]));
    const info = new Float64Array(4);
    computeInformationMatrix(2, 1, 4, xm, new Float64Array(2), info, new Float64Array(4 * 3 + 2));
    expect(Array.from(info)).toEqual([0.6875, -0.1875, -0.1875, 0.1875]);
    expect(computeDError(2, 1, 4, xm, new Float64Array(2))).toBeCloseTo(3.265986323710904, 14);
  });

  it('returns Infinity for a singular information matrix', () => {
    // Every task shows the same level of attribute 2, so its parameters are not identified.
    const p = buildCodingPlan(makeSymmetricDefinition([2, 2], 2));
    const xm = buildDesignMatrix(
      p,
      makeGrid([
        [
          [0, 0],
          [1, 0],
        ],
        [
          [1, 0],
          [0, 0],
        ],
      ]),
    );
    expect(computeDError(2, 2, 2, xm, new Float64Array(2))).toBe(Infinity);
  });
});
