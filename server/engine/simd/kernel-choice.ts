/**
 * Which kernel evaluates the mixed logit: the WebAssembly SIMD kernel when it can run here,
 * else the TypeScript reference kernel, with a note saying why (logged by the caller).
 */
import { loadSimdKernelModule } from './simd-kernel-module';

/** 'auto' takes SIMD when available; 'simd' asks for it (falls back with a note if absent). */
export type KernelPreference = 'auto' | 'simd' | 'typescript';
export type KernelKind = 'simd' | 'typescript';
export const KERNEL_PREFERENCES: readonly KernelPreference[] = ['auto', 'simd', 'typescript'];

export interface KernelChoice {
  kind: KernelKind;
  /** Why SIMD was not used although it was wanted; null otherwise. */
  note: string | null;
}

export function describeFallback(reason: string): string {
  return `WebAssembly SIMD kernel not used: ${reason}; the TypeScript kernel evaluates the model instead`;
}

export function chooseKernel(preference: KernelPreference = 'auto'): KernelChoice {
  if (preference === 'typescript') return { kind: 'typescript', note: null };
  const loaded = loadSimdKernelModule();
  if (loaded.module) return { kind: 'simd', note: null };
  return { kind: 'typescript', note: describeFallback(loaded.reason) };
}
