/**
 * How a level reads to respondents. Numeric levels are written from their value and unit
 * (money in the currency's own style, other units after the number) unless a label is given.
 */
import type { Attribute, Level } from '@shared/schemas/study-definition';
import { formatAmount } from '@/utils/format';

export function formatNumericLevel(value: number, unit?: string): string {
  return formatAmount(value, unit, 2, true);
}

export function formatLevel(attribute: Attribute, level: Level): string {
  if (level.label.trim()) return level.label;
  if (attribute.kind === 'numeric' && level.value !== undefined)
    return formatNumericLevel(level.value, attribute.unit);
  return '';
}
