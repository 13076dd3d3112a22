/**
 * WebAssembly SIMD kernel of the simulated panel mixed-logit log-likelihood and its analytic
 * gradient: the same formulas as the TypeScript reference kernel
 * (server/engine/estimation/mixed-logit-kernel.ts; Train 2009, eq. 6.2 and §10.2),
 *   ln L_n = ln (1/R) Σ_r Π_t P_nt(β_r),  P_nt = 1/(1 + Σ_j e^{β_r·d_j}),
 *   ∂ln L_n/∂θ = Σ_r w_r Σ_t (−Σ_j P_ntj d_j)·∂β_r/∂θ,  w_r ∝ Π_t P_nt(β_r),
 * computed two draws per f64x2 lane pair. Draws are processed in blocks of DRAW_BLOCK (eight
 * draws, four f64x2 registers): for one block every task's utilities, probabilities and the
 * panel product stay in the first-level cache, and each utility is accumulated in registers
 * over the non-zero differences of its row. Everything the kernel reads and writes lives in
 * the one shared memory at addresses given by the slice's header (../arena-header.ts); the
 * kernel allocates nothing and keeps no state between calls.
 */
import {
  DIST_FIXED,
  DIST_LOGNORMAL,
  DIST_NEG_LOGNORMAL,
} from '../../estimation/distribution-codes';
import {
  DRAW_BLOCK,
  H_B,
  H_BLOCK,
  H_BLOCK_SIZE,
  H_CHOL_INDEX,
  H_COL_COEF,
  H_COL_NNZ,
  H_COL_OFF,
  H_COLUMN,
  H_COUNT,
  H_D,
  H_DIFF_START,
  H_DIFFS,
  H_DIMENSION,
  H_DIST,
  H_EXP_TABLE,
  H_FIRST,
  H_G,
  H_GN,
  H_GRAD,
  H_K,
  H_KD,
  H_LP,
  H_MAX_ROWS,
  H_MEAN_INDEX,
  H_P,
  H_R,
  H_ROW_COEF,
  H_ROW_NNZ,
  H_ROW_OFF,
  H_SCORES,
  H_SPREAD_INDEX,
  H_STRIDE,
  H_TASK_START,
  H_THETA,
  H_V,
  H_VARIATES,
  H_W,
  H_WG,
} from '../arena-header';
import { expPair, logScalar } from './simd-math';

/** Tasks multiplied on the probability scale before the product moves to the log scale. */
const LOG_CHUNK = 8;

function word(ctx: usize, field: i32): i32 {
  return load<i32>(ctx + ((<usize>field) << 2));
}

function addr(ctx: usize, field: i32): usize {
  return <usize>load<u32>(ctx + ((<usize>field) << 2));
}

function i32At(base: usize, i: i32): i32 {
  return load<i32>(base + ((<usize>i) << 2));
}

function f64At(base: usize, i: i32): f64 {
  return load<f64>(base + ((<usize>i) << 3));
}

/** Two standard variates (Float32) widened to an f64x2. */
function variatePair(at: usize): v128 {
  return f64x2.promote_low_f32x4(v128.load64_zero(at));
}

