/**
 * The rules every generated design keeps, checked per alternative and per task on the level
 * grid (tables compiled by compile-design-rules.ts):
 * 1. excluded combinations inside one alternative: levels a designed alternative may not
 *    show (rules against the status quo) and excluded pairs (pairs and "when … then …");
 * 2. no two identical designed alternatives in a task, none identical to the status quo;
 * 3. dominance screening, each rule switchable: designed alternatives do not dominate each
 *    other, nor the opt-out / status quo, nor are they dominated by it (dominance-tables.ts);
 * 4. rules between designed alternatives of a task;
 * 5. at most `maxOverlap` attributes showing one level in every designed alternative.
 * A task is valid when all its alternatives are; changing one alternative of a valid task
 * keeps it valid exactly when that alternative is valid (each check involving two
 * alternatives is symmetric or is checked from both sides, and overlap is rechecked whole).
 */
import type { Relation } from '../../../shared/schemas/study-definition';
import { holdsRelation } from '../../../shared/study/excluded-combinations';
import type { LevelGrid } from './design-grid';
import { compareLevelRows, compareWithFixed, type DominanceTables } from './dominance-tables';

export interface BetweenRule {
  /** Index of the excluded combination in the study definition. */
  rule: number;
  a: number;
  first: number;
  second: number;
  relation: Relation;
}

export interface DesignConstraints {
  A: number;
  J: number;
  /** First flat level index of attribute a; levels of a are base[a] .. base[a+1]−1. */
  levelBase: Int32Array;
  levelTotal: number;
  /** Per flat level: −1 when designed alternatives may show it, else the excluding rule. */
  levelRule: Int32Array;
  /** levelTotal²: −1 when two levels may stand together, else the excluding rule. */
  pairRule: Int32Array;
  /** Per attribute, the value of each level (numeric) or its index (categorical). */
  levelValues: Float64Array[];
  between: BetweenRule[];
  dominance: DominanceTables;
  /** Dominance rules in force (switched on and with some known ordering). */
  checks: { betweenDesigned: boolean; overFixed: boolean; byFixed: boolean };
  /** Status-quo level indices, or null when there is no status quo. */
  statusQuo: Int32Array | null;
  /** Most attributes with one level in all designed alternatives of a task; −1 = no limit. */
  maxOverlap: number;
}

/** What breaks a rule (0 = nothing). */
export const Violation = {
  none: 0,
  excludedLevel: 1,
  excludedPair: 2,
  identical: 3,
  sameAsStatusQuo: 4,
  dominatesOther: 5,
  dominatesFixed: 6,
  dominatedByFixed: 7,
  betweenAlternatives: 8,
  overlap: 9,
} as const;
export type ViolationCode = (typeof Violation)[keyof typeof Violation];

/** Excluded levels and pairs inside alternative (s, j). */
export function checkAlternativeLevels(
  c: DesignConstraints,
  grid: LevelGrid,
  s: number,
  j: number,
): ViolationCode {
  const row = (s * grid.J + j) * grid.A;
  for (let a = 0; a < c.A; a++) {
    const la = grid.levels[row + a];
    if (la < 0) continue;
    const ia = c.levelBase[a] + la;
    if (c.levelRule[ia] >= 0) return Violation.excludedLevel;
    const offset = ia * c.levelTotal;
    for (let b = a + 1; b < c.A; b++) {
      const lb = grid.levels[row + b];
      if (lb >= 0 && c.pairRule[offset + c.levelBase[b] + lb] >= 0) return Violation.excludedPair;
    }
  }
  return Violation.none;
}

/** True when alternative (s, j) shows no excluded level or pair. */
export function isAlternativeAllowed(
  c: DesignConstraints,
  grid: LevelGrid,
  s: number,
  j: number,
): boolean {
  return checkAlternativeLevels(c, grid, s, j) === Violation.none;
}

/**
 * Whether attribute a overlaps in task s: true when every designed alternative that shows it
 * takes one level, false when two differ, null when fewer than two alternatives show it.
 */
export function overlapsInTask(grid: LevelGrid, s: number, a: number): boolean | null {
  const { J, A } = grid;
  let first = -1;
  let shown = 0;
  for (let j = 0; j < J; j++) {
    const l = grid.levels[(s * J + j) * A + a];
    if (l < 0) continue;
    if (shown === 0) first = l;
    else if (l !== first) return false;
    shown++;
  }
  return shown >= 2 ? true : null;
}

/** Attributes shown at one level by every designed alternative of task s (shown by ≥ 2). */
export function countOverlap(grid: LevelGrid, s: number): number {
  let overlapping = 0;
  for (let a = 0; a < grid.A; a++) if (overlapsInTask(grid, s, a) === true) overlapping++;
  return overlapping;
}

/** The first rule alternative (s, j) breaks within its task, or Violation.none. */
export function checkAlternativeInTask(
  c: DesignConstraints,
  grid: LevelGrid,
  s: number,
  j: number,
): ViolationCode {
  const levelsCheck = checkAlternativeLevels(c, grid, s, j);
  if (levelsCheck !== Violation.none) return levelsCheck;
  const p = (s * grid.J + j) * grid.A;
  for (let k = 0; k < grid.J; k++) {
    if (k === j) continue;
    const result = compareLevelRows(
      c.dominance,
      grid.levels,
      p,
      grid.levels,
      (s * grid.J + k) * grid.A,
    );
    if (result === 0) return Violation.identical;
    if (c.checks.betweenDesigned && result !== 2) return Violation.dominatesOther;
  }
  if (c.statusQuo && compareLevelRows(c.dominance, grid.levels, p, c.statusQuo, 0) === 0)
    return Violation.sameAsStatusQuo;
  if ((c.checks.overFixed || c.checks.byFixed) && c.dominance.versusFixed) {
    const result = compareWithFixed(c.dominance.versusFixed, grid.levels, p);
    if (c.checks.overFixed && result === 1) return Violation.dominatesFixed;
    if (c.checks.byFixed && result === -1) return Violation.dominatedByFixed;
  }
  for (const rule of c.between) {
    if (rule.first !== j && rule.second !== j) continue;
    const x = grid.levels[(s * grid.J + rule.first) * grid.A + rule.a];
    const y = grid.levels[(s * grid.J + rule.second) * grid.A + rule.a];
    if (x < 0 || y < 0) continue;
    const values = c.levelValues[rule.a];
    if (!holdsRelation(rule.relation, values[x], values[y])) return Violation.betweenAlternatives;
  }
  if (c.maxOverlap >= 0 && countOverlap(grid, s) > c.maxOverlap) return Violation.overlap;
  return Violation.none;
}

/** True when alternative (s, j) keeps every rule within task s. */
export function isAlternativeValidInTask(
  c: DesignConstraints,
  grid: LevelGrid,
  s: number,
  j: number,
): boolean {
  return checkAlternativeInTask(c, grid, s, j) === Violation.none;
}

/** True when every alternative of task s is valid. */
export function isTaskValid(c: DesignConstraints, grid: LevelGrid, s: number): boolean {
  for (let j = 0; j < grid.J; j++) if (!isAlternativeValidInTask(c, grid, s, j)) return false;
  return true;
}
