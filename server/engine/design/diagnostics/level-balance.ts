/**
 * Level balance (Huber & Zwerina 1996): how often each level of each attribute appears
 * among the designed alternatives, overall and per block.
 */
import type { Design } from '../../../../shared/schemas/design';
import type {
  Attribute,
  Level,
  StudyDefinition,
} from '../../../../shared/schemas/study-definition';
import type { LevelGrid } from '../design-grid';
import { getLevelLabel } from '../../../../shared/study/level-labels';
import type { AttributeLevelBalance } from '../../../../shared/schemas/design-diagnostics';

export function getLevelBalance(
  definition: StudyDefinition,
  grid: LevelGrid,
  blockOfTask: Int32Array,
  blocks: number,
): AttributeLevelBalance[] {
  const { S, J, A } = grid;
  return definition.attributes.map((attribute, a) => {
    const L = attribute.levels.length;
    const counts = new Array<number>(L).fill(0);
    const byBlock = Array.from({ length: blocks }, () => new Array<number>(L).fill(0));
    let shown = 0;
    for (let s = 0; s < S; s++)
      for (let j = 0; j < J; j++) {
        const l = grid.levels[(s * J + j) * A + a];
        if (l < 0) continue;
        counts[l]++;
        byBlock[blockOfTask[s] - 1][l]++;
        shown++;
      }
    return {
      attributeId: attribute.id,
      name: attribute.name,
      levels: attribute.levels.map((level, l) => ({
        levelId: level.id,
        label: getLevelLabel(attribute, level),
        count: counts[l],
        share: shown > 0 ? counts[l] / shown : 0,
        inStatusQuo:
          definition.fixedAlternative?.kind === 'status_quo' &&
          definition.fixedAlternative.levels[attribute.id] === level.id,
      })),
      byBlock,
      spread: Math.max(...counts) - Math.min(...counts),
    };
  });
}

/**
 * Levels respondents never see in a design: in no designed alternative and not the status
 * quo's level. A design with such a level cannot estimate it — an error, not a note.
 */
export function listUnshownLevels(
  definition: StudyDefinition,
  design: Design,
): { attribute: Attribute; level: Level }[] {
  const shown = new Set<string>();
  for (const task of design.tasks)
    for (const alternative of task.alternatives)
      for (const [a, l] of Object.entries(alternative.levels)) shown.add(`${a}\u0000${l}`);
  const fx = definition.fixedAlternative;
  if (fx?.kind === 'status_quo')
    for (const [a, l] of Object.entries(fx.levels)) shown.add(`${a}\u0000${l}`);
  return definition.attributes.flatMap((attribute) =>
    attribute.levels
      .filter((level) => !shown.has(`${attribute.id}\u0000${level.id}`))
      .map((level) => ({ attribute, level })),
  );
}