/** β_r of every coefficient for local respondent n into B (K × stride). */
function fillBetas(ctx: usize, n: i32): void {
  const K = word(ctx, H_K);
  const D = word(ctx, H_D);
  const stride = word(ctx, H_STRIDE);
  const theta = addr(ctx, H_THETA);
  const B = addr(ctx, H_B);
  const dist = addr(ctx, H_DIST);
  const dimension = addr(ctx, H_DIMENSION);
  const meanIndex = addr(ctx, H_MEAN_INDEX);
  const spreadIndex = addr(ctx, H_SPREAD_INDEX);
  const draws = addr(ctx, H_VARIATES) + ((<usize>n * <usize>D * <usize>stride) << 2);
  const table = addr(ctx, H_EXP_TABLE);
  const rowBytes = (<usize>stride) << 3;
  for (let k = 0; k < K; k++) {
    const out = B + <usize>k * rowBytes;
    const m = f64x2.splat(f64At(theta, i32At(meanIndex, k)));
    const code = i32At(dist, k);
    if (code == DIST_FIXED) {
      for (let r = 0; r < stride; r += 2) v128.store(out + ((<usize>r) << 3), m);
      continue;
    }
    const spread = i32At(spreadIndex, k);
    if (spread < 0) continue; // member of the correlated block, filled below
    const s = f64x2.splat(f64At(theta, spread));
    const eta = draws + ((<usize>i32At(dimension, k) * <usize>stride) << 2);
    for (let r = 0; r < stride; r += 2) {
      let b = f64x2.add(m, f64x2.mul(s, variatePair(eta + ((<usize>r) << 2))));
      if (code == DIST_LOGNORMAL) b = expPair(b, table);
      else if (code == DIST_NEG_LOGNORMAL) b = f64x2.neg(expPair(b, table));
      v128.store(out + ((<usize>r) << 3), b);
    }
  }
  const blockSize = word(ctx, H_BLOCK_SIZE);
  const block = addr(ctx, H_BLOCK);
  const cholIndex = addr(ctx, H_CHOL_INDEX);
  for (let i = 0; i < blockSize; i++) {
    const k = i32At(block, i);
    const out = B + <usize>k * rowBytes;
    const m = f64x2.splat(f64At(theta, i32At(meanIndex, k)));
    for (let r = 0; r < stride; r += 2) v128.store(out + ((<usize>r) << 3), m);
    for (let l = 0; l <= i; l++) {
      const c = f64x2.splat(f64At(theta, i32At(cholIndex, i * blockSize + l)));
      const eta = draws + ((<usize>i32At(dimension, i32At(block, l)) * <usize>stride) << 2);
      for (let r = 0; r < stride; r += 2) {
        const at = out + ((<usize>r) << 3);
        v128.store(
          at,
          f64x2.add(v128.load(at), f64x2.mul(c, variatePair(eta + ((<usize>r) << 2)))),
        );
      }
    }
  }
}

/**
 * Lists the non-zero differences of local respondent n's rows: by row (for utilities) and,
 * with the gradient, by coefficient (for G). Returns the respondent's first row.
 */
function indexRows(ctx: usize, n: i32, withGradient: bool): i32 {
  const K = word(ctx, H_K);
  const Kd = word(ctx, H_KD);
  const maxRows = word(ctx, H_MAX_ROWS);
  const stride = word(ctx, H_STRIDE);
  const g = word(ctx, H_FIRST) + n;
  const taskStart = addr(ctx, H_TASK_START);
  const diffStart = addr(ctx, H_DIFF_START);
  const diffs = addr(ctx, H_DIFFS);
  const column = addr(ctx, H_COLUMN);
  const rowNnz = addr(ctx, H_ROW_NNZ);
  const rowCoef = addr(ctx, H_ROW_COEF);
  const rowOff = addr(ctx, H_ROW_OFF);
  const rowBase = i32At(diffStart, i32At(taskStart, g));
  const rows = i32At(diffStart, i32At(taskStart, g + 1)) - rowBase;
  for (let i = 0; i < rows; i++) {
    const d = diffs + ((<usize>(rowBase + i) * <usize>Kd) << 3);
    let m = 0;
    for (let k = 0; k < K; k++) {
      const v = f64At(d, i32At(column, k));
      if (v == 0) continue;
      store<f64>(rowCoef + ((<usize>(i * K + m)) << 3), v);
      store<i32>(rowOff + ((<usize>(i * K + m)) << 2), k * stride * 8);
      m++;
    }
    store<i32>(rowNnz + ((<usize>i) << 2), m);
  }
  if (!withGradient) return rowBase;
  const colNnz = addr(ctx, H_COL_NNZ);
  const colCoef = addr(ctx, H_COL_COEF);
  const colOff = addr(ctx, H_COL_OFF);
  for (let k = 0; k < K; k++) {
    const col = i32At(column, k);
    let m = 0;
    for (let i = 0; i < rows; i++) {
      const v = f64At(diffs + ((<usize>(rowBase + i) * <usize>Kd) << 3), col);
      if (v == 0) continue;
      store<f64>(colCoef + ((<usize>(k * maxRows + m)) << 3), -v);
      store<i32>(colOff + ((<usize>(k * maxRows + m)) << 2), i * DRAW_BLOCK * 8);
      m++;
    }
    store<i32>(colNnz + ((<usize>k) << 2), m);
  }
  return rowBase;
}

/** Adds ln of each of the eight products at `prod` into `lp` and resets the products to 1. */
function foldProducts(prod: usize, lp: usize): void {
  for (let q = 0; q < DRAW_BLOCK; q++) {
    const at = (<usize>q) << 3;
    store<f64>(lp + at, load<f64>(lp + at) + logScalar(load<f64>(prod + at)));
    store<f64>(prod + at, 1);
  }
}

