/**
 * Level-balanced random design: every (alternative, attribute) column of the S tasks holds
 * each level ⌊S/L⌋ or ⌈S/L⌉ times in random order (level balance, Huber & Zwerina 1996).
 * Tasks breaking a constraint are repaired by swapping one cell with the same column of
 * another task (which keeps the balance); only when swaps fail is the alternative redrawn.
 */
import type { CodingPlan } from '../../../shared/engine/coding/coding-plan';
import {
  isAlternativeValidInTask,
  isTaskValid,
  type DesignConstraints,
} from './design-constraints';
import { DesignError } from './design-errors';
import type { LevelGrid } from './design-grid';
import { shuffleInPlace, type SeededRandom } from './seeded-random';

const SWAP_ATTEMPTS = 400;
const REDRAW_ATTEMPTS = 2000;

function fillBalancedColumns(plan: CodingPlan, grid: LevelGrid, random: SeededRandom): void {
  const { S, J, A } = grid;
  const column = new Int32Array(S);
  for (let j = 0; j < J; j++)
    for (let a = 0; a < A; a++) {
      if (plan.omitted[j * A + a] === 1) {
        for (let s = 0; s < S; s++) grid.levels[(s * J + j) * A + a] = -1;
        continue;
      }
      const L = plan.attributes[a].levelIds.length;
      // Random offset so that, when L does not divide S, the surplus levels vary by column.
      const shift = random.nextInt(L);
      for (let s = 0; s < S; s++) column[s] = (s + shift) % L;
      shuffleInPlace(random, column);
      for (let s = 0; s < S; s++) grid.levels[(s * J + j) * A + a] = column[s];
    }
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
  random: SeededRandom,
): boolean {
  const { S, J, A } = grid;
  for (let attempt = 0; attempt < SWAP_ATTEMPTS && !isTaskValid(c, grid, s); attempt++) {
    let j = 0;
    while (j < J - 1 && isAlternativeValidInTask(c, grid, s, j)) j++;
    const a = random.nextInt(A);
    if (plan.omitted[j * A + a] === 1) continue;
    const t = random.nextInt(S);
    if (t === s) continue;
    const tWasValid = t < s || isTaskValid(c, grid, t);
    swapCell(grid, s, t, j, a);
    const tOk = !tWasValid || isTaskValid(c, grid, t);
    if (!tOk || (!isAlternativeValidInTask(c, grid, s, j) && random.next() < 0.7))
      swapCell(grid, s, t, j, a);
  }
  for (let attempt = 0; attempt < REDRAW_ATTEMPTS && !isTaskValid(c, grid, s); attempt++) {
    for (let j = 0; j < J; j++) {
      if (isAlternativeValidInTask(c, grid, s, j)) continue;
      for (let a = 0; a < A; a++)
        if (plan.omitted[j * A + a] !== 1)
          grid.levels[(s * J + j) * A + a] = random.nextInt(plan.attributes[a].levelIds.length);
    }
  }
  return isTaskValid(c, grid, s);
}

/**
 * Draws a level-balanced random design of S tasks that satisfies the constraints.
 * Throws DesignError('infeasible') when a task cannot be repaired.
 */
export function generateRandomGrid(
  plan: CodingPlan,
  constraints: DesignConstraints,
  S: number,
  random: SeededRandom,
): LevelGrid {
  const grid: LevelGrid = {
    S,
    J: plan.designedCount,
    A: plan.attributes.length,
    levels: new Int32Array(S * plan.designedCount * plan.attributes.length),
  };
  fillBalancedColumns(plan, grid, random);
  for (let s = 0; s < S; s++) {
    if (!repairTask(plan, constraints, grid, s, random))
      throw new DesignError(
        'infeasible',
        'Could not build a choice task without prohibited combinations, duplicate or dominated alternatives; relax the prohibitions or priors, or add levels.',
      );
  }
  return grid;
}
