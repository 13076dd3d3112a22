/**
 * Level-balanced random design: every (alternative, attribute) column of the S tasks holds
 * each level a designed alternative may show ⌊S/L⌋ or ⌈S/L⌉ times in random order (level
 * balance, Huber & Zwerina 1996). Tasks breaking a rule are repaired by swapping one cell with
 * the same column of another task (which keeps the balance); only when swaps fail is the
 * alternative redrawn. Last, single cells move until every level's count is within its
 * bounds (level-bounds.ts), keeping every task valid.
 */
import type { CodingPlan } from '../../../shared/engine/coding/coding-plan';
import {
  isAlternativeValidInTask,
  isTaskValid,
  type DesignConstraints,
} from './design-constraints';
import { DesignError } from './design-errors';
import type { LevelGrid } from './design-grid';
import {
  canMoveLevel,
  countLevels,
  findOutOfBounds,
  moveLevel,
  type LevelBounds,
} from './level-bounds';
import type { Prng } from '../draws/prng';
import { randomIndex, shuffleInPlace } from '../draws/random-index';

const SWAP_ATTEMPTS = 400;
const REDRAW_ATTEMPTS = 2000;

function fillBalancedColumns(
  plan: CodingPlan,
  c: DesignConstraints,
  grid: LevelGrid,
  random: Prng,
): void {
  const { S, J, A } = grid;
  const column = new Int32Array(S);
  for (let j = 0; j < J; j++)
    for (let a = 0; a < A; a++) {
      if (plan.omitted[j * A + a] === 1) {
        for (let s = 0; s < S; s++) grid.levels[(s * J + j) * A + a] = -1;
        continue;
      }
      const L = plan.attributes[a].levelIds.length;
      const allowed: number[] = [];
      for (let l = 0; l < L; l++) if (c.levelRule[c.levelBase[a] + l] < 0) allowed.push(l);
      if (allowed.length === 0) allowed.push(0);
      // Random offset so that, when L does not divide S, the surplus levels vary by column.
      const shift = randomIndex(random, allowed.length);
      for (let s = 0; s < S; s++) column[s] = allowed[(s + shift) % allowed.length];
      shuffleInPlace(random, column);
      for (let s = 0; s < S; s++) grid.levels[(s * J + j) * A + a] = column[s];
    }
}

/** Moves single cells until every level count is within its bounds; false when stuck. */
function enforceLevelBounds(
  plan: CodingPlan,
  c: DesignConstraints,
  bounds: LevelBounds,
  grid: LevelGrid,
  random: Prng,
): boolean {
  const { J, A } = grid;
  const counts = countLevels(c, grid);
  const order = Int32Array.from({ length: grid.levels.length }, (_, i) => i);
  shuffleInPlace(random, order);
  const tryMove = (cell: number, a: number, from: number, to: number) => {
    if (!canMoveLevel(c, bounds, counts, a, from, to)) return false;
    const task = Math.floor(cell / (J * A));
    const j = Math.floor(cell / A) % J;
    grid.levels[cell] = to;
    if (isAlternativeValidInTask(c, grid, task, j)) {
      moveLevel(c, counts, a, from, to);
      return true;
    }
    grid.levels[cell] = from;
    return false;
  };
  for (let round = 0; round <= grid.levels.length + c.levelTotal; round++) {
    const f = findOutOfBounds(bounds, counts);
    if (f < 0) return true;
    let a = 0;
    while (c.levelBase[a + 1] <= f) a++;
    const l = f - c.levelBase[a];
    const L = plan.attributes[a].levelIds.length;
    let moved = false;
    for (let i = 0; i < order.length && !moved; i++) {
      const cell = order[i];
      if (cell % A !== a || grid.levels[cell] < 0) continue;
      const current = grid.levels[cell];
      if (counts[f] < bounds.min[f]) moved = current !== l && tryMove(cell, a, current, l);
      else if (current === l)
        for (let k = 1; k < L && !moved; k++) moved = tryMove(cell, a, l, (l + k) % L);
    }
    if (!moved) return false;
  }
  return findOutOfBounds(bounds, counts) < 0;
}

function swapCell(grid: LevelGrid, s: number, t: number, j: number, a: number): void {
  const p = (s * grid.J + j) * grid.A + a;
  const q = (t * grid.J + j) * grid.A + a;
  const v = grid.levels[p];
  grid.levels[p] = grid.levels[q];
  grid.levels[q] = v;
}

function repairTask(
  plan: CodingPlan,
  c: DesignConstraints,
  grid: LevelGrid,
  s: number,
  random: Prng,
): boolean {
  const { S, J, A } = grid;
  for (let attempt = 0; attempt < SWAP_ATTEMPTS && !isTaskValid(c, grid, s); attempt++) {
    let j = 0;
    while (j < J - 1 && isAlternativeValidInTask(c, grid, s, j)) j++;
    const a = randomIndex(random, A);
    if (plan.omitted[j * A + a] === 1) continue;
    const t = randomIndex(random, S);
    if (t === s) continue;
    const tWasValid = t < s || isTaskValid(c, grid, t);
    swapCell(grid, s, t, j, a);
    const tOk = !tWasValid || isTaskValid(c, grid, t);
    if (!tOk || (!isAlternativeValidInTask(c, grid, s, j) && random.nextDouble() < 0.7))
      swapCell(grid, s, t, j, a);
  }
  for (let attempt = 0; attempt < REDRAW_ATTEMPTS && !isTaskValid(c, grid, s); attempt++) {
    for (let j = 0; j < J; j++) {
      if (isAlternativeValidInTask(c, grid, s, j)) continue;
      for (let a = 0; a < A; a++)
        if (plan.omitted[j * A + a] !== 1)
          grid.levels[(s * J + j) * A + a] = randomIndex(
            random,
            plan.attributes[a].levelIds.length,
          );
    }
  }
  return isTaskValid(c, grid, s);
}

/**
 * Draws a level-balanced random design of S tasks that keeps every rule and, when given, the
 * level bounds. Throws DesignError('infeasible') when it cannot (generate-design.ts then says
 * which rule binds).
 */
export function generateRandomGrid(
  plan: CodingPlan,
  constraints: DesignConstraints,
  S: number,
  random: Prng,
  bounds?: LevelBounds,
): LevelGrid {
  const grid: LevelGrid = {
    S,
    J: plan.designedCount,
    A: plan.attributes.length,
    levels: new Int32Array(S * plan.designedCount * plan.attributes.length),
  };
  fillBalancedColumns(plan, constraints, grid, random);
  for (let s = 0; s < S; s++) {
    if (!repairTask(plan, constraints, grid, s, random))
      throw new DesignError(
        'infeasible',
        'Could not build a choice task that keeps every excluded combination and dominance rule without duplicate alternatives.',
      );
  }
  if (bounds && !enforceLevelBounds(plan, constraints, bounds, grid, random))
    throw new DesignError(
      'infeasible',
      'Could not reach the required number of appearances of every level.',
    );
  return grid;
}
