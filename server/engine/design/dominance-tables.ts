/**
 * Which level is better under the priors' signs, per attribute, for dominance screening.
 *
 * For attribute a and levels l, l′ the utility difference is d = (c_l − c_l′)·β over a's coded
 * columns; under independent normal priors it has mean μ = (c_l − c_l′)·m and sd
 * σ = sqrt(Σ_k (c_l − c_l′)_k² s_k²). Its sign is *known* when μ ≠ 0 and |μ| ≥ 1.96 σ (at most
 * 2.5 % prior mass on the other sign; fixed priors: σ = 0; zero priors: never known).
 * The opt-out / status quo is compared the same way: against the status quo's level of each
 * attribute, or against the opt-out's coding (every coded column zero, so with dummy coding
 * the reference level counts as "the same as the opt-out").
 *
 * Alternative A dominates B when, on every attribute, the two show the same level (or both
 * omit it) or A's is known to be better, and A is better on at least one. A differing
 * attribute of unknown sign (including one shown in only one of the two) rules dominance out;
 * constants are left aside. This is the attribute-wise non-satiation test of the trade (Reed
 * Johnson et al. 2013, Value in Health 16(1):3-13; the 1.96 threshold is a product default).
 */
import type { CodingPlan } from '../../../shared/engine/coding/coding-plan';

/** Sign codes: better / worse known, the same, or unknown. */
export const BETTER = 1;
export const WORSE = -1;
export const SAME = 0;
export const UNKNOWN = 2;

export interface DominanceTables {
  /** Levels per attribute. */
  levelCounts: Int32Array;
  /** Per attribute, L×L: BETTER when level l is known better than l′, WORSE, else UNKNOWN. */
  preference: Int8Array[];
  /** Per attribute, L: each level against the opt-out / status quo (null without one). */
  versusFixed: Int8Array[] | null;
  /** True when some comparison has a known sign (else no dominance can be recognised). */
  known: boolean;
}

const KNOWN_SIGN_Z = 1.96;

/** Sign of Σ_c diff_c β_c under the priors, or UNKNOWN. */
function signOf(
  diff: (c: number) => number,
  w: number,
  offset: number,
  means: Float64Array,
  sds: Float64Array,
): number {
  let mean = 0;
  let variance = 0;
  let zero = true;
  for (let c = 0; c < w; c++) {
    const d = diff(c);
    if (d !== 0) zero = false;
    mean += d * means[offset + c];
    variance += d * d * sds[offset + c] ** 2;
  }
  if (zero) return SAME;
  if (mean !== 0 && Math.abs(mean) >= KNOWN_SIGN_Z * Math.sqrt(variance))
    return mean > 0 ? BETTER : WORSE;
  return UNKNOWN;
}

/** Builds the tables from the coding plan and the prior means and SDs per coded column. */
export function buildDominanceTables(
  plan: CodingPlan,
  means: Float64Array,
  sds: Float64Array,
): DominanceTables {
  let known = false;
  const note = (sign: number) => {
    if (sign === BETTER || sign === WORSE) known = true;
    return sign;
  };
  const preference = plan.attributes.map((attribute) => {
    const L = attribute.levelIds.length;
    const w = attribute.width;
    const table = new Int8Array(L * L).fill(UNKNOWN);
    for (let l = 0; l < L; l++)
      for (let m = 0; m < L; m++) {
        if (l === m) continue;
        const sign = signOf(
          (c) => attribute.codes[l * w + c] - attribute.codes[m * w + c],
          w,
          attribute.offset,
          means,
          sds,
        );
        // Two levels coded alike (never in practice) cannot be told apart: unknown.
        table[l * L + m] = note(sign === SAME ? UNKNOWN : sign);
      }
    return table;
  });
  const fixed = plan.fixed;
  const versusFixed = fixed
    ? plan.attributes.map((attribute, a) => {
        const L = attribute.levelIds.length;
        const w = attribute.width;
        const row = new Int8Array(L);
        const reference = fixed.levelIndices[a];
        for (let l = 0; l < L; l++) {
          if (reference >= 0) row[l] = l === reference ? SAME : preference[a][l * L + reference];
          else
            row[l] = note(
              signOf((c) => attribute.codes[l * w + c], w, attribute.offset, means, sds),
            );
        }
        return row;
      })
    : null;
  const levelCounts = Int32Array.from(plan.attributes, (a) => a.levelIds.length);
  return { levelCounts, preference, versusFixed, known };
}

/**
 * Compares two rows of level indices (−1 = attribute not shown) attribute by attribute:
 * 0 identical, 1 p dominates q, −1 q dominates p, 2 neither.
 */
export function compareLevelRows(
  t: DominanceTables,
  levels: Int32Array,
  p: number,
  other: Int32Array,
  q: number,
): number {
  let better = false;
  let worse = false;
  for (let a = 0; a < t.preference.length; a++) {
    const lp = levels[p + a];
    const lq = other[q + a];
    if (lp === lq) continue;
    if (lp < 0 || lq < 0) return 2;
    const sign = t.preference[a][lp * t.levelCounts[a] + lq];
    if (sign === BETTER) better = true;
    else if (sign === WORSE) worse = true;
    else return 2;
    if (better && worse) return 2;
  }
  if (!better && !worse) return 0;
  return better ? 1 : -1;
}

/** A designed row against the opt-out / status quo: 1 it dominates, −1 dominated, 0 same, 2 neither. */
export function compareWithFixed(versusFixed: Int8Array[], levels: Int32Array, p: number): number {
  let better = false;
  let worse = false;
  for (let a = 0; a < versusFixed.length; a++) {
    const l = levels[p + a];
    if (l < 0) return 2;
    const sign = versusFixed[a][l];
    if (sign === BETTER) better = true;
    else if (sign === WORSE) worse = true;
    else if (sign === UNKNOWN) return 2;
    if (better && worse) return 2;
  }
  if (!better && !worse) return 0;
  return better ? 1 : -1;
}
