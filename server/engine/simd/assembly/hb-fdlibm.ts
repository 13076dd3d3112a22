/* eslint-disable no-loss-of-precision -- fdlibm and AS241 coefficients are kept verbatim as published (more digits than a double holds). */
/**
 * The natural logarithm and exponential of the HB respondent sweep (hb-respondent.ts), by the
 * algorithms of fdlibm 5.3 (Sun Microsystems 1993; K. C. Ng, e_log.c and e_exp.c): the same
 * argument reductions, minimax polynomials and order of operations, so they return the bits of
 * V8's Math.log and Math.exp, which are ports of the same routines. The TypeScript layer of the
 * sampler calls Math.log and Math.exp, and the chain must be the same draw for draw on either
 * layer: tests/engine/hb/hb-fdlibm.test.ts compares both functions with Math bit for bit.
 *
 * log: x = 2^k·(1 + f) with 1 + f in [√2/2, √2), s = f/(2 + f), ln(1 + f) = f − s·(f − R(s²))
 * with R the degree-14 Remez polynomial Lg1·z + … + Lg7·z⁷ (error < 2^−58.45), ln 2 split in
 * a high part with trailing zeros and a low part so k·ln2_hi is exact.
 * exp: x = k·ln2 + r, |r| ≤ ln2/2, e^r = 1 + r + r·c(r)/(2 − c(r)) with the degree-5 Remez
 * polynomial c (error < 2^−59), scaled by 2^k through the exponent bits; e^1 is Math.E exactly,
 * as V8 special-cases it.
 */
const LN2_HI: f64 = 6.9314718036912381649e-1;
const LN2_LO: f64 = 1.90821492927058770002e-10;
const TWO54: f64 = 1.8014398509481984e16;
const LG1: f64 = 6.66666666666673513e-1;
const LG2: f64 = 3.999999999940941908e-1;
const LG3: f64 = 2.857142874366239149e-1;
const LG4: f64 = 2.222219843214978396e-1;
const LG5: f64 = 1.818357216161805012e-1;
const LG6: f64 = 1.531383769920937332e-1;
const LG7: f64 = 1.479819860511658591e-1;

const O_THRESHOLD: f64 = 7.09782712893383973096e2;
const U_THRESHOLD: f64 = -7.4513321910194110842e2;
const INV_LN2: f64 = 1.442695040888963387;
const P1: f64 = 1.66666666666666019037e-1;
const P2: f64 = -2.77777777770155933842e-3;
const P3: f64 = 6.61375632143793436117e-5;
const P4: f64 = -1.6533902205465251539e-6;
const P5: f64 = 4.13813679705723846039e-8;
/** 2^−1000 and 2^1023, for results whose scale leaves the normal range. */
const TWO_M1000: f64 = 9.332636185032189e-302;
const TWO_1023: f64 = 8.98846567431158e307;
const E: f64 = 2.718281828459045;

/** Builds a double from its high and low 32-bit words. */
function fromWords(hi: u32, lo: u32): f64 {
  return reinterpret<f64>(((<u64>hi) << 32) | (<u64>lo));
}

/** ln x (−∞ at 0, NaN below 0, x itself at +∞ and NaN). */
export function logFdlibm(x: f64): f64 {
  let bits = reinterpret<u64>(x);
  let hx = <i32>(bits >> 32);
  const lx = <u32>bits;
  let k: i32 = 0;
  if (hx < 0x00100000) {
    if (((hx & 0x7fffffff) | lx) == 0) return -Infinity;
    if (hx < 0) return NaN;
    // Subnormal: scale into the normal range.
    k -= 54;
    x *= TWO54;
    bits = reinterpret<u64>(x);
    hx = <i32>(bits >> 32);
  }
  if (hx >= 0x7ff00000) return x + x;
  k += (hx >> 20) - 1023;
  hx &= 0x000fffff;
  const i = (hx + 0x95f64) & 0x100000;
  // Normalise the mantissa into [√2/2, √2) (x or x/2).
  x = fromWords(<u32>(hx | (i ^ 0x3ff00000)), <u32>bits);
  k += i >> 20;
  const f = x - 1.0;
  if ((0x000fffff & (2 + hx)) < 3) {
    // |f| < 2^−20.
    if (f == 0) {
      if (k == 0) return 0;
      const dk = <f64>k;
      return dk * LN2_HI + dk * LN2_LO;
    }
    const r = f * f * (0.5 - 0.33333333333333333 * f);
    if (k == 0) return f - r;
    const dk = <f64>k;
    return dk * LN2_HI - (r - dk * LN2_LO - f);
  }
  const s = f / (2.0 + f);
  const dk = <f64>k;
  const z = s * s;
  let lowPart = hx - 0x6147a;
  const w = z * z;
  const highPart = 0x6b851 - hx;
  const t1 = w * (LG2 + w * (LG4 + w * LG6));
  const t2 = z * (LG1 + w * (LG3 + w * (LG5 + w * LG7)));
  lowPart |= highPart;
  const r = t2 + t1;
  if (lowPart > 0) {
    const hfsq = 0.5 * f * f;
    if (k == 0) return f - (hfsq - s * (hfsq + r));
    return dk * LN2_HI - (hfsq - (s * (hfsq + r) + dk * LN2_LO) - f);
  }
  if (k == 0) return f - s * (f - r);
  return dk * LN2_HI - (s * (f - r) - dk * LN2_LO - f);
}

/** e^x (+∞ above the overflow threshold, 0 below the underflow one, NaN for NaN). */
export function expFdlibm(x: f64): f64 {
  const bits = reinterpret<u64>(x);
  let hx = <u32>(bits >> 32);
  const negative = hx >> 31 != 0;
  hx &= 0x7fffffff;
  if (hx >= 0x40862e42) {
    // |x| ≥ 709.78…
    if (hx >= 0x7ff00000) {
      if (((hx & 0xfffff) | (<u32>bits)) != 0) return x + x;
      return negative ? 0.0 : x;
    }
    if (x > O_THRESHOLD) return Infinity;
    if (x < U_THRESHOLD) return 0.0;
  }
  let hi: f64 = 0;
  let lo: f64 = 0;
  let k: i32 = 0;
  if (hx > 0x3fd62e42) {
    // |x| > ln2/2: reduce by k·ln2.
    if (hx < 0x3ff0a2b2) {
      // V8 returns Math.E for e^1 (the reduction below is one ulp off there).
      if (x == 1.0) return E;
      if (negative) {
        hi = x + LN2_HI;
        lo = -LN2_LO;
        k = -1;
      } else {
        hi = x - LN2_HI;
        lo = LN2_LO;
        k = 1;
      }
    } else {
      k = <i32>(INV_LN2 * x + (negative ? -0.5 : 0.5));
      const t = <f64>k;
      hi = x - t * LN2_HI;
      lo = t * LN2_LO;
    }
    x = hi - lo;
  } else if (hx < 0x3e300000) {
    // |x| < 2^−28.
    return 1.0 + x;
  }
  const t = x * x;
  const twopk =
    k >= -1021
      ? fromWords(<u32>(0x3ff00000 + (k << 20)), 0)
      : fromWords(<u32>(0x3ff00000 + ((k + 1000) << 20)), 0);
  const c = x - t * (P1 + t * (P2 + t * (P3 + t * (P4 + t * P5))));
  if (k == 0) return 1.0 - ((x * c) / (c - 2.0) - x);
  const y = 1.0 - (lo - (x * c) / (2.0 - c) - hi);
  if (k >= -1021) return k == 1024 ? y * 2.0 * TWO_1023 : y * twopk;
  return y * twopk * TWO_M1000;
}
