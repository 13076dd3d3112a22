/**
 * Sobol low-discrepancy points (I. M. Sobol', USSR Comput. Math. Math. Phys. 7:86-112, 1967)
 * in Gray-code order (Antonov & Saleev 1979), with the Joe & Kuo (2008) direction numbers.
 * Point i is the XOR of the direction integers picked by the bits of gray(i) = i ^ (i >> 1),
 * so any point can be computed directly (each respondent takes its own block of indices).
 */
import { SOBOL_JOE_KUO } from './sobol-direction-numbers';

/** Largest supported dimension (the rows copied from the Joe-Kuo table plus dimension 1). */
export const SOBOL_MAX_DIMENSIONS = SOBOL_JOE_KUO.length + 1;

const BITS = 32;

/** Direction integers V[d][j] (scaled to 32 bits) for dimensions 1..dimensions. */
export function createSobolDirections(dimensions: number): Uint32Array[] {
  if (dimensions > SOBOL_MAX_DIMENSIONS) {
    throw new RangeError(`Sobol draws support at most ${SOBOL_MAX_DIMENSIONS} dimensions`);
  }
  const directions: Uint32Array[] = [];
  for (let d = 0; d < dimensions; d++) {
    const v = new Uint32Array(BITS);
    if (d === 0) {
      for (let j = 0; j < BITS; j++) v[j] = 2 ** (BITS - 1 - j);
    } else {
      const [s, a, m] = SOBOL_JOE_KUO[d - 1];
      for (let j = 0; j < Math.min(s, BITS); j++) v[j] = (m[j] * 2 ** (BITS - 1 - j)) >>> 0;
      for (let j = s; j < BITS; j++) {
        let value = (v[j - s] ^ (v[j - s] >>> s)) >>> 0;
        for (let k = 1; k < s; k++) {
          if ((a >>> (s - 1 - k)) & 1) value = (value ^ v[j - k]) >>> 0;
        }
        v[j] = value;
      }
    }
    directions.push(v);
  }
  return directions;
}

/**
 * Coordinate of Sobol point `index` (0-based; point 0 is the origin) in one dimension, as an
 * unsigned 32-bit integer; divide by 2^32 for the value in [0, 1).
 */
export function sobolInteger(index: number, directions: Uint32Array): number {
  let gray = index ^ Math.floor(index / 2);
  let value = 0;
  for (let j = 0; gray > 0; j++) {
    if (gray & 1) value = (value ^ directions[j]) >>> 0;
    gray = Math.floor(gray / 2);
  }
  return value;
}
