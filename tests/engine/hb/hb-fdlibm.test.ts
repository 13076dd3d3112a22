/**
 * The logarithm and exponential of the WebAssembly HB sweep (simd/assembly/hb-fdlibm.ts) follow
 * fdlibm 5.3's e_log.c and e_exp.c (Sun Microsystems 1993), of which V8's Math.log and Math.exp
 * are ports (from memory): the kernel's chain equals the TypeScript layer's only if they return
 * the same bits. Checked on seeded inputs over the ranges the sampler uses (ln of uniforms and of
 * products of logit denominators, e^α of lognormal coefficients) and on the special values, with
 * exact equality (Object.is), no tolerance.
 */
import { describe, expect, it } from 'vitest';
import { createPrng } from '../../../server/engine/draws/prng';
import { loadSimdKernelModule } from '../../../server/engine/simd/simd-kernel-module';

const { module, reason } = loadSimdKernelModule();

function instantiate(m: WebAssembly.Module) {
  const memory = new WebAssembly.Memory({ initial: 1, maximum: 1, shared: true });
  return new WebAssembly.Instance(m, { env: { memory } }).exports as unknown as {
    hbLog(x: number): number;
    hbExp(x: number): number;
  };
}

/** Seeded doubles: `count` values of f(U) for U uniform on (0, 1). */
function seeded(count: number, seed: number, f: (u: number) => number): number[] {
  const prng = createPrng(seed);
  return Array.from({ length: count }, () => f(prng.nextDouble()));
}

function mismatches(values: number[], ours: (x: number) => number, ref: (x: number) => number) {
  return values.filter((x) => !Object.is(ours(x), ref(x)));
}

describe.skipIf(!module)(
  `fdlibm log and exp of the HB kernel (${reason ?? 'SIMD available'})`,
  () => {
    const kernel = instantiate(module!);

    it('gives the bits of Math.log on uniforms, denominators products, wide ranges and special values', () => {
      const values = [
        ...seeded(200_000, 1, (u) => u),
        ...seeded(200_000, 2, (u) => 1 + u * 1e-5),
        ...seeded(200_000, 3, (u) => Math.exp(u * 600)),
        ...seeded(200_000, 4, (u) => 2 ** (u * 2090 - 1070)),
        ...[0, -0, -1, 1, 2, 0.5, Infinity, -Infinity, NaN, 5e-324, 1e250, 1.7976931348623157e308],
      ];
      expect(mismatches(values, kernel.hbLog, Math.log)).toEqual([]);
    });

    it('gives the bits of Math.exp over the whole range and at the special values', () => {
      const values = [
        ...seeded(200_000, 5, (u) => (u - 0.5) * 20),
        ...seeded(200_000, 6, (u) => (u - 0.5) * 1e-6),
        ...seeded(200_000, 7, (u) => u * 1460 - 750),
        ...[0, -0, 1, -1, 709.78, 709.79, -745.1, -745.2, Infinity, -Infinity, NaN, 1e-300],
      ];
      expect(mismatches(values, kernel.hbExp, Math.exp)).toEqual([]);
    });
  },
);
