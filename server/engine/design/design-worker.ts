/**
 * Piscina worker entry for design jobs: validates the message shape, runs the pure
 * generateDesign (which validates definition and spec itself), posts progress on the task's
 * port, and returns a tagged result so DesignError codes survive the thread boundary.
 * Cancellation: the caller aborts piscina's `run` (its `signal` option), which ends the
 * thread; the engine's own AbortSignal is for in-process use.
 */
import { MessagePort } from 'node:worker_threads';
import { z } from 'zod';
import { DesignError } from './design-errors';
import type { DesignProgressMessage, DesignWorkerResult } from './design-worker-messages';
import { generateDesign } from './generate-design';
import { compareDesigns } from './diagnostics/compare-designs';
import { designSchema } from '../../../shared/schemas/design';
import { studyDefinitionSchema } from '../../../shared/schemas/study-definition';
import { lowerThreadPriority } from '../parallel/thread-priority';
import { waitWhileBusy } from '../parallel/fieldwork-yield';

lowerThreadPriority();

const taskSchema = z.object({
  definition: z.unknown(),
  spec: z.unknown(),
  compareWith: designSchema.optional(),
  fieldworkBusy: z.instanceof(Int32Array).optional(),
  port: z.instanceof(MessagePort).optional(),
});

export function runDesignTask(message: unknown): DesignWorkerResult {
  const parsed = taskSchema.safeParse(message);
  if (!parsed.success)
    return { ok: false, error: { code: 'invalid_spec', message: 'Malformed design job message' } };
  const { definition, spec, compareWith, fieldworkBusy, port } = parsed.data;
  try {
    const result = generateDesign(definition, spec, {
      onProgress: (progress) => {
        // Respondents first (parallel/fieldwork-yield.ts): the search waits between passes.
        if (fieldworkBusy) waitWhileBusy(fieldworkBusy);
        port?.postMessage({ type: 'progress', progress } satisfies DesignProgressMessage);
      },
    });
    if (!compareWith) return { ok: true, result };
    // A current design that no longer fits the attributes cannot be scored: no comparison.
    let comparison;
    try {
      comparison = compareDesigns(
        studyDefinitionSchema.parse(definition),
        compareWith,
        result.diagnostics,
        result.spec,
      );
    } catch {
      comparison = undefined;
    }
    return { ok: true, result, comparison };
  } catch (error) {
    if (error instanceof DesignError)
      return {
        ok: false,
        error: { code: error.code, message: error.message, fields: error.fields },
      };
    throw error;
  } finally {
    port?.close();
  }
}

// Piscina loads TypeScript workers through tsx only via the default export: its `name`
// option fails with ERR_UNKNOWN_FILE_EXTENSION under `--import tsx` (checked with piscina 5.3).
export default runDesignTask;
