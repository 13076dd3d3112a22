import { describe, expect, it } from 'vitest';
import { pearsonCorrelation } from '@shared/engine/stats/pearson-correlation';

describe('pearsonCorrelation', () => {
  it("matches Anscombe's (1973) first data set, r = 0.816 (Python statistics.correlation: 0.81642051634484)", () => {
    const x = [10, 8, 13, 9, 11, 14, 6, 4, 12, 7, 5];
    const y = [8.04, 6.95, 7.58, 8.81, 8.33, 9.96, 7.24, 4.26, 10.84, 4.82, 5.68];
    // Double-precision two-pass sums on 11 values: agreement to ~1e-14.
    expect(pearsonCorrelation(x, y)).toBeCloseTo(0.81642051634484, 12);
  });

  it('is exactly ±1 for a linear relation, unchanged by a large common offset', () => {
    const x = [1, 2, 3, 4, 5].map((v) => v + 1e6);
    expect(
      pearsonCorrelation(
        x,
        x.map((v) => 3 - 2 * v),
      ),
    ).toBeCloseTo(-1, 10);
  });

  it('is null for fewer than 3 pairs or a constant side', () => {
    expect(pearsonCorrelation([1, 2], [2, 3])).toBeNull();
    expect(pearsonCorrelation([1, 2, 3, 4], [5, 5, 5, 5])).toBeNull();
  });
});
