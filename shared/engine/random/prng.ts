/**
 * Seeded pseudo-random numbers: xoshiro128** (Blackman & Vigna, "Scrambled linear
 * pseudorandom number generators", ACM TOMS 47(4), 2021) seeded through splitmix32.
 * Deterministic for a given seed on every platform (32-bit integer arithmetic only).
 */
export interface Prng {
  /** Next unsigned 32-bit integer. */
  nextUint32(): number;
  /** Next double strictly inside (0, 1), with 53 random bits. */
  nextDouble(): number;
}

/**
 * A generator whose state words (a, b, c, d) can be handed to another implementation of the same
 * generator and taken back, so that one continues the other's stream (the WebAssembly HB kernel,
 * server/engine/simd/assembly/hb-prng.ts).
 */
export interface StatefulPrng extends Prng {
  /** Writes the four state words into `out`. */
  saveState(out: Int32Array): void;
  /** Continues from the four state words in `state`. */
  loadState(state: Int32Array): void;
}

/** Expands a 32-bit seed into well-mixed state words (splitmix32 finaliser). */
function splitmix32(state: { s: number }): number {
  state.s = (state.s + 0x9e3779b9) | 0;
  let z = state.s;
  z = Math.imul(z ^ (z >>> 16), 0x85ebca6b);
  z = Math.imul(z ^ (z >>> 13), 0xc2b2ae35);
  return (z ^ (z >>> 16)) >>> 0;
}

/**
 * Creates a xoshiro128** generator. `seed` may be any finite number; it is reduced to
 * 32 bits, and `stream` lets callers derive independent streams (e.g. one per respondent)
 * from one user seed.
 */
export function createPrng(seed: number, stream = 0): StatefulPrng {
  const mix = { s: (Math.floor(seed) ^ Math.imul(stream + 1, 0x27d4eb2d)) | 0 };
  let a = splitmix32(mix);
  let b = splitmix32(mix);
  let c = splitmix32(mix);
  let d = splitmix32(mix);
  if ((a | b | c | d) === 0) a = 1;
  const nextUint32 = (): number => {
    const result = Math.imul(rotl(Math.imul(b, 5), 7), 9) >>> 0;
    const t = b << 9;
    c ^= a;
    d ^= b;
    b ^= c;
    a ^= d;
    c ^= t;
    d = rotl(d, 11);
    return result;
  };
  return {
    nextUint32,
    saveState(out) {
      out[0] = a;
      out[1] = b;
      out[2] = c;
      out[3] = d;
    },
    loadState(state) {
      a = state[0];
      b = state[1];
      c = state[2];
      d = state[3];
    },
    nextDouble: () => {
      const hi = nextUint32() >>> 5; // 27 bits
      const lo = nextUint32() >>> 6; // 26 bits
      return (hi * 67108864 + lo + 0.5) / 9007199254740992;
    },
  };
}

function rotl(x: number, k: number): number {
  return (x << k) | (x >>> (32 - k));
}
