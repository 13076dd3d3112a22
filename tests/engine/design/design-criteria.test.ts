/**
 * Design criteria (D-, A-error, S-estimate, C-error) on a design whose MNL information
 * matrix is written by hand (this file), and their Bayesian averages.
 *
 * Hand case: two linear attributes (quality q, cost c; levels 0 and 1), two tasks with two
 * alternatives: task 1 (q, c) = (1, 0) vs (0, 1), task 2 (1, 1) vs (0, 0). With two
 * alternatives a task adds p(1 − p)·d d' (d = x₁ − x₂; McFadden 1974, Huber & Zwerina 1996),
 * so with d₁ = (1, −1), d₂ = (1, 1) and weights w₁, w₂:
 *   I = [[w₁+w₂, w₂−w₁], [w₂−w₁, w₁+w₂]], det I = 4w₁w₂,
 *   Ω = I⁻¹ = [[w₁+w₂, w₁−w₂], [w₁−w₂, w₁+w₂]] / (4w₁w₂).
 * At β = (b, −b), b = ln 3 / 2: task 1's utility difference is ln 3 (p = 3/4, w₁ = 3/16),
 * task 2's is 0 (w₂ = 1/4): det I = 3/16, Ω_qq = Ω_cc = 7/3, Ω_qc = −1/3. Then
 *   D-error = (3/16)^(−1/2) = 4/√3 (Huber & Zwerina 1996);
 *   A-error = tr Ω / K = 7/3 (Rose & Bliemer 2009);
 *   S-estimate = t²·Ω_kk/β_k² = 1.96²·(7/3)/b² for both k (Rose & Bliemer 2013);
 *   C-error = Var(−β_q/β_c) = g'Ωg with g = (1/b, 1/b): (7/3 + 7/3 − 2/3)/b² = 4/b² = 16/(ln 3)²
 *   (delta method as in Scarpa & Rose 2008).
 * Tolerance 1e-12 relative: a 2 × 2 inverse in double precision.
 */
import { describe, expect, it } from 'vitest';
import { buildCodingPlan } from '../../../shared/engine/coding/coding-plan';
import type { DesignCriterion } from '../../../shared/schemas/design-spec';
import { studyDefinitionSchema } from '../../../shared/schemas/study-definition';
import { buildDesignMatrix } from '../../../server/engine/design/design-grid';
import {
  buildCriterionSetup,
  computeDesignCriterion,
  getCriterionUnavailableReason,
} from '../../../server/engine/design/design-criteria';
import { getSampleSizeGuide } from '../../../server/engine/design/diagnostics/sample-size';
import { computeInformationMatrix } from '../../../server/engine/design/mnl-information';
import { makeGrid } from './design-fixtures';

const b = Math.log(3) / 2;
const definition = studyDefinitionSchema.parse({
  attributes: [
    {
      id: 'quality',
      name: 'River health score',
      kind: 'numeric',
      coding: 'linear',
      levels: [0, 1].map((v) => ({ id: `q${v}`, label: String(v), value: v })),
    },
    {
      id: 'bill',
      name: 'Monthly bill increase',
      kind: 'numeric',
      coding: 'linear',
      isCost: true,
      levels: [0, 1].map((v) => ({ id: `c${v}`, label: String(v), value: v })),
    },
  ],
  alternatives: { count: 2, labeled: false, labels: [] },
});
const plan = buildCodingPlan(definition);
const x = buildDesignMatrix(
  plan,
  makeGrid([
    [
      [1, 0],
      [0, 1],
    ],
    [
      [1, 1],
      [0, 0],
    ],
  ]),
);
const beta = Float64Array.from([b, -b]);

function criterion(name: DesignCriterion, draws: Float64Array, R = 1, tValue = 1.96) {
  const setup = buildCriterionSetup(plan, definition, name, draws.subarray(0, 2), tValue);
  return computeDesignCriterion(setup, 2, 2, x, draws, R);
}

const rel = (value: number, expected: number) =>
  expect(Math.abs(value - expected) / expected).toBeLessThan(1e-12);

