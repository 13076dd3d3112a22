/**
 * Options of fitMixedLogit with their documented defaults, checked before any numerics.
 */
import { getMaxDrawDimensions, type DrawsType } from '../draws/uniform-draws';
import { KERNEL_PREFERENCES, type KernelPreference } from '../simd/kernel-choice';
import type { ChoiceData } from './choice-data';
import { DEFAULT_GRADIENT_TOLERANCE, DEFAULT_TOLERANCE } from './convergence';
import { EstimationOptionsError } from './estimation-errors';
import type { CovarianceChoice } from './inference';
import {
  createMixedLogitLayout,
  type CoefficientSpec,
  type MixedLogitLayout,
} from './mixed-logit-layout';
import { assertInteger, checkHoldout } from './shared-option-checks';

export interface MixedLogitOptions {
  coefficients: CoefficientSpec[];
  /** Correlate the normal coefficients through a Cholesky factor (default false). */
  correlated?: boolean;
  /** WTP space (Train & Weeks 2005): the name of the cost coefficient; null for preference space. */
  wtpCost?: string | null;
  /** Draws: type (default 'halton', scrambled), count R (default 500), seed (default 1). */
  draws?: { type?: DrawsType; count?: number; seed?: number; scrambled?: boolean };
  /** BFGS iterations per start (default 300). */
  maxIterations?: number;
  /** Newton decrement g′A⁻¹g at convergence (default 1e-7, see convergence.ts). */
  tolerance?: number;
  /** Largest relative gradient at convergence (default ε^{1/3}). */
  gradientTolerance?: number;
  /** Number of starts: the MNL-based start plus seeded perturbations of it (default 3). */
  starts?: number;
  /** Covariance used for inference (default 'robust'); 'bhhh' skips the numerical Hessian. */
  covariance?: CovarianceChoice;
  /** Explicit starting θ (overrides the MNL start). */
  start?: ArrayLike<number>;
  /** Worker threads for the LL (default 1: in-process). */
  threads?: number;
  /** Holdout tasks for an out-of-sample hit rate. */
  holdout?: ChoiceData | null;
  /** Kernel of the LL: 'auto' (default: WebAssembly SIMD when it can run), 'simd', 'typescript'. */
  kernel?: KernelPreference;
  /** Profile draws that will follow (default 2000), for the time-left estimate only. */
  profileDraws?: number;
  /**
   * First inverse Hessian of BFGS: 'bhhh' (default), the inverse BHHH matrix at each start
   * (bhhh-start.ts, one evaluation of the scores per start), or 'identity', the scaled
   * identity of N&W eq. 6.20. Both reach the same optimum under the same convergence test.
   */
  initialInverseHessian?: InitialInverseHessian;
}

export type InitialInverseHessian = 'bhhh' | 'identity';

export interface CheckedMixedLogitOptions {
  layout: MixedLogitLayout;
  draws: { type: DrawsType; count: number; seed: number; scrambled: boolean };
  maxIterations: number;
  tolerance: number;
  gradientTolerance: number;
  starts: number;
  covariance: CovarianceChoice;
  start: Float64Array | null;
  threads: number;
  holdout: ChoiceData | null;
  kernel: KernelPreference;
  profileDraws: number;
  initialInverseHessian: InitialInverseHessian;
}

const DRAW_TYPES: DrawsType[] = ['halton', 'sobol', 'mlhs', 'random'];

/** Fills defaults and validates; throws EstimationOptionsError naming the field. */
export function checkMixedLogitOptions(
  data: ChoiceData,
  options: MixedLogitOptions,
): CheckedMixedLogitOptions {
  if (!options || !Array.isArray(options.coefficients)) {
    throw new EstimationOptionsError('coefficients must be a list', 'coefficients');
  }
  const layout = createMixedLogitLayout(
    data,
    options.coefficients,
    options.correlated ?? false,
    options.wtpCost ?? null,
  );
  if (layout.D === 0)
    throw new EstimationOptionsError(
      'a mixed logit needs at least one random coefficient',
      'coefficients',
    );
  const draws = {
    type: options.draws?.type ?? 'halton',
    count: options.draws?.count ?? 500,
    seed: options.draws?.seed ?? 1,
    scrambled: options.draws?.scrambled ?? true,
  };
  if (!DRAW_TYPES.includes(draws.type))
    throw new EstimationOptionsError(`unknown draws type ${String(draws.type)}`, 'draws.type');
  assertInteger(draws.count, 'draws.count', 1, 100_000);
  if (!Number.isInteger(draws.seed))
    throw new EstimationOptionsError('draws.seed must be an integer', 'draws.seed');
  if (layout.D > getMaxDrawDimensions(draws.type)) {
    throw new EstimationOptionsError(
      `${draws.type} draws support at most ${getMaxDrawDimensions(draws.type)} random coefficients`,
      'draws.type',
    );
  }
  const maxIterations = options.maxIterations ?? 300;
  assertInteger(maxIterations, 'maxIterations', 1, Number.MAX_SAFE_INTEGER);
  const starts = options.starts ?? 3;
  assertInteger(starts, 'starts', 1, 50);
  const threads = options.threads ?? 1;
  assertInteger(threads, 'threads', 1, 64);
  const tolerance = options.tolerance ?? DEFAULT_TOLERANCE;
  const gradientTolerance = options.gradientTolerance ?? DEFAULT_GRADIENT_TOLERANCE;
  if (!(gradientTolerance > 0))
    throw new EstimationOptionsError('gradientTolerance must be positive', 'gradientTolerance');
  if (!(tolerance > 0)) throw new EstimationOptionsError('tolerance must be positive', 'tolerance');
  const covariance = options.covariance ?? 'robust';
  if (!['robust', 'classical', 'bhhh'].includes(covariance))
    throw new EstimationOptionsError('covariance must be robust, classical or bhhh', 'covariance');
  let start: Float64Array | null = null;
  if (options.start) {
    if (options.start.length !== layout.P)
      throw new EstimationOptionsError(`start must have ${layout.P} values`, 'start');
    start = Float64Array.from(options.start);
    if (!start.every(Number.isFinite))
      throw new EstimationOptionsError('start values must be finite', 'start');
  }
  const holdout = checkHoldout(data, options.holdout);
  const kernel = options.kernel ?? 'auto';
  if (!KERNEL_PREFERENCES.includes(kernel))
    throw new EstimationOptionsError(`unknown kernel ${String(kernel)}`, 'kernel');
  const initialInverseHessian = options.initialInverseHessian ?? 'bhhh';
  if (!['bhhh', 'identity'].includes(initialInverseHessian))
    throw new EstimationOptionsError(
      'initialInverseHessian must be bhhh or identity',
      'initialInverseHessian',
    );
  return {
    initialInverseHessian,
    kernel,
    profileDraws: options.profileDraws ?? 2000,
    layout,
    draws,
    maxIterations,
    tolerance,
    gradientTolerance,
    starts,
    covariance,
    start,
    threads,
    holdout,
  };
}
