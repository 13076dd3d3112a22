/**
 * Covariance options and what a bad Hessian does. Checks: BHHH = (Σ s s′)⁻¹ (Berndt, Hall,
 * Hall & Hausman 1974); the clustered sandwich carries G/(G−1) (Cameron & Miller 2015 §II.C);
 * a Hessian that is not negative definite keeps the estimates, names the eigen-direction in
 * correlation form and gives no SE for the parameters on it; derived quantities of a lognormal
 * (mean e^{b+s²/2}, median e^b; Johnson, Kotz & Balakrishnan 1994 ch. 14), the wrong-sign share
 * of a normal Φ(−|b|/s), and the covariance and correlation implied by a Cholesky factor (Train 2009 §6.3).
 */
import { describe, expect, it } from 'vitest';
import { buildChoiceData } from '../../../server/engine/estimation/build-choice-data';
import { normalCdf } from '../../../server/engine/estimation/coefficient-distributions';
import { computeDerivedQuantities } from '../../../server/engine/estimation/derived-quantities';
import { fitMnl } from '../../../server/engine/estimation/fit-mnl';
import { computeInference, outerProductSum } from '../../../server/engine/estimation/inference';
import { createMixedLogitLayout } from '../../../server/engine/estimation/mixed-logit-layout';
import { invertMatrix } from '../../../server/engine/linalg/invert-matrix';
import { createKernelFixture } from './kernel-fixture';

const unit = (P: number) => ({ factor: new Float64Array(P).fill(1), offset: new Float64Array(P) });

describe('covariance options', () => {
  const { data } = createKernelFixture(['fixed', 'fixed', 'fixed']);

  it('BHHH is the inverse outer product of per-respondent scores, in the user units', async () => {
    const classical = await fitMnl(data, { covariance: 'classical' });
    const bhhh = await fitMnl(data, { covariance: 'bhhh' });
    expect(bhhh.inference.method).toBe('bhhh');
    expect(bhhh.inference.robust).toBeNull();
    expect([...bhhh.estimates]).toEqual([...classical.estimates]);
    // Independent route: scores from the fitted data at the estimate, inverted by Gauss-Jordan.
    const { evaluateMnl } = await import('../../../server/engine/estimation/mnl-likelihood');
    const N = data.taskStart.length - 1;
    const scores = new Float64Array(N * 3);
    evaluateMnl(data, bhhh.estimates, null, null, scores);
    const expected = invertMatrix(outerProductSum(scores, N, 3), 3)!;
    for (let i = 0; i < 9; i++) expect(bhhh.inference.classical![i]).toBeCloseTo(expected[i], 8);
  });

  it('robust = G/(G−1)·A⁻¹BA⁻¹', () => {
    const A = Float64Array.from([4, 1, 1, 3]);
    const scores = Float64Array.from([1, 0, 0, 1, 1, 1]); // 3 respondents
    const inf = computeInference({
      names: ['a', 'b'],
      information: A,
      scores,
      respondents: 3,
      choice: 'robust',
      scaling: unit(2),
    });
    const Ai = invertMatrix(A, 2)!;
    const B = outerProductSum(scores, 3, 2);
    const sandwich = [0, 1, 2, 3].map((i) => {
      const [r, c] = [Math.floor(i / 2), i % 2];
      let s = 0;
      for (let a = 0; a < 2; a++)
        for (let b = 0; b < 2; b++) s += Ai[r * 2 + a] * B[a * 2 + b] * Ai[b * 2 + c];
      return (s * 3) / 2;
    });
    sandwich.forEach((v, i) => expect(inf.robust![i]).toBeCloseTo(v, 12));
    expect(inf.chosen).toBe(inf.robust);
  });

  it('a Hessian that is not negative definite keeps going, names the direction, withholds those SEs', () => {
    // Information with a zero eigen-direction along (b − c)/√2 in correlation form; a is fine.
    const A = Float64Array.from([2, 0, 0, 0, 1, 1, 0, 1, 1]);
    const inf = computeInference({
      names: ['a', 'b', 'c'],
      information: A,
      scores: new Float64Array(6),
      respondents: 2,
      choice: 'classical',
      scaling: unit(3),
    });
    expect(inf.positiveDefinite).toBe(false);
    expect(inf.warnings[0].message).toMatch(
      /not negative definite.*0\.71·b − 0\.71·c|0\.71·c − 0\.71·b/,
    );
    expect(inf.se[0]).toBeCloseTo(Math.sqrt(0.5), 12);
    expect(Number.isNaN(inf.se[1]) && Number.isNaN(inf.se[2])).toBe(true);
  });
});

