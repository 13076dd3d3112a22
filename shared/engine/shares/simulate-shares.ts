/**
 * Predicted choice shares of hypothetical alternatives over a sample of individual taste
 * profiles (the "sample enumeration" of Train 2009, *Discrete Choice Methods with
 * Simulation*, 2nd ed., §2.6.1 and §11.6 [M]): each respondent n gets the logit probabilities
 *   P_nj = Σ_d w_nd · exp(x_j·β_nd) / Σ_i exp(x_i·β_nd)
 * over their D coefficient vectors β_nd with weights w_nd (Σ_d w_nd = 1), and the share of
 * alternative j is the (optionally weighted) average of P_nj over respondents — never the
 * probability of one average person, which overstates the shares of extreme alternatives when
 * tastes vary.
 *
 * With D = 1 and β_n = the respondent's conditional mean this is the usual simulator on
 * individual point estimates; with D > 1 the caller passes draws from each respondent's
 * conditional distribution and their weights. Browser-safe: typed arrays, no Node APIs.
 */
import { fillShiftedExpUtilities } from '../logit/logit-probabilities';
import { assertShareInput, type ShareSimulationInput } from './share-input';

export type { ShareSimulationInput } from './share-input';

export interface ShareSimulationResult {
  /** Share of each alternative over all respondents (length J, sums to 1). */
  shares: Float64Array;
  /** Probability of each alternative per respondent (row-major N × J). */
  probabilities: Float64Array;
  /** Shares per group (row-major G × J; a group with no respondents is all NaN). */
  groupShares: Float64Array;
  /** Respondents per group (length G). */
  groupCounts: Int32Array;
}

/**
 * Simulates shares; see the file comment for the method. Utilities are shifted by their
 * maximum before exponentiating so large utilities cannot overflow.
 */
export function simulateShares(input: ShareSimulationInput): ShareSimulationResult {
  assertShareInput(input);
  const { respondents: N, coefficients: K, alternativeCount: J, betas, alternatives } = input;
  const D = input.drawsPerRespondent ?? 1;
  const G = input.groupCount ?? 0;
  const probabilities = new Float64Array(N * J);
  const utilities = new Float64Array(J);
  const shares = new Float64Array(J);
  const groupShares = new Float64Array(G * J);
  const groupWeights = new Float64Array(G);
  const groupCounts = new Int32Array(G);
  let totalWeight = 0;
  for (let n = 0; n < N; n++) {
    const rowOut = n * J;
    for (let d = 0; d < D; d++) {
      const w = input.drawWeights ? input.drawWeights[n * D + d] : 1 / D;
      const b = (n * D + d) * K;
      const denominator = fillShiftedExpUtilities(K, J, alternatives, 0, betas, b, utilities, 0);
      for (let j = 0; j < J; j++) probabilities[rowOut + j] += (w * utilities[j]) / denominator;
    }
    const weight = input.respondentWeights ? input.respondentWeights[n] : 1;
    totalWeight += weight;
    for (let j = 0; j < J; j++) shares[j] += weight * probabilities[rowOut + j];
    if (G > 0) {
      const g = input.groups![n];
      if (g < 0) continue;
      groupCounts[g]++;
      groupWeights[g] += weight;
      for (let j = 0; j < J; j++) groupShares[g * J + j] += weight * probabilities[rowOut + j];
    }
  }
  for (let j = 0; j < J; j++) shares[j] /= totalWeight;
  for (let g = 0; g < G; g++) for (let j = 0; j < J; j++) groupShares[g * J + j] /= groupWeights[g];
  return { shares, probabilities, groupShares, groupCounts };
}
