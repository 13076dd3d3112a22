/**
 * sfc32 (Chris Doty-Humphrey's "small fast counter", PractRand suite) seeded through
 * splitmix32-style mixing of one integer, with integers as floor(u·n) of a 32-bit uniform.
 * Kept only to rebuild what earlier generator versions made from a stored seed: respondent
 * plans of plan generator version 1 (docs/methods.md "Plan generator versions"). Everything
 * new draws from draws/prng.ts (xoshiro128**) through draws/random-index.ts.
 */

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

/**
 * The version-1 index picker of a seed: each call gives an integer on 0..n−1 exactly as the
 * version-1 generator did (slightly biased for n not a power of two, which is why it was
 * replaced).
 */
export function createLegacySfc32Index(seed: number): (n: number) => number {
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
  return (n: number) => Math.floor((nextUint() / 4294967296) * n);
}
