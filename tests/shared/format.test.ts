import { describe, expect, it } from 'vitest';
import {
  formatAmount,
  formatCount,
  formatDate,
  formatDateTime,
  formatInterval,
  formatNumber,
  formatPercent,
  formatPValue,
  formatSignificant,
  getCurrencyCode,
} from '../../shared/format';
import { nameWithUnit } from '../../shared/engine/coding/coded-columns';

describe('formatNumber', () => {
  it('writes fixed decimals with grouping and a true minus sign', () => {
    expect(formatNumber(-1234.5678)).toBe('−1,234.568');
    expect(formatNumber(0.5, 2)).toBe('0.50');
  });
  it('drops the sign of a value that rounds to zero and dashes a missing value', () => {
    expect(formatNumber(-0.0001)).toBe('0.000');
    expect(formatNumber(null)).toBe('—');
    expect(formatNumber(Number.NaN)).toBe('—');
  });
});

describe('formatSignificant', () => {
  // Expected strings are the same rounding as Number.prototype.toPrecision (ECMA-262, 2024,
  // §21.1.3.5), written with the app's grouping and minus sign.
  it('keeps the significant digits, trailing zeros included, with a true minus sign', () => {
    expect(formatSignificant(0.284134)).toBe('0.2841');
    expect(formatSignificant(-1.5, 3)).toBe('−1.50');
    expect(formatSignificant(12345.6)).toBe('12,350');
  });
  it('dashes a missing or infinite value', () => {
    expect(formatSignificant(null)).toBe('—');
    expect(formatSignificant(Number.POSITIVE_INFINITY)).toBe('—');
  });
});

describe('formatAmount', () => {
  it('writes money in one style whatever the sign (no "−2.56 €" beside "€15")', () => {
    expect(formatAmount(-2.56, '€')).toBe('−€2.56');
    expect(formatAmount(15, '€')).toBe('€15.00');
    expect(formatAmount(15, 'EUR', 2, true)).toBe('€15');
    expect(formatAmount(1200, 'usd')).toBe('US$1,200.00');
  });
  it('puts any other unit after the number', () => {
    expect(formatAmount(3, 'days', 0)).toBe('3 days');
    expect(formatAmount(2.5, '', 1)).toBe('2.5');
  });
  it('knows which units are money', () => {
    expect(getCurrencyCode('£')).toBe('GBP');
    expect(getCurrencyCode('per year')).toBeNull();
    expect(getCurrencyCode('abc')).toBeNull();
  });
});

describe('percent, p-values, counts, intervals', () => {
  it('formats them through Intl', () => {
    expect(formatPercent(0.1234)).toBe('12.3%');
    expect(formatPValue(0.0004)).toBe('<0.001');
    expect(formatPValue(0.0421)).toBe('0.042');
    expect(formatCount(12480)).toBe('12,480');
    expect(formatInterval(-0.074, 0.009)).toBe('−0.074 to 0.009');
  });
});

describe('dates', () => {
  it('uses one date style, with or without the time', () => {
    const at = new Date(2026, 11, 2, 16, 44);
    expect(formatDate(at)).toBe('2 Dec 2026');
    expect(formatDateTime(at)).toBe('2 Dec 2026, 16:44');
    expect(formatDate('not a date')).toBe('—');
  });
});

describe('nameWithUnit', () => {
  it('never doubles a unit the name already says', () => {
    expect(nameWithUnit('Supply interruptions per year', 'per year')).toBe(
      'Supply interruptions per year',
    );
    expect(nameWithUnit('Share of renewable pumping energy', '%')).toBe(
      'Share of renewable pumping energy (%)',
    );
    expect(nameWithUnit('Monthly bill increase', undefined)).toBe('Monthly bill increase');
  });
});
