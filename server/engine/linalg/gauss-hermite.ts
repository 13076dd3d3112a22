/**
 * Gauss-Hermite nodes and weights for ∫ e^{−x²} f(x) dx ≈ Σ w_i f(x_i), by the Golub-Welsch
 * algorithm (G. H. Golub and J. H. Welsch, "Calculation of Gauss quadrature rules", Math.
 * Comp. 23:221-230, 1969): nodes are the eigenvalues of the symmetric tridiagonal Jacobi
 * matrix with zero diagonal and off-diagonal √(i/2), weights √π·v_{0i}² from the first
 * components of its eigenvectors; the eigenproblem is solved by the implicit QL method with
 * Wilkinson shifts (tql2; Bowdler, Martin, Reinsch & Wilkinson 1968). Nodes ascending.
 */
export function computeGaussHermite(n: number): { nodes: Float64Array; weights: Float64Array } {
  if (!Number.isInteger(n) || n < 1 || n > 400)
    throw new RangeError('n must be an integer in 1..400');
  const d = new Float64Array(n);
  const e = new Float64Array(n);
  for (let i = 0; i < n - 1; i++) e[i] = Math.sqrt((i + 1) / 2);
  // z holds the eigenvectors (row k, column j); only row 0 is needed but rotations mix rows.
  const z = new Float64Array(n * n);
  for (let i = 0; i < n; i++) z[i * n + i] = 1;
  for (let l = 0; l < n; l++) {
    for (let iter = 0; ; iter++) {
      let m = l;
      for (; m < n - 1; m++) {
        const dd = Math.abs(d[m]) + Math.abs(d[m + 1]);
        if (Math.abs(e[m]) <= Number.EPSILON * dd) break;
      }
      if (m === l) break;
      if (iter === 60) throw new Error('Gauss-Hermite eigenvalues did not converge');
      let g = (d[l + 1] - d[l]) / (2 * e[l]);
      let r = Math.hypot(g, 1);
      g = d[m] - d[l] + e[l] / (g + (g >= 0 ? r : -r));
      let s = 1;
      let c = 1;
      let p = 0;
      let i = m - 1;
      for (; i >= l; i--) {
        const f = s * e[i];
        const b = c * e[i];
        r = Math.hypot(f, g);
        e[i + 1] = r;
        if (r === 0) {
          d[i + 1] -= p;
          e[m] = 0;
          break;
        }
        s = f / r;
        c = g / r;
        g = d[i + 1] - p;
        r = (d[i] - g) * s + 2 * c * b;
        p = s * r;
        d[i + 1] = g + p;
        g = c * r - b;
        for (let k = 0; k < n; k++) {
          const t = z[k * n + i + 1];
          z[k * n + i + 1] = s * z[k * n + i] + c * t;
          z[k * n + i] = c * z[k * n + i] - s * t;
        }
      }
      if (r === 0 && i >= l) continue;
      d[l] -= p;
      e[l] = g;
      e[m] = 0;
    }
  }
  const order = Array.from({ length: n }, (_, j) => j).sort((a, b) => d[a] - d[b]);
  const nodes = Float64Array.from(order, (j) => d[j]);
  const weights = Float64Array.from(order, (j) => Math.sqrt(Math.PI) * z[j] ** 2);
  // Symmetric rule: force exact symmetry of nodes so odd moments vanish to rounding.
  for (let j = 0; j < Math.floor(n / 2); j++) {
    const x = (nodes[n - 1 - j] - nodes[j]) / 2;
    nodes[j] = -x;
    nodes[n - 1 - j] = x;
    const w = (weights[j] + weights[n - 1 - j]) / 2;
    weights[j] = w;
    weights[n - 1 - j] = w;
  }
  if (n % 2 === 1) nodes[(n - 1) / 2] = 0;
  return { nodes, weights };
}
