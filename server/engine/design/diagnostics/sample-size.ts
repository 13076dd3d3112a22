/**
 * Sample-size guides for a design.
 * - S-estimate (Rose & Bliemer 2013, Transportation 40(5):1021-1041 [M formula]): with Σ₁ the
 *   asymptotic covariance for ONE respondent answering the whole design once (inverse of the
 *   MNL information at the prior means), N_k = (t · sqrt(Σ₁,kk) / |β_k|)² is the number of
 *   design replications at which coefficient k's expected t-ratio reaches t = 1.96.
 * - Power version (de Bekker-Grob et al. 2015 [M formula]):
 *   N_k = (z_(1−β) + z_(1−α/2))² Σ₁,kk / β_k², here 80 % power at α = 0.05.
 * - Level-count floor N ≥ 500·c/(t·a): every level seen about 500 times in aggregate (as
 *   summarised in the good-practice guide of de Bekker-Grob et al. 2015, The Patient 8(5) [M];
 *   docs/methods.md, "Sample-size guide").
 * With B blocks each respondent answers one block, so a replication needs B respondents.
 */
import { inverseNormal as getInverseNormal } from '../../draws/inverse-normal';
import type { SampleSizeGuide } from '../../../../shared/schemas/design-diagnostics';

const Z_T = getInverseNormal(0.975);
const Z_POWER = getInverseNormal(0.8);

/** Level-count floor ⌈500·c/(t·a)⌉ (main effects; c = most levels of any attribute). */
export function getLevelCountSampleSize(c: number, t: number, a: number): number {
  // Round before ceil so 500·4/(8·3)·… rounding noise does not add a respondent.
  return Math.ceil(Number(((500 * c) / (t * a)).toFixed(9)));
}

/** Builds the guide from the one-replication covariance Σ₁ (K × K, row-major). */
export function getSampleSizeGuide(input: {
  columns: { key: string; name: string }[];
  covarianceOne: Float64Array | null;
  priorMeans: Float64Array;
  blocks: number;
  tasksPerRespondent: number;
  alternatives: number;
  maxLevels: number;
}): SampleSizeGuide {
  const K = input.columns.length;
  let maxT = 0;
  let maxPower = 0;
  let any = false;
  const coefficients = input.columns.map((column, k) => {
    const variance = input.covarianceOne ? input.covarianceOne[k * K + k] : Infinity;
    const beta = input.priorMeans[k];
    const known = beta !== 0 && Number.isFinite(variance);
    const forT = known ? (Z_T * Z_T * variance) / (beta * beta) : null;
    const forPower = known ? ((Z_T + Z_POWER) ** 2 * variance) / (beta * beta) : null;
    if (forT !== null && forPower !== null) {
      any = true;
      maxT = Math.max(maxT, forT);
      maxPower = Math.max(maxPower, forPower);
    }
    return {
      key: column.key,
      name: column.name,
      prior: beta,
      standardErrorOne: Number.isFinite(variance) ? Math.sqrt(variance) : null,
      replicationsForT: forT,
      replicationsForPower: forPower,
    };
  });
  const replications = any ? Math.ceil(maxT) : null;
  return {
    coefficients,
    sEstimateReplications: replications,
    sEstimateRespondents: replications === null ? null : replications * input.blocks,
    powerRespondents: any ? Math.ceil(maxPower) * input.blocks : null,
    ruleOfThumb: {
      respondents: getLevelCountSampleSize(
        input.maxLevels,
        input.tasksPerRespondent,
        input.alternatives,
      ),
      c: input.maxLevels,
      t: input.tasksPerRespondent,
      a: input.alternatives,
      note: 'N ≥ 500·c/(t·a) (de Bekker-Grob et al. 2015): a floor, not a power calculation.',
    },
  };
}
