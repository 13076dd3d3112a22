/**
 * Per-attribute level codes: the numbers each level of one attribute writes into the coded
 * columns of a choice model's design matrix.
 *
 * Methods (standard regression coding, e.g. Hensher, Rose & Greene 2015, *Applied Choice
 * Analysis*, 2nd ed., ch. 6 [M]):
 * - dummy: one column per non-reference level, 1 for that level, 0 otherwise; the reference
 *   level (the attribute's `referenceLevelId`, default the first level) codes as all zeros.
 * - effects: one column per non-base level as for dummy, but the base level codes as −1 in
 *   every column so level effects sum to zero; the base is always the last level
 *   (`referenceLevelId` is documented as dummy-only in the study definition).
 * - linear: one column holding the level's numeric value.
 */
import type { Attribute } from '../../schemas/study-definition';

export interface AttributeCodes {
  /** Number of coded columns this attribute contributes. */
  width: number;
  /** Level ids in definition order (level index → id). */
  levelIds: string[];
  /** Row-major nLevels × width table: row l holds the code of level l. */
  codes: Float64Array;
  /** Level ids whose column is in position c (length width); empty for linear coding. */
  columnLevelIds: string[];
}

/** Builds the level-code table of one attribute for its declared coding. */
export function getAttributeCodes(attribute: Attribute): AttributeCodes {
  const levelIds = attribute.levels.map((l) => l.id);
  const n = levelIds.length;
  if (attribute.coding === 'linear') {
    const codes = new Float64Array(n);
    attribute.levels.forEach((l, i) => {
      codes[i] = l.value ?? Number.NaN;
    });
    return { width: 1, levelIds, codes, columnLevelIds: [] };
  }
  const width = n - 1;
  const baseIndex =
    attribute.coding === 'dummy'
      ? Math.max(0, levelIds.indexOf(attribute.referenceLevelId ?? levelIds[0]))
      : n - 1;
  const columnLevelIds = levelIds.filter((_, i) => i !== baseIndex);
  const codes = new Float64Array(n * width);
  let column = 0;
  for (let l = 0; l < n; l++) {
    if (l === baseIndex) {
      if (attribute.coding === 'effects') codes.fill(-1, l * width, (l + 1) * width);
      continue;
    }
    codes[l * width + column] = 1;
    column++;
  }
  return { width, levelIds, codes, columnLevelIds };
}
