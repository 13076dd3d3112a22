import { describe, expect, it } from 'vitest';
import { createShutdown } from '../../../server/lib/stop-on-signals';

describe('createShutdown', () => {
  it('runs the steps in order, each awaited, then exits 0', async () => {
    const order: string[] = [];
    const logged: unknown[] = [];
    const exits: number[] = [];
    const shutdown = createShutdown(
      { info: (obj: unknown, msg?: string) => void logged.push([obj, msg]) } as never,
      'shutting down',
      [
        () => void order.push('server'),
        async () => {
          await new Promise((r) => setTimeout(r, 10));
          order.push('jobs');
        },
        () => order.push('pool'),
      ],
      (code) => void exits.push(code),
    );
    await shutdown('SIGTERM');
    expect(order).toEqual(['server', 'jobs', 'pool']);
    expect(exits).toEqual([0]);
    expect(logged).toEqual([[{ signal: 'SIGTERM' }, 'shutting down']]);
  });

  it('ignores a second signal while stopping', async () => {
    let runs = 0;
    const exits: number[] = [];
    const shutdown = createShutdown({ info: () => {} } as never, 'stop', [() => runs++], (c) =>
      exits.push(c),
    );
    await Promise.all([shutdown('SIGINT'), shutdown('SIGTERM')]);
    expect(runs).toBe(1);
    expect(exits).toEqual([0]);
  });
});
