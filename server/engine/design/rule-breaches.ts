/**
 * Where a design (generated, imported or kept after an edit of the study) breaks the study's
 * excluded combinations: one entry per alternative and rule (rules between alternatives: per
 * task, alternative −1). Uses the same compiled tables as the design search.
 */
import { buildCodingPlan } from '../../../shared/engine/coding/coding-plan';
import type { Design } from '../../../shared/schemas/design';
import type { StudyDefinition } from '../../../shared/schemas/study-definition';
import { holdsRelation } from '../../../shared/study/excluded-combinations';
import { buildDesignConstraints } from './compile-design-rules';
import type { DesignConstraints } from './design-constraints';
import { readDesignGrid, type LevelGrid } from './design-grid';

export interface RuleBreach {
  /** Index of the task in design.tasks. */
  taskIndex: number;
  /** Designed alternative (0-based), or −1 for a rule between alternatives. */
  alternative: number;
  /** Index of the rule in definition.excludedCombinations. */
  rule: number;
}

/** Breaches in a level grid, from compiled constraints. */
export function listGridBreaches(c: DesignConstraints, grid: LevelGrid): RuleBreach[] {
  const out: RuleBreach[] = [];
  const { S, J, A } = grid;
  for (let s = 0; s < S; s++) {
    for (let j = 0; j < J; j++) {
      const row = (s * J + j) * A;
      const rules = new Set<number>();
      for (let a = 0; a < A; a++) {
        const la = grid.levels[row + a];
        if (la < 0) continue;
        const ia = c.levelBase[a] + la;
        if (c.levelRule[ia] >= 0) rules.add(c.levelRule[ia]);
        for (let b = a + 1; b < A; b++) {
          const lb = grid.levels[row + b];
          const rule = lb >= 0 ? c.pairRule[ia * c.levelTotal + c.levelBase[b] + lb] : -1;
          if (rule >= 0) rules.add(rule);
        }
      }
      for (const rule of rules) out.push({ taskIndex: s, alternative: j, rule });
    }
    for (const rule of c.between) {
      const x = grid.levels[(s * J + rule.first) * A + rule.a];
      const y = grid.levels[(s * J + rule.second) * A + rule.a];
      const values = c.levelValues[rule.a];
      if (x >= 0 && y >= 0 && !holdsRelation(rule.relation, values[x], values[y]))
        out.push({ taskIndex: s, alternative: -1, rule: rule.rule });
    }
  }
  return out;
}

/** Breaches of a design against a definition; throws RangeError when they do not match. */
export function listRuleBreaches(definition: StudyDefinition, design: Design): RuleBreach[] {
  if (definition.excludedCombinations.length === 0) return [];
  const plan = buildCodingPlan(definition);
  const zeros = new Float64Array(plan.columnCount);
  const c = buildDesignConstraints(plan, definition, zeros, zeros);
  return listGridBreaches(c, readDesignGrid(plan, design).grid);
}
