import { describe, expect, it } from 'vitest';
import { isSpreadParameter, showSpread } from '@shared/results/spread';

// s and −s give the same model (s·η with η symmetric about zero), so the reported spread is |s|
// and its interval is the interval of s carried over to |s| (common practice, no source).
describe('showSpread', () => {
  it('mirrors a negative estimate and its interval when the interval excludes zero', () => {
    expect(showSpread(-0.5, -0.7, -0.3)).toEqual({ value: 0.5, lower: 0.3, upper: 0.7 });
  });
  it('keeps a positive estimate and interval as they are', () => {
    expect(showSpread(0.5, 0.3, 0.7)).toEqual({ value: 0.5, lower: 0.3, upper: 0.7 });
  });
  it('turns an interval across zero into 0 to the larger |end|', () => {
    // The example: −0.032, interval −0.074 to 0.009 → |s| 0.032, 0 to 0.074.
    expect(showSpread(-0.032, -0.074, 0.009)).toEqual({ value: 0.032, lower: 0, upper: 0.074 });
  });
  it('keeps the estimate when there is no interval', () => {
    expect(showSpread(-0.2, null, null)).toEqual({ value: 0.2, lower: null, upper: null });
  });
});

describe('isSpreadParameter', () => {
  it('knows spreads from means and Cholesky terms', () => {
    expect(isSpreadParameter('interruptions.sd')).toBe(true);
    expect(isSpreadParameter('river.spread')).toBe(true);
    expect(isSpreadParameter('interruptions.mean')).toBe(false);
    expect(isSpreadParameter('chol.a.a')).toBe(false);
    expect(isSpreadParameter('price')).toBe(false);
  });
});
