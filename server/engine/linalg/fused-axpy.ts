/**
 * Fused multiply-accumulate of several strided streams into one:
 *   out[o + r] (=|+=) Σ_i coef[i] · src[offs[i] + r],  r = 0..length−1.
 * Summing up to eight sources per pass loads and stores `out` once per pass instead of
 * once per term (the loop fusion of BLAS-style kernels; cf. stdlib-js daxpy), which halves
 * the memory traffic of the utility and gradient loops of the mixed-logit kernel.
 */
export function fusedAxpy(
  out: Float64Array,
  o: number,
  src: Float64Array,
  coef: Float64Array,
  offs: Int32Array,
  count: number,
  length: number,
  assign: boolean,
): void {
  if (count === 0) {
    if (assign) out.fill(0, o, o + length);
    return;
  }
  let i = 0;
  // Each width has an assigning and an accumulating loop, written out twice on purpose: one
  // loop with the test inside would branch on every element, and zero-filling `out` before
  // accumulating would add a pass over it (the traffic this kernel exists to save).
  let first = assign;
  while (i < count) {
    // 5..8 remaining sources go in one eight-wide pass; missing ones get coefficient 0.
    const left = count - i;
    const m = left >= 5 ? Math.min(8, left) : left;
    if (m >= 5) {
      const c0 = coef[i],
        c1 = coef[i + 1],
        c2 = coef[i + 2],
        c3 = coef[i + 3];
      const c4 = coef[i + 4],
        c5 = m > 5 ? coef[i + 5] : 0,
        c6 = m > 6 ? coef[i + 6] : 0,
        c7 = m > 7 ? coef[i + 7] : 0;
      const s0 = offs[i],
        s1 = offs[i + 1],
        s2 = offs[i + 2],
        s3 = offs[i + 3];
      const s4 = offs[i + 4],
        s5 = m > 5 ? offs[i + 5] : s4,
        s6 = m > 6 ? offs[i + 6] : s4,
        s7 = m > 7 ? offs[i + 7] : s4;
      if (first) {
        for (let r = 0; r < length; r++) {
          out[o + r] =
            c0 * src[s0 + r] +
            c1 * src[s1 + r] +
            c2 * src[s2 + r] +
            c3 * src[s3 + r] +
            c4 * src[s4 + r] +
            c5 * src[s5 + r] +
            c6 * src[s6 + r] +
            c7 * src[s7 + r];
        }
      } else {
        for (let r = 0; r < length; r++) {
          out[o + r] +=
            c0 * src[s0 + r] +
            c1 * src[s1 + r] +
            c2 * src[s2 + r] +
            c3 * src[s3 + r] +
            c4 * src[s4 + r] +
            c5 * src[s5 + r] +
            c6 * src[s6 + r] +
            c7 * src[s7 + r];
        }
      }
    } else if (m === 4) {
      const c0 = coef[i],
        c1 = coef[i + 1],
        c2 = coef[i + 2],
        c3 = coef[i + 3];
      const s0 = offs[i],
        s1 = offs[i + 1],
        s2 = offs[i + 2],
        s3 = offs[i + 3];
      if (first)
        for (let r = 0; r < length; r++)
          out[o + r] = c0 * src[s0 + r] + c1 * src[s1 + r] + c2 * src[s2 + r] + c3 * src[s3 + r];
      else
        for (let r = 0; r < length; r++)
          out[o + r] += c0 * src[s0 + r] + c1 * src[s1 + r] + c2 * src[s2 + r] + c3 * src[s3 + r];
    } else if (m === 3) {
      const c0 = coef[i],
        c1 = coef[i + 1],
        c2 = coef[i + 2];
      const s0 = offs[i],
        s1 = offs[i + 1],
        s2 = offs[i + 2];
      if (first)
        for (let r = 0; r < length; r++)
          out[o + r] = c0 * src[s0 + r] + c1 * src[s1 + r] + c2 * src[s2 + r];
      else
        for (let r = 0; r < length; r++)
          out[o + r] += c0 * src[s0 + r] + c1 * src[s1 + r] + c2 * src[s2 + r];
    } else if (m === 2) {
      const c0 = coef[i],
        c1 = coef[i + 1];
      const s0 = offs[i],
        s1 = offs[i + 1];
      if (first) for (let r = 0; r < length; r++) out[o + r] = c0 * src[s0 + r] + c1 * src[s1 + r];
      else for (let r = 0; r < length; r++) out[o + r] += c0 * src[s0 + r] + c1 * src[s1 + r];
    } else {
      const c0 = coef[i];
      const s0 = offs[i];
      if (first) for (let r = 0; r < length; r++) out[o + r] = c0 * src[s0 + r];
      else for (let r = 0; r < length; r++) out[o + r] += c0 * src[s0 + r];
    }
    first = false;
    i += m;
  }
}
