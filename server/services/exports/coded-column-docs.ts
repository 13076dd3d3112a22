/**
 * Codebook lines for the coded columns of the long choice file: what each column is, its unit
 * and how it is coded (dummy, effects, linear value, alternative-specific constant).
 */
import type { StudyDefinition } from '../../../shared/schemas/study-definition';
import { getAttributeCodes } from '../../../shared/engine/coding/level-codes';
import { getLevelLabel } from '../../../shared/study/level-labels';
import type { PreparedColumn } from '../choice-data-from-study';
import { col, type ColumnDoc } from './documented-table';

export function describeCodedColumn(definition: StudyDefinition, c: PreparedColumn): ColumnDoc {
  const attribute = definition.attributes.find((a) => a.id === c.attributeId);
  if (c.kind === 'constant')
    return col(
      c.code,
      'integer',
      `${c.name} (alternative-specific constant)`,
      'none',
      "1 on that alternative's rows, 0 otherwise",
    );
  if (!attribute) return col(c.code, 'estimate', c.name);
  if (c.kind === 'linear')
    return col(
      c.code,
      'estimate',
      `${c.name}: the level's value${c.isCost ? ' (the cost attribute)' : ''}`,
      attribute.unit?.trim() || "as the attribute's levels",
      'numeric value of the level shown',
    );
  const label = (id: string | undefined) => {
    const level = attribute.levels.find((l) => l.id === id);
    return level ? getLevelLabel(attribute, level) : (id ?? '');
  };
  const codes = getAttributeCodes(attribute);
  const reference = label(attribute.levels.find((l) => !codes.columnLevelIds.includes(l.id))?.id);
  return col(
    c.code,
    'integer',
    c.name,
    'none',
    attribute.coding === 'effects'
      ? `effects coding: 1 = ${label(c.levelId)}, −1 = ${reference} (the omitted level), 0 otherwise`
      : `dummy coding: 1 = ${label(c.levelId)}, 0 otherwise (reference level: ${reference})`,
  );
}
