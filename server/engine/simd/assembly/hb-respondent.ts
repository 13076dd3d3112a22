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
  // Four rows (two lane pairs) per pass: each coefficient's column entry is read once.
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
