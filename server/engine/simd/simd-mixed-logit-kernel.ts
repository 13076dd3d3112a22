/**
 * The WebAssembly SIMD kernel (assembly/mixed-logit.ts) behind the same MixedLogitKernel
 * interface as the TypeScript reference kernel: θ goes into the slice's input area of the
 * shared arena, the kernel runs, and the gradient (and scores) are read back from it.
 */
import type { MixedLogitKernel } from '../estimation/mixed-logit-kernel';
import type { ArenaPlan } from './arena-plan';

interface KernelExports {
  evaluate(ctx: number, withScores: number): number;
  simulate(ctx: number, n: number): number;
}

/** Instantiates the kernel over slice `sliceIndex` of an arena held in `memory`. */
export function createSimdMixedLogitKernel(
  module: WebAssembly.Module,
  memory: WebAssembly.Memory,
  plan: ArenaPlan,
  sliceIndex: number,
): MixedLogitKernel {
  const instance = new WebAssembly.Instance(module, { env: { memory } });
  const kernel = instance.exports as unknown as KernelExports;
  const slice = plan.slices[sliceIndex];
  const { P, K } = plan.dims;
  const R = plan.dims.draws;
  const { stride } = plan;
  const buffer = memory.buffer;
  const theta = new Float64Array(buffer, slice.theta, P);
  const grad = new Float64Array(buffer, slice.grad, P);
  const scores = new Float64Array(buffer, slice.scores, slice.count * P);
  const B = new Float64Array(buffer, slice.B, K * stride);
  const w = new Float64Array(buffer, slice.w, stride);
  const assertTheta = (x: Float64Array) => {
    if (x.length !== P) throw new RangeError(`theta must have ${P} values`);
  };
  return {
    parameterCount: P,
    respondentCount: slice.count,
    evaluate(x, g, s = null) {
      assertTheta(x);
      theta.set(x);
      const ll = kernel.evaluate(slice.header, s ? 1 : 0);
      g.set(grad);
      if (s) s.set(scores);
      return ll;
    },
    simulateRespondent(n, x, betas, weights) {
      assertTheta(x);
      theta.set(x);
      const lnL = kernel.simulate(slice.header, n);
      for (let k = 0; k < K; k++) betas.set(B.subarray(k * stride, k * stride + R), k * R);
      weights.set(w.subarray(0, R));
      return lnL;
    },
  };
}
