/**
 * Piscina pools whose worker files are TypeScript: a thread loads the worker's prebuilt bundle
 * when it is up to date (prebuilt-workers.ts), else the source through `--import <tsx loader>`
 * (resolved from this package's node_modules); both work whether the parent runs under tsx,
 * vitest or plain node. Plus the SharedArrayBuffer copies through which workers read choice
 * data without copying it per task.
 */
import { createRequire } from 'node:module';
import { pathToFileURL } from 'node:url';
import { Piscina } from 'piscina';
import { prebuiltWorkerFile } from './prebuilt-workers';
import type { ChoiceData } from '../estimation/choice-data';

/**
 * How a thread loads the TypeScript worker `filename`: its up-to-date prebuilt bundle, else the
 * source through the tsx loader (`prebuilt: false` forces the latter, for the side-by-side
 * benchmark). The execArgv is always given: by default threads inherit the parent's, which
 * under tsx holds `--import tsx` and would load the loader for a bundle too.
 */
export function workerEntry(
  filename: string,
  options: { prebuilt?: boolean } = {},
): { filename: string; execArgv: string[] } {
  const prebuilt = options.prebuilt === false ? null : prebuiltWorkerFile(filename);
  if (prebuilt) return { filename: prebuilt, execArgv: [] };
  const tsxLoader = pathToFileURL(createRequire(import.meta.url).resolve('tsx')).href;
  return { filename, execArgv: ['--import', tsxLoader] };
}

/** A piscina pool whose worker file (`options.filename`) is TypeScript. */
export function createTsPiscina(
  options: Omit<NonNullable<ConstructorParameters<typeof Piscina>[0]>, 'execArgv'> & {
    filename: string;
  },
): Piscina {
  return new Piscina({ ...options, ...workerEntry(options.filename) });
}

/** A pool of `threads` worker threads running the export `name` of `filename`. */
export function createTsWorkerPool(filename: string, name: string, threads: number): Piscina {
  return createTsPiscina({
    filename,
    name,
    minThreads: threads,
    maxThreads: threads,
    idleTimeout: 60_000,
  });
}

/** A copy of a typed array in a SharedArrayBuffer. */
export function toShared<T extends Int32Array | Float64Array>(array: T): T {
  const buffer = new SharedArrayBuffer(array.byteLength);
  const copy = (
    array instanceof Int32Array ? new Int32Array(buffer) : new Float64Array(buffer)
  ) as T;
  copy.set(array);
  return copy;
}

/** Choice data whose typed arrays live in SharedArrayBuffers (ids and names are copied). */
export function shareChoiceData(data: ChoiceData): ChoiceData {
  return {
    columns: [...data.columns],
    respondentIds: [...data.respondentIds],
    taskIds: [...data.taskIds],
    taskStart: toShared(data.taskStart),
    diffStart: toShared(data.diffStart),
    diffs: toShared(data.diffs),
    altCount: toShared(data.altCount),
  };
}
