/**
 * A precomputed, array-based view of a study definition's coding, so kernels can code an
 * alternative from level indices without touching ids or strings.
 */
import type { StudyDefinition } from '../../schemas/study-definition';
import { getCodedColumns, type CodedColumn } from './coded-columns';
import { getAttributeCodes, type AttributeCodes } from './level-codes';

export interface PlannedAttribute extends AttributeCodes {
  id: string;
  /** First coded column of this attribute. */
  offset: number;
}

export interface CodingPlan {
  columns: CodedColumn[];
  /** K: number of coded columns. */
  columnCount: number;
  attributes: PlannedAttribute[];
  /** J: designed alternatives per task. */
  designedCount: number;
  /** Column of the constant of designed alternative j, or −1 (length J). */
  constantColumn: Int32Array;
  /** 1 where attribute a is omitted for designed alternative j (row-major J × A). */
  omitted: Uint8Array;
  /** The opt-out / status quo, or null. */
  fixed: null | {
    kind: 'opt_out' | 'status_quo';
    constantColumn: number;
    /** Level index per attribute (−1 for the opt-out, which codes as zero). */
    levelIndices: Int32Array;
  };
}

/** Builds the coding plan of a (validated) study definition. */
export function buildCodingPlan(definition: StudyDefinition): CodingPlan {
  const columns = getCodedColumns(definition);
  const attributes: PlannedAttribute[] = [];
  let offset = 0;
  for (const attribute of definition.attributes) {
    const codes = getAttributeCodes(attribute);
    attributes.push({ ...codes, id: attribute.id, offset });
    offset += codes.width;
  }
  const J = definition.alternatives.count;
  const A = attributes.length;
  const constantColumn = new Int32Array(J).fill(-1);
  const omitted = new Uint8Array(J * A);
  if (definition.alternatives.labeled) {
    definition.alternatives.labels.forEach((label, j) => {
      constantColumn[j] = columns.findIndex((c) => c.key === `asc:${label.id}`);
      attributes.forEach((attribute, a) => {
        if (label.omittedAttributeIds.includes(attribute.id)) omitted[j * A + a] = 1;
      });
    });
  }
  let fixed: CodingPlan['fixed'] = null;
  const fx = definition.fixedAlternative;
  if (fx) {
    const levelIndices = new Int32Array(A).fill(-1);
    if (fx.kind === 'status_quo') {
      attributes.forEach((attribute, a) => {
        levelIndices[a] = attribute.levelIds.indexOf(fx.levels[attribute.id] ?? '');
      });
    }
    fixed = {
      kind: fx.kind,
      constantColumn: columns.findIndex((c) => c.key === 'asc:fixed'),
      levelIndices,
    };
  }
  return {
    columns,
    columnCount: columns.length,
    attributes,
    designedCount: J,
    constantColumn,
    omitted,
    fixed,
  };
}
