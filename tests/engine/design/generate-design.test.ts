/**
 * Behaviour of generateDesign by method: reproducibility, level balance, blocking, the
 * shifted full factorial, opt-out / status quo, labeled alternatives, progress and cancel.
 */
import { describe, expect, it } from 'vitest';
import { assignBlocks } from '../../../server/engine/design/assign-blocks';
import { generateDesign } from '../../../server/engine/design/generate-design';
import { createPrng } from '../../../server/engine/draws/prng';
import { designSchema } from '../../../shared/schemas/design';
import { getCodedColumns } from '../../../shared/engine/coding/coded-columns';
import {
  makeLabeledDefinition,
  makeStudyDefinition,
} from '../../../scripts/lib/study-factory/definition';
import { makeSymmetricDefinition } from './design-fixtures';

describe('assignBlocks', () => {
  // A perfectly balanced split exists: the 2^3 factorial into two half-fractions
  // (x1 + x2 + x3 mod 2) and the 3^3 into three thirds (a + b + c mod 3), each of which shows
  // every level of every attribute equally often (regular fractions; common practice, no source).
  const factorial = (L: number) => {
    const rows: number[] = [];
    for (let i = 0; i < L ** 3; i++)
      rows.push(Math.floor(i / (L * L)), Math.floor(i / L) % L, i % L);
    return { S: L ** 3, J: 1, A: 3, levels: Int32Array.from(rows) };
  };
  it.each([
    [2, 2],
    [3, 3],
  ])('splits the %i-level 3-attribute factorial into %i exactly balanced blocks', (L, B) => {
    for (const seed of [1, 2, 3]) {
      const grid = factorial(L);
      const blockOf = assignBlocks(grid, [L, L, L], B, createPrng(seed));
      for (let b = 1; b <= B; b++)
        for (let a = 0; a < 3; a++)
          for (let l = 0; l < L; l++) {
            let n = 0;
            for (let s = 0; s < grid.S; s++)
              if (blockOf[s] === b && grid.levels[s * 3 + a] === l) n++;
            expect(n).toBe(grid.S / B / L);
          }
    }
  });
});

describe('generateDesign', () => {
  it('is reproducible for a seed and changes with the seed', () => {
    const def = makeSymmetricDefinition([3, 3, 2], 2);
    const spec = { method: 'd_efficient', tasks: 12, blocks: 2, starts: 2, seed: 9 } as const;
    const a = generateDesign(def, spec);
    const b = generateDesign(def, spec);
    const c = generateDesign(def, { ...spec, seed: 10 });
    expect(b.design).toEqual(a.design);
    expect(c.design).not.toEqual(a.design);
  });

  it('balances levels exactly in a random design when the levels divide the tasks', () => {
    const { diagnostics } = generateDesign(makeSymmetricDefinition([2, 3, 4], 3), {
      method: 'random',
      tasks: 12,
      seed: 3,
    });
    // 12 tasks × 3 alternatives = 36 appearances: 18, 12, 9 per level.
    expect(diagnostics.levelBalance.map((a) => a.levels.map((l) => l.count))).toEqual([
      [18, 18],
      [12, 12, 12],
      [9, 9, 9, 9],
    ]);
  });

  it('makes equal blocks and numbers tasks block by block', () => {
    const { design, diagnostics } = generateDesign(makeSymmetricDefinition([3, 3, 2], 2), {
      method: 'd_efficient',
      tasks: 18,
      blocks: 3,
      starts: 2,
      seed: 5,
    });
    expect(diagnostics.tasksPerBlock).toEqual([6, 6, 6]);
    expect(design.tasks.map((t) => t.task)).toEqual(Array.from({ length: 18 }, (_, i) => i + 1));
    expect(design.tasks.map((t) => t.block)).toEqual([
      1, 1, 1, 1, 1, 1, 2, 2, 2, 2, 2, 2, 3, 3, 3, 3, 3, 3,
    ]);
  });

  it('builds the shifted full factorial: one task per profile, 100 % efficient for 3^3 in triples', () => {
    // Street & Burgess 2007 [M]: generators (1,1,1), (2,2,2) on the complete 3^3 factorial
    // make every pair differ on every attribute, which attains the optimum of §2.2.
    const { design, diagnostics } = generateDesign(makeSymmetricDefinition([3, 3, 3], 3), {
      method: 'full_factorial',
      blocks: 3,
    });
    expect(design.tasks).toHaveLength(27);
    expect(diagnostics.dEfficiency!.efficiency).toBeCloseTo(1, 12);
    expect(diagnostics.overlap.every((o) => o.share === 0)).toBe(true);
  });

  it('designs around a status quo: valid design, probabilities over three rows summing to 1', () => {
    const def = makeStudyDefinition();
    const columns = getCodedColumns(def).map((c) => ({
      key: c.key,
      mean: c.key === 'attr:bill' ? -0.1 : c.key === 'asc:fixed' ? 0.5 : 0.2,
      sd: 0.05,
    }));
    const { design, diagnostics } = generateDesign(def, {
      method: 'd_efficient',
      tasks: 16,
      blocks: 2,
      starts: 2,
      priors: { kind: 'bayesian', columns, draws: 30 },
    });
    expect(designSchema.safeParse(design).success).toBe(true);
    expect(Number.isFinite(diagnostics.dError)).toBe(true);
    for (const row of diagnostics.choiceProbabilities) {
      expect(row.probabilities).toHaveLength(3);
      expect(row.probabilities.reduce((s, p) => s + p, 0)).toBeCloseTo(1, 12);
    }
  });

  it('leaves attributes a labeled alternative omits out of its levels', () => {
    const def = makeLabeledDefinition(['renew']);
    const { design } = generateDesign(def, { method: 'random', tasks: 10, seed: 2 });
    for (const task of design.tasks) {
      expect(task.alternatives[0].levels.renew).toBeDefined();
      expect(task.alternatives[1].levels.renew).toBeUndefined();
    }
  });

  it('reports progress per pass and stops when the signal aborts', () => {
    const def = makeSymmetricDefinition([3, 3, 3, 3], 3);
    const phases: string[] = [];
    const controller = new AbortController();
    expect(() =>
      generateDesign(
        def,
        { method: 'd_efficient', tasks: 12, starts: 4 },
        {
          signal: controller.signal,
          onProgress: (p) => {
            phases.push(p.phase);
            if (p.phase === 'searching' && p.start === 2) controller.abort();
          },
        },
      ),
    ).toThrow(/abort/i);
    expect(phases[0]).toBe('building');
    expect(phases.filter((p) => p === 'searching').length).toBeGreaterThan(1);
    expect(phases).not.toContain('done');
  });
});
