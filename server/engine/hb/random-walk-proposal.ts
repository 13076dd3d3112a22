/**
 * The random-walk proposal of one respondent's α_n in the HB sampler (Train 2009, §12.6):
 * α' = α_n + ρ·L·z with z ~ N(0, I) and L = chol Σ. With w = L⁻¹(α_n − μ), L⁻¹(α' − μ) = w + ρz
 * (plain algebra), so one triangular solve gives both prior quadratic forms. The Kr normals are
 * drawn first, in coefficient order: that order is part of the seeded draw stream.
 */
import { drawStandardNormal } from '../draws/gamma-variate';
import type { Prng } from '../draws/prng';
import { solveLower } from '../linalg/triangular';

/** Scratch of proposeRandomWalk, Kr entries each. */
export interface ProposalWorkspace {
  z: Float64Array;
  w: Float64Array;
}

export function createProposalWorkspace(Kr: number): ProposalWorkspace {
  return { z: new Float64Array(Kr), w: new Float64Array(Kr) };
}

/**
 * Writes α' for α = alpha[offset .. offset+Kr) into `proposal` and returns the log ratio of the
 * N(μ, Σ) prior densities, ln φ(α') − ln φ(α) = −½(|w + ρz|² − |w|²).
 */
export function proposeRandomWalk(
  alpha: Float64Array,
  offset: number,
  mu: Float64Array,
  L: Float64Array,
  Kr: number,
  rho: number,
  prng: Prng,
  proposal: Float64Array,
  ws: ProposalWorkspace,
): number {
  const { z, w } = ws;
  for (let r = 0; r < Kr; r++) {
    proposal[r] = alpha[offset + r] - mu[r];
    z[r] = drawStandardNormal(prng);
  }
  solveLower(L, Kr, proposal, 0, w);
  let qOld = 0;
  let qNew = 0;
  for (let r = 0; r < Kr; r++) {
    qOld += w[r] * w[r];
    const wNew = w[r] + rho * z[r];
    qNew += wNew * wNew;
    let step = 0;
    for (let j = 0; j <= r; j++) step += L[r * Kr + j] * z[j];
    proposal[r] = alpha[offset + r] + rho * step;
  }
  return -0.5 * (qNew - qOld);
}
