/**
 * Constraints every generated design satisfies, checked per alternative and per task:
 * 1. no prohibited pair of levels inside one alternative;
 * 2. no two identical designed alternatives in a task, and none identical to the status quo;
 * 3. no designed alternative dominated by another designed alternative of the same task.
 *
 * Dominance (definition used here). For attribute a and levels l, l′ the utility difference
 * is d = (c_l − c_l′)·β over a's coded columns; under independent normal priors it has mean
 * μ = (c_l − c_l′)·m and sd σ = sqrt(Σ_k (c_l − c_l′)_k² s_k²). Its sign is *known* when
 * μ ≠ 0 and |μ| ≥ 1.96 σ (at most 2.5 % prior mass on the other sign; fixed priors: σ = 0,
 * zero priors: never known). Alternative A dominates B when, on every attribute, the two
 * show the same level (or both omit it) or A's level is known to be better, and A is better
 * on at least one attribute. A differing attribute of unknown sign (including one shown in
 * only one of the two) rules dominance out. Constants are ignored, and the opt-out /
 * status quo is not compared (choosing it is never "irrational" in itself). This is the
 * attribute-wise non-satiation test of the trade (Reed Johnson et al. 2013 [M]; common
 * practice, no source for the 1.96 threshold).
 */
import type { CodingPlan } from '../../../shared/engine/coding/coding-plan';
import type { Prohibition } from '../../../shared/schemas/study-definition';
import type { LevelGrid } from './design-grid';

export interface DesignConstraints {
  A: number;
  J: number;
  /** First flat level index of attribute a; levels of a are base[a] .. base[a+1]−1. */
  levelBase: Int32Array;
  levelTotal: number;
  /** levelTotal × levelTotal, 1 where the two levels may not appear together. */
  prohibited: Uint8Array;
  /** Per attribute, L×L: +1 when level l is known better than l′, −1 known worse, 0 unknown. */
  preference: Int8Array[];
  /** True when some attribute has a known ordering (otherwise dominance checks are skipped). */
  checksDominance: boolean;
  /** Status-quo level indices, or null when there is no status quo. */
  statusQuo: Int32Array | null;
}

const KNOWN_SIGN_Z = 1.96;

/** Precomputes the constraint tables for a coding plan, prohibitions and prior means/sds. */
export function buildDesignConstraints(
  plan: CodingPlan,
  prohibitions: Prohibition[],
  priorMeans: Float64Array,
  priorSds: Float64Array,
): DesignConstraints {
  const A = plan.attributes.length;
  const levelBase = new Int32Array(A + 1);
  plan.attributes.forEach((attribute, a) => {
    levelBase[a + 1] = levelBase[a] + attribute.levelIds.length;
  });
  const levelTotal = levelBase[A];
  const prohibited = new Uint8Array(levelTotal * levelTotal);
  for (const p of prohibitions) {
    const a = plan.attributes.findIndex((x) => x.id === p.a.attributeId);
    const b = plan.attributes.findIndex((x) => x.id === p.b.attributeId);
    if (a < 0 || b < 0) continue;
    const la = plan.attributes[a].levelIds.indexOf(p.a.levelId);
    const lb = plan.attributes[b].levelIds.indexOf(p.b.levelId);
    if (la < 0 || lb < 0) continue;
    prohibited[(levelBase[a] + la) * levelTotal + levelBase[b] + lb] = 1;
    prohibited[(levelBase[b] + lb) * levelTotal + levelBase[a] + la] = 1;
  }
  let checksDominance = false;
  const preference = plan.attributes.map((attribute) => {
    const L = attribute.levelIds.length;
    const w = attribute.width;
    const table = new Int8Array(L * L);
    for (let l = 0; l < L; l++)
      for (let m = 0; m < L; m++) {
        if (l === m) continue;
        let mean = 0;
        let variance = 0;
        for (let c = 0; c < w; c++) {
          const diff = attribute.codes[l * w + c] - attribute.codes[m * w + c];
          mean += diff * priorMeans[attribute.offset + c];
          variance += diff * diff * priorSds[attribute.offset + c] ** 2;
        }
        if (mean !== 0 && Math.abs(mean) >= KNOWN_SIGN_Z * Math.sqrt(variance)) {
          table[l * L + m] = mean > 0 ? 1 : -1;
          checksDominance = true;
        }
      }
    return table;
  });
  const statusQuo = plan.fixed?.kind === 'status_quo' ? plan.fixed.levelIndices : null;
  return {
    A,
    J: plan.designedCount,
    levelBase,
    levelTotal,
    prohibited,
    preference,
    checksDominance,
    statusQuo,
  };
}

/** True when alternative (s, j) contains no prohibited pair of levels. */
export function isAlternativeAllowed(
  c: DesignConstraints,
  grid: LevelGrid,
  s: number,
  j: number,
): boolean {
  const row = (s * grid.J + j) * grid.A;
  for (let a = 0; a < c.A; a++) {
    const la = grid.levels[row + a];
    if (la < 0) continue;
    const ia = (c.levelBase[a] + la) * c.levelTotal;
    for (let b = a + 1; b < c.A; b++) {
      const lb = grid.levels[row + b];
      if (lb >= 0 && c.prohibited[ia + c.levelBase[b] + lb] === 1) return false;
    }
  }
  return true;
}

/**
 * Compares alternatives p and q (offsets of their level rows): 0 = identical, 1 = p
 * dominates q, −1 = q dominates p, 2 = neither.
 */
export function compareAlternatives(
  c: DesignConstraints,
  levels: Int32Array,
  p: number,
  q: number,
  other: Int32Array = levels,
): number {
  let better = false;
  let worse = false;
  let unknown = false;
  for (let a = 0; a < c.A; a++) {
    const lp = levels[p + a];
    const lq = other[q + a];
    if (lp === lq) continue;
    if (lp < 0 || lq < 0) {
      unknown = true;
      continue;
    }
    const L = c.levelBase[a + 1] - c.levelBase[a];
    const sign = c.preference[a][lp * L + lq];
    if (sign > 0) better = true;
    else if (sign < 0) worse = true;
    else unknown = true;
  }
  if (!better && !worse && !unknown) return 0;
  if (unknown || (better && worse)) return 2;
  return better ? 1 : -1;
}

/**
 * True when alternative (s, j) is allowed and neither identical to, dominated by, nor
 * dominating another designed alternative of task s, nor identical to the status quo.
 */
export function isAlternativeValidInTask(
  c: DesignConstraints,
  grid: LevelGrid,
  s: number,
  j: number,
): boolean {
  if (!isAlternativeAllowed(c, grid, s, j)) return false;
  const p = (s * grid.J + j) * grid.A;
  for (let k = 0; k < grid.J; k++) {
    if (k === j) continue;
    const result = compareAlternatives(c, grid.levels, p, (s * grid.J + k) * grid.A);
    if (result === 0) return false;
    if (c.checksDominance && result !== 2) return false;
  }
  if (c.statusQuo && compareAlternatives(c, grid.levels, p, 0, c.statusQuo) === 0) return false;
  return true;
}

/** True when every alternative of task s is valid. */
export function isTaskValid(c: DesignConstraints, grid: LevelGrid, s: number): boolean {
  for (let j = 0; j < grid.J; j++) if (!isAlternativeValidInTask(c, grid, s, j)) return false;
  return true;
}
