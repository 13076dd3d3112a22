/**
 * How a design stands against every rule, whether or not the rule was applied when it was
 * made (imported designs, rules switched off): dominance under the priors' signs, excluded
 * combinations, appearances per level, overlap per task, and balance across blocks.
 * Blocks count as balanced when every level's count in every block lies within one of its
 * fair share (count over the design × the block's share of tasks), beyond rounding — a
 * product default.
 */
import type { CodingPlan } from '../../../../shared/engine/coding/coding-plan';
import type { DesignSpec } from '../../../../shared/schemas/design-spec';
import type { StudyDefinition } from '../../../../shared/schemas/study-definition';
import { describeExcludedCombination } from '../../../../shared/study/excluded-combinations';
import { getLevelLabel } from '../../../../shared/study/level-labels';
import { buildDesignConstraints } from '../compile-design-rules';
import { countOverlap } from '../design-constraints';
import type { LevelGrid } from '../design-grid';
import { compareLevelRows, compareWithFixed } from '../dominance-tables';
import { buildLevelBounds, countLevels } from '../level-bounds';
import { listGridBreaches } from '../rule-breaches';
import type { DominanceRuleName, RuleReport } from '../../../../shared/schemas/design-diagnostics';

export function getRuleReport(input: {
  definition: StudyDefinition;
  plan: CodingPlan;
  grid: LevelGrid;
  blockOfTask: Int32Array;
  blocks: number;
  means: Float64Array;
  sds: Float64Array;
  rules: Pick<DesignSpec, 'dominance' | 'balance'> | null;
}): RuleReport {
  const { definition, plan, grid, blockOfTask, blocks, rules } = input;
  const c = buildDesignConstraints(plan, definition, input.means, input.sds, rules ?? undefined);
  const { S, J, A } = grid;
  const versusFixed = c.dominance.versusFixed;
  const tally = { betweenDesigned: [0, 0], overFixed: [0, 0], byFixed: [0, 0] };
  for (let s = 0; s < S; s++) {
    const seen = { betweenDesigned: false, overFixed: false, byFixed: false };
    for (let j = 0; j < J; j++) {
      const p = (s * J + j) * A;
      for (let k = 0; k < J; k++) {
        if (k === j) continue;
        if (compareLevelRows(c.dominance, grid.levels, p, grid.levels, (s * J + k) * A) === -1) {
          tally.betweenDesigned[1]++;
          seen.betweenDesigned = true;
          break;
        }
      }
      const versus = versusFixed ? compareWithFixed(versusFixed, grid.levels, p) : 2;
      if (versus === 1) {
        tally.overFixed[1]++;
        seen.overFixed = true;
      }
      if (versus === -1) {
        tally.byFixed[1]++;
        seen.byFixed = true;
      }
    }
    for (const key of Object.keys(seen) as DominanceRuleName[]) if (seen[key]) tally[key][0]++;
  }
  const dominance = (Object.keys(tally) as DominanceRuleName[]).map((rule) => ({
    rule,
    active: rules ? rules.dominance[rule] : null,
    applies: c.dominance.known && (rule === 'betweenDesigned' || versusFixed !== null),
    tasks: tally[rule][0],
    alternatives: tally[rule][1],
  }));

  const breaches = listGridBreaches(c, grid);
  const excludedCombinations = definition.excludedCombinations.map((rule, r) => ({
    id: rule.id,
    text: describeExcludedCombination(definition, rule),
    breaches: breaches.filter((b) => b.rule === r).length,
  }));

  const counts = countLevels(c, grid);
  let levelsBelowMinimum = 0;
  let tasksOverOverlap = 0;
  if (rules) {
    const bounds = buildLevelBounds(plan, c, S, rules.balance);
    for (let f = 0; f < c.levelTotal; f++) if (counts[f] < bounds.min[f]) levelsBelowMinimum++;
    if (rules.balance.maxOverlap !== null)
      for (let s = 0; s < S; s++)
        if (countOverlap(grid, s) > rules.balance.maxOverlap) tasksOverOverlap++;
  }

  return {
    dominanceKnown: c.dominance.known,
    dominance,
    excludedCombinations,
    balance: { rules: rules?.balance ?? null, levelsBelowMinimum, tasksOverOverlap },
    blocks: getBlockBalance(definition, c.levelBase, grid, blockOfTask, blocks, counts),
  };
}

function getBlockBalance(
  definition: StudyDefinition,
  levelBase: Int32Array,
  grid: LevelGrid,
  blockOfTask: Int32Array,
  blocks: number,
  counts: Int32Array,
): RuleReport['blocks'] {
  const { S, J, A } = grid;
  const T = counts.length;
  const byBlock = new Int32Array(blocks * T);
  const sizes = new Int32Array(blocks);
  for (let s = 0; s < S; s++) {
    const b = blockOfTask[s] - 1;
    sizes[b]++;
    for (let j = 0; j < J; j++)
      for (let a = 0; a < A; a++) {
        const l = grid.levels[(s * J + j) * A + a];
        if (l >= 0) byBlock[b * T + levelBase[a] + l]++;
      }
  }
  let worstDeviation = 0;
  let worst: RuleReport['blocks']['worst'] = null;
  let balanced = true;
  for (let b = 0; b < blocks; b++)
    for (let a = 0; a < A; a++)
      for (let l = 0; l < levelBase[a + 1] - levelBase[a]; l++) {
        const f = levelBase[a] + l;
        const fair = (counts[f] * sizes[b]) / S;
        const count = byBlock[b * T + f];
        const deviation = Math.abs(count - fair);
        if (count < Math.floor(fair) - 1 || count > Math.ceil(fair) + 1) balanced = false;
        if (deviation > worstDeviation + 1e-12) {
          const attribute = definition.attributes[a];
          worstDeviation = deviation;
          worst = {
            attribute: attribute.name,
            level: getLevelLabel(attribute, attribute.levels[l]),
            block: b + 1,
            count,
            fair,
          };
        }
      }
  return { balanced, worstDeviation, worst };
}
