/**
 * Compiles a study's excluded combinations, the spec's dominance and overlap rules and the
 * priors into the lookup tables of DesignConstraints. "When A is one of X, B is one of Y"
 * becomes the excluded pairs (x, y′) for x in X and y′ not in Y; a rule against the status quo
 * becomes the levels a designed alternative may not show. Every table entry keeps the index
 * of the rule that set it, so an infeasible design can say which rule binds.
 */
import type { CodingPlan } from '../../../shared/engine/coding/coding-plan';
import type { DesignSpec } from '../../../shared/schemas/design-spec';
import type { StudyDefinition } from '../../../shared/schemas/study-definition';
import { holdsRelation } from '../../../shared/study/excluded-combinations';
import type { BetweenRule, DesignConstraints } from './design-constraints';
import { buildDominanceTables } from './dominance-tables';

type Rules = Pick<DesignSpec, 'dominance' | 'balance'>;

const allRulesOn: Rules = {
  dominance: { betweenDesigned: true, overFixed: true, byFixed: true },
  balance: { minAppearances: 1, levelBalance: false, maxOverlap: null },
};

export function buildDesignConstraints(
  plan: CodingPlan,
  definition: Pick<StudyDefinition, 'attributes' | 'excludedCombinations'>,
  priorMeans: Float64Array,
  priorSds: Float64Array,
  rules: Rules = allRulesOn,
): DesignConstraints {
  const A = plan.attributes.length;
  const levelBase = new Int32Array(A + 1);
  plan.attributes.forEach((attribute, a) => {
    levelBase[a + 1] = levelBase[a] + attribute.levelIds.length;
  });
  const T = levelBase[A];
  const levelRule = new Int32Array(T).fill(-1);
  const pairRule = new Int32Array(T * T).fill(-1);
  const attributeIndex = new Map(plan.attributes.map((x, a) => [x.id, a]));
  const levelIndex = (a: number, levelId: string) => plan.attributes[a].levelIds.indexOf(levelId);
  const levelValues = plan.attributes.map((attribute) => {
    const source = definition.attributes.find((x) => x.id === attribute.id);
    return Float64Array.from(attribute.levelIds, (id, l) =>
      source?.kind === 'numeric' ? (source.levels.find((x) => x.id === id)?.value ?? l) : l,
    );
  });
  const excludePair = (rule: number, a: number, la: number, b: number, lb: number) => {
    const p = levelBase[a] + la;
    const q = levelBase[b] + lb;
    if (pairRule[p * T + q] < 0) pairRule[p * T + q] = rule;
    if (pairRule[q * T + p] < 0) pairRule[q * T + p] = rule;
  };
  const between: BetweenRule[] = [];
  definition.excludedCombinations.forEach((rule, r) => {
    switch (rule.kind) {
      case 'pair': {
        const a = attributeIndex.get(rule.a.attributeId);
        const b = attributeIndex.get(rule.b.attributeId);
        if (a === undefined || b === undefined || a === b) return;
        const la = levelIndex(a, rule.a.levelId);
        const lb = levelIndex(b, rule.b.levelId);
        if (la >= 0 && lb >= 0) excludePair(r, a, la, b, lb);
        return;
      }
      case 'when_then': {
        const a = attributeIndex.get(rule.when.attributeId);
        const b = attributeIndex.get(rule.then.attributeId);
        if (a === undefined || b === undefined || a === b) return;
        const allowed = new Set(rule.then.levelIds);
        for (const id of rule.when.levelIds) {
          const la = levelIndex(a, id);
          if (la < 0) continue;
          plan.attributes[b].levelIds.forEach((other, lb) => {
            if (!allowed.has(other)) excludePair(r, a, la, b, lb);
          });
        }
        return;
      }
      case 'versus_status_quo': {
        const a = attributeIndex.get(rule.attributeId);
        const sq = plan.fixed?.kind === 'status_quo' ? plan.fixed.levelIndices : null;
        if (a === undefined || !sq || sq[a] < 0) return;
        const values = levelValues[a];
        for (let l = 0; l < values.length; l++)
          if (
            !holdsRelation(rule.relation, values[l], values[sq[a]]) &&
            levelRule[levelBase[a] + l] < 0
          )
            levelRule[levelBase[a] + l] = r;
        return;
      }
      case 'between_alternatives': {
        const a = attributeIndex.get(rule.attributeId);
        if (
          a === undefined ||
          rule.first >= plan.designedCount ||
          rule.second >= plan.designedCount
        )
          return;
        between.push({
          rule: r,
          a,
          first: rule.first,
          second: rule.second,
          relation: rule.relation,
        });
        return;
      }
    }
  });
  const dominance = buildDominanceTables(plan, priorMeans, priorSds);
  const hasFixed = dominance.versusFixed !== null;
  return {
    A,
    J: plan.designedCount,
    levelBase,
    levelTotal: T,
    levelRule,
    pairRule,
    levelValues,
    between,
    dominance,
    checks: {
      betweenDesigned: dominance.known && rules.dominance.betweenDesigned,
      overFixed: dominance.known && hasFixed && rules.dominance.overFixed,
      byFixed: dominance.known && hasFixed && rules.dominance.byFixed,
    },
    statusQuo: plan.fixed?.kind === 'status_quo' ? plan.fixed.levelIndices : null,
    maxOverlap: rules.balance.maxOverlap ?? -1,
  };
}