/**
 * For local respondent n (betas in B): lp (per draw ln Π_t P_nt) and, with the gradient,
 * G (K × stride: per draw Σ_t ∂ln P_nt/∂β = −Σ_t Σ_j P_ntj d_j), one block of draws at a time.
 */
function simulateTasks(ctx: usize, n: i32, withGradient: bool): void {
  const K = word(ctx, H_K);
  const stride = word(ctx, H_STRIDE);
  const maxRows = word(ctx, H_MAX_ROWS);
  const g = word(ctx, H_FIRST) + n;
  const taskStart = addr(ctx, H_TASK_START);
  const diffStart = addr(ctx, H_DIFF_START);
  const B = addr(ctx, H_B);
  const G = addr(ctx, H_G);
  const V = addr(ctx, H_V);
  const lpAll = addr(ctx, H_LP);
  const table = addr(ctx, H_EXP_TABLE);
  const rowNnz = addr(ctx, H_ROW_NNZ);
  const rowCoef = addr(ctx, H_ROW_COEF);
  const rowOff = addr(ctx, H_ROW_OFF);
  const colNnz = addr(ctx, H_COL_NNZ);
  const colCoef = addr(ctx, H_COL_COEF);
  const colOff = addr(ctx, H_COL_OFF);
  const rowBase = indexRows(ctx, n, withGradient);
  const t0 = i32At(taskStart, g);
  const t1 = i32At(taskStart, g + 1);
  // Products of the block live in the gradient workspace's scratch (W), eight doubles.
  const prod = addr(ctx, H_WG);
  const one = f64x2.splat(1);
  for (let r0 = 0; r0 < stride; r0 += DRAW_BLOCK) {
    const b0 = B + ((<usize>r0) << 3);
    const lp = lpAll + ((<usize>r0) << 3);
    for (let q = 0; q < DRAW_BLOCK; q++) {
      store<f64>(lp + ((<usize>q) << 3), 0);
      store<f64>(prod + ((<usize>q) << 3), 1);
    }
    let sinceLog = 0;
    for (let t = t0; t < t1; t++) {
      const i0 = i32At(diffStart, t) - rowBase;
      const i1 = i32At(diffStart, t + 1) - rowBase;
      let d0 = one;
      let d1 = one;
      let d2 = one;
      let d3 = one;
      for (let i = i0; i < i1; i++) {
        let a0 = f64x2.splat(0);
        let a1 = a0;
        let a2 = a0;
        let a3 = a0;
        const nnz = i32At(rowNnz, i);
        const coefs = rowCoef + ((<usize>(i * K)) << 3);
        const offs = rowOff + ((<usize>(i * K)) << 2);
        for (let q = 0; q < nnz; q++) {
          const c = f64x2.splat(f64At(coefs, q));
          const src = b0 + <usize>i32At(offs, q);
          a0 = f64x2.add(a0, f64x2.mul(c, v128.load(src)));
          a1 = f64x2.add(a1, f64x2.mul(c, v128.load(src, 16)));
          a2 = f64x2.add(a2, f64x2.mul(c, v128.load(src, 32)));
          a3 = f64x2.add(a3, f64x2.mul(c, v128.load(src, 48)));
        }
        a0 = expPair(a0, table);
        a1 = expPair(a1, table);
        a2 = expPair(a2, table);
        a3 = expPair(a3, table);
        d0 = f64x2.add(d0, a0);
        d1 = f64x2.add(d1, a1);
        d2 = f64x2.add(d2, a2);
        d3 = f64x2.add(d3, a3);
        if (withGradient) {
          const v = V + ((<usize>(i * DRAW_BLOCK)) << 3);
          v128.store(v, a0);
          v128.store(v, a1, 16);
          v128.store(v, a2, 32);
          v128.store(v, a3, 48);
        }
      }
      // P_chosen = 1/den; the rows' e^v become P_j = e^v/den.
      d0 = f64x2.div(one, d0);
      d1 = f64x2.div(one, d1);
      d2 = f64x2.div(one, d2);
      d3 = f64x2.div(one, d3);
      v128.store(prod, f64x2.mul(v128.load(prod), d0));
      v128.store(prod, f64x2.mul(v128.load(prod, 16), d1), 16);
      v128.store(prod, f64x2.mul(v128.load(prod, 32), d2), 32);
      v128.store(prod, f64x2.mul(v128.load(prod, 48), d3), 48);
      if (withGradient) {
        for (let i = i0; i < i1; i++) {
          const v = V + ((<usize>(i * DRAW_BLOCK)) << 3);
          v128.store(v, f64x2.mul(v128.load(v), d0));
          v128.store(v, f64x2.mul(v128.load(v, 16), d1), 16);
          v128.store(v, f64x2.mul(v128.load(v, 32), d2), 32);
          v128.store(v, f64x2.mul(v128.load(v, 48), d3), 48);
        }
      }
      if (++sinceLog == LOG_CHUNK) {
        foldProducts(prod, lp);
        sinceLog = 0;
      }
    }
    if (sinceLog > 0) foldProducts(prod, lp);
    if (!withGradient) continue;
    // G_k = −Σ_rows d_k P_row for this block of draws.
    for (let k = 0; k < K; k++) {
      let g0 = f64x2.splat(0);
      let g1 = g0;
      let g2 = g0;
      let g3 = g0;
      const nnz = i32At(colNnz, k);
      const coefs = colCoef + ((<usize>(k * maxRows)) << 3);
      const offs = colOff + ((<usize>(k * maxRows)) << 2);
      for (let q = 0; q < nnz; q++) {
        const c = f64x2.splat(f64At(coefs, q));
        const src = V + <usize>i32At(offs, q);
        g0 = f64x2.add(g0, f64x2.mul(c, v128.load(src)));
        g1 = f64x2.add(g1, f64x2.mul(c, v128.load(src, 16)));
        g2 = f64x2.add(g2, f64x2.mul(c, v128.load(src, 32)));
        g3 = f64x2.add(g3, f64x2.mul(c, v128.load(src, 48)));
      }
      const out = G + ((<usize>(k * stride + r0)) << 3);
      v128.store(out, g0);
      v128.store(out, g1, 16);
      v128.store(out, g2, 32);
      v128.store(out, g3, 48);
    }
  }
}

