/**
 * The inverse BHHH matrix that starts BFGS (bhhh-start.ts), checked against its definition
 * B = Σ_n s_n s_nᵀ (Berndt, Hall, Hall & Hausman 1974) and B·B⁻¹ = I, and the fallback when B
 * is singular.
 */
import { describe, expect, it } from 'vitest';
import { getBhhhInverseHessian } from '../../../server/engine/estimation/bhhh-start';

describe('getBhhhInverseHessian', () => {
  it('inverts Σ s sᵀ and returns an exactly symmetric matrix', () => {
    // 3 × 2 scores: B = [[1+0+4, 2+0+2], [2+0+2, 4+9+1]] = [[5, 4], [4, 14]] (by hand),
    // B⁻¹ = [[14, −4], [−4, 5]] / (70 − 16) (closed form of a 2 × 2 inverse).
    const scores = Float64Array.from([1, 2, 0, 3, 2, 1]);
    const start = getBhhhInverseHessian(scores, 3, 2);
    expect(start.note).toBeNull();
    const h = start.inverseHessian!;
    const expected = [14 / 54, -4 / 54, -4 / 54, 5 / 54];
    // A 2 × 2 eigen-solve: a few ulps of relative error.
    h.forEach((v, i) => expect(v).toBeCloseTo(expected[i], 14));
    expect(h[1]).toBe(h[2]);
  });

  it('is the identity in B·B⁻¹ on a random 400 × 12 score matrix, symmetric bit for bit', () => {
    const N = 400;
    const P = 12;
    let state = 12345;
    // Park & Miller (1988) minimal standard generator: a fixed, seeded matrix.
    const next = () => ((state = (state * 16807) % 2147483647) / 2147483647) * 2 - 1;
    const scores = Float64Array.from({ length: N * P }, next);
    const h = getBhhhInverseHessian(scores, N, P).inverseHessian!;
    const b = new Float64Array(P * P);
    for (let n = 0; n < N; n++)
      for (let i = 0; i < P; i++)
        for (let j = 0; j < P; j++) b[i * P + j] += scores[n * P + i] * scores[n * P + j];
    for (let i = 0; i < P; i++)
      for (let j = 0; j < P; j++) {
        let v = 0;
        for (let k = 0; k < P; k++) v += b[i * P + k] * h[k * P + j];
        // B is well conditioned here (N ≫ P, independent columns): error of order P·ε·cond(B).
        expect(Math.abs(v - (i === j ? 1 : 0))).toBeLessThan(1e-12);
        expect(h[i * P + j]).toBe(h[j * P + i]);
      }
  });

  it('gives no inverse, with a note, when two parameters have the same scores', () => {
    // Columns 1 and 2 equal: B has rank 2 of 3, so there is no inverse to start from.
    const scores = Float64Array.from([1, 2, 2, 0, 1, 1, 3, -1, -1, 2, 0, 0]);
    const start = getBhhhInverseHessian(scores, 4, 3);
    expect(start.inverseHessian).toBeNull();
    expect(start.note).toMatch(/singular.*scaled identity/);
  });
});
