/**
 * Coordinate-exchange improvement of a choice design (Meyer & Nachtsheim 1995,
 * Technometrics 37(1):60-69; for Bayesian D-error, Kessels, Jones, Goos & Vandebroek 2009,
 * JBES 27(2):279-291): visit every cell (attribute of a designed alternative of a task), try
 * every other level that keeps the constraints, keep the level with the lowest criterion;
 * repeat passes until a pass brings no improvement or `maxPasses` is reached. Only strict
 * improvements are accepted, so the result is never worse than the start.
 * A singular start is first improved under a small ridge (det(I + ρ·Id)) until the
 * information matrix becomes non-singular, then under the exact criterion.
 * Level bounds (level-bounds.ts) are kept: a cell changes only when both levels stay within
 * their counts. With level balance the counts leave little room, so each cell also tries
 * swapping its level with a cell of the same attribute in another alternative of its task and,
 * for each other level, with one cell in another task (evaluate-swap.ts); swaps keep counts.
 */
import type { CodingPlan } from '../../../shared/engine/coding/coding-plan';
import { isAlternativeValidInTask, type DesignConstraints } from './design-constraints';
import { createTaskEvaluator, type TaskEvaluator } from './task-evaluator';
import { createCriterionEvaluator } from './criterion-evaluator';
import type { CriterionScorer } from './design-criteria';
import { buildDesignMatrix, getRowsPerTask, type LevelGrid } from './design-grid';
import { canMoveLevel, countLevels, moveLevel, type LevelBounds } from './level-bounds';
import { trySwaps } from './evaluate-swap';

export interface ExchangeOptions {
  maxPasses: number;
  /** Appearance bounds per level; swaps are tried too when `swaps` is set (level balance). */
  bounds?: LevelBounds;
  swaps?: boolean;
  /** Another criterion than the D-error (design-criteria.ts); absent = D-error. */
  scorer?: CriterionScorer;
  signal?: AbortSignal;
  /** Called after each pass with the pass number (1-based) and the criterion. */
  onPass?: (pass: number, value: number) => void;
}

export interface ExchangeResult {
  grid: LevelGrid;
  /** Criterion of the returned design (mean over the draws). */
  value: number;
  startValue: number;
  passes: number;
}

/** Relative improvement below which a change counts as a tie (rounding noise). */
const MIN_RELATIVE_GAIN = 1e-10;

function runPasses(
  plan: CodingPlan,
  c: DesignConstraints,
  grid: LevelGrid,
  evaluator: TaskEvaluator,
  value: number,
  ridge: number,
  options: ExchangeOptions,
  passOffset: number,
): { value: number; passes: number } {
  const { S, J, A } = grid;
  const counts = countLevels(c, grid);
  const bounds = options.bounds;
  let passes = 0;
  for (let pass = 1; passOffset + pass <= options.maxPasses; pass++) {
    let improved = false;
    value = evaluator.reset(ridge);
    for (let s = 0; s < S; s++) {
      evaluator.beginTask(s);
      let taskChanged = false;
      for (let j = 0; j < J; j++) {
        const cell = (s * J + j) * A;
        for (let a = 0; a < A; a++) {
          options.signal?.throwIfAborted();
          const current = grid.levels[cell + a];
          if (current < 0) continue;
          let best = current;
          const L = plan.attributes[a].levelIds.length;
          for (let l = 0; l < L; l++) {
            if (l === current) continue;
            if (bounds && !canMoveLevel(c, bounds, counts, a, current, l)) continue;
            grid.levels[cell + a] = l;
            if (!isAlternativeValidInTask(c, grid, s, j)) continue;
            const bound = value * (1 - MIN_RELATIVE_GAIN);
            const candidate = evaluator.evaluateChange(s, j, a, current, l, bound);
            if (candidate < bound) {
              value = candidate;
              best = l;
            }
          }
          grid.levels[cell + a] = best;
          if (best !== current) {
            improved = true;
            taskChanged = true;
            evaluator.commitChange(s, j, a, current, best);
            moveLevel(c, counts, a, current, best);
          }
          if (options.swaps) {
            const swapped = trySwaps(
              { plan, c, grid, evaluator, pass },
              s,
              j,
              a,
              value * (1 - MIN_RELATIVE_GAIN),
            );
            if (swapped.touchedTask) taskChanged = true;
            if (swapped.value < Infinity) {
              value = swapped.value;
              improved = true;
            }
          }
        }
      }
      if (taskChanged) evaluator.endTask(s);
    }
    passes = pass;
    options.onPass?.(passOffset + pass, value);
    if (!improved || (ridge > 0 && evaluator.reset(0) < Infinity)) break;
  }
  return { value, passes };
}

/**
 * Improves `start` (copied, not modified) by coordinate exchange under the mean D-error (or
 * `options.scorer`'s criterion) over `draws` (R × K). Returns the improved grid and its criterion.
 */
export function improveByCoordinateExchange(
  plan: CodingPlan,
  constraints: DesignConstraints,
  start: LevelGrid,
  draws: Float64Array,
  R: number,
  options: ExchangeOptions,
): ExchangeResult {
  const grid: LevelGrid = { ...start, levels: start.levels.slice() };
  const x = buildDesignMatrix(plan, grid);
  const evaluator = options.scorer
    ? createCriterionEvaluator(plan, grid.S, x, draws, R, options.scorer)
    : createTaskEvaluator(plan, grid.S, x, draws, R);
  const startValue = evaluator.reset(0);
  let value = startValue;
  let passes = 0;
  if (value === Infinity) {
    // Scale the ridge to the information's size so it only breaks ties among singular designs.
    const ridge =
      1e-6 * Math.max(1e-12, getMeanDiagonal(plan.columnCount, grid.S, x, getRowsPerTask(plan)));
    const phase = runPasses(plan, constraints, grid, evaluator, Infinity, ridge, options, 0);
    passes = phase.passes;
    value = evaluator.reset(0);
  }
  if (value < Infinity) {
    const phase = runPasses(plan, constraints, grid, evaluator, value, 0, options, passes);
    passes += phase.passes;
  }
  // Recompute from scratch: the running value carries rounding of the incremental updates,
  // and a start is returned unchanged if rounding ever made the search drift upward.
  value = evaluator.reset(0);
  if (!(value <= startValue))
    return {
      grid: { ...start, levels: start.levels.slice() },
      value: startValue,
      startValue,
      passes,
    };
  return { grid, value, startValue, passes };
}

/** Mean squared coded value per column, a scale for the ridge. */
function getMeanDiagonal(K: number, S: number, x: Float64Array, Jt: number): number {
  let sum = 0;
  for (let i = 0; i < S * Jt * K; i++) sum += x[i] * x[i];
  return sum / (K * Jt);
}
