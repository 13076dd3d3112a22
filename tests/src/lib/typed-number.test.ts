/**
 * Numbers as people type them (src/lib/typed-number.ts): a decimal comma is read as a point
 * (comma-decimal locales and their phone keyboards; common practice, no source).
 */
import { describe, expect, it } from 'vitest';
import { readTypedNumber } from '@/lib/typed-number';

describe('readTypedNumber', () => {
  it.each<[string, number | null]>([
    ['2.5', 2.5],
    ['2,5', 2.5],
    [' -0,75 ', -0.75],
    ['12', 12],
    ['', null],
    ['   ', null],
  ])('reads %j as %j', (typed, read) => {
    expect(readTypedNumber(typed)).toBe(read);
  });

  it.each(['abc', '2,5 €', '1,000,000', 'Infinity', '2..5'])('reads %j as NaN', (typed) => {
    expect(readTypedNumber(typed)).toBeNaN();
  });
});
