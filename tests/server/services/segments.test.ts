import { describe, expect, it } from 'vitest';
import { getBinCount, getQuantile, summarizeSegments } from '../../../server/services/segments';

describe('getQuantile (Hyndman & Fan 1996, definition 7)', () => {
  it('matches the definition-7 quartiles of 1..4 and 1..5', () => {
    // h = (n−1)p: for 1..4, p = .25 → h = .75 → 1.75; p = .5 → 2.5; p = .75 → 3.25 (by hand).
    expect(getQuantile([1, 2, 3, 4], 0.25)).toBeCloseTo(1.75, 14);
    expect(getQuantile([1, 2, 3, 4], 0.5)).toBeCloseTo(2.5, 14);
    expect(getQuantile([1, 2, 3, 4], 0.75)).toBeCloseTo(3.25, 14);
    expect(getQuantile([1, 2, 3, 4, 5], 0.25)).toBe(2);
    expect(getQuantile([7], 0.9)).toBe(7);
  });
});

describe('getBinCount (Sturges 1926, clamped to 5..30)', () => {
  it('uses ⌈log₂ n⌉ + 1', () => {
    expect(getBinCount(400)).toBe(10); // ⌈8.64⌉ + 1
    expect(getBinCount(3)).toBe(5);
    expect(getBinCount(2 ** 40)).toBe(30);
  });
});

describe('summarizeSegments', () => {
  const values = [1, 2, 3, 10, 20, 30, 99];
  const groups = ['a', 'a', 'a', 'b', 'b', 'b', null];

  it('gives each group its count, mean, sample SD and five numbers', () => {
    const out = summarizeSegments(values, groups);
    expect(out.groups.map((g) => g.key)).toEqual(['a', 'b']);
    const [a, b] = out.groups;
    // a = {1,2,3}: mean 2, SD 1; b = {10,20,30}: mean 20, SD 10 (hand computed).
    expect(a).toMatchObject({ count: 3, mean: 2, min: 1, median: 2, max: 3, q1: 1.5, q3: 2.5 });
    expect(a.sd).toBeCloseTo(1, 14);
    expect(b).toMatchObject({ count: 3, mean: 20, median: 20 });
    expect(b.sd).toBeCloseTo(10, 14);
  });

  it('leaves values without a group out of every group and of the bin range', () => {
    const out = summarizeSegments(values, groups, { bins: 29 });
    expect(out.edges[0]).toBe(1);
    expect(out.edges[out.edges.length - 1]).toBe(30);
    const total = out.groups.reduce((s, g) => s + g.histogram.reduce((x, y) => x + y, 0), 0);
    expect(total).toBe(6);
  });

  it('bins every value once on edges shared by all groups, the maximum in the last bin', () => {
    const out = summarizeSegments([0, 1, 2, 3, 4], ['x', 'x', 'y', 'y', 'y'], { bins: 4 });
    expect(out.edges).toEqual([0, 1, 2, 3, 4]);
    expect(out.groups[0].histogram).toEqual([1, 1, 0, 0]);
    expect(out.groups[1].histogram).toEqual([0, 0, 1, 2]);
  });

  it('follows the given group order, drops empty groups and reports no SD for one value', () => {
    const out = summarizeSegments([5, 6, 7], ['late', 'early', 'early'], {
      order: ['early', 'never', 'late'],
    });
    expect(out.groups.map((g) => g.key)).toEqual(['early', 'late']);
    expect(out.groups[1].sd).toBeNull();
  });

  it('gives a constant sample a bin of positive width', () => {
    const out = summarizeSegments([2, 2], ['a', 'a'], { bins: 5 });
    expect(out.edges[0]).toBeLessThan(2);
    expect(out.edges[5]).toBeGreaterThan(2);
    expect(out.groups[0].histogram.reduce((x, y) => x + y, 0)).toBe(2);
  });

  it('rejects mismatched lengths and non-finite values', () => {
    expect(() => summarizeSegments([1], [])).toThrow(/length/);
    expect(() => summarizeSegments([Number.NaN], ['a'])).toThrow(/finite/);
  });
});
