/**
 * Options of the latent class logit (fitLatentClass) with their documented defaults, checked
 * before any numerics, including whether the data can identify the classes asked for. The rules
 * (common practice, no source): every respondent needs at least 2 choice tasks (classes are told
 * apart by repeated choices); fewer parameters than respondents; at least 10 respondents per class.
 */
import type { ChoiceData } from '../estimation/choice-data';
import { EstimationOptionsError } from '../estimation/estimation-errors';
import {
  assertInteger,
  checkHoldout,
  resolveCoefficientColumn,
  resolveCostIndex,
} from '../estimation/shared-option-checks';

export const LC_MIN_TASKS = 2;
export const LC_MAX_CLASSES = 8;
export const LC_RESPONDENTS_PER_CLASS = 10;

/** Respondent-level covariates of the membership model, rows in data.respondentIds order. */
export interface MembershipCovariates {
  names: string[];
  /** N × M, row-major. */
  values: Float64Array;
}

export interface LatentClassOptions {
  coefficients: { name: string; column?: string }[];
  /** A number of classes, or [min, max] to fit each and choose by BIC (default 2). */
  classes?: number | [number, number];
  /** EM starts per number of classes: the MNL plus seeded perturbations (default 10). */
  starts?: number;
  membership?: MembershipCovariates | null;
  /** EM iterations per start (default 2000). */
  maxIterations?: number;
  /** Stop EM when the LL rises by less than this, relative (default 1e-8); Newton steps follow. */
  tolerance?: number;
  seed?: number;
  cost?: string;
  holdout?: ChoiceData | null;
}

export interface CheckedLatentClassOptions {
  names: string[];
  /** Data column of each coefficient. */
  column: Int32Array;
  classes: number[];
  starts: number;
  membership: MembershipCovariates;
  maxIterations: number;
  tolerance: number;
  seed: number;
  cost: number;
  holdout: ChoiceData | null;
}

/** Parameters of a C-class model: C·K coefficients and (C−1)(1+M) membership parameters. */
export function countLatentClassParameters(C: number, K: number, M: number): number {
  return C * K + (C - 1) * (1 + M);
}

/** Throws unless N respondents with these tasks can identify C classes of K coefficients. */
export function assertClassesIdentifiable(data: ChoiceData, C: number, K: number, M: number): void {
  const N = data.taskStart.length - 1;
  let short = 0;
  for (let n = 0; n < N; n++) if (data.taskStart[n + 1] - data.taskStart[n] < LC_MIN_TASKS) short++;
  if (short > 0)
    throw new EstimationOptionsError(
      `a latent class model needs at least ${LC_MIN_TASKS} choice tasks per respondent; ${short} of ${N} respondents have fewer`,
      'classes',
    );
  const P = countLatentClassParameters(C, K, M);
  if (P >= N || N < LC_RESPONDENTS_PER_CLASS * C)
    throw new EstimationOptionsError(
      `${C} classes need ${P} parameters and at least ${Math.max(P + 1, LC_RESPONDENTS_PER_CLASS * C)} respondents; the data have ${N}: fit fewer classes`,
      'classes',
    );
}

/** Fills defaults and validates; throws EstimationOptionsError naming the field. */
export function checkLatentClassOptions(
  data: ChoiceData,
  options: LatentClassOptions,
): CheckedLatentClassOptions {
  if (!options || !Array.isArray(options.coefficients) || options.coefficients.length === 0)
    throw new EstimationOptionsError('at least one coefficient is required', 'coefficients');
  const names = options.coefficients.map((c) => c.name);
  const column = Int32Array.from(options.coefficients, (_, k) =>
    resolveCoefficientColumn(data, options.coefficients, k),
  );
  const range = options.classes ?? 2;
  const [lo, hi] = Array.isArray(range) ? range : [range, range];
  assertInteger(lo, 'classes', 1, LC_MAX_CLASSES);
  assertInteger(hi, 'classes', 1, LC_MAX_CLASSES);
  if (hi < lo)
    throw new EstimationOptionsError('classes: the range must run from low to high', 'classes');
  const starts = options.starts ?? 10;
  assertInteger(starts, 'starts', 1, 100);
  const maxIterations = options.maxIterations ?? 2000;
  assertInteger(maxIterations, 'maxIterations', 1, 100_000);
  const tolerance = options.tolerance ?? 1e-8;
  if (!(tolerance > 0)) throw new EstimationOptionsError('tolerance must be positive', 'tolerance');
  const seed = options.seed ?? 1;
  assertInteger(seed, 'seed', 0, 2 ** 31 - 1);
  const N = data.taskStart.length - 1;
  const membership = options.membership ?? { names: [], values: new Float64Array(0) };
  const M = membership.names.length;
  if (membership.values.length !== N * M || !membership.values.every(Number.isFinite))
    throw new EstimationOptionsError(
      `membership needs ${M} finite values for each of the ${N} respondents`,
      'membership',
    );
  // The largest model decides identifiability; a range stops at what the data can carry.
  assertClassesIdentifiable(data, hi, names.length, M);
  const cost = resolveCostIndex(names, options.cost);
  const holdout = checkHoldout(data, options.holdout);
  return {
    names,
    column,
    classes: Array.from({ length: hi - lo + 1 }, (_, i) => lo + i),
    starts,
    membership,
    maxIterations,
    tolerance,
    seed,
    cost,
    holdout,
  };
}