/** Normalised weights into W (zero past R); returns ln L_n, −∞ if every draw underflows. */
function normaliseWeights(ctx: usize): f64 {
  const R = word(ctx, H_R);
  const stride = word(ctx, H_STRIDE);
  const lp = addr(ctx, H_LP);
  const w = addr(ctx, H_W);
  const table = addr(ctx, H_EXP_TABLE);
  let max = -Infinity;
  for (let r = 0; r < R; r++) {
    const v = f64At(lp, r);
    if (v > max) max = v;
  }
  if (max == -Infinity) return -Infinity;
  const shift = f64x2.splat(max);
  for (let r = 0; r < stride; r += 2) {
    const at = (<usize>r) << 3;
    v128.store(w + at, expPair(f64x2.sub(v128.load(lp + at), shift), table));
  }
  for (let r = R; r < stride; r++) store<f64>(w + ((<usize>r) << 3), 0);
  let sum = 0.0;
  for (let r = 0; r < R; r++) sum += f64At(w, r);
  const inv = f64x2.splat(1 / sum);
  for (let r = 0; r < stride; r += 2) {
    const at = w + ((<usize>r) << 3);
    v128.store(at, f64x2.mul(v128.load(at), inv));
  }
  return max + logScalar(sum / <f64>R);
}

function sumLanes(a: v128, b: v128): f64 {
  const s = f64x2.add(a, b);
  return f64x2.extract_lane(s, 0) + f64x2.extract_lane(s, 1);
}

/** Σ_r x_r·η_r over the stride (x Float64, η Float32 variates). */
function dotVariates(x: usize, eta: usize, stride: i32): f64 {
  let s0 = f64x2.splat(0);
  let s1 = s0;
  for (let r = 0; r < stride; r += 4) {
    s0 = f64x2.add(
      s0,
      f64x2.mul(v128.load(x + ((<usize>r) << 3)), variatePair(eta + ((<usize>r) << 2))),
    );
    s1 = f64x2.add(
      s1,
      f64x2.mul(v128.load(x + ((<usize>r) << 3), 16), variatePair(eta + ((<usize>r) << 2) + 8)),
    );
  }
  return sumLanes(s0, s1);
}

