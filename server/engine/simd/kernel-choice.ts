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

/** Models the WebAssembly kernel does not cover. */
export const WTP_SPACE_REASON = 'models in WTP space run on the TypeScript kernel only';

/** The kernel for a model (`wtpCost` ≥ 0: WTP space, which only the TypeScript kernel has). */
export function chooseKernel(
  preference: KernelPreference = 'auto',
  model: { wtpCost: number } = { wtpCost: -1 },
): KernelChoice {
  if (preference === 'typescript') return { kind: 'typescript', note: null };
  if (model.wtpCost >= 0) return { kind: 'typescript', note: describeFallback(WTP_SPACE_REASON) };
  const loaded = loadSimdKernelModule();
  if (loaded.module) return { kind: 'simd', note: null };
  return { kind: 'typescript', note: describeFallback(loaded.reason) };
}
