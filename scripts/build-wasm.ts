/**
 * Builds the WebAssembly SIMD kernel (server/engine/simd/assembly → build/mixed-logit.wasm)
 * with the AssemblyScript compiler from node_modules; nothing is downloaded. `npm run build`
 * runs it; the test setup, start and the benchmarks call ensureSimdKernelBuilt() so a clean
 * clone gets the kernel before anything needs it.
 * Usage: npm run build:wasm [-- --if-stale]
 */
import { execFile } from 'node:child_process';
import fs from 'node:fs';
import { createRequire } from 'node:module';
import path from 'node:path';
import { fileURLToPath } from 'node:url';
import { promisify } from 'node:util';
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

/**
 * Compiles the kernel with the compiler's own command line, in a plain node process; throws
 * with the compiler's messages on failure. Not imported here: this script and the test setup
 * run under a TypeScript loader (tsx, vitest), which put the compiler's several megabytes of
 * JavaScript through its transform, and loading it took 7.8 s instead of 0.5 s (2026-12-04).
 */
export async function buildSimdKernel(): Promise<void> {
  const ascCli = path.join(
    path.dirname(createRequire(import.meta.url).resolve('assemblyscript/package.json')),
    'bin/asc.js',
  );
  try {
    await promisify(execFile)(
      process.execPath,
      [ascCli, '--config', path.join(SIMD_DIR, 'asconfig.json')],
      { cwd: SIMD_DIR, maxBuffer: 16 * 1024 * 1024 },
    );
  } catch (err) {
    const { stdout = '', stderr = '' } = err as { stdout?: string; stderr?: string };
    throw new Error(`WebAssembly kernel build failed:\n${stdout}${stderr || String(err)}`);
  }
  // The command line exits 0 on some mistakes (a configuration it cannot read prints its help).
  if (isSimdKernelStale()) throw new Error(`WebAssembly kernel build wrote no ${OUTPUT}`);
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
