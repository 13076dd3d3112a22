/**
 * Codes one alternative into a row of the design matrix (length K = plan.columnCount).
 * Omitted attributes (labeled alternatives) and the opt-out's attributes code as zeros; the
 * status quo codes its fixed levels; constants are 1 in their own column.
 */
import type { CodingPlan } from './coding-plan';

/**
 * Index-based kernel: writes the row of designed alternative `alternative` (0..J−1), or of
 * the fixed alternative when `alternative === plan.designedCount`, into
 * `out[outOffset .. outOffset+K)`. `levels[levelOffset + a]` is the level index of attribute
 * a (−1 = not shown, codes as zero); it is ignored for the fixed alternative.
 */
export function codeAlternativeIndices(
  plan: CodingPlan,
  alternative: number,
  levels: Int32Array,
  levelOffset: number,
  out: Float64Array,
  outOffset: number,
): void {
  const K = plan.columnCount;
  const A = plan.attributes.length;
  out.fill(0, outOffset, outOffset + K);
  const isFixed = alternative === plan.designedCount;
  if (isFixed && !plan.fixed) throw new RangeError('The study has no opt-out or status quo');
  for (let a = 0; a < A; a++) {
    const level = isFixed ? plan.fixed!.levelIndices[a] : levels[levelOffset + a];
    if (level < 0) continue;
    if (!isFixed && plan.omitted[alternative * A + a] === 1) continue;
    const attribute = plan.attributes[a];
    const w = attribute.width;
    const src = level * w;
    const dst = outOffset + attribute.offset;
    for (let c = 0; c < w; c++) out[dst + c] = attribute.codes[src + c];
  }
  const constant = isFixed ? plan.fixed!.constantColumn : plan.constantColumn[alternative];
  if (constant >= 0) out[outOffset + constant] = 1;
}

/**
 * Id-based convenience for previews and estimation: codes the designed alternative
 * `alternative` (0-based) or `'fixed'` from an attribute id → level id map. Unknown or
 * missing attributes code as zero; an unknown level id throws.
 */
export function codeAlternative(
  plan: CodingPlan,
  alternative: number | 'fixed',
  levels: Record<string, string>,
  out: Float64Array = new Float64Array(plan.columnCount),
  outOffset = 0,
): Float64Array {
  const indices = new Int32Array(plan.attributes.length);
  plan.attributes.forEach((attribute, a) => {
    const levelId = levels[attribute.id];
    if (levelId === undefined) {
      indices[a] = -1;
      return;
    }
    const index = attribute.levelIds.indexOf(levelId);
    if (index < 0)
      throw new RangeError(`Unknown level "${levelId}" of attribute "${attribute.id}"`);
    indices[a] = index;
  });
  const j = alternative === 'fixed' ? plan.designedCount : alternative;
  if (j < 0 || j > plan.designedCount || !Number.isInteger(j))
    throw new RangeError(`Alternative ${String(alternative)} does not exist`);
  codeAlternativeIndices(plan, j, indices, 0, out, outOffset);
  return out;
}
