/**
 * The engine's working form of a design: level indices in an Int32Array, task-major
 * (S tasks × J designed alternatives × A attributes), −1 where a labeled alternative omits
 * the attribute. Converts to the coded design matrix and to/from the shared `Design` shape.
 */
import type { CodingPlan } from '../../../shared/engine/coding/coding-plan';
import { codeAlternativeIndices } from '../../../shared/engine/coding/code-alternative';
import type { Design } from '../../../shared/schemas/design';

export interface LevelGrid {
  S: number;
  J: number;
  A: number;
  levels: Int32Array;
}

/** Rows per task in the design matrix: the designed alternatives plus any opt-out / status quo. */
export function getRowsPerTask(plan: CodingPlan): number {
  return plan.designedCount + (plan.fixed ? 1 : 0);
}

/** Codes task s (all its rows, fixed alternative last) into `x` starting at row s·Jt. */
export function codeTaskRows(plan: CodingPlan, grid: LevelGrid, s: number, x: Float64Array): void {
  const K = plan.columnCount;
  const Jt = getRowsPerTask(plan);
  for (let j = 0; j < grid.J; j++) {
    codeAlternativeIndices(plan, j, grid.levels, (s * grid.J + j) * grid.A, x, (s * Jt + j) * K);
  }
  if (plan.fixed) codeAlternativeIndices(plan, grid.J, grid.levels, 0, x, (s * Jt + grid.J) * K);
}

/** Builds the S·Jt × K design matrix of a grid. */
export function buildDesignMatrix(plan: CodingPlan, grid: LevelGrid): Float64Array {
  const x = new Float64Array(grid.S * getRowsPerTask(plan) * plan.columnCount);
  for (let s = 0; s < grid.S; s++) codeTaskRows(plan, grid, s, x);
  return x;
}

/** Reads a `Design` into a grid (tasks in array order) plus each task's block (1-based). */
export function readDesignGrid(
  plan: CodingPlan,
  design: Design,
): { grid: LevelGrid; blockOfTask: Int32Array } {
  const S = design.tasks.length;
  const J = plan.designedCount;
  const A = plan.attributes.length;
  const levels = new Int32Array(S * J * A).fill(-1);
  const blockOfTask = new Int32Array(S);
  design.tasks.forEach((task, s) => {
    blockOfTask[s] = task.block;
    if (task.alternatives.length !== J)
      throw new RangeError(
        `Task ${task.task} has ${task.alternatives.length} alternatives, not ${J}`,
      );
    task.alternatives.forEach((alternative, j) => {
      plan.attributes.forEach((attribute, a) => {
        if (plan.omitted[j * A + a] === 1) return;
        const levelId = alternative.levels[attribute.id];
        const index = levelId === undefined ? -1 : attribute.levelIds.indexOf(levelId);
        if (index < 0)
          throw new RangeError(
            `Task ${task.task}, alternative ${j + 1}: no valid level of ${attribute.id}`,
          );
        levels[(s * J + j) * A + a] = index;
      });
    });
  });
  return { grid: { S, J, A, levels }, blockOfTask };
}

/**
 * Writes a grid as a `Design`: tasks sorted by block (stable), numbered 1..S in that order,
 * so each block's tasks are consecutive.
 */
export function writeDesign(
  plan: CodingPlan,
  grid: LevelGrid,
  blockOfTask: Int32Array,
  blocks: number,
): Design {
  const order = Array.from({ length: grid.S }, (_, s) => s).sort(
    (p, q) => blockOfTask[p] - blockOfTask[q] || p - q,
  );
  return {
    blocks,
    tasks: order.map((s, i) => ({
      block: blockOfTask[s],
      task: i + 1,
      alternatives: Array.from({ length: grid.J }, (_, j) => {
        const levels: Record<string, string> = {};
        plan.attributes.forEach((attribute, a) => {
          const index = grid.levels[(s * grid.J + j) * grid.A + a];
          if (index >= 0) levels[attribute.id] = attribute.levelIds[index];
        });
        return { levels };
      }),
    })),
  };
}
