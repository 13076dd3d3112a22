/**
 * How often each level may appear over the designed alternatives of the whole design: at
 * least `minAppearances` for every level a designed alternative may show (so a level never
 * goes missing), and with level balance ⌊n/L⌋ … ⌈n/L⌉ where n is the attribute's cells and L
 * the levels it may show (Huber & Zwerina 1996's level balance). Levels that rules keep out
 * of designed alternatives get 0 … 0. Counts change cell by cell; a change is allowed when
 * both levels stay within their bounds.
 */
import type { CodingPlan } from '../../../shared/engine/coding/coding-plan';
import type { BalanceRules } from '../../../shared/schemas/design-spec';
import type { DesignConstraints } from './design-constraints';
import type { LevelGrid } from './design-grid';

export interface LevelBounds {
  min: Int32Array;
  max: Int32Array;
  /** Cells per attribute over the design (tasks × alternatives showing it). */
  cells: Int32Array;
}

export function buildLevelBounds(
  plan: CodingPlan,
  c: DesignConstraints,
  S: number,
  balance: BalanceRules,
): LevelBounds {
  const A = plan.attributes.length;
  const J = plan.designedCount;
  const min = new Int32Array(c.levelTotal);
  const max = new Int32Array(c.levelTotal);
  const cells = new Int32Array(A);
  for (let a = 0; a < A; a++) {
    let shown = 0;
    for (let j = 0; j < J; j++) if (plan.omitted[j * A + a] !== 1) shown++;
    const n = S * shown;
    cells[a] = n;
    const L = plan.attributes[a].levelIds.length;
    let allowed = 0;
    for (let l = 0; l < L; l++) if (c.levelRule[c.levelBase[a] + l] < 0) allowed++;
    for (let l = 0; l < L; l++) {
      const f = c.levelBase[a] + l;
      if (c.levelRule[f] >= 0 || n === 0) continue;
      min[f] = balance.minAppearances;
      max[f] = n;
      if (balance.levelBalance && allowed > 0) {
        min[f] = Math.max(min[f], Math.floor(n / allowed));
        max[f] = Math.ceil(n / allowed);
      }
    }
  }
  return { min, max, cells };
}

/** Appearances of every flat level over the designed alternatives of `grid`. */
export function countLevels(c: DesignConstraints, grid: LevelGrid): Int32Array {
  const counts = new Int32Array(c.levelTotal);
  for (let i = 0; i < grid.levels.length; i++) {
    const l = grid.levels[i];
    if (l >= 0) counts[c.levelBase[i % grid.A] + l]++;
  }
  return counts;
}

/** True when attribute a may go from level `from` to `to` in one cell. */
export function canMoveLevel(
  c: DesignConstraints,
  bounds: LevelBounds,
  counts: Int32Array,
  a: number,
  from: number,
  to: number,
): boolean {
  const f = c.levelBase[a] + from;
  const t = c.levelBase[a] + to;
  return counts[f] - 1 >= bounds.min[f] && counts[t] + 1 <= bounds.max[t];
}

export function moveLevel(
  c: DesignConstraints,
  counts: Int32Array,
  a: number,
  from: number,
  to: number,
): void {
  counts[c.levelBase[a] + from]--;
  counts[c.levelBase[a] + to]++;
}

/** The first flat level outside its bounds, or −1. */
export function findOutOfBounds(bounds: LevelBounds, counts: Int32Array): number {
  for (let f = 0; f < counts.length; f++)
    if (counts[f] < bounds.min[f] || counts[f] > bounds.max[f]) return f;
  return -1;
}
