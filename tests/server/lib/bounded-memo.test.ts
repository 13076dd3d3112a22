/**
 * boundedMemo: each input computed once while it is remembered, and never more than `kept`
 * entries held (common practice, no source).
 */
import { describe, expect, it } from 'vitest';
import { boundedMemo } from '../../../server/lib/bounded-memo';

describe('boundedMemo', () => {
  it('computes each input once, a null result included', () => {
    const calls: string[] = [];
    const memo = boundedMemo((s) => (calls.push(s), s === 'none' ? null : s.length), 10);
    expect([memo('ab'), memo('ab'), memo('none'), memo('none')]).toEqual([2, 2, null, null]);
    expect(calls).toEqual(['ab', 'none']);
  });

  it('when full, starts again rather than growing', () => {
    const calls: string[] = [];
    const memo = boundedMemo((s) => (calls.push(s), s), 2);
    for (const s of ['a', 'b', 'c', 'a']) memo(s);
    // 'c' found the memo full (a, b) and emptied it; 'a' was then computed again.
    expect(calls).toEqual(['a', 'b', 'c', 'a']);
  });
});
