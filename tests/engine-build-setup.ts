/**
 * Vitest global setup of both projects: builds the WebAssembly kernel and the engine worker
 * bundles when their sources are newer than the build (`npm run build` builds them too), so the
 * kernel-equality tests run the real kernel rather than the TypeScript fallback, and engine
 * threads start from the bundles instead of loading their sources through tsx (about half a
 * second of CPU per thread).
 */
import { ensureSimdKernelBuilt } from '../scripts/build-wasm';
import { ensureEngineWorkersBuilt } from '../scripts/build-engine-workers';

export default async function setup() {
  await ensureSimdKernelBuilt();
  await ensureEngineWorkersBuilt();
}
