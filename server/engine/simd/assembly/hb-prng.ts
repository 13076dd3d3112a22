/* eslint-disable no-loss-of-precision -- fdlibm and AS241 coefficients are kept verbatim as published (more digits than a double holds). */
/**
 * The seeded draws of the HB respondent sweep (hb-respondent.ts), continuing the TypeScript
 * generator's stream from its four state words in memory (createPrng's saveState and loadState,
 * shared/engine/random/prng.ts): xoshiro128** (Blackman & Vigna, ACM TOMS 47(4), 2021), doubles from 53 of
 * its bits as nextDouble makes them, and standard normals by inversion with Wichura's AS241
 * PPND16 (Applied Statistics 37(3):477-484, 1988) as shared/engine/random/inverse-normal.ts
 * evaluates it — the same coefficients in the same order of operations, fdlibm's logarithm (the
 * bits of Math.log, hb-fdlibm.ts) and the correctly rounded square root — so a normal drawn here
 * has the bits of drawStandardNormal's and the stream goes on where TypeScript left it.
 */
import { logFdlibm } from './hb-fdlibm';

/** The next 32-bit output of the generator whose state words are at `state`. */
function nextUint32(state: usize): u32 {
  let a = load<u32>(state);
  let b = load<u32>(state, 4);
  let c = load<u32>(state, 8);
  let d = load<u32>(state, 12);
  const result = rotl<u32>(b * 5, 7) * 9;
  const t = b << 9;
  c ^= a;
  d ^= b;
  b ^= c;
  a ^= d;
  c ^= t;
  d = rotl<u32>(d, 11);
  store<u32>(state, a);
  store<u32>(state, b, 4);
  store<u32>(state, c, 8);
  store<u32>(state, d, 12);
  return result;
}

/** A double strictly inside (0, 1) with 53 random bits (27 high, then 26). */
export function nextDouble(state: usize): f64 {
  const hi = <f64>(nextUint32(state) >>> 5);
  const lo = <f64>(nextUint32(state) >>> 6);
  return (hi * 67108864 + lo + 0.5) / 9007199254740992;
}

/** Φ⁻¹(U) for the next uniform U (AS241, as inverseNormal). */
export function nextStandardNormal(state: usize): f64 {
  const p = nextDouble(state);
  const q = p - 0.5;
  if (Math.abs(q) <= 0.425) {
    const r = 0.180625 - q * q;
    return (
      (q *
        (((((((2.5090809287301226727e3 * r + 3.3430575583588128105e4) * r +
          6.7265770927008700853e4) *
          r +
          4.5921953931549871457e4) *
          r +
          1.3731693765509461125e4) *
          r +
          1.9715909503065514427e3) *
          r +
          1.3314166789178437745e2) *
          r +
          3.387132872796366608)) /
      (((((((5.226495278852854561e3 * r + 2.8729085735721942674e4) * r + 3.930789580009271061e4) *
        r +
        2.1213794301586595867e4) *
        r +
        5.3941960214247511077e3) *
        r +
        6.871870074920579083e2) *
        r +
        4.2313330701600911252e1) *
        r +
        1)
    );
  }
  let r = Math.sqrt(-logFdlibm(q < 0 ? p : 1 - p));
  let value: f64;
  if (r <= 5) {
    r -= 1.6;
    value =
      (((((((7.7454501427834140764e-4 * r + 2.27238449892691845833e-2) * r +
        2.4178072517745061177e-1) *
        r +
        1.27045825245236838258) *
        r +
        3.64784832476320460504) *
        r +
        5.7694972214606914055) *
        r +
        4.6303378461565452959) *
        r +
        1.42343711074968357734) /
      (((((((1.05075007164441684324e-9 * r + 5.475938084995344946e-4) * r +
        1.51986665636164571966e-2) *
        r +
        1.4810397642748007459e-1) *
        r +
        6.897673349851000045e-1) *
        r +
        1.6763848301838038494) *
        r +
        2.05319162663775882187) *
        r +
        1);
  } else {
    r -= 5;
    value =
      (((((((2.01033439929228813265e-7 * r + 2.71155556874348757815e-5) * r +
        1.2426609473880784386e-3) *
        r +
        2.6532189526576123093e-2) *
        r +
        2.9656057182850489123e-1) *
        r +
        1.7848265399172913358) *
        r +
        5.4637849111641143699) *
        r +
        6.6579046435011037772) /
      (((((((2.04426310338993978564e-15 * r + 1.4215117583164458887e-7) * r +
        1.8463183175100546818e-5) *
        r +
        7.868691311456132591e-4) *
        r +
        1.4875361290850614852e-2) *
        r +
        1.3692988092273580531e-1) *
        r +
        5.9983220655588793769e-1) *
        r +
        1);
  }
  return q < 0 ? -value : value;
}