/** One respondent's gradient Σ_r w_r G_r ∂β_r/∂θ into GN (P). */
function accumulateGradient(ctx: usize, n: i32): void {
  const K = word(ctx, H_K);
  const D = word(ctx, H_D);
  const P = word(ctx, H_P);
  const stride = word(ctx, H_STRIDE);
  const B = addr(ctx, H_B);
  const G = addr(ctx, H_G);
  const w = addr(ctx, H_W);
  const wg = addr(ctx, H_WG);
  const gn = addr(ctx, H_GN);
  const dist = addr(ctx, H_DIST);
  const dimension = addr(ctx, H_DIMENSION);
  const meanIndex = addr(ctx, H_MEAN_INDEX);
  const spreadIndex = addr(ctx, H_SPREAD_INDEX);
  const draws = addr(ctx, H_VARIATES) + ((<usize>n * <usize>D * <usize>stride) << 2);
  const rowBytes = (<usize>stride) << 3;
  memory.fill(gn, 0, (<usize>P) << 3);
  for (let k = 0; k < K; k++) {
    const gk = G + <usize>k * rowBytes;
    const bk = B + <usize>k * rowBytes;
    const code = i32At(dist, k);
    const lognormal = code == DIST_LOGNORMAL || code == DIST_NEG_LOGNORMAL;
    // x_r = w_r G_r (× β_r for the lognormals, whose ∂β/∂b = β).
    let m0 = f64x2.splat(0);
    let m1 = m0;
    for (let r = 0; r < stride; r += 4) {
      const at = (<usize>r) << 3;
      let x0 = f64x2.mul(v128.load(w + at), v128.load(gk + at));
      let x1 = f64x2.mul(v128.load(w + at, 16), v128.load(gk + at, 16));
      if (lognormal) {
        x0 = f64x2.mul(x0, v128.load(bk + at));
        x1 = f64x2.mul(x1, v128.load(bk + at, 16));
      }
      v128.store(wg + at, x0);
      v128.store(wg + at, x1, 16);
      m0 = f64x2.add(m0, x0);
      m1 = f64x2.add(m1, x1);
    }
    const mi = gn + ((<usize>i32At(meanIndex, k)) << 3);
    store<f64>(mi, load<f64>(mi) + sumLanes(m0, m1));
    const spread = i32At(spreadIndex, k);
    if (code == DIST_FIXED || spread < 0) continue;
    const eta = draws + ((<usize>i32At(dimension, k) * <usize>stride) << 2);
    const si = gn + ((<usize>spread) << 3);
    store<f64>(si, load<f64>(si) + dotVariates(wg, eta, stride));
  }
  const blockSize = word(ctx, H_BLOCK_SIZE);
  const block = addr(ctx, H_BLOCK);
  const cholIndex = addr(ctx, H_CHOL_INDEX);
  for (let i = 0; i < blockSize; i++) {
    const gk = G + <usize>i32At(block, i) * rowBytes;
    for (let r = 0; r < stride; r += 2) {
      const at = (<usize>r) << 3;
      v128.store(wg + at, f64x2.mul(v128.load(w + at), v128.load(gk + at)));
    }
    for (let l = 0; l <= i; l++) {
      const eta = draws + ((<usize>i32At(dimension, i32At(block, l)) * <usize>stride) << 2);
      const ci = gn + ((<usize>i32At(cholIndex, i * blockSize + l)) << 3);
      store<f64>(ci, load<f64>(ci) + dotVariates(wg, eta, stride));
    }
  }
}

/**
 * Σ_n ln L_n over the slice at θ (header's THETA); writes the gradient to GRAD and, when
 * withScores, each respondent's gradient to SCORES (count × P).
 */
export function evaluate(ctx: usize, withScores: i32): f64 {
  const count = word(ctx, H_COUNT);
  const P = word(ctx, H_P);
  const grad = addr(ctx, H_GRAD);
  const gn = addr(ctx, H_GN);
  const scores = addr(ctx, H_SCORES);
  memory.fill(grad, 0, (<usize>P) << 3);
  let ll = 0.0;
  for (let n = 0; n < count; n++) {
    fillBetas(ctx, n);
    simulateTasks(ctx, n, true);
    const lnL = normaliseWeights(ctx);
    ll += lnL;
    if (lnL == -Infinity) {
      if (withScores) memory.fill(scores + ((<usize>n * <usize>P) << 3), 0, (<usize>P) << 3);
      continue;
    }
    accumulateGradient(ctx, n);
    for (let p = 0; p < P; p++) {
      const at = (<usize>p) << 3;
      store<f64>(grad + at, load<f64>(grad + at) + load<f64>(gn + at));
    }
    if (withScores) memory.copy(scores + ((<usize>n * <usize>P) << 3), gn, (<usize>P) << 3);
  }
  return ll;
}

/**
 * For local respondent n at θ: fills B with β_r (K × stride) and W with the normalised
 * weights (used by the taste profiles); returns ln L_n.
 */
export function simulate(ctx: usize, n: i32): f64 {
  fillBetas(ctx, n);
  simulateTasks(ctx, n, false);
  return normaliseWeights(ctx);
}
