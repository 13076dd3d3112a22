/**
 * The HB sampler's per-respondent design matrices, laid out for its inner loop: the rows of
 * respondent n (their non-chosen alternatives' x_j − x_chosen, choice-data.ts) start at
 * rowStart[n], and their columns of the random coefficients are stored column by column in one
 * contiguous block, random[(Kr·rowStart[n]) + r·R_n + i] = d_{n,i,r} (likewise `fixed` with Kf
 * columns). A change of one coefficient then updates the respondent's R_n utilities with one
 * stride-1 pass (an axpy), which keeps the loop free of the serial dot-product chains of the
 * row-major layout (the stride/offset convention of BLAS level 1, Lawson et al. 1979).
 */
import type { ChoiceData } from '../estimation/choice-data';
import type { HbLayout } from './check-hb-options';

export interface RespondentDesign {
  /** Length N+1: the rows of respondent n are rowStart[n] .. rowStart[n+1]−1. */
  rowStart: Int32Array;
  /** Column-major blocks of the random coefficients' columns (Kr per respondent). */
  random: Float64Array;
  /** Column-major blocks of the fixed coefficients' columns (Kf per respondent). */
  fixed: Float64Array;
  /** Largest R_n. */
  maxRows: number;
}

/** Builds the blocks from data whose K columns are the coefficients in layout order. */
export function buildRespondentDesign(data: ChoiceData, layout: HbLayout): RespondentDesign {
  const { diffs, diffStart, taskStart } = data;
  const N = taskStart.length - 1;
  const rowStart = new Int32Array(N + 1);
  for (let n = 0; n <= N; n++) rowStart[n] = diffStart[taskStart[n]];
  const rows = rowStart[N];
  let maxRows = 1;
  for (let n = 0; n < N; n++) maxRows = Math.max(maxRows, rowStart[n + 1] - rowStart[n]);
  return {
    rowStart,
    random: transposeBlocks(diffs, layout.K, layout.random, rowStart, rows),
    fixed: transposeBlocks(diffs, layout.K, layout.fixed, rowStart, rows),
    maxRows,
  };
}

function transposeBlocks(
  diffs: Float64Array,
  K: number,
  columns: Int32Array,
  rowStart: Int32Array,
  rows: number,
): Float64Array {
  const C = columns.length;
  const out = new Float64Array(rows * C);
  for (let n = 0; n + 1 < rowStart.length; n++) {
    const first = rowStart[n];
    const R = rowStart[n + 1] - first;
    const block = C * first;
    for (let c = 0; c < C; c++)
      for (let i = 0; i < R; i++) out[block + c * R + i] = diffs[(first + i) * K + columns[c]];
  }
  return out;
}

/**
 * u[uOffset + i] = v[vOffset + i] + Σ_c delta[c]·block[blockOffset + c·R + i] for i < R: the
 * utilities of one respondent after their coefficients change by `delta` (C of them).
 */
export function shiftUtilities(
  v: Float64Array,
  vOffset: number,
  block: Float64Array,
  blockOffset: number,
  delta: Float64Array,
  C: number,
  R: number,
  u: Float64Array,
  uOffset: number,
): void {
  // Four rows at a time in registers: each coefficient's column is read once, and the four sums
  // are independent, so the loop is not bound by one chain of dependent additions.
  let i = 0;
  for (; i + 4 <= R; i += 4) {
    let a0 = v[vOffset + i];
    let a1 = v[vOffset + i + 1];
    let a2 = v[vOffset + i + 2];
    let a3 = v[vOffset + i + 3];
    for (let c = 0, col = blockOffset + i; c < C; c++, col += R) {
      const d = delta[c];
      a0 += d * block[col];
      a1 += d * block[col + 1];
      a2 += d * block[col + 2];
      a3 += d * block[col + 3];
    }
    u[uOffset + i] = a0;
    u[uOffset + i + 1] = a1;
    u[uOffset + i + 2] = a2;
    u[uOffset + i + 3] = a3;
  }
  for (; i < R; i++) {
    let a = v[vOffset + i];
    for (let c = 0; c < C; c++) a += delta[c] * block[blockOffset + c * R + i];
    u[uOffset + i] = a;
  }
}
