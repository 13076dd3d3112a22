/* eslint-disable no-loss-of-precision -- AS241 coefficients are kept verbatim as published (more digits than a double holds). */
/**
 * The three rational approximations of Wichura's AS241 PPND16 (M. J. Wichura, "Algorithm AS 241:
 * The percentage points of the normal distribution", Applied Statistics 37(3):477-484, 1988),
 * with the published coefficients in the published order of operations. Plain `number`
 * arithmetic with no imports and no Math, because two compilers build this one file: TypeScript
 * for inverseNormal (inverse-normal.ts) and AssemblyScript for the HB kernel's normal draws
 * (server/engine/simd/assembly/hb-prng.ts, where `number` is f64). Each caller takes its own
 * logarithm and square root for the tails (the kernel has no Math.log with the bits of the
 * JavaScript one); every operation here rounds the same way on both sides, so a normal drawn in
 * the kernel has the bits of the TypeScript one.
 */

/** Φ⁻¹(0.5 + q) for |q| ≤ 0.425. */
export function as241Central(q: number): number {
  const r = 0.180625 - q * q;
  return (
    (q *
      (((((((2.5090809287301226727e3 * r + 3.3430575583588128105e4) * r + 6.7265770927008700853e4) *
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
    (((((((5.226495278852854561e3 * r + 2.8729085735721942674e4) * r + 3.930789580009271061e4) * r +
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

/**
 * Φ⁻¹(1 − P) for the tail probability P = min(p, 1 − p) < 0.075, given r = sqrt(−ln P); the
 * caller gives it the sign of p − 0.5.
 */
export function as241Tail(r: number): number {
  if (r <= 5) {
    const s = r - 1.6;
    return (
      (((((((7.7454501427834140764e-4 * s + 2.27238449892691845833e-2) * s +
        2.4178072517745061177e-1) *
        s +
        1.27045825245236838258) *
        s +
        3.64784832476320460504) *
        s +
        5.7694972214606914055) *
        s +
        4.6303378461565452959) *
        s +
        1.42343711074968357734) /
      (((((((1.05075007164441684324e-9 * s + 5.475938084995344946e-4) * s +
        1.51986665636164571966e-2) *
        s +
        1.4810397642748007459e-1) *
        s +
        6.897673349851000045e-1) *
        s +
        1.6763848301838038494) *
        s +
        2.05319162663775882187) *
        s +
        1)
    );
  }
  const s = r - 5;
  return (
    (((((((2.01033439929228813265e-7 * s + 2.71155556874348757815e-5) * s +
      1.2426609473880784386e-3) *
      s +
      2.6532189526576123093e-2) *
      s +
      2.9656057182850489123e-1) *
      s +
      1.7848265399172913358) *
      s +
      5.4637849111641143699) *
      s +
      6.6579046435011037772) /
    (((((((2.04426310338993978564e-15 * s + 1.4215117583164458887e-7) * s +
      1.8463183175100546818e-5) *
      s +
      7.868691311456132591e-4) *
      s +
      1.4875361290850614852e-2) *
      s +
      1.3692988092273580531e-1) *
      s +
      5.9983220655588793769e-1) *
      s +
      1)
  );
}
