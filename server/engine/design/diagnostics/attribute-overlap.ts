/**
 * Attribute-level overlap (Huber & Zwerina 1996's "minimal overlap"): for each attribute,
 * the share of tasks in which it takes the same level in every designed alternative that
 * shows it (tasks where fewer than two alternatives show it are left out).
 */
import type { StudyDefinition } from '../../../../shared/schemas/study-definition';
import type { LevelGrid } from '../design-grid';
import { overlapsInTask } from '../design-constraints';
import type { AttributeOverlap } from '../../../../shared/schemas/design-diagnostics';

export function getAttributeOverlap(
  definition: StudyDefinition,
  grid: LevelGrid,
): AttributeOverlap[] {
  return definition.attributes.map((attribute, a) => {
    let comparable = 0;
    let overlapping = 0;
    for (let s = 0; s < grid.S; s++) {
      const overlaps = overlapsInTask(grid, s, a);
      if (overlaps === null) continue;
      comparable++;
      if (overlaps) overlapping++;
    }
    return {
      attributeId: attribute.id,
      name: attribute.name,
      share: comparable > 0 ? overlapping / comparable : null,
    };
  });
}
