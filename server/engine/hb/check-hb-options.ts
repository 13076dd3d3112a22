/**
 * Options of the hierarchical Bayes logit (fitHb) with their documented defaults, checked before
 * any numerics. Priors: μ ~ N(m₀·1, v₀·I) and Σ ~ IW(ν, s·I). The default ("rossi") is ν = K + 3,
 * s = ν, v₀ = 100 (Rossi, Allenby & McCulloch 2005, Bayesian Statistics and Marketing, §5.5 and
 * their rhierMnlRwMixture defaults, from memory); "train" is IW(K, K·I) (Train 2009, Discrete
 * Choice Methods with Simulation, §12.5). K counts the random coefficients. The priors act on the
 * coefficients as coded: rescaling an attribute rescales its coefficient against the prior.
 */
import { HB_DEFAULTS, HB_DISTRIBUTIONS } from '../../../shared/schemas/estimation-families';
import type { ChoiceData } from '../estimation/choice-data';
import { EstimationOptionsError } from '../estimation/estimation-errors';
import {
  assertInteger,
  checkHoldout,
  resolveCoefficientColumn,
  resolveCostIndex,
} from '../estimation/shared-option-checks';

/** Index of a name in this list = its HB_* code below. */
export { HB_DISTRIBUTIONS };
export type HbDistribution = (typeof HB_DISTRIBUTIONS)[number];

/** β = α (normal or fixed), e^α (lognormal) or −e^α (neg_lognormal). */
export const HB_NORMAL = 0;
export const HB_LOGNORMAL = 1;
export const HB_NEG_LOGNORMAL = 2;
export const HB_FIXED = 3;

/** Fewest estimation tasks per respondent for individual-level estimates (common practice, no source). */
export const HB_MIN_TASKS = 3;

export interface HbCoefficientSpec {
  name: string;
  /** Data column (defaults to the name). */
  column?: string;
  distribution: string;
}

export interface HbPriorOptions {
  /** 'rossi' (default): IW(K+3, (K+3)·I); 'train': IW(K, K·I). */
  preset?: 'rossi' | 'train';
  /** Prior mean of every μ_k (default 0). */
  muMean?: number;
  /** Prior variance of every μ_k (default 100). */
  muVariance?: number;
  /** Inverse-Wishart degrees of freedom ν (default from the preset); must exceed K − 1. */
  nu?: number;
  /** Inverse-Wishart scale s of V = s·I (default from the preset). */
  scale?: number;
}

export interface HbOptions {
  coefficients: HbCoefficientSpec[];
  /** Full covariance Σ (true) or a diagonal one (default false). */
  correlated?: boolean;
  /** Iterations per chain, burn-in included (default HB_DEFAULTS). */
  iterations?: number;
  /** Burn-in iterations per chain, during which the proposal adapts (default iterations / 2). */
  burnin?: number;
  /** Keep every thin-th draw after burn-in (default HB_DEFAULTS). */
  thin?: number;
  /** Random-walk MH steps per respondent per iteration (default HB_DEFAULTS). */
  steps?: number;
  /** Independent chains, each with its own seed stream (default 2). */
  chains?: number;
  /** Seed of chain 1; chain c uses the stream c of the same seed (default 1). */
  seed?: number;
  priors?: HbPriorOptions;
  /** Cost coefficient for WTP per draw. */
  cost?: string;
  holdout?: ChoiceData | null;
  /** Worker threads for the chains (default 1: chains run one after another in-process). */
  threads?: number;
}

export interface HbLayout {
  names: string[];
  K: number;
  /** HB_* code of each coefficient. */
  transform: Int8Array;
  /** Data column of each coefficient. */
  column: Int32Array;
  /** Coefficient indexes of the random coefficients (Kr of them), then of the fixed ones. */
  random: Int32Array;
  fixed: Int32Array;
}

export interface CheckedHbOptions {
  layout: HbLayout;
  correlated: boolean;
  iterations: number;
  burnin: number;
  thin: number;
  steps: number;
  chains: number;
  seed: number;
  priors: {
    preset: 'rossi' | 'train' | 'custom';
    muMean: number;
    muVariance: number;
    nu: number;
    scale: number;
  };
  cost: number;
  holdout: ChoiceData | null;
  threads: number;
  /** Draws kept per chain. */
  retained: number;
}

/** Stored per-respondent draws are capped (4-byte floats) so a run cannot exhaust memory. */
const MAX_STORED_VALUES = 60_000_000;

/** Throws unless every respondent has at least HB_MIN_TASKS estimation tasks. */
export function assertEnoughTasksForHb(data: ChoiceData): void {
  const N = data.taskStart.length - 1;
  let short = 0;
  let fewest = Infinity;
  for (let n = 0; n < N; n++) {
    const tasks = data.taskStart[n + 1] - data.taskStart[n];
    fewest = Math.min(fewest, tasks);
    if (tasks < HB_MIN_TASKS) short++;
  }
  if (short > 0)
    throw new EstimationOptionsError(
      `hierarchical Bayes needs at least ${HB_MIN_TASKS} choice tasks per respondent for individual estimates; ${short} of ${N} respondents have fewer (fewest: ${fewest})`,
      'model',
    );
}

