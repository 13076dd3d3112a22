/**
 * WebAssembly SIMD kernel of the HB sampler's respondent step (server/engine/hb/individual-step.ts):
 * the proposal's utilities of one respondent, u_i = v_i + Σ_c δ_c·d_{i,c}, over its column-major
 * design block (server/engine/hb/respondent-design.ts), then e^{u_i} and each task's logit
 * denominator 1 + Σ_{i ∈ t} e^{u_i} (Train 2009, eq. 3.6 with utilities relative to the chosen
 * alternative). It is step for step the arithmetic of the TypeScript layer (shiftUtilities,
 * then computeLoglikOfUtilities up to the logarithm): each row's sum runs over c in the same
 * order, two rows per f64x2 lane pair (a multiply, then an add: WebAssembly does not fuse them),
 * expPair gives the bits of expTang, and each denominator adds its rows in row order, so the
 * chain is the same draw for draw. The logarithm stays with the caller (one per respondent).
 */
import { expFdlibm, logFdlibm } from './hb-fdlibm';
import { nextDouble, nextStandardNormal } from './hb-prng';
import { expPair } from './simd-math';

/**
 * Writes u (R values) from v, the block (C columns of R rows) and δ (C values); e^{u} into `ex`;
 * and for the T tasks whose row ends (relative to the respondent's first row) are the i32s at
 * `taskEnd`, each denominator into `den`. `table` holds the 256 doubles 2^(j/256).
 */
export function hbDenominators(
  block: usize,
  v: usize,
  delta: usize,
  C: i32,
  R: i32,
  u: usize,
  ex: usize,
  taskEnd: usize,
  T: i32,
  den: usize,
  table: usize,
): void {
  const colBytes = (<usize>R) << 3;
  let i = 0;
  // Eight rows (four lane pairs) per pass, then four: each coefficient's column entries are read
  // once, and the four independent sums keep the adder busy (each row's sum is still the same
  // sequence of operations).
  for (; i + 8 <= R; i += 8) {
    const at = (<usize>i) << 3;
    let a0 = v128.load(v + at);
    let a1 = v128.load(v + at + 16);
    let a2 = v128.load(v + at + 32);
    let a3 = v128.load(v + at + 48);
    let col = block + at;
    for (let c = 0; c < C; c++) {
      const d = f64x2.splat(load<f64>(delta + ((<usize>c) << 3)));
      a0 = f64x2.add(a0, f64x2.mul(d, v128.load(col)));
      a1 = f64x2.add(a1, f64x2.mul(d, v128.load(col + 16)));
      a2 = f64x2.add(a2, f64x2.mul(d, v128.load(col + 32)));
      a3 = f64x2.add(a3, f64x2.mul(d, v128.load(col + 48)));
      col += colBytes;
    }
    v128.store(u + at, a0);
    v128.store(u + at + 16, a1);
    v128.store(u + at + 32, a2);
    v128.store(u + at + 48, a3);
    v128.store(ex + at, expPair(a0, table));
    v128.store(ex + at + 16, expPair(a1, table));
    v128.store(ex + at + 32, expPair(a2, table));
    v128.store(ex + at + 48, expPair(a3, table));
  }
  for (; i + 4 <= R; i += 4) {
    const at = (<usize>i) << 3;
    let a0 = v128.load(v + at);
    let a1 = v128.load(v + at + 16);
    let col = block + at;
    for (let c = 0; c < C; c++) {
      const d = f64x2.splat(load<f64>(delta + ((<usize>c) << 3)));
      a0 = f64x2.add(a0, f64x2.mul(d, v128.load(col)));
      a1 = f64x2.add(a1, f64x2.mul(d, v128.load(col + 16)));
      col += colBytes;
    }
    v128.store(u + at, a0);
    v128.store(u + at + 16, a1);
    v128.store(ex + at, expPair(a0, table));
    v128.store(ex + at + 16, expPair(a1, table));
  }
  for (; i < R; i++) {
    const at = (<usize>i) << 3;
    let a = load<f64>(v + at);
    for (let c = 0; c < C; c++)
      a += load<f64>(delta + ((<usize>c) << 3)) * load<f64>(block + <usize>c * colBytes + at);
    store<f64>(u + at, a);
    // Lane 0 of a pair whose lane 1 is e^0: the same arithmetic as the pairs above.
    store<f64>(
      ex + at,
      f64x2.extract_lane(expPair(f64x2.replace_lane(f64x2.splat(0), 0, a), table), 0),
    );
  }
  let row = 0;
  for (let t = 0; t < T; t++) {
    const end = load<i32>(taskEnd + ((<usize>t) << 2));
    let denominator: f64 = 1;
    for (; row < end; row++) denominator += load<f64>(ex + ((<usize>row) << 3));
    store<f64>(den + ((<usize>t) << 3), denominator);
  }
}

