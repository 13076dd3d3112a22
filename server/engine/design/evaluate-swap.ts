/**
 * Swap moves of the coordinate exchange under level balance: two cells of one attribute
 * exchange their levels, which keeps every level's count. Partners of cell (s, j, a): every
 * other alternative of task s, and for each other level one cell of another task (scanning
 * from a task that moves with the pass, so passes try different partners). The first swap
 * that lowers the criterion below `bound` is kept.
 *
 * The task evaluator works one task at a time (task-evaluator.ts), so a swap across tasks s
 * and t commits the change in s, folds s into the information, evaluates the change in t, and
 * returns to s: on rejection the change in s is undone, and the caller must fold s again at
 * the end of the task (`touchedTask`).
 */
import type { CodingPlan } from '../../../shared/engine/coding/coding-plan';
import { isAlternativeValidInTask, type DesignConstraints } from './design-constraints';
import type { LevelGrid } from './design-grid';
import type { TaskEvaluator } from './task-evaluator';

export interface SwapContext {
  plan: CodingPlan;
  c: DesignConstraints;
  grid: LevelGrid;
  evaluator: TaskEvaluator;
  pass: number;
}

export interface SwapResult {
  /** The criterion after the kept swap, or Infinity when none was kept. */
  value: number;
  /** True when task s's information must be folded again at the end of the task. */
  touchedTask: boolean;
}

/**
 * Swaps the levels of cells (s, j, a) and (t, k, a), keeping the swap when it lowers the
 * criterion below `bound`. Within a task (t = s) the evaluator stays on s throughout.
 */
function swapCells(
  x: SwapContext,
  s: number,
  j: number,
  t: number,
  k: number,
  a: number,
  bound: number,
) {
  const { c, grid, evaluator } = x;
  const across = t !== s;
  const p = (s * grid.J + j) * grid.A + a;
  const q = (t * grid.J + k) * grid.A + a;
  const l = grid.levels[p];
  const m = grid.levels[q];
  grid.levels[p] = m;
  grid.levels[q] = l;
  if (!isAlternativeValidInTask(c, grid, s, j) || !isAlternativeValidInTask(c, grid, t, k)) {
    grid.levels[p] = l;
    grid.levels[q] = m;
    return Infinity;
  }
  evaluator.commitChange(s, j, a, l, m);
  if (across) {
    evaluator.endTask(s);
    evaluator.beginTask(t);
  }
  const value = evaluator.evaluateChange(t, k, a, m, l, bound);
  if (value < bound) {
    evaluator.commitChange(t, k, a, m, l);
    if (across) {
      evaluator.endTask(t);
      evaluator.beginTask(s);
    }
    return value;
  }
  if (across) evaluator.beginTask(s);
  evaluator.commitChange(s, j, a, m, l);
  grid.levels[p] = l;
  grid.levels[q] = m;
  return Infinity;
}

/** Tries the swaps of cell (s, j, a); see the file comment. */
export function trySwaps(
  x: SwapContext,
  s: number,
  j: number,
  a: number,
  bound: number,
): SwapResult {
  const { grid, plan } = x;
  const { S, J, A } = grid;
  const l = grid.levels[(s * J + j) * A + a];
  if (l < 0) return { value: Infinity, touchedTask: false };
  for (let k = 0; k < J; k++) {
    const m = grid.levels[(s * J + k) * A + a];
    if (k === j || m < 0 || m === l) continue;
    const value = swapCells(x, s, j, s, k, a, bound);
    if (value < Infinity) return { value, touchedTask: true };
  }
  let touchedTask = false;
  const L = plan.attributes[a].levelIds.length;
  for (let m = 0; m < L; m++) {
    if (m === l) continue;
    // One partner holding level m in another task, scanning from a pass-dependent task.
    for (let step = 1; step < S; step++) {
      const t = (s + step + x.pass) % S;
      if (t === s) continue;
      let k = 0;
      while (k < J && grid.levels[(t * J + k) * A + a] !== m) k++;
      if (k === J) continue;
      const value = swapCells(x, s, j, t, k, a, bound);
      touchedTask = true;
      if (value < Infinity) return { value, touchedTask };
      break;
    }
  }
  return { value: Infinity, touchedTask };
}
