/**
 * invertLower on the lower-triangular matrix of ones, whose inverse is the bidiagonal matrix
 * with 1 on the diagonal and −1 just below it (closed form: (I − N)⁻¹ = I + N + N² + … for the
 * nilpotent shift N, so the ones matrix is (I − N)⁻¹ and its inverse is I − N). All entries
 * are small integers, so the result is exact in floating point.
 */
import { describe, expect, it } from 'vitest';
import { invertLower } from '../../../server/engine/linalg/triangular';

const n = 5;
const ones = () => {
  const L = new Float64Array(n * n);
  for (let i = 0; i < n; i++) for (let j = 0; j <= i; j++) L[i * n + j] = 1;
  return L;
};
const bidiagonal = () => {
  const X = new Float64Array(n * n);
  for (let i = 0; i < n; i++) {
    X[i * n + i] = 1;
    if (i > 0) X[i * n + i - 1] = -1;
  }
  return X;
};

describe('invertLower', () => {
  it('writes the inverse into another array, upper triangle zeroed', () => {
    const out = new Float64Array(n * n).fill(7);
    invertLower(ones(), n, out);
    expect(Array.from(out)).toEqual(Array.from(bidiagonal()));
  });

  it('inverts in place, leaving the strict upper triangle as it was', () => {
    const L = ones();
    for (let i = 0; i < n; i++) for (let j = i + 1; j < n; j++) L[i * n + j] = 9;
    invertLower(L, n, L);
    const expected = bidiagonal();
    for (let i = 0; i < n; i++) for (let j = i + 1; j < n; j++) expected[i * n + j] = 9;
    expect(Array.from(L)).toEqual(Array.from(expected));
  });
});
