/**
 * Pearson correlations between coded columns over the designed alternatives' rows (the
 * opt-out / status quo row is constant and left out). A column without variation gets null.
 */
export function getColumnCorrelations(
  K: number,
  rowsPerTask: number,
  designedPerTask: number,
  S: number,
  x: Float64Array,
): (number | null)[][] {
  const n = S * designedPerTask;
  const mean = new Float64Array(K);
  const forEachRow = (f: (offset: number) => void) => {
    for (let s = 0; s < S; s++)
      for (let j = 0; j < designedPerTask; j++) f((s * rowsPerTask + j) * K);
  };
  forEachRow((o) => {
    for (let k = 0; k < K; k++) mean[k] += x[o + k] / n;
  });
  const cov = new Float64Array(K * K);
  forEachRow((o) => {
    for (let i = 0; i < K; i++) {
      const di = x[o + i] - mean[i];
      for (let k = 0; k <= i; k++) cov[i * K + k] += di * (x[o + k] - mean[k]);
    }
  });
  const out: (number | null)[][] = [];
  for (let i = 0; i < K; i++) {
    out.push([]);
    for (let k = 0; k < K; k++) {
      const c = i >= k ? cov[i * K + k] : cov[k * K + i];
      const denominator = Math.sqrt(cov[i * K + i] * cov[k * K + k]);
      // Relative threshold: a column of identical values has rounding-level variance.
      out[i].push(denominator > 1e-12 ? c / denominator : null);
    }
  }
  return out;
}
