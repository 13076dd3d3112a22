/**
 * The web process's fieldwork flag (server/lib/fieldwork-busy.ts): busy at once when a sample
 * of its event-loop utilisation reaches the threshold, calm only after CALM_MS below it; and an
 * engine thread's wait on the flag (server/engine/parallel/fieldwork-yield.ts).
 */
import { describe, expect, it } from 'vitest';
import { Worker } from 'node:worker_threads';
import {
  CALM_MS,
  nextBusyState,
  SAMPLE_MS,
  startFieldworkBusySignal,
  type BusyState,
} from '../../../server/lib/fieldwork-busy';
import {
  BUSY,
  CALM,
  createBusyFlag,
  waitWhileBusy,
} from '../../../server/engine/parallel/fieldwork-yield';

const options = { threshold: 0.2 };
const calm: BusyState = { busy: false, calmSince: null };

describe('nextBusyState', () => {
  it('turns busy at the first sample at or above the threshold', () => {
    expect(nextBusyState(calm, 0.19, 0, options)).toEqual(calm);
    expect(nextBusyState(calm, 0.2, 0, options)).toEqual({ busy: true, calmSince: null });
  });

  it('stays busy through a lull shorter than CALM_MS, then turns calm', () => {
    let s = nextBusyState(calm, 0.9, 0, options);
    s = nextBusyState(s, 0.05, 100, options);
    expect(s).toEqual({ busy: true, calmSince: 100 });
    s = nextBusyState(s, 0.05, 100 + CALM_MS - 1, options);
    expect(s.busy).toBe(true);
    // A busy sample in the lull starts the count again.
    s = nextBusyState(s, 0.5, 100 + CALM_MS, options);
    expect(s).toEqual({ busy: true, calmSince: null });
    s = nextBusyState(s, 0.05, 2_000, options);
    s = nextBusyState(s, 0.05, 2_000 + CALM_MS, options);
    expect(s).toEqual(calm);
  });
});

describe('startFieldworkBusySignal', () => {
  it('sets the flag while this thread is kept busy, and leaves it calm when stopped', async () => {
    const signal = startFieldworkBusySignal(options);
    try {
      expect(Atomics.load(signal.flag, 0)).toBe(CALM);
      // Three samples' worth of work without a turn of the event loop: utilisation near 1.
      const until = performance.now() + 3 * SAMPLE_MS;
      while (performance.now() < until);
      await new Promise((resolve) => setTimeout(resolve, 2 * SAMPLE_MS));
      expect(Atomics.load(signal.flag, 0)).toBe(BUSY);
    } finally {
      signal.stop();
    }
    expect(Atomics.load(signal.flag, 0)).toBe(CALM);
  });
});

describe('waitWhileBusy', () => {
  it('returns at once while calm', () => {
    expect(waitWhileBusy(createBusyFlag())).toBe(0);
  });

  it('blocks until another thread turns the flag calm', async () => {
    const flag = createBusyFlag();
    Atomics.store(flag, 0, BUSY);
    // The other side, as the web process would: calm after a while, with a notify.
    const other = new Worker(
      `const { workerData } = require('node:worker_threads');
       Atomics.wait(new Int32Array(new SharedArrayBuffer(4)), 0, 0, 150);
       Atomics.store(workerData, 0, ${CALM});
       Atomics.notify(workerData, 0);`,
      { eval: true, workerData: flag },
    );
    try {
      const waited = waitWhileBusy(flag, 5_000);
      expect(Atomics.load(flag, 0)).toBe(CALM);
      expect(waited).toBeGreaterThan(0);
    } finally {
      await other.terminate();
    }
  });
});
