/**
 * Entry point of the design engine: checks the request, builds the tasks by the chosen
 * method (full factorial with cyclic shifts, level-balanced random, or D-efficient by
 * coordinate exchange from several random starts), assigns blocks, and returns the design
 * with its diagnostics. Pure: no I/O; progress through `hooks.onProgress`, cancellation
 * through `hooks.signal` (throws the signal's reason, an AbortError by default).
 */
import type { Design } from '../../../shared/schemas/design';
import { DESIGN_GENERATOR_VERSION, type DesignSpec } from '../../../shared/schemas/design-spec';
import { assignBlocks } from './assign-blocks';
import { DesignError } from './design-errors';
import { checkDesignSpec, type CheckedDesignSpec } from './check-design-spec';
import { improveByCoordinateExchange } from './coordinate-exchange';
import { buildDesignConstraints } from './compile-design-rules';
import type { DesignConstraints } from './design-constraints';
import { explainInfeasibleDesign } from './explain-infeasible';
import { buildLevelBounds, countLevels, findOutOfBounds } from './level-bounds';
import { writeDesign, type LevelGrid } from './design-grid';
import { diagnoseDesign } from './diagnostics/diagnose-design';
import type { DesignDiagnostics } from '../../../shared/schemas/design-diagnostics';
import { buildShiftedGrid, countFullFactorial, listFullFactorial } from './full-factorial';
import { buildPriorDraws } from './prior-draws';
import { buildCriterionSetup, createCriterionScorer } from './design-criteria';
import { generateRandomGrid } from './random-design';
import { DESIGN_STREAM } from './design-random';
import { createPrng, type Prng } from '../draws/prng';

/** Largest number of tasks a design may hold (shared/schemas/design.ts). */
const MAX_DESIGN_TASKS = 2000;

export interface DesignProgress {
  phase: 'building' | 'searching' | 'blocking' | 'diagnosing' | 'done';
  /** Rough share of the work done, 0..1. */
  fraction: number;
  /** d_efficient: current start (1-based), its pass, and the best criterion so far. */
  start?: number;
  starts?: number;
  pass?: number;
  bestDError?: number;
}

export interface DesignHooks {
  onProgress?: (progress: DesignProgress) => void;
  signal?: AbortSignal;
}

export interface GeneratedDesign {
  design: Design;
  diagnostics: DesignDiagnostics;
  /** The spec with defaults filled (store it with the design for reproducibility). */
  spec: DesignSpec;
}

function searchDEfficient(
  checked: CheckedDesignSpec,
  constraints: DesignConstraints,
  random: Prng,
  hooks: DesignHooks,
): LevelGrid {
  const { spec, plan, priorMeans, priorSds, draws } = checked;
  const bounds = buildLevelBounds(plan, constraints, spec.tasks!, spec.balance);
  const R = draws;
  const betas = R > 1 ? buildPriorDraws(priorMeans, priorSds, R, spec.seed) : priorMeans;
  // The D-error keeps its incremental evaluator; other criteria score through a scorer.
  const scorer =
    spec.criterion === 'd_error'
      ? undefined
      : createCriterionScorer(
          buildCriterionSetup(plan, checked.definition, spec.criterion, priorMeans, spec.tValue),
        );
  let best: LevelGrid | null = null;
  let bestValue = Infinity;
  for (let start = 1; start <= spec.starts; start++) {
    hooks.signal?.throwIfAborted();
    const initial = generateRandomGrid(plan, constraints, spec.tasks!, random, bounds);
    const result = improveByCoordinateExchange(plan, constraints, initial, betas, R, {
      maxPasses: spec.maxIterations,
      bounds,
      swaps: spec.balance.levelBalance,
      scorer,
      signal: hooks.signal,
      onPass: (pass, value) =>
        hooks.onProgress?.({
          phase: 'searching',
          fraction: 0.05 + (0.85 * (start - 1 + Math.min(0.9, pass / (pass + 2)))) / spec.starts,
          start,
          starts: spec.starts,
          pass,
          bestDError: Math.min(bestValue, value),
        }),
    });
    if (best === null || result.value < bestValue) {
      best = result.grid;
      bestValue = result.value;
    }
  }
  return best!;
}

