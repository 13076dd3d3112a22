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

/** Expands a 32-bit seed into well-mixed state words (splitmix32 finaliser). */
function splitmix32(state: { s: number }): number {
  state.s = (state.s + 0x9e3779b9) | 0;
  let z = state.s;
  z = Math.imul(z ^ (z >>> 16), 0x85ebca6b);
  z = Math.imul(z ^ (z >>> 13), 0xc2b2ae35);
  return (z ^ (z >>> 16)) >>> 0;
}

/** A generator whose state words (a, b, c, d) live in a typed array another kernel can continue. */
export interface StatefulPrng extends Prng {
  readonly state: Int32Array;
}

/**
 * The state words of the generator for `seed` and `stream` (see createPrng), written into
 * `state` (four 32-bit words).
 */
export function seedPrngState(seed: number, stream = 0, state = new Int32Array(4)): Int32Array {
  const mix = { s: (Math.floor(seed) ^ Math.imul(stream + 1, 0x27d4eb2d)) | 0 };
  for (let i = 0; i < 4; i++) state[i] = splitmix32(mix);
  if ((state[0] | state[1] | state[2] | state[3]) === 0) state[0] = 1;
  return state;
}

/**
 * xoshiro128** on the state words in `state`, which it advances in place: the WebAssembly HB
 * kernel (server/engine/simd/assembly/hb-prng.ts) continues the same stream from them.
 */
export function createPrngOnState(state: Int32Array): StatefulPrng {
  const nextUint32 = (): number => {
    let a = state[0];
    let b = state[1];
    let c = state[2];
    let d = state[3];
    const result = Math.imul(rotl(Math.imul(b, 5), 7), 9) >>> 0;
    const t = b << 9;
    c ^= a;
    d ^= b;
    b ^= c;
    a ^= d;
    c ^= t;
    d = rotl(d, 11);
    state[0] = a;
    state[1] = b;
    state[2] = c;
    state[3] = d;
    return result;
  };
  return {
    state,
    nextUint32,
    nextDouble: () => {
      const hi = nextUint32() >>> 5; // 27 bits
      const lo = nextUint32() >>> 6; // 26 bits
      return (hi * 67108864 + lo + 0.5) / 9007199254740992;
    },
  };
}

/**
 * Creates a xoshiro128** generator. `seed` may be any finite number; it is reduced to
 * 32 bits, and `stream` lets callers derive independent streams (e.g. one per respondent)
 * from one user seed.
 */
export function createPrng(seed: number, stream = 0): StatefulPrng {
  return createPrngOnState(seedPrngState(seed, stream));
}

function rotl(x: number, k: number): number {
  return (x << k) | (x >>> (32 - k));
}