describe('derived quantities', () => {
  const data = buildChoiceData(
    ['a', 'b', 'c'],
    [
      { respondent: 1, task: 1, alt: 1, chosen: 1, values: [1, 0, 1] },
      { respondent: 1, task: 1, alt: 2, chosen: 0, values: [0, 1, 0] },
    ],
  ).data;

  it('lognormal mean, median, SD; normal wrong-sign share; correlation from the Cholesky factor', () => {
    const layout = createMixedLogitLayout(
      data,
      [
        { name: 'a', distribution: 'normal' },
        { name: 'b', distribution: 'normal' },
        { name: 'c', distribution: 'lognormal' },
      ],
      true,
    );
    // θ = [a.mean, b.mean, c.mean, c.sd, chol.a.a, chol.b.a, chol.b.b]
    const theta = [0.5, -1, -0.2, 0.4, 0.8, 0.3, 0.4];
    const cov = new Float64Array(49);
    for (let p = 0; p < 7; p++) cov[p * 8] = 0.01;
    const d = computeDerivedQuantities(layout, theta, cov, { draws: 4000, seed: 3 });
    const get = (name: string, q: string) => d.find((x) => x.name === name && x.quantity === q)!;
    expect(get('c', 'mean').estimate).toBeCloseTo(Math.exp(-0.2 + 0.08), 12);
    expect(get('c', 'median').estimate).toBeCloseTo(Math.exp(-0.2), 12);
    expect(get('c', 'sd').estimate).toBeCloseTo(Math.exp(-0.12) * Math.sqrt(Math.expm1(0.16)), 12);
    expect(get('a', 'wrong_sign_share').estimate).toBeCloseTo(normalCdf(-0.5 / 0.8), 12);
    expect(get('b', 'sd').estimate).toBeCloseTo(0.5, 12);
    expect(get('b~a', 'correlation').estimate).toBeCloseTo((0.8 * 0.3) / (0.8 * 0.5), 12);
    // Implied covariance Σ = LL′ (Train 2009 §6.3) and its delta SEs in closed form:
    // Σ_aa = L_aa², SE 2·L_aa·0.1; Σ_ba = L_ba·L_aa, SE 0.1·√(L_aa² + L_ba²).
    expect(get('a~a', 'covariance').estimate).toBeCloseTo(0.64, 12);
    expect(get('b~a', 'covariance').estimate).toBeCloseTo(0.24, 12);
    expect(get('b~b', 'covariance').estimate).toBeCloseTo(0.09 + 0.16, 12);
    expect(get('a~a', 'covariance').se!).toBeCloseTo(2 * 0.8 * 0.1, 8);
    expect(get('b~a', 'covariance').se!).toBeCloseTo(0.1 * Math.sqrt(0.64 + 0.09), 8);
    // Delta SE of the median e^b is e^b·SE(b) = e^{−0.2}·0.1; the simulation agrees within its error.
    expect(get('c', 'median').se!).toBeCloseTo(Math.exp(-0.2) * 0.1, 8);
    expect(Math.abs(get('c', 'median').simulatedSe! / get('c', 'median').se! - 1)).toBeLessThan(
      0.05,
    ); // ≈ 4.5 Monte Carlo SEs of an SD from 4000 draws
  });
});
