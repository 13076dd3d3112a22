/**
 * The seeded draws of the HB respondent sweep (hb-respondent.ts), continuing the TypeScript
 * generator's stream from its four state words in memory (createPrng's saveState and loadState,
 * shared/engine/random/prng.ts): xoshiro128** (Blackman & Vigna, ACM TOMS 47(4), 2021), doubles from 53 of
 * its bits as nextDouble makes them, and standard normals by inversion with Wichura's AS241
 * PPND16 (Applied Statistics 37(3):477-484, 1988): the very rational approximations that
 * inverseNormal evaluates (shared/engine/random/as241.ts, compiled here by AssemblyScript), with
 * fdlibm's logarithm (the bits of Math.log, hb-fdlibm.ts) and the correctly rounded square root —
 * so a normal drawn here has the bits of drawStandardNormal's and the stream goes on where
 * TypeScript left it.
 */
import { as241Central, as241Tail } from '../../../../shared/engine/random/as241';
import { logFdlibm } from './hb-fdlibm';

/**
 * The next 32-bit output of the generator whose state words are at `state`. The xoshiro128**
 * step is written here a second time, beside createPrng's, and not shared like as241.ts: the
 * TypeScript generator keeps its state in closure variables (a typed-array state made every
 * caller's nextDouble about 1.8× slower), while the kernel's lives in shared memory as u32 words;
 * no one function body serves both. The chain-equality tests compare the two streams.
 */
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
  if (Math.abs(q) <= 0.425) return as241Central(q);
  const value = as241Tail(Math.sqrt(-logFdlibm(q < 0 ? p : 1 - p)));
  return q < 0 ? -value : value;
}
