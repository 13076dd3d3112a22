/**
 * Covariance matrices of the estimates, computed on the internally scaled parameters and
 * reported in the user's units:
 *  - classical: the inverse information A⁻¹, A = −Hessian (Train 2009 §8.7);
 *  - BHHH: the inverse outer product of per-respondent scores B⁻¹, B = Σ_n s_n s_n′ (Berndt,
 *    Hall, Hall & Hausman 1974), used in place of the classical one when asked (no Hessian);
 *  - robust (sandwich) clustered by respondent: G/(G−1)·A⁻¹ B A⁻¹ with G respondents (the
 *    finite-sample factor of Cameron & Miller 2015, J. Human Resources 50:317-372, §II.C).
 * A that is not positive definite never discards the run: the estimates stay, the run says so,
 * names the eigen-direction (in correlation form, see analyse-information.ts), and gives
 * standard errors only for parameters that do not load on it.
 */
import { analyseInformation, describeDirection } from '../linalg/analyse-information';
import type { EstimationWarning } from './estimation-warnings';
import { covarianceToUser, type ThetaScaling } from './parameter-scaling';

export type CovarianceChoice = 'robust' | 'classical' | 'bhhh';

export interface InferenceInput {
  names: readonly string[];
  /** −Hessian in internal units; null with the BHHH choice. */
  information: Float64Array | null;
  /** N×P per-respondent scores in internal units. */
  scores: Float64Array;
  respondents: number;
  choice: CovarianceChoice;
  scaling: ThetaScaling;
}

export interface Inference {
  method: 'hessian' | 'bhhh';
  used: 'classical' | 'robust';
  /** P×P in user units (null when no parameter has one). */
  classical: Float64Array | null;
  robust: Float64Array | null;
  se: Float64Array;
  robustSe: Float64Array;
  /** The covariance inference uses (classical or robust as chosen). */
  chosen: Float64Array | null;
  positiveDefinite: boolean;
  conditionNumber: number;
  clusters: number;
  correction: number;
  warnings: EstimationWarning[];
}

/** Σ_n s_n s_n′ for the N×P score rows (the "meat" of the sandwich, and the BHHH matrix). */
export function outerProductSum(scores: Float64Array, N: number, P: number): Float64Array {
  const out = new Float64Array(P * P);
  for (let n = 0; n < N; n++)
    for (let a = 0; a < P; a++) {
      const sa = scores[n * P + a];
      if (sa === 0) continue;
      for (let b = 0; b < P; b++) out[a * P + b] += sa * scores[n * P + b];
    }
  return out;
}

function product(a: Float64Array, b: Float64Array, P: number): Float64Array {
  const out = new Float64Array(P * P);
  for (let i = 0; i < P; i++)
    for (let k = 0; k < P; k++) {
      const v = a[i * P + k];
      if (v === 0) continue;
      for (let j = 0; j < P; j++) out[i * P + j] += v * b[k * P + j];
    }
  return out;
}

function standardErrors(cov: Float64Array | null, P: number, undetermined: boolean[]) {
  return Float64Array.from({ length: P }, (_, p) =>
    cov && !undetermined[p] && cov[p * P + p] >= 0 ? Math.sqrt(cov[p * P + p]) : NaN,
  );
}

export function computeInference(input: InferenceInput): Inference {
  const { names, scores, respondents: G, scaling } = input;
  const P = names.length;
  const meat = outerProductSum(scores, G, P);
  const bhhh = input.choice === 'bhhh';
  const information = bhhh ? meat : input.information!;
  const analysis = analyseInformation(information, P);
  const warnings: EstimationWarning[] = [];
  if (!analysis.positiveDefinite) {
    const what = bhhh ? 'The BHHH matrix is singular' : 'The Hessian is not negative definite';
    const directions = analysis.weak.map((w) => describeDirection(w, names));
    const involved = [
      ...new Set(analysis.weak.flatMap((w) => w.loadings.map((l) => names[l.index]))),
    ];
    warnings.push({
      code: 'hessian_not_negative_definite',
      message: `${what} at the estimate (eigen-direction${directions.length > 1 ? 's' : ''} ${directions.join('; ')}): the log-likelihood is flat or curves upward along it, so the estimate may be a saddle point or a parameter is not identified. The point estimates are kept; standard errors are not given for ${involved.join(', ')}.`,
      parameters: involved,
    });
  }
  const undetermined = analysis.undetermined;
  const anyDetermined = undetermined.some((u) => !u);
  const correction = G > 1 ? G / (G - 1) : 1;
  const internalClassical = anyDetermined ? analysis.inverse : null;
  const internalRobust =
    anyDetermined && !bhhh
      ? product(product(analysis.inverse, meat, P), analysis.inverse, P).map((v) => v * correction)
      : null;
  const classical = internalClassical ? covarianceToUser(scaling, internalClassical) : null;
  const robust = internalRobust ? covarianceToUser(scaling, internalRobust) : null;
  // Rows and columns of undetermined parameters are unknown, not zero.
  for (const cov of [classical, robust])
    if (cov)
      for (let i = 0; i < P; i++)
        for (let j = 0; j < P; j++) if (undetermined[i] || undetermined[j]) cov[i * P + j] = NaN;
  const used = input.choice === 'robust' ? 'robust' : 'classical';
  return {
    method: bhhh ? 'bhhh' : 'hessian',
    used,
    classical,
    robust,
    se: standardErrors(classical, P, undetermined),
    robustSe: standardErrors(robust, P, undetermined),
    chosen: used === 'robust' ? robust : classical,
    positiveDefinite: analysis.positiveDefinite,
    conditionNumber: analysis.conditionNumber,
    clusters: G,
    correction: bhhh ? 1 : correction,
    warnings,
  };
}