/** Builds the tasks by the spec's method; throws DesignError('infeasible') as it comes. */
function buildGrid(
  checked: CheckedDesignSpec,
  constraints: DesignConstraints,
  random: Prng,
  hooks: DesignHooks,
): LevelGrid {
  const { spec, plan } = checked;
  if (spec.method === 'd_efficient') return searchDEfficient(checked, constraints, random, hooks);
  if (spec.method === 'random')
    return generateRandomGrid(
      plan,
      constraints,
      spec.tasks!,
      random,
      buildLevelBounds(plan, constraints, spec.tasks!, spec.balance),
    );
  const { profiles, count } = listFullFactorial(plan, constraints);
  assertFullFactorialTasks(count, spec);
  const grid = buildShiftedGrid(plan, constraints, profiles, count);
  // Every allowed profile is in the design once; its counts are what the rules leave.
  const bounds = buildLevelBounds(plan, constraints, count, spec.balance);
  if (findOutOfBounds(bounds, countLevels(constraints, grid)) >= 0)
    throw new DesignError('infeasible', 'Some level is shown too rarely in the full factorial.');
  return grid;
}

/** A full factorial has one task per feasible profile; a given task count must agree. */
function assertFullFactorialTasks(count: number, spec: DesignSpec): void {
  if (count > MAX_DESIGN_TASKS)
    throw new DesignError(
      'too_large',
      `The full factorial has ${count} feasible profiles; a design holds at most ${MAX_DESIGN_TASKS} tasks.`,
      { method: 'Too many profiles for a full factorial' },
    );
  if (spec.blocks > count)
    throw new DesignError(
      'invalid_spec',
      `More blocks than the ${count} tasks of the full factorial`,
      {
        blocks: 'More blocks than tasks',
      },
    );
  if (spec.tasks !== undefined && spec.tasks !== count)
    throw new DesignError(
      'invalid_spec',
      `The full factorial has ${count} tasks, not ${spec.tasks}`,
      {
        tasks: `The full factorial has ${count} tasks`,
      },
    );
}

/** Generates a design; see the file comment. Throws DesignError for bad or infeasible requests. */
export function generateDesign(
  definition: unknown,
  specInput: unknown,
  hooks: DesignHooks = {},
): GeneratedDesign {
  const checked = checkDesignSpec(definition, specInput);
  const { spec, plan, priorMeans, priorSds } = checked;
  const random = createPrng(spec.seed, DESIGN_STREAM);
  hooks.onProgress?.({ phase: 'building', fraction: 0 });
  const constraints = buildDesignConstraints(plan, checked.definition, priorMeans, priorSds, spec);
  let grid: LevelGrid;
  try {
    grid = buildGrid(checked, constraints, random, hooks);
  } catch (error) {
    if (!(error instanceof DesignError) || error.code !== 'infeasible') throw error;
    const tasks = spec.tasks ?? countFullFactorial(plan);
    throw new DesignError(
      'infeasible',
      explainInfeasibleDesign({
        plan,
        definition: checked.definition,
        spec: { ...spec, tasks },
        priorMeans,
        priorSds,
        constraints,
        bounds: buildLevelBounds(plan, constraints, tasks, spec.balance),
      }),
    );
  }
  hooks.signal?.throwIfAborted();
  hooks.onProgress?.({ phase: 'blocking', fraction: 0.92 });
  const levelCounts = plan.attributes.map((a) => a.levelIds.length);
  const blockOfTask = assignBlocks(grid, levelCounts, spec.blocks, random);
  const design = writeDesign(plan, grid, blockOfTask, spec.blocks);
  hooks.onProgress?.({ phase: 'diagnosing', fraction: 0.95 });
  const diagnostics = diagnoseDesign(checked.definition, design, spec.priors, spec.seed, spec);
  const searched = diagnostics.criteria?.values.find((v) => v.criterion === spec.criterion);
  hooks.onProgress?.({ phase: 'done', fraction: 1, bestDError: searched?.value ?? undefined });
  return {
    design,
    diagnostics,
    spec: { ...spec, tasks: grid.S, generatorVersion: DESIGN_GENERATOR_VERSION },
  };
}
