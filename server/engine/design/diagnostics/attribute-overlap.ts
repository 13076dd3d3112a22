/**
 * Attribute-level overlap (Huber & Zwerina 1996's "minimal overlap"): for each attribute,
 * the share of tasks in which it takes the same level in every designed alternative that
 * shows it (tasks where fewer than two alternatives show it are left out).
 */
import type { StudyDefinition } from '../../../../shared/schemas/study-definition';
import type { LevelGrid } from '../design-grid';
import type { AttributeOverlap } from '../../../../shared/schemas/design-diagnostics';

export function getAttributeOverlap(
  definition: StudyDefinition,
  grid: LevelGrid,
): AttributeOverlap[] {
  const { S, J, A } = grid;
  return definition.attributes.map((attribute, a) => {
    let comparable = 0;
    let overlapping = 0;
    for (let s = 0; s < S; s++) {
      let first = -1;
      let shown = 0;
      let same = true;
      for (let j = 0; j < J; j++) {
        const l = grid.levels[(s * J + j) * A + a];
        if (l < 0) continue;
        if (shown === 0) first = l;
        else if (l !== first) same = false;
        shown++;
      }
      if (shown < 2) continue;
      comparable++;
      if (same) overlapping++;
    }
    return {
      attributeId: attribute.id,
      name: attribute.name,
      share: comparable > 0 ? overlapping / comparable : null,
    };
  });
}
