/**
 * What a fitted latent class model reports: per class its share (the mean prior probability
 * (1/N)Σ_n π_nc, with a delta-method SE from the membership parameters' covariance), its
 * coefficients with SEs from the observed information, its WTP −β_k/β_cost with delta-method SEs
 * (Hole 2007, Health Econ 16:827-840), the membership parameters; per respondent the posterior
 * class probabilities, the most likely class, and the posterior-weighted mean and SD of each
 * coefficient and WTP, Σ_c h_nc β_c (the latent-class analogue of a conditional mean; Greene &
 * Hensher 2003, §4), with 1/Σ_c h_nc² as the effective number of classes.
 */
import type { ChoiceData } from '../estimation/choice-data';
import type { LatentClassState } from './latent-class-state';
import type { TasteProfile } from '../estimation/taste-profiles';
import { finiteOrNull } from '../estimation/finite-or-null';

type NamedEstimate = { name: string; estimate: number; se: number | null };

export interface LatentClassSummary {
  classes: {
    class: number;
    share: number;
    shareSe: number | null;
    estimates: NamedEstimate[];
    wtp: NamedEstimate[] | null;
    membership: NamedEstimate[];
  }[];
  /** A taste profile per respondent, with the posterior class probabilities. */
  individuals: (TasteProfile & { classProbabilities: number[]; likeliestClass: number })[];
  /** Share-weighted mean and SD of each coefficient across classes. */
  population: { name: string; mean: number; sd: number }[];
}

export function summarizeLatentClass(
  data: ChoiceData,
  z: Float64Array,
  state: LatentClassState,
  covariance: Float64Array | null,
  names: string[],
  membershipNames: string[],
  cost: number,
): LatentClassSummary {
  const { C, K, Mp, betas, pi, h } = state;
  const N = data.taskStart.length - 1;
  const P = C * K + (C - 1) * Mp;
  const G = C * K;
  const cov = (a: number, b: number) => (covariance ? covariance[a * P + b] : NaN);
  const shares = Array.from({ length: C }, (_, c) => {
    let s = 0;
    for (let n = 0; n < N; n++) s += pi[n * C + c];
    return s / N;
  });
  const shareSe = (c: number) => {
    // ∂ share_c / ∂γ_(d,m) = (1/N) Σ_n π_nc (δ_cd − π_nd) z_nm; z_n0 = 1 always.
    const grad = new Float64Array((C - 1) * Mp);
    for (let n = 0; n < N; n++)
      for (let d = 1; d < C; d++) {
        const f = (pi[n * C + c] * ((c === d ? 1 : 0) - pi[n * C + d])) / N;
        for (let m = 0; m < Mp; m++) grad[(d - 1) * Mp + m] += f * z[n * Mp + m];
      }
    let v = 0;
    grad.forEach((ga, a) => grad.forEach((gb, b) => (v += ga * gb * cov(G + a, G + b))));
    return finiteOrNull(Math.sqrt(v));
  };
  const classes = shares.map((share, c) => {
    const at = (k: number) => c * K + k;
    const se = (p: number) => finiteOrNull(Math.sqrt(cov(p, p)));
    return {
      class: c + 1,
      share,
      shareSe: C === 1 ? 0 : shareSe(c),
      estimates: names.map((name, k) => ({ name, estimate: betas[at(k)], se: se(at(k)) })),
      wtp:
        cost < 0
          ? null
          : names.flatMap((name, k) => {
              if (k === cost) return [];
              const bk = betas[at(k)];
              const bq = betas[at(cost)];
              const r = bk / bq;
              const v =
                (cov(at(k), at(k)) -
                  2 * r * cov(at(k), at(cost)) +
                  r * r * cov(at(cost), at(cost))) /
                (bq * bq);
              return [{ name, estimate: -r, se: finiteOrNull(Math.sqrt(v)) }];
            }),
      membership:
        c === 0
          ? []
          : ['constant', ...membershipNames].map((name, m) => {
              const p = G + (c - 1) * Mp + m;
              return { name, estimate: state.gamma[(c - 1) * Mp + m], se: se(p) };
            }),
    };
  });
  const individuals = data.respondentIds.map((respondent, n) => {
    const probabilities = Array.from(h.subarray(n * C, (n + 1) * C));
    let likeliest = 0;
    probabilities.forEach((p, c) => p > probabilities[likeliest] && (likeliest = c));
    const mean: Record<string, number> = {};
    const sd: Record<string, number> = {};
    const wtp: Record<string, number> = {};
    names.forEach((name, k) => {
      let m1 = 0;
      let m2 = 0;
      let ratio = 0;
      for (let c = 0; c < C; c++) {
        const b = betas[c * K + k];
        m1 += probabilities[c] * b;
        m2 += probabilities[c] * b * b;
        if (cost >= 0) ratio -= (probabilities[c] * b) / betas[c * K + cost];
      }
      mean[name] = m1;
      sd[name] = Math.sqrt(Math.max(0, m2 - m1 * m1));
      if (cost >= 0 && k !== cost) wtp[name] = ratio;
    });
    return {
      respondent,
      mean,
      sd,
      ...(cost >= 0 ? { wtp } : {}),
      classProbabilities: probabilities,
      likeliestClass: likeliest + 1,
      effectiveDraws: 1 / probabilities.reduce((s, p) => s + p * p, 0),
    };
  });
  const population = names.map((name, k) => {
    let m1 = 0;
    let m2 = 0;
    shares.forEach((s, c) => {
      m1 += s * betas[c * K + k];
      m2 += s * betas[c * K + k] ** 2;
    });
    return { name, mean: m1, sd: Math.sqrt(Math.max(0, m2 - m1 * m1)) };
  });
  return { classes, individuals, population };
}
