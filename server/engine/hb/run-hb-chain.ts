/**
 * One chain of the HB logit's Gibbs sampler (Allenby & Rossi 1999; Train 2009, §12.6), per
 * iteration: (1) each α_n | μ, Σ by `steps` random-walk Metropolis–Hastings steps with proposal
 * α_n + ρ·chol(Σ)·z, accepted with probability min(1, P(y_n|β(α'))φ(α'|μ,Σ) / P(y_n|β(α))φ(α|μ,Σ));
 * (2) the fixed coefficients by a random-walk MH step over all respondents (Train 2009, §12.7);
 * (3) μ | α, Σ and (4) Σ | α, μ from their conjugate conditionals (gibbs-conditionals.ts).
 * During burn-in ρ ← ρ·exp(rate − 0.3) after every iteration (and the fixed step's scale by
 * exp(0.1·(accepted − 0.3))), steering acceptance toward 0.3 (Train 2009, §12.6.2, from memory);
 * after burn-in both stay fixed, so the kept draws come from a valid Markov chain. Bounded: the
 * loop runs `iterations` times; non-finite or exploding population values end it with
 * EstimationFailedError.
 */
import { createPrng } from '../draws/prng';
import { choleskyDecompose } from '../linalg/cholesky';
import type { ChoiceData } from '../estimation/choice-data';
import { EstimationCancelledError, EstimationFailedError } from '../estimation/estimation-errors';
import type { CheckedHbOptions } from './check-hb-options';
import {
  createGibbsWorkspace,
  drawPopulationCovariance,
  drawPopulationMean,
} from './gibbs-conditionals';
import type { HbChainResult } from './hb-chain-result';
import type { HbStart } from './hb-start';
import {
  createIndividualStep,
  type IndividualStep,
  type IndividualStepFactory,
} from './individual-step';
import { createFixedStep } from './fixed-step';

export interface HbChainHooks {
  /** Called every PROGRESS_EVERY iterations; returning true stops the chain (cancel). */
  onProgress?: (iteration: number) => boolean | void;
}

const PROGRESS_EVERY = 50;
const TRACE_POINTS = 250;
/** |μ_k| or Σ_kk beyond these means the hierarchy is running away (common practice, no source). */
const MU_LIMIT = 1e3;
const SIGMA_LIMIT = 1e6;

/** The seed stream of chain c (0-based) for the user's seed. */
export function getChainStream(chain: number): number {
  return 0x4842_00 + chain;
}

/**
 * Runs chain `chain` on data whose columns are the coefficients in order. `createStep` is the
 * respondent layer; only the benchmark passes another (the previous kernel, for comparison).
 */