/** Denominators whose product passes this move to the log scale (as sumLogDenominators). */
const FLUSH: f64 = 1e250;

/**
 * −Σ_t ln den_t as the TypeScript layer takes it (respondent-shift-kernel.ts, sumLogDenominators):
 * products of denominators, one logarithm per 1e250 of product.
 */
function sumLogDenominators(den: usize, T: i32): f64 {
  let ll: f64 = 0;
  let product: f64 = 1;
  for (let t = 0; t < T; t++) {
    product *= load<f64>(den + ((<usize>t) << 3));
    if (product > FLUSH) {
      ll -= logFdlibm(product);
      product = 1;
    }
  }
  return ll - logFdlibm(product);
}

/**
 * β of an α under transform code 0 (normal), 1 (lognormal) or 2 (negative lognormal). One call
 * of the exponential inside a branch: written as two returns, the optimiser turned them into a
 * select and evaluated both exponentials for every coefficient, normal ones included.
 */
function toBeta(transform: i32, alpha: f64): f64 {
  let beta = alpha;
  if (transform != 0) {
    beta = expFdlibm(alpha);
    if (transform == 2) beta = -beta;
  }
  return beta;
}

/**
 * One random-walk Metropolis–Hastings sweep over respondents n0 … n1−1, `steps` proposals each
 * (Train 2009, §12.6), step for step the arithmetic of the TypeScript layer
 * (server/engine/hb/individual-step.ts with random-walk-proposal.ts and the kernel above):
 *   w = L⁻¹(α_n − μ) by forward substitution, α' = α_n + ρ·L·z, ln φ(α')/φ(α_n) =
 *   −½(|w + ρz|² − |w|²), β' = T(α'), u = v_n + D_n(β' − β_n), ln P(y_n | β') from the
 *   denominators, accepted when ln U < ln P(y_n | β') − ln P(y_n | β_n) + ln φ(α')/φ(α_n).
 * The draws continue the TypeScript generator's stream from its state words at `prng`
 * (hb-prng.ts), in the order the TypeScript step takes them: the Kr normals of the proposal,
 * then U. On acceptance α_n, β_n, the kept utilities v_n and ln P(y_n | β_n) are updated.
 * Returns the accepted count. Layout (all doubles unless said): alpha, beta N × Kr; ll N; mu Kr;
 * L Kr × Kr row-major; transform Kr i32; rowStart and taskStart N + 1 i32; taskEnd one i32 per
 * task (row ends relative to the respondent's first row); scratch 4·Kr; vNew, ex max rows; den
 * max tasks; prng four u32.
 */