describe('design criteria on the hand-computed two-task case', () => {
  it('has the information matrix written out in the file comment', () => {
    const info = new Float64Array(4);
    computeInformationMatrix(2, 2, 2, x, beta, info, new Float64Array(2 * 3 + 2));
    [3 / 16 + 1 / 4, 1 / 4 - 3 / 16, 1 / 4 - 3 / 16, 3 / 16 + 1 / 4].forEach((v, i) =>
      expect(info[i]).toBeCloseTo(v, 15),
    );
  });

  it('gives D-error 4/√3 (Huber & Zwerina 1996)', () => {
    rel(criterion('d_error', beta), 4 / Math.sqrt(3));
  });

  it('gives A-error tr(Ω)/K = 7/3 (Rose & Bliemer 2009)', () => {
    rel(criterion('a_error', beta), 7 / 3);
  });

  it('gives the S-estimate 1.96²·(7/3)/b² (Rose & Bliemer 2013), and scales with t²', () => {
    rel(criterion('s_estimate', beta), (1.96 * 1.96 * (7 / 3)) / (b * b));
    rel(criterion('s_estimate', beta, 1, 2.58), (2.58 * 2.58 * (7 / 3)) / (b * b));
  });

  it('agrees with the per-coefficient N_k of the sample-size guide', () => {
    const cov = Float64Array.from([7 / 3, -1 / 3, -1 / 3, 7 / 3]);
    const guide = getSampleSizeGuide({
      columns: plan.columns,
      covarianceOne: cov,
      priorMeans: beta,
      blocks: 1,
      tasksPerRespondent: 2,
      alternatives: 2,
      maxLevels: 2,
    });
    // The guide uses z = Φ⁻¹(0.975) = 1.959963984540054 (AS241), not the rounded 1.96.
    const sEstimate = criterion('s_estimate', beta, 1, 1.959963984540054);
    rel(Math.max(...guide.coefficients.map((c) => c.replicationsForT ?? 0)), sEstimate);
  });

  it('gives C-error 16/(ln 3)² (delta method, Scarpa & Rose 2008)', () => {
    rel(criterion('c_error', beta), 16 / Math.log(3) ** 2);
  });

  it('averages over prior draws like the Bayesian D-error (Sándor & Wedel 2001)', () => {
    // Draw 2 at β = 0: w₁ = w₂ = 1/4, I = ½·Id, Ω = 2·Id: D = 2, A = 2.
    const draws = Float64Array.from([b, -b, 0, 0]);
    rel(criterion('d_error', draws, 2), (4 / Math.sqrt(3) + 2) / 2);
    rel(criterion('a_error', draws, 2), (7 / 3 + 2) / 2);
    // Draw 2 at (b, b): w₁ = 1/4, w₂ = 3/16, Ω_qc = +1/3, WTP = −1, g = (−1/b, 1/b): 4/b² again.
    const sameC = Float64Array.from([b, -b, b, b]);
    rel(criterion('c_error', sameC, 2), 16 / Math.log(3) ** 2);
  });

  it('says why the S-estimate and the C-error need non-zero priors', () => {
    const zero = new Float64Array(2);
    const sSetup = buildCriterionSetup(plan, definition, 's_estimate', zero, 1.96);
    expect(getCriterionUnavailableReason(sSetup, 's_estimate', zero)).toMatch(/non-zero mean/);
    const cSetup = buildCriterionSetup(plan, definition, 'c_error', zero, 1.96);
    expect(getCriterionUnavailableReason(cSetup, 'c_error', zero)).toMatch(/cost coefficient/);
    expect(getCriterionUnavailableReason(cSetup, 'c_error', beta)).toBeNull();
  });

  it('gives Infinity for a singular design', () => {
    const flat = buildDesignMatrix(
      plan,
      makeGrid([
        [
          [1, 0],
          [0, 0],
        ],
        [
          [0, 0],
          [1, 0],
        ],
      ]),
    );
    const setup = buildCriterionSetup(plan, definition, 'a_error', beta, 1.96);
    expect(computeDesignCriterion(setup, 2, 2, flat, beta, 1)).toBe(Infinity);
  });
});
