/* eslint-disable no-loss-of-precision -- AS241 coefficients are kept verbatim as published (more digits than a double holds). */
/**
 * Inverse of the standard normal distribution function, Φ⁻¹(p), by Wichura's algorithm
 * AS241 PPND16 (M. J. Wichura, "Algorithm AS 241: The percentage points of the normal
 * distribution", Applied Statistics 37(3):477-484, 1988), accurate to about 1 part in 1e16.
 * Three rational approximations: |p − 0.5| ≤ 0.425; r = sqrt(−ln min(p, 1−p)) ≤ 5; r > 5.
 * Returns −Infinity at p = 0, +Infinity at p = 1 and NaN outside [0, 1].
 */
export function inverseNormal(p: number): number {
  if (!(p >= 0 && p <= 1)) return NaN;
  if (p === 0) return -Infinity;
  if (p === 1) return Infinity;
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
  let r = Math.sqrt(-Math.log(q < 0 ? p : 1 - p));
  let value: number;
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
