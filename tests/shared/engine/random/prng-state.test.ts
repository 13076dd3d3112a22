/**
 * The seeded generator's state words (shared/engine/random/prng.ts): saved and loaded again they
 * repeat the stream, and loaded into another generator they continue the first one's stream —
 * what the WebAssembly HB kernel relies on when it takes the chain's draws over for a sweep and
 * hands them back (checked end to end in tests/engine/hb/individual-step.test.ts). Property of
 * the implementation, no outside source.
 */
import { describe, expect, it } from 'vitest';
import { createPrng } from '../../../../shared/engine/random/prng';

const draw = (prng: ReturnType<typeof createPrng>, count: number) =>
  Array.from({ length: count }, () => prng.nextUint32());

describe('seeded generator state words', () => {
  it('repeat the stream when loaded back', () => {
    const prng = createPrng(11, 4);
    draw(prng, 5);
    const state = new Int32Array(4);
    prng.saveState(state);
    const first = draw(prng, 50);
    prng.loadState(state);
    expect(draw(prng, 50)).toEqual(first);
  });

  it('let another generator continue the stream where the first stopped', () => {
    const a = createPrng(11, 4);
    const b = createPrng(99, 1);
    draw(a, 7);
    const state = new Int32Array(4);
    a.saveState(state);
    b.loadState(state);
    expect(draw(b, 40)).toEqual(draw(a, 40));
    expect(b.nextDouble()).toBe(a.nextDouble());
  });
});
