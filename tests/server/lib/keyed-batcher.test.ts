/**
 * The keyed batcher (server/lib/keyed-batcher.ts): what is submitted in one turn of the event
 * loop goes out together at its end while a slot is free, items gather while batches are in
 * flight, never share a batch (or a moment in flight) with an item
 * of the same key, keep their order, and get their own result or error when a batch fails.
 */
import { describe, expect, it } from 'vitest';
import { createKeyedBatcher } from '../../../server/lib/keyed-batcher';

type Item = { key: string; n: number };

/** A batcher whose runs wait until released, recording every batch they were given. */
function recordingBatcher(opts: {
  maxBatch?: number;
  maxInFlight?: number;
  failBatches?: boolean;
}) {
  const batches: number[][] = [];
  const gates: (() => void)[] = [];
  const gate = () => new Promise<void>((resolve) => gates.push(resolve));
  const batcher = createKeyedBatcher<Item, string>({
    maxBatch: opts.maxBatch ?? 64,
    maxInFlight: opts.maxInFlight ?? 2,
    keyOf: (i) => i.key,
    runOne: async (i) => {
      batches.push([i.n]);
      await gate();
      if (i.n < 0) throw new Error(`item ${i.n} fails`);
      return `one ${i.n}`;
    },
    runBatch: async (items) => {
      batches.push(items.map((i) => i.n));
      await gate();
      if (opts.failBatches) throw new Error('the batch fails');
      return items.map((i) => `batch ${i.n}`);
    },
  });
  /** Releases every run waiting now, then lets the promise callbacks run. */
  const release = async () => {
    for (const open of gates.splice(0)) open();
    for (let i = 0; i < 10; i++) await Promise.resolve();
  };
  return { batcher, batches, release };
}

const item = (n: number, key = `k${n}`): Item => ({ key, n });
/** The end of this turn of the event loop, when the batcher sends what was submitted in it. */
const turn = () => new Promise<void>((resolve) => setImmediate(resolve));

describe('createKeyedBatcher', () => {
  it('sends what is submitted in one turn together at its end, and what waits for a slot in the next batch', async () => {
    const { batcher, batches, release } = recordingBatcher({});
    const results = [0, 1, 2].map((n) => batcher.submit(item(n)));
    expect(batches).toEqual([]);
    await turn();
    expect(batches).toEqual([[0, 1, 2]]);
    results.push(batcher.submit(item(3)));
    await turn();
    expect(batches).toEqual([[0, 1, 2], [3]]);
    // Both slots busy: these wait, then leave together.
    results.push(...[4, 5, 6].map((n) => batcher.submit(item(n))));
    await turn();
    expect(batcher.waiting).toBe(3);
    await release();
    expect(batches).toEqual([[0, 1, 2], [3], [4, 5, 6]]);
    await release();
    expect(await Promise.all(results)).toEqual([
      'batch 0',
      'batch 1',
      'batch 2',
      'one 3',
      'batch 4',
      'batch 5',
      'batch 6',
    ]);
    expect(batcher.inFlight).toBe(0);
    expect(batcher.gathered).toBe(6);
  });

  it('takes at most maxBatch items, oldest first', async () => {
    const { batcher, batches, release } = recordingBatcher({ maxBatch: 3, maxInFlight: 1 });
    const all = Array.from({ length: 8 }, (_, n) => batcher.submit(item(n)));
    await turn();
    for (let i = 0; i < 3; i++) await release();
    expect(batches).toEqual([
      [0, 1, 2],
      [3, 4, 5],
      [6, 7],
    ]);
    expect(await Promise.all(all)).toHaveLength(8);
  });

  it('never puts two items of one key in a batch, nor beside a batch in flight with that key', async () => {
    const { batcher, batches, release } = recordingBatcher({ maxInFlight: 2 });
    const all = [batcher.submit(item(0, 'a'))];
    await turn();
    all.push(
      batcher.submit(item(1, 'a')), // key a is in flight: waits, although a slot is free
      batcher.submit(item(2, 'b')),
      batcher.submit(item(3, 'a')),
      batcher.submit(item(4, 'c')),
    );
    await turn();
    expect(batches).toEqual([[0], [2, 4]]);
    await release();
    // a's first item is done: its second goes, its third waits for that one.
    expect(batches).toEqual([[0], [2, 4], [1]]);
    await release();
    expect(batches).toEqual([[0], [2, 4], [1], [3]]);
    await release();
    expect(await Promise.all(all)).toEqual(['one 0', 'one 1', 'batch 2', 'one 3', 'batch 4']);
  });

  it('runs every item of a failed batch on its own, so each gets its own result or error', async () => {
    const { batcher, batches, release } = recordingBatcher({ maxInFlight: 1, failBatches: true });
    const first = batcher.submit(item(0));
    await turn();
    const ok = batcher.submit(item(1));
    const bad = batcher.submit(item(-2));
    await turn();
    await release(); // item 0 alone; then the batch [1, -2] starts
    await release(); // the batch fails; each item runs on its own
    await release();
    expect(batches).toEqual([[0], [1, -2], [1], [-2]]);
    expect(await first).toBe('one 0');
    expect(await ok).toBe('one 1');
    await expect(bad).rejects.toThrow('item -2 fails');
  });
});
