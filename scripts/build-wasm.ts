/**
 * Builds the WebAssembly SIMD kernel (server/engine/simd/assembly → build/mixed-logit.wasm)
 * with the AssemblyScript compiler from node_modules; nothing is downloaded. `npm run build`
 * runs it; the test setup, start and the benchmarks call ensureSimdKernelBuilt() so a clean
 * clone gets the kernel before anything needs it.
 * Usage: npm run build:wasm [-- --if-stale]
 */
import fs from 'node:fs';
import path from 'node:path';
import { fileURLToPath } from 'node:url';
import { ensureBuilt, runBuildCommand, type BuildStep } from './lib/build-step';

const ROOT = path.resolve(path.dirname(fileURLToPath(import.meta.url)), '..');
const SIMD_DIR = path.join(ROOT, 'server/engine/simd');
const OUTPUT = path.join(SIMD_DIR, 'build/mixed-logit.wasm');
/** The kernel's sources: the AssemblyScript files and the portable files they import. */
const SOURCES = [
  path.join(SIMD_DIR, 'asconfig.json'),
  path.join(SIMD_DIR, 'arena-header.ts'),
  path.join(ROOT, 'server/engine/estimation/distribution-codes.ts'),
  path.join(ROOT, 'shared/engine/random/as241.ts'),
  ...fs
    .readdirSync(path.join(SIMD_DIR, 'assembly'))
    .filter((f) => f.endsWith('.ts'))
    .map((f) => path.join(SIMD_DIR, 'assembly', f)),
];

/** True when the built kernel is missing or older than one of its sources. */
export function isSimdKernelStale(): boolean {
  if (!fs.existsSync(OUTPUT)) return true;
  const built = fs.statSync(OUTPUT).mtimeMs;
  return SOURCES.some((f) => fs.statSync(f).mtimeMs > built);
}

/** Compiles the kernel; throws with the compiler's messages on failure. */
export async function buildSimdKernel(): Promise<void> {
  const asc = (await import('assemblyscript/asc')).default;
  let messages = '';
  const sink = { write: (chunk: string | Uint8Array) => void (messages += String(chunk)) };
  const result = await asc.main(['--config', path.join(SIMD_DIR, 'asconfig.json')], {
    stdout: sink,
    stderr: sink,
  });
  if (result.error) throw new Error(`WebAssembly kernel build failed:\n${messages}`);
}

const step: BuildStep = {
  name: 'WebAssembly kernel',
  output: OUTPUT,
  isStale: isSimdKernelStale,
  build: buildSimdKernel,
};

/** Builds when missing or stale; quick when up to date. */
export const ensureSimdKernelBuilt = (): Promise<void> => ensureBuilt(step);

await runBuildCommand(step, import.meta.url);
