/**
 * The coded columns (model parameters) a study definition implies, in matrix order:
 * attribute columns in attribute order, then alternative-specific constants of labeled
 * alternatives 2..J (the first labeled alternative is the reference), then one constant for
 * the opt-out / status quo when the study has one.
 */
import type { StudyDefinition } from '../../schemas/study-definition';
import { getAttributeCodes } from './level-codes';
import { getLevelLabel } from '../../study/level-labels';

export type CodedColumnKind = 'level' | 'linear' | 'constant';

export interface CodedColumn {
  /**
   * Stable key used to attach priors and estimates: `attr:<attributeId>:<levelId>`,
   * `attr:<attributeId>` (linear), `asc:<labeledAlternativeId>` or `asc:fixed`.
   */
  key: string;
  /** Readable name, e.g. "River health: good" or "Monthly bill increase (€)". */
  name: string;
  kind: CodedColumnKind;
  attributeId?: string;
  levelId?: string;
  /** For constants: designed alternative index (0-based) or 'fixed'. */
  alternative?: number | 'fixed';
}

/**
 * "Share of renewable energy (%)", but never a unit twice: a name that already says its unit
 * ("Supply interruptions per year" with unit "per year") is left as it is.
 */
export function nameWithUnit(name: string, unit: string | undefined): string {
  const u = unit?.trim();
  if (!u || name.toLowerCase().includes(u.toLowerCase())) return name;
  return `${name} (${u})`;
}

/** Lists the coded columns of a study definition (see the file comment for the order). */
export function getCodedColumns(definition: StudyDefinition): CodedColumn[] {
  const columns: CodedColumn[] = [];
  for (const attribute of definition.attributes) {
    const codes = getAttributeCodes(attribute);
    if (attribute.coding === 'linear') {
      columns.push({
        key: `attr:${attribute.id}`,
        name: nameWithUnit(attribute.name, attribute.unit),
        kind: 'linear',
        attributeId: attribute.id,
      });
      continue;
    }
    for (const levelId of codes.columnLevelIds) {
      const level = attribute.levels.find((l) => l.id === levelId);
      columns.push({
        key: `attr:${attribute.id}:${levelId}`,
        name: `${attribute.name}: ${level ? getLevelLabel(attribute, level) : levelId}`,
        kind: 'level',
        attributeId: attribute.id,
        levelId,
      });
    }
  }
  if (definition.alternatives.labeled) {
    definition.alternatives.labels.forEach((label, j) => {
      if (j === 0) return;
      columns.push({
        key: `asc:${label.id}`,
        name: `Constant: ${label.name}`,
        kind: 'constant',
        alternative: j,
      });
    });
  }
  if (definition.fixedAlternative) {
    columns.push({
      key: 'asc:fixed',
      name: `Constant: ${definition.fixedAlternative.label}`,
      kind: 'constant',
      alternative: 'fixed',
    });
  }
  return columns;
}
