/**
 * Loads the compiled WebAssembly SIMD kernel (built by `npm run build:wasm` from assembly/)
 * once per thread and tells whether it can run here. It cannot when the file was not built,
 * when the runtime's WebAssembly lacks SIMD (the module then fails to compile) or shared
 * memory: callers fall back to the TypeScript kernel with the reason as a note, never a crash.
 */
import fs from 'node:fs';
import { fileURLToPath } from 'node:url';

export const SIMD_KERNEL_FILE = fileURLToPath(new URL('./build/mixed-logit.wasm', import.meta.url));

export type SimdKernelModule =
  { module: WebAssembly.Module; reason: null } | { module: null; reason: string };

/**
 * Smallest module using one SIMD instruction (v128.const, i32x4.extract_lane):
 * (module (func (result i32) v128.const i64x2 0 0 i32x4.extract_lane 0)).
 */
const SIMD_PROBE = Uint8Array.from([
  0x00, 0x61, 0x73, 0x6d, 0x01, 0x00, 0x00, 0x00, 0x01, 0x05, 0x01, 0x60, 0x00, 0x01, 0x7f, 0x03,
  0x02, 0x01, 0x00, 0x0a, 0x19, 0x01, 0x17, 0x00, 0xfd, 0x0c, 0x00, 0x00, 0x00, 0x00, 0x00, 0x00,
  0x00, 0x00, 0x00, 0x00, 0x00, 0x00, 0x00, 0x00, 0x00, 0x00, 0xfd, 0x1b, 0x00, 0x0b,
]);

/** Whether this runtime's WebAssembly validates SIMD instructions. */
export function detectWasmSimd(): boolean {
  try {
    return typeof WebAssembly === 'object' && WebAssembly.validate(SIMD_PROBE);
  } catch {
    return false;
  }
}

let cached: SimdKernelModule | null = null;

/** The compiled kernel module, or null with the reason it cannot be used. */
export function loadSimdKernelModule(): SimdKernelModule {
  // The probe is cheap and asked every time; the compiled file is kept for the thread's life.
  if (!detectWasmSimd())
    return { module: null, reason: 'this runtime’s WebAssembly has no SIMD support' };
  cached ??= compile();
  return cached;
}

function compile(): SimdKernelModule {
  let bytes: Buffer;
  try {
    bytes = fs.readFileSync(SIMD_KERNEL_FILE);
  } catch {
    return {
      module: null,
      reason: `the WebAssembly kernel is not built (${SIMD_KERNEL_FILE}; run npm run build:wasm)`,
    };
  }
  try {
    return { module: new WebAssembly.Module(new Uint8Array(bytes)), reason: null };
  } catch (err) {
    return {
      module: null,
      reason: `the WebAssembly kernel does not compile here: ${(err as Error).message}`,
    };
  }
}
