/**
 * Level labels: derived from value and unit, and whether an own label still writes its value.
 * Number formats checked are the usual written forms (common practice, no source).
 */
import { describe, expect, it } from 'vitest';
import {
  checkLevelLabel,
  formatNumericLevel,
  getLevelLabel,
  labelShowsValue,
  readNumbersInLabel,
} from '../../../shared/study/level-labels';
import { formatAmount } from '../../../shared/format';

const bill = { kind: 'numeric' as const, unit: '€' };

describe('getLevelLabel', () => {
  it('derives a numeric label from value and unit unless the level has its own', () => {
    expect(getLevelLabel(bill, { id: 'b', label: '', value: 8 })).toBe('€8');
    expect(getLevelLabel(bill, { id: 'b', label: ' No increase ', value: 0 })).toBe('No increase');
    expect(formatNumericLevel(-3, '€')).toBe('−€3');
    expect(formatNumericLevel(1250.5, 'days')).toBe('1,250.5 days');
  });

  it('writes amounts with the product formatter: the typed symbol, trailing zeros dropped', () => {
    // One formatter for levels and results (shared/format.ts formatAmount, Intl.NumberFormat).
    expect(formatNumericLevel(15, '$')).toBe('$15');
    expect(formatNumericLevel(2.5, '£')).toBe('£2.5');
    expect(formatNumericLevel(12.25, 'EUR')).toBe('€12.25');
    expect(formatNumericLevel(15, 'CHF')).toMatch(/^CHF\s15$/);
    expect(formatNumericLevel(-2, 'km')).toBe('−2 km');
    expect(formatNumericLevel(1000, '')).toBe('1,000');
    expect(formatNumericLevel(1000, '€')).toBe(formatAmount(1000, '€', 2, true));
    for (const unit of ['€', '$', 'CHF', 'km', ''])
      expect(labelShowsValue(formatNumericLevel(-1234.5, unit), -1234.5)).toBe(true);
  });
});

describe('readNumbersInLabel', () => {
  it.each([
    ['€6', [6]],
    ['€1,000', [1, 1000]],
    ['1.250,5 €', [1250.5]],
    ['2,5 km', [2.5]],
    ['20 %', [20]],
    ['10 000 people', [10000]],
    ['−€3', [-3]],
    ['4–6 days', [4, 6]],
    ['€6 per 2 months', [6, 2]],
  ])('reads %s as %j', (text, values) => {
    expect(readNumbersInLabel(text)).toEqual(values);
  });
});

describe('labelShowsValue', () => {
  it('finds the value as a whole number, not as part of another', () => {
    expect(labelShowsValue('€6 a month', 6)).toBe(true);
    expect(labelShowsValue('€16', 6)).toBe(false);
    expect(labelShowsValue('1.5', 15)).toBe(false);
    expect(labelShowsValue('€3', -3)).toBe(false);
    expect(labelShowsValue('No increase', 0)).toBe(false);
  });
});

describe('checkLevelLabel', () => {
  it('tells derived, value-writing, confirmed and drifted labels apart', () => {
    expect(checkLevelLabel(bill, { id: 'b', label: '', value: 8 })).toBe('derived');
    expect(checkLevelLabel(bill, { id: 'b', label: '€8', value: 8 })).toBe('shows_value');
    expect(checkLevelLabel(bill, { id: 'b', label: '€6', value: 8 })).toBe('drifted');
    const confirmed = { value: 8, label: '€6' };
    expect(
      checkLevelLabel(bill, { id: 'b', label: '€6', value: 8, labelConfirmed: confirmed }),
    ).toBe('confirmed');
    // A confirmation is for one value and one label.
    expect(
      checkLevelLabel(bill, { id: 'b', label: '€6', value: 9, labelConfirmed: confirmed }),
    ).toBe('drifted');
    expect(
      checkLevelLabel(bill, { id: 'b', label: '€5', value: 8, labelConfirmed: confirmed }),
    ).toBe('drifted');
    expect(checkLevelLabel({ kind: 'categorical' }, { id: 'p', label: 'Poor' })).toBe('derived');
  });
});
