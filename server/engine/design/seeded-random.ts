/**
 * sfc32 (Chris Doty-Humphrey's "small fast counter", PractRand suite) seeded through
 * splitmix32-style mixing of one integer; uniforms in [0, 1) with 32 bits of resolution.
 * The design engine no longer uses it (it draws from draws/prng.ts since generator version 2,
 * docs/methods.md "Design generator versions"); the respondents' randomised orders and the
 * demo's simulated people still do, because their stored seeds were drawn with it and
 * changing their stream changes every plan and the demo data.
 */
export interface SeededRandom {
  /** Uniform on [0, 1). */
  next(): number;
  /** Uniform integer on 0..n−1. */
  nextInt(n: number): number;
}

function mixSeed(seed: number): () => number {
  let state = seed >>> 0;
  return () => {
    state = (state + 0x9e3779b9) >>> 0;
    let z = state;
    z = Math.imul(z ^ (z >>> 16), 0x85ebca6b) >>> 0;
    z = Math.imul(z ^ (z >>> 13), 0xc2b2ae35) >>> 0;
    return (z ^ (z >>> 16)) >>> 0;
  };
}

/** Creates an independent generator; the same seed always gives the same stream. */
export function createSeededRandom(seed: number): SeededRandom {
  const mix = mixSeed(seed);
  let a = mix();
  let b = mix();
  let c = mix();
  let d = mix();
  const nextUint = () => {
    const t = (((a + b) >>> 0) + d) >>> 0;
    d = (d + 1) >>> 0;
    a = b ^ (b >>> 9);
    b = (c + (c << 3)) >>> 0;
    c = ((c << 21) | (c >>> 11)) >>> 0;
    c = (c + t) >>> 0;
    return t;
  };
  for (let i = 0; i < 12; i++) nextUint();
  return {
    next: () => nextUint() / 4294967296,
    nextInt: (n: number) => Math.floor((nextUint() / 4294967296) * n),
  };
}

/** Fisher–Yates shuffle of `values[offset .. offset+length)` in place. */
export function shuffleInPlace(
  random: SeededRandom,
  values: Int32Array,
  offset = 0,
  length = values.length - offset,
): void {
  for (let i = length - 1; i > 0; i--) {
    const k = random.nextInt(i + 1);
    const t = values[offset + i];
    values[offset + i] = values[offset + k];
    values[offset + k] = t;
  }
}