export function hbSweep(
  n0: i32,
  n1: i32,
  steps: i32,
  Kr: i32,
  rho: f64,
  block: usize,
  v: usize,
  ll: usize,
  alpha: usize,
  beta: usize,
  mu: usize,
  L: usize,
  prng: usize,
  transform: usize,
  rowStart: usize,
  taskStart: usize,
  taskEnd: usize,
  scratch: usize,
  delta: usize,
  vNew: usize,
  ex: usize,
  den: usize,
  table: usize,
): i32 {
  const kBytes = (<usize>Kr) << 3;
  const proposal = scratch;
  const w = scratch + kBytes;
  const betaNew = w + kBytes;
  const z = betaNew + kBytes;
  let moved = 0;
  for (let n = n0; n < n1; n++) {
    const a = alpha + <usize>n * kBytes;
    const b = beta + <usize>n * kBytes;
    const first = load<i32>(rowStart + ((<usize>n) << 2));
    const R = load<i32>(rowStart + ((<usize>(n + 1)) << 2)) - first;
    const firstTask = load<i32>(taskStart + ((<usize>n) << 2));
    const T = load<i32>(taskStart + ((<usize>(n + 1)) << 2)) - firstTask;
    const vn = v + ((<usize>first) << 3);
    const blockN = block + <usize>first * kBytes;
    const taskEndN = taskEnd + ((<usize>firstTask) << 2);
    const lln = ll + ((<usize>n) << 3);
    for (let repeat = 0; repeat < steps; repeat++) {
      for (let r = 0; r < Kr; r++) store<f64>(z + ((<usize>r) << 3), nextStandardNormal(prng));
      // w = L⁻¹(α_n − μ), forward substitution as solveLower.
      for (let i = 0; i < Kr; i++) {
        const row = L + <usize>i * kBytes;
        let s = load<f64>(a + ((<usize>i) << 3)) - load<f64>(mu + ((<usize>i) << 3));
        for (let k = 0; k < i; k++)
          s -= load<f64>(row + ((<usize>k) << 3)) * load<f64>(w + ((<usize>k) << 3));
        store<f64>(w + ((<usize>i) << 3), s / load<f64>(row + ((<usize>i) << 3)));
      }
      let qOld: f64 = 0;
      let qNew: f64 = 0;
      for (let r = 0; r < Kr; r++) {
        const at = (<usize>r) << 3;
        const wr = load<f64>(w + at);
        qOld += wr * wr;
        const wNew = wr + rho * load<f64>(z + at);
        qNew += wNew * wNew;
        const row = L + <usize>r * kBytes;
        let step: f64 = 0;
        for (let j = 0; j <= r; j++)
          step += load<f64>(row + ((<usize>j) << 3)) * load<f64>(z + ((<usize>j) << 3));
        const p = load<f64>(a + at) + rho * step;
        store<f64>(proposal + at, p);
        const bNew = toBeta(load<i32>(transform + ((<usize>r) << 2)), p);
        store<f64>(betaNew + at, bNew);
        store<f64>(delta + at, bNew - load<f64>(b + at));
      }
      const logPrior = -0.5 * (qNew - qOld);
      hbDenominators(blockN, vn, delta, Kr, R, vNew, ex, taskEndN, T, den, table);
      const llNew = sumLogDenominators(den, T);
      const logU = logFdlibm(nextDouble(prng));
      if (!(logU < llNew - load<f64>(lln) + logPrior)) continue;
      for (let r = 0; r < Kr; r++) {
        const at = (<usize>r) << 3;
        store<f64>(a + at, load<f64>(proposal + at));
        store<f64>(b + at, load<f64>(betaNew + at));
      }
      for (let i = 0; i < R; i++) {
        const at = (<usize>i) << 3;
        store<f64>(vn + at, load<f64>(vNew + at));
      }
      store<f64>(lln, llNew);
      moved++;
    }
  }
  return moved;
}

/** ln x by hb-fdlibm.ts, exported so the tests can compare its bits with Math.log. */
export function hbLog(x: f64): f64 {
  return logFdlibm(x);
}

/** e^x by hb-fdlibm.ts, exported so the tests can compare its bits with Math.exp. */
export function hbExp(x: f64): f64 {
  return expFdlibm(x);
}
