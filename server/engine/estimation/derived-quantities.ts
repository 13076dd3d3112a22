/**
 * Quantities derived from a mixed logit's parameters, with standard errors and intervals by
 * the delta method and by simulation (propagate-uncertainty.ts): for a lognormal coefficient
 * its population mean, median and SD; for normal, triangular and uniform ones the SD and the
 * share of the population with the sign opposite to the mean (Φ(−|b|/σ) for a normal); for
 * correlated normals the SDs, covariances and correlations implied by the Cholesky factor L (Σ = LL′, Train
 * 2009 §6.3). Distribution formulas in coefficient-distributions.ts. In WTP space they describe
 * the WTP distributions.
 */
import {
  getCoefficientDistribution,
  type CoefficientDistributionAt,
  mean,
  median,
  sd,
  wrongSignShare,
} from './coefficient-distributions';
import {
  DIST_FIXED,
  DIST_LOGNORMAL,
  DIST_NEG_LOGNORMAL,
  type MixedLogitLayout,
} from './mixed-logit-layout';
import { propagateUncertainty, type PropagatedEstimate } from './propagate-uncertainty';

export type DerivedKind =
  'mean' | 'median' | 'sd' | 'correlation' | 'covariance' | 'wrong_sign_share';

export interface DerivedQuantityEstimate extends PropagatedEstimate {
  name: string;
  quantity: DerivedKind;
  label: string;
}

interface Definition {
  name: string;
  quantity: DerivedKind;
  label: string;
  value: (theta: ArrayLike<number>) => number;
}

function definitions(layout: MixedLogitLayout): Definition[] {
  const defs: Definition[] = [];
  const of = (k: number) => (theta: ArrayLike<number>) =>
    getCoefficientDistribution(layout, theta, k);
  layout.coefficients.forEach((c, k) => {
    const code = layout.dist[k];
    if (code === DIST_FIXED) return;
    const d = of(k);
    const add = (
      quantity: DerivedKind,
      label: string,
      f: (at: CoefficientDistributionAt) => number,
    ) =>
      defs.push({ name: c.name, quantity, label: `${label} of ${c.name}`, value: (t) => f(d(t)) });
    if (code === DIST_LOGNORMAL || code === DIST_NEG_LOGNORMAL) {
      add('mean', 'population mean', mean);
      add('median', 'population median', median);
      add('sd', 'population SD', sd);
      return;
    }
    add('sd', 'population SD', sd);
    add(
      'wrong_sign_share',
      'share of the population with the sign opposite to the mean',
      wrongSignShare,
    );
  });
  const B = layout.block.length;
  // Σ = LL′: Σ_ij = Σ_l L_il L_jl over l ≤ min(i, j).
  const covarianceAt = (t: ArrayLike<number>, i: number, j: number) => {
    let cov = 0;
    for (let l = 0; l <= Math.min(i, j); l++)
      cov += t[layout.cholIndex[i * B + l]] * t[layout.cholIndex[j * B + l]];
    return cov;
  };
  for (let i = 0; i < B; i++)
    for (let j = 0; j <= i; j++) {
      const a = layout.coefficients[layout.block[i]].name;
      const b = layout.coefficients[layout.block[j]].name;
      defs.push({
        name: `${a}~${b}`,
        quantity: 'covariance',
        label: i === j ? `variance of ${a}` : `covariance of ${a} and ${b}`,
        value: (t) => covarianceAt(t, i, j),
      });
    }
  for (let i = 0; i < B; i++)
    for (let j = 0; j < i; j++) {
      const a = layout.coefficients[layout.block[i]].name;
      const b = layout.coefficients[layout.block[j]].name;
      defs.push({
        name: `${a}~${b}`,
        quantity: 'correlation',
        label: `correlation of ${a} and ${b}`,
        value: (t) => {
          let cov = 0;
          let vi = 0;
          let vj = 0;
          for (let l = 0; l < B; l++) {
            const li = l <= i ? t[layout.cholIndex[i * B + l]] : 0;
            const lj = l <= j ? t[layout.cholIndex[j * B + l]] : 0;
            cov += li * lj;
            vi += li * li;
            vj += lj * lj;
          }
          return cov / Math.sqrt(vi * vj);
        },
      });
    }
  return defs;
}

export function computeDerivedQuantities(
  layout: MixedLogitLayout,
  theta: ArrayLike<number>,
  covariance: Float64Array | null,
  options: { seed?: number; draws?: number } = {},
): DerivedQuantityEstimate[] {
  const defs = definitions(layout);
  if (defs.length === 0) return [];
  const estimates = propagateUncertainty(
    (x) => Float64Array.from(defs, (d) => d.value(x)),
    theta,
    covariance,
    { seed: options.seed, draws: options.draws ?? 2000 },
  );
  return defs.map((d, i) => ({
    name: d.name,
    quantity: d.quantity,
    label: d.label,
    ...estimates[i],
  }));
}
