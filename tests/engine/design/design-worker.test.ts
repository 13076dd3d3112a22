/**
 * The piscina design worker runs the engine in a thread (from its prebuilt bundle), streams
 * progress, returns DesignError codes as data, and can be cancelled.
 */
import { afterAll, describe, expect, it } from 'vitest';
import {
  createDesignPool,
  runDesignInWorker,
} from '../../../server/engine/design/run-design-in-worker';
import { generateDesign } from '../../../server/engine/design/generate-design';
import type { DesignProgress } from '../../../server/engine/design/generate-design';
import { makeSymmetricDefinition } from './design-fixtures';
import { holdBusy } from '../../support/hold-busy';

describe('design worker', () => {
  const pool = createDesignPool({ maxThreads: 1 });
  afterAll(async () => {
    await pool.destroy();
  });

  it('returns the same design as the in-process engine and reports progress', async () => {
    const definition = makeSymmetricDefinition([3, 3, 2], 2);
    const spec = { method: 'd_efficient', tasks: 12, blocks: 2, starts: 2, seed: 3 };
    const progress: DesignProgress[] = [];
    const out = await runDesignInWorker(
      pool,
      { definition, spec },
      { onProgress: (p) => progress.push(p) },
    );
    expect(out.ok).toBe(true);
    if (!out.ok) return;
    expect(out.result.design).toEqual(generateDesign(definition, spec).design);
    // Progress messages may trail the result by a tick.
    await new Promise((resolve) => setTimeout(resolve, 50));
    expect(progress.some((p) => p.phase === 'searching')).toBe(true);
  });

  it('waits at its passes while fieldwork is busy, and returns the same design', async () => {
    const definition = makeSymmetricDefinition([3, 3, 2], 2);
    const spec = { method: 'd_efficient', tasks: 12, blocks: 2, starts: 2, seed: 3 };
    const started = performance.now();
    const plain = await runDesignInWorker(pool, { definition, spec });
    // Held longer than the whole job takes unheld: ending before the flag turns calm would
    // mean the search never waited.
    const { fieldworkBusy, calmAt } = holdBusy(Math.max(300, 2 * (performance.now() - started)));
    const held = await runDesignInWorker(pool, { definition, spec, fieldworkBusy });
    expect(performance.now()).toBeGreaterThanOrEqual(await calmAt);
    expect(held).toEqual(plain);
  });

  it('returns a DesignError as data', async () => {
    const out = await runDesignInWorker(pool, {
      definition: makeSymmetricDefinition([3, 3], 2),
      spec: { method: 'random' },
    });
    expect(out).toMatchObject({
      ok: false,
      error: { code: 'invalid_spec', fields: { tasks: expect.any(String) } },
    });
  });

  it('rejects when the job is aborted', async () => {
    const controller = new AbortController();
    const job = runDesignInWorker(
      pool,
      {
        definition: makeSymmetricDefinition([4, 4, 4, 4, 4], 3),
        spec: { method: 'd_efficient', tasks: 40, starts: 50, priors: { kind: 'zero' } },
      },
      { signal: controller.signal, onProgress: () => controller.abort() },
    );
    await expect(job).rejects.toThrow(/abort/i);
  });
});
