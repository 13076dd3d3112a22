/**
 * Vitest global setup of both projects: builds the WebAssembly kernel when its sources are newer
 * than the build (`npm run build` builds it too), so the kernel-equality tests run the real
 * kernel rather than the TypeScript fallback.
 */
import { ensureSimdKernelBuilt } from '../scripts/build-wasm';

export default async function setup() {
  await ensureSimdKernelBuilt();
}
