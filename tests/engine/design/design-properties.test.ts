/**
 * Property tests (fast-check) on random small studies: designs never contain prohibited
 * combinations, identical alternatives or dominated alternatives, and coordinate exchange
 * never returns a design worse than its start. Constraints are checked here by an
 * independent implementation written from the definitions in design-constraints.ts.
 */
import fc from 'fast-check';
import { describe, expect, it } from 'vitest';
import { buildCodingPlan } from '../../../shared/engine/coding/coding-plan';
import {
  studyDefinitionSchema,
  type StudyDefinition,
} from '../../../shared/schemas/study-definition';
import type { Design } from '../../../shared/schemas/design';
import { improveByCoordinateExchange } from '../../../server/engine/design/coordinate-exchange';
import { computeBayesianDError } from '../../../server/engine/design/d-error';
import { buildDesignConstraints } from '../../../server/engine/design/design-constraints';
import { DesignError } from '../../../server/engine/design/design-errors';
import { buildDesignMatrix, getRowsPerTask } from '../../../server/engine/design/design-grid';
import { generateDesign } from '../../../server/engine/design/generate-design';
import { generateRandomGrid } from '../../../server/engine/design/random-design';
import { createSeededRandom } from '../../../server/engine/design/seeded-random';

interface Case {
  definition: StudyDefinition;
  means: Record<string, number>;
}

const caseArbitrary = fc
  .record({
    attributes: fc.array(
      fc.record({
        numeric: fc.boolean(),
        levels: fc.integer({ min: 2, max: 4 }),
        coding: fc.constantFrom('dummy', 'effects'),
        // Prior means per coded column; 0 makes that difference's sign unknown.
        slope: fc.constantFrom(-1, -0.5, 0, 0.5, 1),
      }),
      { minLength: 2, maxLength: 4 },
    ),
    J: fc.integer({ min: 2, max: 3 }),
    statusQuo: fc.boolean(),
    prohibit: fc.boolean(),
    seed: fc.integer({ min: 0, max: 1000 }),
  })
  .map(({ attributes, J, statusQuo, prohibit, seed }): Case & { seed: number } => {
    const definition = studyDefinitionSchema.parse({
      attributes: attributes.map((a, i) => ({
        id: `a${i}`,
        name: `Attribute ${i + 1}`,
        kind: a.numeric ? 'numeric' : 'categorical',
        coding: a.numeric ? 'linear' : a.coding,
        levels: Array.from({ length: a.levels }, (_, l) => ({
          id: `a${i}l${l}`,
          label: `L${l}`,
          value: l * 2,
        })),
      })),
      alternatives: { count: J, labeled: false, labels: [] },
      fixedAlternative: statusQuo
        ? {
            kind: 'status_quo',
            label: 'Now',
            levels: Object.fromEntries(attributes.map((_, i) => [`a${i}`, `a${i}l0`])),
          }
        : null,
      prohibitions: prohibit
        ? [
            {
              id: 'p1',
              a: { attributeId: 'a0', levelId: 'a0l1' },
              b: { attributeId: 'a1', levelId: 'a1l1' },
            },
          ]
        : [],
    });
    const means: Record<string, number> = {};
    buildCodingPlan(definition).columns.forEach((c, k) => {
      const a = attributes[Number(c.attributeId?.slice(1) ?? 0)];
      means[c.key] = c.kind === 'constant' ? 0.3 : a.slope * (1 + (k % 3) * 0.25);
    });
    return { definition, means, seed };
  });

/** Level utility under the prior means, from the coding definitions (dummy/effects/linear). */
function levelUtility(c: Case, attributeIndex: number, levelId: string): number {
  const attribute = c.definition.attributes[attributeIndex];
  const l = attribute.levels.findIndex((x) => x.id === levelId);
  if (attribute.coding === 'linear')
    return c.means[`attr:${attribute.id}`] * attribute.levels[l].value!;
  const last = attribute.levels.length - 1;
  if (attribute.coding === 'dummy') return l === 0 ? 0 : c.means[`attr:${attribute.id}:${levelId}`];
  if (l < last) return c.means[`attr:${attribute.id}:${levelId}`];
  return -attribute.levels
    .slice(0, last)
    .reduce((s, x) => s + c.means[`attr:${attribute.id}:${x.id}`], 0);
}

