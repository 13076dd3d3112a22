/**
 * Elementary functions of the WebAssembly kernel (AssemblyScript; WebAssembly has no exp or
 * log instruction).
 *
 * expPair: e^x of both lanes of an f64x2 by Tang's table-driven method (P. T. P. Tang, ACM
 * TOMS 15(2):144-157, 1989), step for step the same arithmetic as expStream in
 * server/engine/linalg/exp-stream.ts, so both kernels give the same bits: x clamped to
 * [−700, 700], k = ⌊x·256/ln2 + ½⌋ (through the same shifted truncation), r = x − k·c_hi −
 * k·c_lo, p(r) the degree-4 Taylor polynomial, e^x = p · 2^(j/256) · 2^m with j = k mod 256,
 * m = ⌊k/256⌋. The table entry is gathered lane by lane; 2^m is added to its exponent bits
 * (exact, the product stays normal for |x| ≤ 700).
 *
 * logScalar: ln x = e·ln2 + 2·atanh(s), x = 2^e·m with m in [√½, √2), s = (m − 1)/(m + 1),
 * |s| ≤ 0.1716, atanh by its Taylor series s + s³/3 + … + s¹⁹/19 (truncation < 3e-17
 * relative), ln2 split in two parts (Cody & Waite 1980) so e·ln2 is exact to 1e-19.
 */
const INV_STEP: f64 = 256 / 0.6931471805599453;
const STEP_HI: f64 = 0.6931471803691238 / 256;
const STEP_LO: f64 = 1.9082149292705877e-10 / 256;
const SHIFT: f64 = 1048576;
const LN2_HI: f64 = 0.6931471803691238;
const LN2_LO: f64 = 1.9082149292705877e-10;

/** e^x of both lanes; `table` is the address of the 256 doubles 2^(j/256). */
export function expPair(x: v128, table: usize): v128 {
  const v = f64x2.pmin(f64x2.pmax(x, f64x2.splat(-700)), f64x2.splat(700));
  const t = f64x2.sub(
    f64x2.floor(f64x2.add(f64x2.mul(v, f64x2.splat(INV_STEP)), f64x2.splat(SHIFT + 0.5))),
    f64x2.splat(SHIFT),
  );
  const r = f64x2.sub(
    f64x2.sub(v, f64x2.mul(t, f64x2.splat(STEP_HI))),
    f64x2.mul(t, f64x2.splat(STEP_LO)),
  );
  let p = f64x2.add(f64x2.splat(1.0 / 6.0), f64x2.mul(r, f64x2.splat(1.0 / 24.0)));
  p = f64x2.add(f64x2.splat(0.5), f64x2.mul(r, p));
  p = f64x2.add(f64x2.splat(1), f64x2.mul(r, p));
  p = f64x2.add(f64x2.splat(1), f64x2.mul(r, p));
  const k = i32x4.trunc_sat_f64x2_s_zero(t);
  const j0 = <usize>(i32x4.extract_lane(k, 0) & 255);
  const j1 = <usize>(i32x4.extract_lane(k, 1) & 255);
  let scaled = v128.load64_zero(table + (j0 << 3));
  scaled = v128.load64_lane(table + (j1 << 3), scaled, 1);
  const m = i64x2.extend_low_i32x4_s(i32x4.shr_s(k, 8));
  scaled = i64x2.add(scaled, i64x2.shl(m, 52));
  return f64x2.mul(p, scaled);
}

/** Natural logarithm of x ≥ 0 (0 → −∞, +∞ → +∞, NaN → NaN). */
export function logScalar(x: f64): f64 {
  if (!(x > 0)) return x == 0 ? -Infinity : NaN;
  if (x == Infinity) return x;
  let e: i64 = 0;
  let bits = reinterpret<i64>(x);
  if (bits < 0x0010000000000000) {
    // subnormal: scale into the normal range first
    bits = reinterpret<i64>(x * 18014398509481984.0); // 2^54
    e = -54;
  }
  e += ((bits >> 52) & 0x7ff) - 1023;
  let m = reinterpret<f64>((bits & 0x000fffffffffffff) | 0x3ff0000000000000);
  if (m > 1.4142135623730951) {
    m *= 0.5;
    e += 1;
  }
  const s = (m - 1) / (m + 1);
  const z = s * s;
  let q = 1.0 / 19.0;
  q = 1.0 / 17.0 + z * q;
  q = 1.0 / 15.0 + z * q;
  q = 1.0 / 13.0 + z * q;
  q = 1.0 / 11.0 + z * q;
  q = 1.0 / 9.0 + z * q;
  q = 1.0 / 7.0 + z * q;
  q = 1.0 / 5.0 + z * q;
  q = 1.0 / 3.0 + z * q;
  const atanh2 = 2 * s + 2 * s * (z * q);
  const ef = <f64>e;
  return ef * LN2_HI + (atanh2 + ef * LN2_LO);
}
