/**
 * Assigns the tasks of a design to blocks of equal size so that every block shows each
 * level of each attribute about equally often. Method (ours, documented here): start from a
 * seeded random assignment, then swap tasks between blocks while the sum over blocks,
 * attributes and levels of (count − target)² decreases, target = overall count × block
 * share; a local search in the spirit of the exchange algorithms of Cook & Nachtsheim
 * (1980) [M]. Blocking does not change the D-error of the whole design.
 */
import type { LevelGrid } from './design-grid';
import type { Prng } from '../draws/prng';
import { randomIndex, shuffleInPlace } from '../draws/random-index';

const MAX_PASSES = 50;
const FULL_PAIR_LIMIT = 400;

/** Returns the 1-based block of each task. */
export function assignBlocks(
  grid: LevelGrid,
  levelCounts: number[],
  blocks: number,
  random: Prng,
): Int32Array {
  const { S, J, A } = grid;
  const blockOf = new Int32Array(S);
  const order = Int32Array.from({ length: S }, (_, s) => s);
  shuffleInPlace(random, order);
  // Block sizes differ by at most one (equal when blocks divide S).
  for (let i = 0; i < S; i++) blockOf[order[i]] = (i % blocks) + 1;
  if (blocks === 1) return blockOf;

  const base = new Int32Array(A + 1);
  for (let a = 0; a < A; a++) base[a + 1] = base[a] + levelCounts[a];
  const T = base[A];
  const counts = new Float64Array((blocks + 1) * T);
  const totals = new Float64Array(T);
  const sizes = new Float64Array(blocks + 1);
  const add = (s: number, b: number, sign: number) => {
    for (let j = 0; j < J; j++)
      for (let a = 0; a < A; a++) {
        const l = grid.levels[(s * J + j) * A + a];
        if (l >= 0) counts[b * T + base[a] + l] += sign;
      }
  };
  for (let s = 0; s < S; s++) {
    add(s, blockOf[s], 1);
    sizes[blockOf[s]]++;
    for (let j = 0; j < J; j++)
      for (let a = 0; a < A; a++) {
        const l = grid.levels[(s * J + j) * A + a];
        if (l >= 0) totals[base[a] + l]++;
      }
  }
  const blockCost = (b: number) => {
    let cost = 0;
    const share = sizes[b] / S;
    for (let t = 0; t < T; t++) cost += (counts[b * T + t] - totals[t] * share) ** 2;
    return cost;
  };
  const trySwap = (s: number, t: number): boolean => {
    const p = blockOf[s];
    const q = blockOf[t];
    if (p === q) return false;
    const before = blockCost(p) + blockCost(q);
    add(s, p, -1);
    add(t, q, -1);
    add(s, q, 1);
    add(t, p, 1);
    if (blockCost(p) + blockCost(q) < before - 1e-9) {
      blockOf[s] = q;
      blockOf[t] = p;
      return true;
    }
    add(s, q, -1);
    add(t, p, -1);
    add(s, p, 1);
    add(t, q, 1);
    return false;
  };
  for (let pass = 0; pass < MAX_PASSES; pass++) {
    let improved = false;
    if (S <= FULL_PAIR_LIMIT) {
      for (let s = 0; s < S; s++)
        for (let t = s + 1; t < S; t++) improved = trySwap(s, t) || improved;
    } else {
      for (let i = 0; i < S * 20; i++)
        improved = trySwap(randomIndex(random, S), randomIndex(random, S)) || improved;
    }
    if (!improved) break;
  }
  return blockOf;
}
