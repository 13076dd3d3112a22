/**
 * Full-factorial candidate set (every combination of levels, minus profiles an excluded
 * combination or a dominance rule against the opt-out / status quo rules out) and a choice design built from it with cyclic level shifts: each
 * feasible profile is the first alternative of one task and alternative j adds j to every
 * attribute's level index modulo its number of levels (shifted designs; Bunch, Louviere &
 * Anderson 1996 working paper [M]; Street & Burgess 2007 ch. 5 generators [M]). When a
 * shifted alternative breaks a constraint the next feasible profile in cyclic order is used.
 */
import type { CodingPlan } from '../../../shared/engine/coding/coding-plan';
import { isAlternativeValidInTask, type DesignConstraints } from './design-constraints';
import { DesignError } from './design-errors';
import type { LevelGrid } from './design-grid';

/** Refuse candidate sets larger than this (the enumeration is cheap, the design is not). */
export const MAX_FULL_FACTORIAL = 20000;

/** Number of level combinations before excluded combinations. */
export function countFullFactorial(plan: CodingPlan): number {
  return plan.attributes.reduce((n, a) => n * a.levelIds.length, 1);
}

/**
 * Feasible profiles as a P × A Int32Array of level indices (lexicographic, last attribute
 * fastest). Throws DesignError('too_large') past `limit` combinations.
 */
export function listFullFactorial(
  plan: CodingPlan,
  constraints: DesignConstraints,
  limit = MAX_FULL_FACTORIAL,
): { profiles: Int32Array; count: number } {
  const total = countFullFactorial(plan);
  const A = plan.attributes.length;
  if (total > limit)
    throw new DesignError(
      'too_large',
      `The full factorial has ${total} profiles, more than the ${limit} allowed; use a random or D-efficient design.`,
    );
  const profiles = new Int32Array(total * A);
  const probe: LevelGrid = { S: 1, J: 1, A, levels: new Int32Array(A) };
  // One alternative alone: rules between alternatives and overlap do not apply yet.
  const oneAlt = { ...constraints, J: 1, statusQuo: null, between: [], maxOverlap: -1 };
  let count = 0;
  for (let i = 0; i < total; i++) {
    let rest = i;
    for (let a = A - 1; a >= 0; a--) {
      const L = plan.attributes[a].levelIds.length;
      probe.levels[a] = rest % L;
      rest = Math.floor(rest / L);
    }
    if (!isAlternativeValidInTask(oneAlt, probe, 0, 0)) continue;
    profiles.set(probe.levels, count * A);
    count++;
  }
  return { profiles: profiles.slice(0, count * A), count };
}

/** Builds the shifted design: one task per feasible profile (see the file comment). */
export function buildShiftedGrid(
  plan: CodingPlan,
  constraints: DesignConstraints,
  profiles: Int32Array,
  count: number,
): LevelGrid {
  const J = plan.designedCount;
  const A = plan.attributes.length;
  const grid: LevelGrid = { S: count, J, A, levels: new Int32Array(count * J * A) };
  const indexOf = new Map<string, number>();
  for (let p = 0; p < count; p++) indexOf.set(profiles.subarray(p * A, (p + 1) * A).join(','), p);
  const shifted = new Int32Array(A);
  for (let s = 0; s < count; s++) {
    for (let j = 0; j < J; j++) {
      for (let a = 0; a < A; a++)
        shifted[a] = (profiles[s * A + a] + j) % plan.attributes[a].levelIds.length;
      const start = indexOf.get(shifted.join(',')) ?? (s + j) % count;
      let placed = false;
      for (let step = 0; step < count && !placed; step++) {
        const p = (start + step) % count;
        const cell = (s * J + j) * A;
        for (let a = 0; a < A; a++)
          grid.levels[cell + a] = plan.omitted[j * A + a] === 1 ? -1 : profiles[p * A + a];
        placed = isPlacedValid(constraints, grid, s, j);
      }
      if (!placed)
        throw new DesignError(
          'infeasible',
          `No feasible profile completes task ${s + 1} of the full factorial.`,
        );
    }
  }
  return grid;
}

/**
 * Checks alternative j of task s against the alternatives already placed (0..j−1): rules
 * between alternatives only among placed ones, overlap once the task is complete.
 */
function isPlacedValid(c: DesignConstraints, grid: LevelGrid, s: number, j: number): boolean {
  const partial: LevelGrid = {
    S: 1,
    J: j + 1,
    A: grid.A,
    levels: grid.levels.subarray(s * grid.J * grid.A, (s * grid.J + j + 1) * grid.A),
  };
  const placed: DesignConstraints = {
    ...c,
    J: j + 1,
    between: c.between.filter((r) => r.first <= j && r.second <= j),
    maxOverlap: j === grid.J - 1 ? c.maxOverlap : -1,
  };
  return isAlternativeValidInTask(placed, partial, 0, j);
}
