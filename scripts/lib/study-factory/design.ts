/**
 * A seeded random design for a study definition: every task's packages pick each attribute's
 * level uniformly with the project's generator (shared/engine/random/prng), tasks in blocks
 * of equal size. Imports only shared/ (used in Playwright and browser bundles too).
 */
import { createPrng } from '../../../shared/engine/random/prng';
import type { Design } from '../../../shared/schemas/design';
import type { StudyDefinition } from '../../../shared/schemas/study-definition';

export type StudyDesignOptions = { blocks?: number; tasksPerBlock?: number; seed?: number };

/** Default: 2 blocks of 8 tasks from seed 11; the same options always give the same design. */
export function makeStudyDesign(
  definition: StudyDefinition,
  { blocks = 2, tasksPerBlock = 8, seed = 11 }: StudyDesignOptions = {},
): Design {
  const prng = createPrng(seed);
  const pick = <T>(xs: T[]) => xs[Math.floor(prng.nextDouble() * xs.length)];
  const tasks = Array.from({ length: blocks * tasksPerBlock }, (_, i) => ({
    block: Math.floor(i / tasksPerBlock) + 1,
    task: i + 1,
    alternatives: Array.from({ length: definition.alternatives.count }, () => ({
      levels: Object.fromEntries(
        definition.attributes.map((a) => [a.id, pick(a.levels.map((l) => l.id))]),
      ),
    })),
  }));
  return { blocks, tasks };
}
