/**
 * The unit and basis of a willingness to pay, in words: what money, and for what change.
 * WTP_k = −β_k/β_cost is money of the cost attribute per one-unit change of column k, so it
 * reads "€ of monthly bill increase per +1 in Supply interruptions per year" (linear), "… for
 * River health rating: Good instead of Poor" (dummy), "… for Good against the average level"
 * (effects) or "… for Keep the current service, all else equal" (a constant).
 */
import type { StudyDefinition } from '../../schemas/study-definition';
import { getCodedColumns, nameWithUnit } from './coded-columns';
import { getAttributeCodes } from './level-codes';

const lowerFirst = (s: string) => (/^[A-Z][a-z]/.test(s) ? s[0].toLowerCase() + s.slice(1) : s);

/** "€ of monthly bill increase", or "cost units" when the study names no cost unit. */
export function getMoneyUnit(definition: StudyDefinition): string {
  const cost = definition.attributes.find((a) => a.isCost);
  if (!cost) return 'cost units';
  const unit = cost.unit?.trim() || 'units';
  return `${unit} of ${lowerFirst(cost.name)}`;
}

/** The WTP unit of one coded column (by its key, e.g. "attr:interruptions"), or null. */
export function getWtpUnit(definition: StudyDefinition, key: string): string | null {
  const column = getCodedColumns(definition).find((c) => c.key === key);
  if (!column) return null;
  const money = getMoneyUnit(definition);
  if (column.kind === 'constant') {
    const name = column.name.replace(/^Constant:\s*/, '');
    return `${money} for ${name}, all else equal`;
  }
  const attribute = definition.attributes.find((a) => a.id === column.attributeId);
  // The cost coefficient is the denominator of every WTP: it has no WTP of its own.
  if (!attribute || attribute.isCost) return null;
  if (column.kind === 'linear')
    return `${money} per +1 in ${nameWithUnit(attribute.name, attribute.unit)}`;
  const level = attribute.levels.find((l) => l.id === column.levelId);
  if (attribute.coding === 'effects')
    return `${money} for ${attribute.name}: ${level?.label ?? ''} against the average level`;
  const codes = getAttributeCodes(attribute);
  const reference = attribute.levels.find((l) => !codes.columnLevelIds.includes(l.id));
  return `${money} for ${attribute.name}: ${level?.label ?? ''} instead of ${reference?.label ?? 'the reference level'}`;
}
