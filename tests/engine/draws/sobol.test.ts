import { describe, expect, it } from 'vitest';
import { createSobolDirections, sobolInteger } from '../../../server/engine/draws/sobol';

const toUnit = (x: number) => x / 4294967296;

describe('Sobol points (Joe & Kuo 2008 direction numbers, Gray-code order)', () => {
  // Reference: scipy 1.17.1 scipy.stats.qmc.Sobol(d, scramble=False).random(n), which uses the
  // same Joe-Kuo table (values printed by Python, row index = point index).
  const reference: Record<number, number[]> = {
    1: [0.5, 0.5, 0.5, 0.5, 0.5, 0.5, 0.5, 0.5],
    2: [0.75, 0.25, 0.25, 0.25, 0.75, 0.75, 0.25, 0.75],
    3: [0.25, 0.75, 0.75, 0.75, 0.25, 0.25, 0.75, 0.25],
    5: [0.875, 0.875, 0.125, 0.375, 0.875, 0.625, 0.875, 0.375],
    11: [0.4375, 0.5625, 0.1875, 0.6875, 0.8125, 0.0625, 0.6875, 0.6875],
    15: [0.0625, 0.9375, 0.5625, 0.3125, 0.6875, 0.1875, 0.8125, 0.3125],
  };

  it.each(Object.entries(reference))(
    'matches scipy at point %s in 8 dimensions',
    (index, expected) => {
      const dirs = createSobolDirections(8);
      expected.forEach((value, d) =>
        expect(toUnit(sobolInteger(Number(index), dirs[d]))).toBe(value),
      );
    },
  );

  it('matches scipy at point 1000 in dimensions 51..60', () => {
    // scipy 1.17.1 Sobol(d=60, scramble=False).random(1024)[1000][50:60]
    const expected = [
      0.3525390625, 0.5166015625, 0.7529296875, 0.4384765625, 0.1259765625, 0.8916015625,
      0.4541015625, 0.0791015625, 0.8837890625, 0.5712890625,
    ];
    const dirs = createSobolDirections(60);
    expected.forEach((value, i) => expect(toUnit(sobolInteger(1000, dirs[50 + i]))).toBe(value));
  });
});
