/**
 * Quasi-Newton minimisation by BFGS on the inverse Hessian (Nocedal & Wright, Numerical
 * Optimization, 2nd ed., Algorithm 6.1) with a weak-Wolfe line search by bisection and
 * expansion (Lewis & Overton 2013, Math. Program. 141:135-163), and update skipping when
 * y's ≤ 0. The first inverse Hessian is the caller's `initialInverseHessian` when given (for
 * maximum likelihood the inverse BHHH matrix at the start, bhhh-start.ts), otherwise the
 * scaled identity H0 = (y's / y'y)·I of N&W eq. 6.20. The objective is asynchronous so it can
 * be evaluated on worker threads.
 *
 * It stops as "converged" only when the convergence test of convergence.ts passes with the
 * current inverse-Hessian approximation (Newton decrement g′Hg and the relative gradient); as
 * "stalled" when the line search finds no better point; as "iteration_limit" otherwise. A
 * small change in f never ends it. Callers confirm the verdict with a real Hessian.
 *
 * Resuming: after every iteration `onState` gets the whole state (iterate, f, gradient, inverse
 * Hessian, counters and the stop verdict, if any). Started again with `resume` set to such a
 * state, the minimisation takes exactly the steps it would have taken had it never stopped:
 * nothing else carries over from one iteration to the next, and the state is taken before the
 * next direction is computed. The caller decides which states to keep and where.
 */
import {
  measureConvergence,
  multiply,
  passesConvergence,
  type ConvergenceStatus,
  type ConvergenceTolerances,
} from './convergence';
import { choleskyDecompose } from '../linalg/cholesky';
import { EstimationCancelledError } from './estimation-errors';

/** f(x) with its gradient written into g; may return a non-finite value to reject x. */
export type AsyncObjective = (x: Float64Array, g: Float64Array) => Promise<number>;

export interface BfgsOptions extends ConvergenceTolerances {
  signal?: AbortSignal;
  onIteration?: (iteration: number, f: number, gradientNorm: number) => void;
  /**
   * Called after every iteration with a copy of the state, before onIteration: a caller that
   * shows an iteration has the state to resume from it.
   */
  onState?: (state: BfgsState) => void;
  /** Continue from this state (from onState) instead of x0: no evaluation at x0. */
  resume?: BfgsState;
  /**
   * The first inverse Hessian, n × n row-major, symmetric positive definite (checked); the
   * first step is then tried at full length. Ignored on resume (the state has its own).
   */
  initialInverseHessian?: Float64Array;
}

/** Where the minimisation stands after an iteration: all it needs to go on exactly. */
export interface BfgsState {
  x: Float64Array;
  f: number;
  grad: Float64Array;
  /** The inverse-Hessian approximation, n × n row-major. */
  inverseHessian: Float64Array;
  iterations: number;
  evaluations: number;
  relativeChange: number;
  /** Set when this iteration ended the minimisation: resuming returns at once. */
  stopped: BfgsStopReason | null;
}

export type BfgsStopReason = ConvergenceStatus;

export interface BfgsResult {
  x: Float64Array;
  f: number;
  grad: Float64Array;
  iterations: number;
  evaluations: number;
  converged: boolean;
  reason: BfgsStopReason;
  /** Euclidean norm of the final gradient. */
  gradientNorm: number;
  /** g′Hg with the final inverse-Hessian approximation. */
  decrement: number;
  /** |Δf| / max(|f|, 1) of the last iteration. */
  relativeChange: number;
}

const C1 = 1e-4;
const C2 = 0.9;

