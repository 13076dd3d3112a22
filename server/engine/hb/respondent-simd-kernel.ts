/**
 * The HB respondent layer on the WebAssembly SIMD kernel (simd/assembly/hb-respondent.ts), over
 * one shared memory holding the design blocks, the utilities and the sampler's state (α_n, β_n,
 * ln P(y_n | β_n)). Two entries: hbDenominators, a proposal's utilities, exponentials and task
 * denominators (the logarithm then taken here, as in the TypeScript kernel), for the fixed step
 * and the summary's simulated fit; and hbSweep, whole random-walk MH sweeps over respondents
 * with the draws (the chain generator's stream, continued from its state words), the proposal,
 * the logarithm (fdlibm's, the bits of Math.log) and the acceptance in the kernel. Both give the
 * TypeScript layer's chain bit for bit (tests/engine/hb/individual-step.test.ts).
 */
import { EXP_TABLE } from '../linalg/exp-stream';
import { HB_LOGNORMAL, HB_NEG_LOGNORMAL } from './check-hb-options';
import {
  getMaxTasks,
  sumLogDenominators,
  type KernelInput,
  type RespondentShiftKernel,
} from './respondent-shift-kernel';

interface HbKernelExports {
  hbDenominators(
    block: number,
    v: number,
    delta: number,
    C: number,
    R: number,
    u: number,
    ex: number,
    taskEnd: number,
    T: number,
    den: number,
    table: number,
  ): void;
  hbSweep(
    n0: number,
    n1: number,
    steps: number,
    Kr: number,
    rho: number,
    block: number,
    v: number,
    ll: number,
    alpha: number,
    beta: number,
    mu: number,
    L: number,
    prng: number,
    transform: number,
    rowStart: number,
    taskStart: number,
    taskEnd: number,
    scratch: number,
    delta: number,
    vNew: number,
    ex: number,
    den: number,
    table: number,
  ): number;
}

/** `sweep`: whether whole sweeps run in the kernel (else only the proposals' likelihoods). */
export function createSimdKernel(
  module: WebAssembly.Module,
  { data, design, Kr, Kf, transform }: KernelInput,
  sweep: boolean,
): RespondentShiftKernel {
  const { rowStart, maxRows } = design;
  const { diffStart, taskStart } = data;
  const N = rowStart.length - 1;
  const rows = rowStart[N];
  const tasks = taskStart[N];
  const maxTasks = getMaxTasks(taskStart);
  // One memory, doubles first (8-byte aligned), then the 32-bit integers.
  let bytes = 0;
  const take = (count: number, size = 8) => {
    const at = bytes;
    bytes += Math.ceil((count * size) / 16) * 16;
    return at;
  };
  const at = {
    table: take(256),
    random: take(rows * Kr),
    fixed: take(rows * Kf),
    v: take(rows),
    vFixed: take(Kf > 0 ? rows : 0),
    vNew: take(maxRows),
    ex: take(maxRows),
    delta: take(Math.max(Kr, Kf, 1)),
    den: take(maxTasks),
    alpha: take(N * Kr),
    beta: take(N * Kr),
    ll: take(N),
    mu: take(Kr),
    L: take(Kr * Kr),
    scratch: take(4 * Kr),
    taskEnd: take(tasks, 4),
    rowStart: take(N + 1, 4),
    taskStart: take(N + 1, 4),
    transform: take(Kr, 4),
    prng: take(4, 4),
  };
  const pages = Math.max(1, Math.ceil(bytes / 65536));
  const memory = new WebAssembly.Memory({ initial: pages, maximum: pages, shared: true });
  const buffer = memory.buffer;
  const f64 = (offset: number, length: number) => new Float64Array(buffer, offset, length);
  const i32 = (offset: number, length: number) => new Int32Array(buffer, offset, length);
  f64(at.table, 256).set(EXP_TABLE);
  const random = f64(at.random, rows * Kr);
  random.set(design.random);
  const fixed = f64(at.fixed, rows * Kf);
  fixed.set(design.fixed);
  const taskEnd = i32(at.taskEnd, tasks);
  for (let n = 0; n < N; n++)
    for (let t = taskStart[n]; t < taskStart[n + 1]; t++)
      taskEnd[t] = diffStart[t + 1] - rowStart[n];
  i32(at.rowStart, N + 1).set(rowStart);
  i32(at.taskStart, N + 1).set(taskStart.subarray(0, N + 1));
  // Transform codes of the kernel: 0 identity, 1 e^α, 2 −e^α (fixed coefficients are not here).
  i32(at.transform, Kr).set(
    Array.from(transform, (t) => (t === HB_LOGNORMAL ? 1 : t === HB_NEG_LOGNORMAL ? 2 : 0)),
  );
  const v = f64(at.v, rows);
  const den = f64(at.den, maxTasks);
  const mu = f64(at.mu, Kr);
  const L = f64(at.L, Kr * Kr);
  const prng = i32(at.prng, 4);
  const vFixedAt = Kf > 0 ? at.vFixed : at.v;
  const kernel = new WebAssembly.Instance(module, { env: { memory } })
    .exports as unknown as HbKernelExports;
  return {
    kind: sweep ? 'simd' : 'simd-likelihood',
    random,
    fixed,
    v,
    vFixed: Kf > 0 ? f64(at.vFixed, rows) : v,
    vNew: f64(at.vNew, maxRows),
    delta: f64(at.delta, Math.max(Kr, Kf)),
    exps: f64(at.ex, maxRows),
    denominators: den,
    alpha: f64(at.alpha, N * Kr),
    beta: f64(at.beta, N * Kr),
    ll: f64(at.ll, N),
    sweep: sweep
      ? (steps, muNow, lNow, rho, generator) => {
          mu.set(muNow.subarray(0, Kr));
          L.set(lNow.subarray(0, Kr * Kr));
          generator.saveState(prng);
          const moved = kernel.hbSweep(
            0,
            N,
            steps,
            Kr,
            rho,
            at.random,
            at.v,
            at.ll,
            at.alpha,
            at.beta,
            at.mu,
            at.L,
            at.prng,
            at.transform,
            at.rowStart,
            at.taskStart,
            at.taskEnd,
            at.scratch,
            at.delta,
            at.vNew,
            at.ex,
            at.den,
            at.table,
          );
          generator.loadState(prng);
          return moved;
        }
      : null,
    shiftedLoglik(n, isFixed) {
      const first = rowStart[n];
      const R = rowStart[n + 1] - first;
      const T = taskStart[n + 1] - taskStart[n];
      kernel.hbDenominators(
        isFixed ? at.fixed + 8 * Kf * first : at.random + 8 * Kr * first,
        at.v + 8 * first,
        at.delta,
        isFixed ? Kf : Kr,
        R,
        isFixed ? vFixedAt + 8 * first : at.vNew,
        at.ex,
        at.taskEnd + 4 * taskStart[n],
        T,
        at.den,
        at.table,
      );
      return sumLogDenominators(den, T);
    },
  };
}
