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

const bill = { kind: 'numeric' as const, unit: '€' };

describe('getLevelLabel', () => {
  it('derives a numeric label from value and unit unless the level has its own', () => {
    expect(getLevelLabel(bill, { id: 'b', label: '', value: 8 })).toBe('€8');
    expect(getLevelLabel(bill, { id: 'b', label: ' No increase ', value: 0 })).toBe('No increase');
    expect(formatNumericLevel(-3, '€')).toBe('−€3');
    expect(formatNumericLevel(1250.5, 'days')).toBe('1,250.5 days');
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
