import { as241Central, as241Tail } from './as241';

/**
 * Inverse of the standard normal distribution function, Φ⁻¹(p), by Wichura's algorithm
 * AS241 PPND16 (M. J. Wichura, "Algorithm AS 241: The percentage points of the normal
 * distribution", Applied Statistics 37(3):477-484, 1988), accurate to about 1 part in 1e16.
 * Three rational approximations (as241.ts): |p − 0.5| ≤ 0.425; r = sqrt(−ln min(p, 1−p)) ≤ 5;
 * r > 5. Returns −Infinity at p = 0, +Infinity at p = 1 and NaN outside [0, 1].
 */
export function inverseNormal(p: number): number {
  if (!(p >= 0 && p <= 1)) return NaN;
  if (p === 0) return -Infinity;
  if (p === 1) return Infinity;
  const q = p - 0.5;
  if (Math.abs(q) <= 0.425) return as241Central(q);
  const value = as241Tail(Math.sqrt(-Math.log(q < 0 ? p : 1 - p)));
  return q < 0 ? -value : value;
}
