/**
 * How a level reads to respondents. Numeric levels are written from their value and unit
 * (currency symbols before the number, other units after it) unless a label is given.
 */
import type { Attribute, Level } from '@shared/schemas/study-definition';

const PREFIX_UNITS = new Set(['€', '$', '£', '¥', 'CHF', 'kr']);

export function formatNumber(value: number): string {
  return new Intl.NumberFormat('en-GB', { maximumFractionDigits: 2 }).format(value);
}

export function formatNumericLevel(value: number, unit?: string): string {
  const u = unit?.trim() ?? '';
  if (!u) return formatNumber(value);
  if (PREFIX_UNITS.has(u)) return `${value < 0 ? '−' : ''}${u}${formatNumber(Math.abs(value))}`;
  return `${formatNumber(value)} ${u}`;
}

export function formatLevel(attribute: Attribute, level: Level): string {
  if (level.label.trim()) return level.label;
  if (attribute.kind === 'numeric' && level.value !== undefined)
    return formatNumericLevel(level.value, attribute.unit);
  return '';
}
