/** A short note beside each prior input saying which sign researchers usually expect. */
import type { CodedColumn } from '@shared/engine/coding/coded-columns';
import type { StudyDefinition } from '@shared/schemas/study-definition';

export function getPriorHint(definition: StudyDefinition, column: CodedColumn): string {
  const attribute = definition.attributes.find((a) => a.id === column.attributeId);
  if (column.kind === 'constant')
    return 'Preference for this alternative when everything else is equal; 0 if unsure.';
  if (attribute?.isCost) return 'Usually negative: a higher cost makes an option less attractive.';
  if (column.kind === 'linear')
    return 'Per unit: positive if more is better, negative if more is worse.';
  const against = attribute?.coding === 'effects' ? 'the average level' : 'the reference level';
  return `Positive if this level is preferred to ${against}, negative if not.`;
}
