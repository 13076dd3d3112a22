/**
 * Eigen-decomposition of a symmetric n×n matrix (row-major) through ml-matrix's symmetric
 * QL algorithm (tred2/tql2 of the EISPACK lineage; Wilkinson & Reinsch 1971). Eigenvalues come
 * in ascending order; column i of `vectors` (row-major n×n) belongs to values[i].
 */
import { EigenvalueDecomposition, Matrix } from 'ml-matrix';

export interface SymmetricEigen {
  values: Float64Array;
  /** n×n row-major; vectors[r * n + i] is component r of eigenvector i. */
  vectors: Float64Array;
}

export function decomposeSymmetric(a: Float64Array, n: number): SymmetricEigen {
  const rows: number[][] = [];
  for (let i = 0; i < n; i++) {
    const row: number[] = [];
    // Average with the transpose so tiny asymmetries from finite differences cannot matter.
    for (let j = 0; j < n; j++) row.push((a[i * n + j] + a[j * n + i]) / 2);
    rows.push(row);
  }
  const eig = new EigenvalueDecomposition(new Matrix(rows), { assumeSymmetric: true });
  const values = eig.realEigenvalues;
  const V = eig.eigenvectorMatrix;
  const order = values.map((_, i) => i).sort((x, y) => values[x] - values[y]);
  const out = { values: new Float64Array(n), vectors: new Float64Array(n * n) };
  order.forEach((src, i) => {
    out.values[i] = values[src];
    for (let r = 0; r < n; r++) out.vectors[r * n + i] = V.get(r, src);
  });
  return out;
}
