/**
 * A mixed-logit checkpoint (server/engine/estimation/mixed-logit-checkpoint.ts) as JSON for the
 * run_checkpoints table. Every number travels as the base64 of its float64 bytes, so what is read
 * back is bit for bit what was saved (JSON numbers cannot carry Infinity, and exact decimal
 * round trips are not needed then); the draws settings go along so that a checkpoint is used
 * only with the draws it was made with.
 */
import { z } from 'zod';
import type { BfgsResult, BfgsState } from '../engine/estimation/bfgs';
import type { MixedLogitCheckpoint } from '../engine/estimation/mixed-logit-checkpoint';

const CODEC_VERSION = 1;
const reasonSchema = z.enum(['converged', 'stalled', 'iteration_limit']);
const vectorSchema = z.string().regex(/^[A-Za-z0-9+/]*={0,2}$/);
const count = z.number().int().nonnegative();

const storedResultSchema = z.object({
  x: vectorSchema,
  grad: vectorSchema,
  /** f, gradientNorm, decrement, relativeChange. */
  scalars: vectorSchema,
  iterations: count,
  evaluations: count,
  reason: reasonSchema,
});

const storedStateSchema = z.object({
  x: vectorSchema,
  grad: vectorSchema,
  inverseHessian: vectorSchema,
  /** f, relativeChange. */
  scalars: vectorSchema,
  iterations: count,
  evaluations: count,
  stopped: reasonSchema.nullable(),
});

export const storedCheckpointSchema = z.object({
  version: z.literal(CODEC_VERSION),
  draws: z.unknown(),
  start: count,
  finished: z.array(storedResultSchema).max(1000),
  current: storedStateSchema.nullable(),
});
export type StoredCheckpoint = z.infer<typeof storedCheckpointSchema>;

function encodeVector(v: Float64Array | number[]): string {
  const a = Float64Array.from(v);
  return Buffer.from(a.buffer, a.byteOffset, a.byteLength).toString('base64');
}

function decodeVector(text: string): Float64Array {
  const bytes = Buffer.from(text, 'base64');
  if (bytes.byteLength % 8 !== 0)
    throw new Error('a saved vector is not a whole number of doubles');
  const out = new Float64Array(bytes.byteLength / 8);
  new Uint8Array(out.buffer).set(bytes);
  return out;
}

export function encodeCheckpoint(
  checkpoint: MixedLogitCheckpoint,
  draws: unknown,
): StoredCheckpoint {
  return {
    version: CODEC_VERSION,
    draws,
    start: checkpoint.start,
    finished: checkpoint.finished.map((r) => ({
      x: encodeVector(r.x),
      grad: encodeVector(r.grad),
      scalars: encodeVector([r.f, r.gradientNorm, r.decrement, r.relativeChange]),
      iterations: r.iterations,
      evaluations: r.evaluations,
      reason: r.reason,
    })),
    current: checkpoint.current && {
      x: encodeVector(checkpoint.current.x),
      grad: encodeVector(checkpoint.current.grad),
      inverseHessian: encodeVector(checkpoint.current.inverseHessian),
      scalars: encodeVector([checkpoint.current.f, checkpoint.current.relativeChange]),
      iterations: checkpoint.current.iterations,
      evaluations: checkpoint.current.evaluations,
      stopped: checkpoint.current.stopped,
    },
  };
}

/** The checkpoint stored as `json`; throws when it is malformed or of another version. */
export function decodeCheckpoint(json: unknown): {
  checkpoint: MixedLogitCheckpoint;
  draws: unknown;
} {
  const stored = storedCheckpointSchema.parse(json);
  const finished = stored.finished.map((r): BfgsResult => {
    const [f, gradientNorm, decrement, relativeChange] = decodeVector(r.scalars);
    return {
      x: decodeVector(r.x),
      f,
      grad: decodeVector(r.grad),
      iterations: r.iterations,
      evaluations: r.evaluations,
      converged: r.reason === 'converged',
      reason: r.reason,
      gradientNorm,
      decrement,
      relativeChange,
    };
  });
  const c = stored.current;
  const current: BfgsState | null = c && {
    x: decodeVector(c.x),
    f: decodeVector(c.scalars)[0],
    grad: decodeVector(c.grad),
    inverseHessian: decodeVector(c.inverseHessian),
    iterations: c.iterations,
    evaluations: c.evaluations,
    relativeChange: decodeVector(c.scalars)[1],
    stopped: c.stopped,
  };
  return { checkpoint: { start: stored.start, finished, current }, draws: stored.draws };
}