function createHbLayout(data: ChoiceData, coefficients: HbCoefficientSpec[]): HbLayout {
  if (!Array.isArray(coefficients) || coefficients.length === 0)
    throw new EstimationOptionsError('at least one coefficient is required', 'coefficients');
  const K = coefficients.length;
  const transform = new Int8Array(K);
  const column = new Int32Array(K);
  coefficients.forEach((c, k) => {
    const field = `coefficients.${k}`;
    if (!c.name) throw new EstimationOptionsError(`${field}.name is required`, `${field}.name`);
    column[k] = resolveCoefficientColumn(data, coefficients, k);
    const code = (HB_DISTRIBUTIONS as readonly string[]).indexOf(c.distribution);
    if (code < 0)
      throw new EstimationOptionsError(
        `hierarchical Bayes coefficients are normal, lognormal, neg_lognormal or fixed, not ${String(c.distribution)}`,
        `${field}.distribution`,
      );
    transform[k] = code;
  });
  const random = [...transform.keys()].filter((k) => transform[k] !== HB_FIXED);
  if (random.length === 0)
    throw new EstimationOptionsError(
      'hierarchical Bayes needs at least one random coefficient',
      'coefficients',
    );
  return {
    names: coefficients.map((c) => c.name),
    K,
    transform,
    column,
    random: Int32Array.from(random),
    fixed: Int32Array.from([...transform.keys()].filter((k) => transform[k] === HB_FIXED)),
  };
}

function checkPriors(p: HbPriorOptions | undefined, Kr: number): CheckedHbOptions['priors'] {
  const preset = p?.preset ?? 'rossi';
  if (preset !== 'rossi' && preset !== 'train')
    throw new EstimationOptionsError('priors.preset must be "rossi" or "train"', 'priors.preset');
  const nu = p?.nu ?? (preset === 'train' ? Kr : Kr + 3);
  const scale = p?.scale ?? nu;
  const muMean = p?.muMean ?? 0;
  const muVariance = p?.muVariance ?? 100;
  if (!(nu > Kr - 1) || !Number.isFinite(nu))
    throw new EstimationOptionsError(
      `priors.nu must exceed ${Kr - 1} (random coefficients − 1)`,
      'priors.nu',
    );
  if (!(scale > 0) || !Number.isFinite(scale))
    throw new EstimationOptionsError('priors.scale must be positive', 'priors.scale');
  if (!Number.isFinite(muMean))
    throw new EstimationOptionsError('priors.muMean must be finite', 'priors.muMean');
  if (!(muVariance > 0) || !Number.isFinite(muVariance))
    throw new EstimationOptionsError('priors.muVariance must be positive', 'priors.muVariance');
  const custom = p?.nu !== undefined || p?.scale !== undefined;
  return { preset: custom ? 'custom' : preset, muMean, muVariance, nu, scale };
}

/** Fills defaults and validates; throws EstimationOptionsError naming the field. */
export function checkHbOptions(data: ChoiceData, options: HbOptions): CheckedHbOptions {
  if (!options || typeof options !== 'object')
    throw new EstimationOptionsError('options are required', 'options');
  const layout = createHbLayout(data, options.coefficients);
  const Kr = layout.random.length;
  const correlated = options.correlated ?? false;
  if (correlated && Kr < 2)
    throw new EstimationOptionsError(
      'correlated needs at least two random coefficients',
      'correlated',
    );
  const iterations = options.iterations ?? HB_DEFAULTS.iterations;
  assertInteger(iterations, 'mcmc.iterations', 100, 2_000_000);
  const burnin = options.burnin ?? Math.floor(iterations / 2);
  assertInteger(burnin, 'mcmc.burnin', 0, iterations - 1);
  const thin = options.thin ?? HB_DEFAULTS.thin;
  assertInteger(thin, 'mcmc.thin', 1, 10_000);
  const steps = options.steps ?? HB_DEFAULTS.steps;
  assertInteger(steps, 'mcmc.steps', 1, 50);
  const chains = options.chains ?? HB_DEFAULTS.chains;
  assertInteger(chains, 'mcmc.chains', 1, 16);
  const seed = options.seed ?? 1;
  assertInteger(seed, 'mcmc.seed', 0, 2 ** 31 - 1);
  const threads = options.threads ?? 1;
  assertInteger(threads, 'threads', 1, 64);
  const retained = Math.floor((iterations - burnin) / thin);
  if (retained < 20)
    throw new EstimationOptionsError(
      `(iterations − burn-in) / thin keeps ${retained} draws per chain; keep at least 20`,
      'mcmc.thin',
    );
  const N = data.taskStart.length - 1;
  if (retained * chains * N * Kr > MAX_STORED_VALUES)
    throw new EstimationOptionsError(
      `${retained} kept draws × ${chains} chains × ${N} respondents × ${Kr} coefficients is too many to store; thin more`,
      'mcmc.thin',
    );
  assertEnoughTasksForHb(data);
  const cost = resolveCostIndex(layout.names, options.cost);
  const holdout = checkHoldout(data, options.holdout);
  return {
    layout,
    correlated,
    iterations,
    burnin,
    thin,
    steps,
    chains,
    seed,
    priors: checkPriors(options.priors, Kr),
    cost,
    holdout,
    threads,
    retained,
  };
}