/** Independent check of the three constraints on a design (fixed priors: sd = 0). */
function findViolation(c: Case, design: Design): string | null {
  const attrs = c.definition.attributes;
  const sq =
    c.definition.fixedAlternative?.kind === 'status_quo'
      ? c.definition.fixedAlternative.levels
      : null;
  for (const task of design.tasks) {
    const alts = task.alternatives.map((a) => a.levels);
    for (const levels of alts) {
      for (const p of c.definition.prohibitions)
        if (levels[p.a.attributeId] === p.a.levelId && levels[p.b.attributeId] === p.b.levelId)
          return `prohibited pair in task ${task.task}`;
      if (sq && attrs.every((a) => levels[a.id] === sq[a.id]))
        return `status quo repeated in task ${task.task}`;
    }
    for (let i = 0; i < alts.length; i++)
      for (let k = 0; k < alts.length; k++) {
        if (i === k) continue;
        if (attrs.every((a) => alts[i][a.id] === alts[k][a.id]))
          return `identical alternatives in task ${task.task}`;
        let strictly = false;
        const weaklyBetter = attrs.every((a, ai) => {
          if (alts[i][a.id] === alts[k][a.id]) return true;
          const d = levelUtility(c, ai, alts[i][a.id]) - levelUtility(c, ai, alts[k][a.id]);
          if (d > 0) strictly = true;
          return d > 0;
        });
        if (weaklyBetter && strictly)
          return `alternative ${i + 1} dominates ${k + 1} in task ${task.task}`;
      }
  }
  return null;
}

describe('design constraints (property)', () => {
  it('never produce prohibited, identical or dominated alternatives', () => {
    fc.assert(
      fc.property(caseArbitrary, fc.constantFrom('random', 'd_efficient'), (c, method) => {
        const K = buildCodingPlan(c.definition).columnCount;
        const Jt = c.definition.alternatives.count + (c.definition.fixedAlternative ? 1 : 0);
        const spec = {
          method,
          tasks: Math.ceil(K / (Jt - 1)) + 2,
          starts: 1,
          maxIterations: 4,
          seed: c.seed,
          priors: {
            kind: 'fixed',
            columns: Object.entries(c.means).map(([key, mean]) => ({ key, mean })),
          },
        };
        try {
          const { design } = generateDesign(c.definition, spec);
          expect(findViolation(c, design)).toBeNull();
        } catch (error) {
          // Some random studies leave no feasible task at all; that must be reported as such.
          expect(error).toBeInstanceOf(DesignError);
          expect((error as DesignError).code).toBe('infeasible');
        }
      }),
      { numRuns: 60, seed: 20261202 },
    );
  });
});

describe('coordinate exchange (property)', () => {
  it('never returns a design worse than its start, and reports its D-error exactly', () => {
    fc.assert(
      fc.property(caseArbitrary, fc.boolean(), (c, bayesian) => {
        const plan = buildCodingPlan(c.definition);
        const K = plan.columnCount;
        const means = Float64Array.from(plan.columns.map((col) => c.means[col.key]));
        const sds = new Float64Array(K).fill(bayesian ? 0.3 : 0);
        const R = bayesian ? 8 : 1;
        const draws = new Float64Array(R * K);
        const random = createSeededRandom(c.seed);
        for (let r = 0; r < R; r++)
          for (let k = 0; k < K; k++) draws[r * K + k] = means[k] + sds[k] * (random.next() - 0.5);
        const constraints = buildDesignConstraints(plan, c.definition.prohibitions, means, sds);
        let start;
        try {
          start = generateRandomGrid(
            plan,
            constraints,
            Math.ceil(K / (getRowsPerTask(plan) - 1)) + 1,
            random,
          );
        } catch {
          return; // infeasible random study; covered by the constraint property above
        }
        const Jt = getRowsPerTask(plan);
        const before = computeBayesianDError(
          K,
          start.S,
          Jt,
          buildDesignMatrix(plan, start),
          draws,
          R,
        );
        const result = improveByCoordinateExchange(plan, constraints, start, draws, R, {
          maxPasses: 6,
        });
        const after = computeBayesianDError(
          K,
          start.S,
          Jt,
          buildDesignMatrix(plan, result.grid),
          draws,
          R,
        );
        expect(result.value).toBe(after);
        if (Number.isFinite(before)) expect(after).toBeLessThanOrEqual(before);
      }),
      { numRuns: 60, seed: 7 },
    );
  });
});
