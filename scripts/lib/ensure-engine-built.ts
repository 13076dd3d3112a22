/**
 * What an engine benchmark needs before it starts: the WebAssembly kernel and the engine worker
 * bundles, each rebuilt only when its sources are newer than the build.
 */
import { ensureSimdKernelBuilt } from '../build-wasm';
import { ensureEngineWorkersBuilt } from '../build-engine-workers';

export async function ensureEngineBuilt(): Promise<void> {
  await ensureSimdKernelBuilt();
  await ensureEngineWorkersBuilt();
}