/** Minimises f from x0; throws EstimationCancelledError when the signal fires. */
export async function minimizeBfgs(
  f: AsyncObjective,
  x0: Float64Array,
  options: BfgsOptions,
): Promise<BfgsResult> {
  const n = x0.length;
  const from = options.resume;
  if (from) assertStateFits(from, n);
  const x = Float64Array.from(from?.x ?? x0);
  const g = new Float64Array(n);
  let evaluations = 1;
  let fx: number;
  if (from) {
    g.set(from.grad);
    fx = from.f;
    evaluations = from.evaluations;
  } else {
    fx = await f(x, g);
    if (!Number.isFinite(fx))
      throw new Error('the log-likelihood is not finite at the starting values');
  }
  const H = new Float64Array(n * n);
  const given = from ? undefined : options.initialInverseHessian;
  if (given) assertSymmetricPositiveDefinite(given, n);
  // Only a fresh start from the identity rescales H after its first step (N&W eq. 6.20).
  const scaleFirstUpdate = !from && !given;
  if (from) H.set(from.inverseHessian);
  else if (given) H.set(given);
  else for (let i = 0; i < n; i++) H[i * n + i] = 1;
  const d = new Float64Array(n);
  const xNew = new Float64Array(n);
  const gNew = new Float64Array(n);
  const s = new Float64Array(n);
  const y = new Float64Array(n);
  const Hy = new Float64Array(n);
  let iterations = from?.iterations ?? 0;
  let relativeChange = from?.relativeChange ?? Infinity;
  let reason: BfgsStopReason = from?.stopped ?? 'iteration_limit';
  // Judged only after an update: the first H may be the identity, no estimate of the curvature.
  const converged = () => passesConvergence(measureConvergence(g, multiply(H, g), x, fx), options);
  while (!from?.stopped && iterations < options.maxIterations) {
    if (options.signal?.aborted) throw new EstimationCancelledError();
    for (let i = 0; i < n; i++) {
      let v = 0;
      for (let j = 0; j < n; j++) v -= H[i * n + j] * g[j];
      d[i] = v;
    }
    let slope = dot(g, d);
    if (!(slope < 0)) {
      // H lost positive definiteness numerically: restart from steepest descent.
      H.fill(0);
      for (let i = 0; i < n; i++) H[i * n + i] = 1;
      for (let i = 0; i < n; i++) d[i] = -g[i];
      slope = dot(g, d);
    }
    // The identity knows nothing of the scale of f: keep the first step to unit length.
    let alpha = iterations === 0 && scaleFirstUpdate ? Math.min(1, 1 / Math.sqrt(dot(g, g))) : 1;
    let lo = 0;
    let hi = Infinity;
    let fNew = NaN;
    let accepted = false;
    for (let trial = 0; trial < 40; trial++) {
      for (let i = 0; i < n; i++) xNew[i] = x[i] + alpha * d[i];
      fNew = await f(xNew, gNew);
      evaluations++;
      if (!Number.isFinite(fNew) || fNew > fx + C1 * alpha * slope) {
        hi = alpha;
      } else if (dot(gNew, d) < C2 * slope) {
        lo = alpha;
        accepted = true;
        if (hi === Infinity) {
          alpha *= 2;
          continue;
        }
      } else {
        accepted = true;
        break;
      }
      alpha = (lo + hi) / 2;
      if (accepted && hi - lo < 1e-12 * lo) break;
    }
    if (!accepted) {
      reason = 'stalled';
      break;
    }
    if (!(Number.isFinite(fNew) && fNew <= fx + C1 * alpha * slope)) {
      // Last trial failed; fall back to the last step that met the sufficient-decrease rule.
      alpha = lo;
      for (let i = 0; i < n; i++) xNew[i] = x[i] + alpha * d[i];
      fNew = await f(xNew, gNew);
      evaluations++;
    }
    for (let i = 0; i < n; i++) {
      s[i] = xNew[i] - x[i];
      y[i] = gNew[i] - g[i];
    }
    updateInverseHessian(H, s, y, Hy, iterations === 0 && scaleFirstUpdate);
    relativeChange = Math.abs(fNew - fx) / Math.max(Math.abs(fNew), 1);
    x.set(xNew);
    g.set(gNew);
    fx = fNew;
    iterations++;
    // The line search fell back to a zero step (alpha 0): the point did not move.
    const stopped: BfgsStopReason | null = converged()
      ? 'converged'
      : alpha === 0
        ? 'stalled'
        : iterations >= options.maxIterations
          ? 'iteration_limit'
          : null;
    options.onState?.({
      x: Float64Array.from(x),
      f: fx,
      grad: Float64Array.from(g),
      inverseHessian: Float64Array.from(H),
      iterations,
      evaluations,
      relativeChange,
      stopped,
    });
    options.onIteration?.(iterations, fx, Math.sqrt(dot(g, g)));
    if (stopped) {
      reason = stopped;
      break;
    }
  }
  return {
    x,
    f: fx,
    grad: g,
    iterations,
    evaluations,
    converged: reason === 'converged',
    reason,
    gradientNorm: Math.sqrt(dot(g, g)),
    decrement: Math.abs(dot(g, multiply(H, g))),
    relativeChange,
  };
}

function assertStateFits(state: BfgsState, n: number): void {
  if (
    state.x.length !== n ||
    state.grad.length !== n ||
    state.inverseHessian.length !== n * n ||
    !Number.isFinite(state.f)
  )
    throw new Error(`a BFGS state of ${state.x.length} parameters cannot resume a problem of ${n}`);
}

function assertSymmetricPositiveDefinite(h: Float64Array, n: number): void {
  let symmetric = h.length === n * n;
  for (let i = 0; symmetric && i < n; i++)
    for (let j = 0; j < i; j++)
      if (!(Math.abs(h[i * n + j] - h[j * n + i]) <= 1e-12 * Math.abs(h[i * n + j]))) {
        symmetric = false;
        break;
      }
  if (!symmetric || !choleskyDecompose(h, n, new Float64Array(n * n)))
    throw new Error('the initial inverse Hessian must be symmetric positive definite');
}

function updateInverseHessian(
  H: Float64Array,
  s: Float64Array,
  y: Float64Array,
  Hy: Float64Array,
  first: boolean,
): void {
  const n = s.length;
  const ys = dot(y, s);
  if (!(ys > 1e-12 * Math.sqrt(dot(s, s) * dot(y, y)))) return;
  if (first) {
    const scale = ys / dot(y, y);
    for (let i = 0; i < n; i++) H[i * n + i] = scale;
  }
  const rho = 1 / ys;
  for (let i = 0; i < n; i++) {
    let v = 0;
    for (let j = 0; j < n; j++) v += H[i * n + j] * y[j];
    Hy[i] = v;
  }
  const yHy = dot(y, Hy);
  const c = rho * rho * yHy + rho;
  for (let i = 0; i < n; i++)
    for (let j = 0; j < n; j++)
      H[i * n + j] += c * s[i] * s[j] - rho * (Hy[i] * s[j] + s[i] * Hy[j]);
}

function dot(a: Float64Array, b: Float64Array): number {
  let s = 0;
  for (let i = 0; i < a.length; i++) s += a[i] * b[i];
  return s;
}
