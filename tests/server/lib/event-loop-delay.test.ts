/**
 * The event-loop delay a web process reports over its IPC channel
 * (server/lib/event-loop-delay.ts), with stand-in channels and one real child process.
 */
import { describe, expect, it } from 'vitest';
import { fork } from 'node:child_process';
import { EventEmitter } from 'node:events';
import path from 'node:path';
import {
  askEventLoopDelay,
  EVENT_LOOP_DELAY_REPLY,
  EVENT_LOOP_DELAY_REQUEST,
  relayEventLoopDelay,
  summariseDelay,
  worstDelay,
  type EventLoopDelay,
} from '../../../server/lib/event-loop-delay';

const delay = (p99Ms: number, processes = 1): EventLoopDelay => ({
  p50Ms: p99Ms / 2,
  p99Ms,
  maxMs: p99Ms * 2,
  processes,
});

/** A child that answers each question with `answer` (or stays silent when it is null). */
function fakeChild(answer: EventLoopDelay | null) {
  const c = new EventEmitter() as EventEmitter & { send: (m: unknown) => boolean };
  c.send = (m) => {
    if ((m as { type?: string }).type === EVENT_LOOP_DELAY_REQUEST && answer)
      queueMicrotask(() => c.emit('message', { type: EVENT_LOOP_DELAY_REPLY, delay: answer }));
    return true;
  };
  return c;
}

describe('summariseDelay', () => {
  it('when nothing was sampled yet, gives zeros', () => {
    expect(summariseDelay({ count: 0, percentile: () => NaN, max: 0 })).toEqual({
      p50Ms: 0,
      p99Ms: 0,
      maxMs: 0,
      processes: 1,
    });
  });

  it('turns the histogram nanoseconds into milliseconds', () => {
    const h = { count: 10, percentile: (p: number) => p * 1e6, max: 250e6 };
    expect(summariseDelay(h)).toEqual({ p50Ms: 50, p99Ms: 99, maxMs: 250, processes: 1 });
  });
});

describe('worstDelay', () => {
  it('keeps the worst of each figure and counts the processes', () => {
    expect(worstDelay([delay(10), delay(40, 2)])).toEqual({
      p50Ms: 20,
      p99Ms: 40,
      maxMs: 80,
      processes: 3,
    });
  });
});

describe('askEventLoopDelay', () => {
  it('resolves with the child’s answer', async () => {
    expect(await askEventLoopDelay(fakeChild(delay(12)))).toEqual(delay(12));
  });

  it('when the child does not answer, resolves with null', async () => {
    expect(await askEventLoopDelay(fakeChild(null), 50)).toBeNull();
  });
});

describe('relayEventLoopDelay', () => {
  it('answers its parent with the worst of its web processes, leaving out silent ones', async () => {
    const parent = new EventEmitter() as EventEmitter & { send?: (m: unknown) => boolean };
    const sent: unknown[] = [];
    parent.send = (m) => sent.push(m) > 0;
    const children = [fakeChild(delay(5)), fakeChild(delay(30)), fakeChild(null)];
    const stop = relayEventLoopDelay(() => children, parent as unknown as NodeJS.Process);
    parent.emit('message', { type: EVENT_LOOP_DELAY_REQUEST });
    await new Promise((r) => setTimeout(r, 2_500));
    stop();
    expect(sent).toEqual([
      { type: EVENT_LOOP_DELAY_REPLY, delay: worstDelay([delay(5), delay(30)]) },
    ]);
  }, 10_000);
});

describe('reportEventLoopDelay', () => {
  it('in a real child process, measures a blocked event loop', async () => {
    const child = fork(path.resolve(import.meta.dirname, '../../fixtures/event-loop-reporter.ts'), {
      execArgv: ['--import', 'tsx'],
      stdio: ['ignore', 'ignore', 'inherit', 'ipc'],
    });
    try {
      await new Promise((resolve) => child.once('message', resolve)); // its "blocked" notice
      const d = await askEventLoopDelay(child, 10_000);
      // The child blocked its loop for 200 ms once: the 10 ms timer fired at least that late.
      expect(d!.maxMs).toBeGreaterThanOrEqual(200);
      expect(d!.processes).toBe(1);
    } finally {
      child.kill();
    }
  }, 30_000);
});
