/**
 * Small study definitions for design tests (symmetric attributes named after the invented
 * Larkspur Valley Water scenario).
 */
import {
  studyDefinitionSchema,
  type StudyDefinition,
} from '../../../shared/schemas/study-definition';
import type { LevelGrid } from '../../../server/engine/design/design-grid';

const NAMES = [
  'River health',
  'Taste warnings',
  'Interruptions',
  'Renewables',
  'Pressure',
  'Meters',
];

/** k attributes with the given level counts and coding, J unlabeled alternatives. */
export function makeSymmetricDefinition(
  levelCounts: number[],
  J: number,
  coding: 'effects' | 'dummy' = 'effects',
  extra: Partial<StudyDefinition> = {},
): StudyDefinition {
  return studyDefinitionSchema.parse({
    attributes: levelCounts.map((n, a) => ({
      id: `a${a}`,
      name: NAMES[a] ?? `Attribute ${a + 1}`,
      kind: 'categorical',
      coding,
      levels: Array.from({ length: n }, (_, l) => ({ id: `a${a}l${l}`, label: `level ${l + 1}` })),
    })),
    alternatives: { count: J, labeled: false, labels: [] },
    ...extra,
  });
}

/** Grid from rows of level indices: tasks[s][j][a]. */
export function makeGrid(tasks: number[][][]): LevelGrid {
  const S = tasks.length;
  const J = tasks[0].length;
  const A = tasks[0][0].length;
  return { S, J, A, levels: Int32Array.from(tasks.flat(2)) };
}

/** Check-A design (docs/methods.md "Design check values"): L9 rows (a, b, a+b mod 3), alternatives shifted +1, +2. */
export function makeCheckAGrid(): LevelGrid {
  const tasks: number[][][] = [];
  for (let a = 0; a < 3; a++)
    for (let b = 0; b < 3; b++) {
      const base = [a, b, (a + b) % 3];
      tasks.push([0, 1, 2].map((shift) => base.map((v) => (v + shift) % 3)));
    }
  return makeGrid(tasks);
}

/** Check-B design (docs/methods.md "Design check values"): OMEP {000, 011, 101, 110} paired with its fold-over. */
export function makeFoldoverGrid(): LevelGrid {
  const omep = [
    [0, 0, 0],
    [0, 1, 1],
    [1, 0, 1],
    [1, 1, 0],
  ];
  return makeGrid(omep.map((row) => [row, row.map((v) => 1 - v)]));
}
