import { describe, expect, it } from 'vitest';
import { computeGaussHermite } from '../../../server/engine/linalg/gauss-hermite';

describe('computeGaussHermite (Golub-Welsch)', () => {
  // Abramowitz & Stegun Table 25.10 as listed in docs/methods.md "Estimation check values" ([C] numpy hermgauss; A&S
  // agrees to 15 digits as far as recalled, [M]). Listed to 15 significant digits.
  const table: Record<number, [number, number][]> = {
    2: [[0.707106781186548, 0.886226925452758]],
    3: [
      [0, 1.181635900603677],
      [1.224744871391589, 0.295408975150919],
    ],
    4: [
      [0.52464762327529, 0.804914090005513],
      [1.650680123885785, 0.081312835447245],
    ],
    5: [
      [0, 0.945308720482942],
      [0.958572464613819, 0.393619323152241],
      [2.020182870456086, 0.019953242059046],
    ],
    10: [
      [0.342901327223705, 0.610862633735326],
      [1.036610829789514, 0.240138611082315],
      [1.756683649299882, 0.033874394455481],
      [2.53273167423279, 0.001343645746781],
      [3.436159118837737, 7.64043285523264e-6],
    ],
  };

  it.each(Object.entries(table))('n = %s matches the table', (n, rows) => {
    const { nodes, weights } = computeGaussHermite(Number(n));
    for (const [x, w] of rows) {
      const i = nodes.findIndex((v) => Math.abs(v - x) < 1e-12);
      expect(i).toBeGreaterThanOrEqual(0);
      expect(Math.abs(weights[i] - w)).toBeLessThan(1e-15 + 1e-14 * w);
    }
  });

  it('integrates e^{−x²}·x^{2k} exactly for 2k < 2n: ∫ = Γ(k + ½)', () => {
    // Exactness of an n-point Gauss rule up to degree 2n − 1 (Golub & Welsch 1969).
    const { nodes, weights } = computeGaussHermite(20);
    const gammaHalf = [
      Math.sqrt(Math.PI),
      Math.sqrt(Math.PI) / 2,
      (3 * Math.sqrt(Math.PI)) / 4,
      (15 * Math.sqrt(Math.PI)) / 8,
    ];
    gammaHalf.forEach((expected, k) => {
      const sum = nodes.reduce((acc, x, i) => acc + weights[i] * x ** (2 * k), 0);
      expect(sum).toBeCloseTo(expected, 12);
    });
  });
});