export function runHbChain(
  data: ChoiceData,
  opts: CheckedHbOptions,
  chain: number,
  start: HbStart,
  hooks: HbChainHooks = {},
  createStep: IndividualStepFactory = createIndividualStep,
): HbChainResult {
  const { layout, iterations, burnin, thin, retained } = opts;
  const Kr = layout.random.length;
  const Kf = layout.fixed.length;
  const N = data.taskStart.length - 1;
  const prng = createPrng(opts.seed, getChainStream(chain));
  const individual = createStep(data, layout, start.alpha);
  const fixedStep = Kf > 0 ? createFixedStep(layout, start.fixedChol, opts.priors) : null;
  const gibbs = createGibbsWorkspace(Kr);
  const mu = Float64Array.from(layout.random, (k) => start.alpha[k]);
  const sigma = new Float64Array(Kr * Kr);
  const sigmaInv = new Float64Array(Kr * Kr);
  const sigmaChol = new Float64Array(Kr * Kr);
  for (let k = 0; k < Kr; k++) sigma[k * Kr + k] = sigmaInv[k * Kr + k] = sigmaChol[k * Kr + k] = 1;
  const out: HbChainResult = {
    chain,
    mu: new Float64Array(retained * Kr),
    sigma: new Float64Array(retained * Kr * Kr),
    fixed: new Float64Array(retained * Kf),
    loglik: new Float64Array(retained),
    betas: new Float32Array(retained * N * Kr),
    trace: createTrace(iterations, Kr),
    acceptanceBurnin: 0,
    acceptance: 0,
    acceptanceFixed: Kf > 0 ? 0 : null,
    scale: 0,
    mnlLoglik: start.mnlLoglik,
  };
  const traceEvery = Math.max(1, Math.ceil(iterations / TRACE_POINTS));
  let rho = 0.1;
  let accepted = 0;
  let acceptedBurnin = 0;
  let fixedAccepted = 0;
  let kept = 0;
  let tracePoint = 0;
  for (let it = 0; it < iterations; it++) {
    const rate = individual.step(mu, sigmaChol, rho, prng, opts.steps) / (N * opts.steps);
    const fixedMoved = fixedStep ? fixedStep.step(individual, prng) : false;
    if (!drawPopulationMean(individual.alpha, N, sigmaInv, opts.priors, prng, mu, gibbs))
      fail(chain, it, 'the posterior covariance of the population means is not positive definite');
    if (
      !drawPopulationCovariance(
        individual.alpha,
        N,
        mu,
        opts.priors,
        opts.correlated,
        prng,
        sigma,
        sigmaInv,
        gibbs,
      )
    )
      fail(chain, it, 'the covariance draw is not positive definite');
    if (!choleskyDecompose(sigma, Kr, sigmaChol))
      fail(chain, it, 'the covariance draw is not positive definite');
    assertBounded(mu, sigma, Kr, chain, it, layout.names, layout.random);
    if (it < burnin) {
      acceptedBurnin += rate;
      rho *= Math.exp(rate - 0.3);
      fixedStep?.adapt(fixedMoved);
    } else {
      accepted += rate;
      if (fixedMoved) fixedAccepted++;
      if ((it - burnin + 1) % thin === 0 && kept < retained) {
        storeDraw(out, kept++, individual, mu, sigma, N, Kr, Kf);
        if (!Number.isFinite(out.loglik[kept - 1]))
          fail(chain, it, 'the log-likelihood is not finite');
      }
    }
    if ((it + 1) % traceEvery === 0 || it === iterations - 1) {
      const t = out.trace;
      if (tracePoint < t.iteration.length) {
        t.iteration[tracePoint] = it + 1;
        for (let k = 0; k < Kr; k++) {
          t.mu[tracePoint * Kr + k] = mu[k];
          t.sigmaDiag[tracePoint * Kr + k] = sigma[k * Kr + k];
        }
        t.acceptance[tracePoint] = rate;
        t.scale[tracePoint++] = rho;
      }
    }
    if ((it + 1) % PROGRESS_EVERY === 0 && hooks.onProgress?.(it + 1) === true)
      throw new EstimationCancelledError();
  }
  out.acceptanceBurnin = burnin > 0 ? acceptedBurnin / burnin : NaN;
  out.acceptance = accepted / (iterations - burnin);
  if (out.acceptanceFixed !== null) out.acceptanceFixed = fixedAccepted / (iterations - burnin);
  out.scale = rho;
  return out;
}

function createTrace(iterations: number, Kr: number): HbChainResult['trace'] {
  const points = Math.min(iterations, TRACE_POINTS) + 1;
  return {
    iteration: new Int32Array(points),
    mu: new Float64Array(points * Kr),
    sigmaDiag: new Float64Array(points * Kr),
    acceptance: new Float64Array(points),
    scale: new Float64Array(points),
  };
}

function storeDraw(
  out: HbChainResult,
  s: number,
  individual: IndividualStep,
  mu: Float64Array,
  sigma: Float64Array,
  N: number,
  Kr: number,
  Kf: number,
): void {
  out.mu.set(mu, s * Kr);
  out.sigma.set(sigma, s * Kr * Kr);
  if (Kf > 0) out.fixed.set(individual.fixedAlpha, s * Kf);
  out.loglik[s] = individual.totalLoglik();
  individual.writeBetas(out.betas, s * N * Kr);
}

function assertBounded(
  mu: Float64Array,
  sigma: Float64Array,
  Kr: number,
  chain: number,
  it: number,
  names: string[],
  random: Int32Array,
): void {
  for (let k = 0; k < Kr; k++) {
    const v = sigma[k * Kr + k];
    if (!(Math.abs(mu[k]) < MU_LIMIT) || !(v < SIGMA_LIMIT))
      fail(
        chain,
        it,
        `the population distribution of ${names[random[k]]} ran away (mean ${mu[k].toPrecision(3)}, variance ${v.toPrecision(3)}); the choices may be perfectly predicted by an attribute, or the attribute needs another scale`,
      );
  }
}

function fail(chain: number, it: number, reason: string): never {
  throw new EstimationFailedError(`chain ${chain + 1} diverged at iteration ${it + 1}: ${reason}`);
}
