/**
 * The inner kernel of the HB respondent layer: for respondent n, the utilities after a change δ of
 * its coefficients, u = v_n + D_n δ (the random or the fixed columns' block of
 * respondent-design.ts), and ln P(y_n | u) = −Σ_t ln(1 + Σ_{i∈t} e^{u_i}) (Train 2009, eq. 3.6).
 * Two implementations with the same arithmetic, so the chain is the same draw for draw whichever
 * runs: the WebAssembly SIMD kernel (simd/assembly/hb-respondent.ts) over one memory holding the
 * design blocks and utilities, or the TypeScript loops (shiftUtilities, computeLoglikOfUtilities).
 * The caller reads and writes the arrays below (they are views into the WebAssembly memory when
 * that kernel runs) and calls shiftedLoglik; nothing is allocated per call.
 */
import type { ChoiceData } from '../estimation/choice-data';
import { EXP_TABLE, expTang } from '../linalg/exp-stream';
import { loadSimdKernelModule } from '../simd/simd-kernel-module';
import type { RespondentDesign } from './respondent-design';
import { shiftUtilities } from './respondent-design';

export type RespondentKernelPreference = 'auto' | 'typescript';

export interface RespondentShiftKernel {
  kind: 'simd' | 'typescript';
  /** The design blocks (copies of `design`'s). */
  random: Float64Array;
  fixed: Float64Array;
  /** Current utilities of every row; utilities with a fixed-coefficient candidate. */
  v: Float64Array;
  vFixed: Float64Array;
  /** The proposal's utilities of the respondent last shifted with `fixed` false (from 0). */
  vNew: Float64Array;
  /** δ: the change of the random (or fixed) coefficients. */
  delta: Float64Array;
  /** After shiftedLoglik: e^{u_i} of the respondent's rows (from 0) and each task's denominator. */
  exps: Float64Array;
  denominators: Float64Array;
  /**
   * u = v_n + D_n δ into vNew[0..R) (random columns) or into vFixed at the respondent's rows
   * (fixed columns); returns ln P(y_n | u).
   */
  shiftedLoglik(n: number, fixed: boolean): number;
}

/** Denominators whose product passes this move to the log scale (as computeLoglikOfUtilities). */
const FLUSH = 1e250;

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
}

export function createRespondentShiftKernel(
  data: ChoiceData,
  design: RespondentDesign,
  Kr: number,
  Kf: number,
  preference: RespondentKernelPreference = 'auto',
): RespondentShiftKernel {
  const module = preference === 'auto' ? loadSimdKernelModule().module : null;
  if (module) {
    try {
      return createSimdKernel(module, { data, design, Kr, Kf });
    } catch {
      // No shared WebAssembly memory here (or not this large): the TypeScript kernel, same chain.
    }
  }
  return createTypeScriptKernel({ data, design, Kr, Kf });
}

/** What both kernels are built from: the data, their design blocks and the column counts. */
interface KernelInput {
  data: ChoiceData;
  design: RespondentDesign;
  Kr: number;
  Kf: number;
}

function createTypeScriptKernel({ data, design, Kr, Kf }: KernelInput): RespondentShiftKernel {
  const { rowStart, maxRows } = design;
  const { diffStart, taskStart } = data;
  const rows = rowStart[rowStart.length - 1];
  const v = new Float64Array(rows);
  const vNew = new Float64Array(maxRows);
  const vFixed = Kf > 0 ? new Float64Array(rows) : v;
  const delta = new Float64Array(Math.max(Kr, Kf));
  const exps = new Float64Array(maxRows);
  const denominators = new Float64Array(getMaxTasks(taskStart));
  return {
    kind: 'typescript',
    random: design.random,
    fixed: design.fixed,
    v,
    vFixed,
    vNew,
    delta,
    exps,
    denominators,
    shiftedLoglik(n, fixed) {
      const first = rowStart[n];
      const R = rowStart[n + 1] - first;
      const [block, C, u, offset] = fixed
        ? [design.fixed, Kf, vFixed, first]
        : [design.random, Kr, vNew, 0];
      shiftUtilities(v, first, block, C * first, delta, C, R, u, offset);
      // The arithmetic of computeLoglikOfUtilities (respondent-logit-loglik.ts), keeping the
      // exponentials and denominators.
      const firstTask = taskStart[n];
      const T = taskStart[n + 1] - firstTask;
      let i = 0;
      for (let t = 0; t < T; t++) {
        let denominator = 1;
        for (const end = diffStart[firstTask + t + 1] - first; i < end; i++)
          denominator += exps[i] = expTang(u[offset + i]);
        denominators[t] = denominator;
      }
      return sumLogDenominators(denominators, T);
    },
  };
}

function getMaxTasks(taskStart: Int32Array): number {
  let max = 1;
  for (let n = 0; n + 1 < taskStart.length; n++)
    max = Math.max(max, taskStart[n + 1] - taskStart[n]);
  return max;
}

/**
 * −Σ_t ln d_t as computeLoglikOfUtilities takes it: products of denominators, one Math.log per
 * 1e250 of product, so both kernels give the bits of the previous layer.
 */
function sumLogDenominators(den: Float64Array, T: number): number {
  let ll = 0;
  let product = 1;
  for (let t = 0; t < T; t++) {
    product *= den[t];
    if (product > FLUSH) {
      ll -= Math.log(product);
      product = 1;
    }
  }
  return ll - Math.log(product);
}

function createSimdKernel(
  module: WebAssembly.Module,
  { data, design, Kr, Kf }: KernelInput,
): RespondentShiftKernel {
  const { rowStart, maxRows } = design;
  const { diffStart, taskStart } = data;
  const N = rowStart.length - 1;
  const rows = rowStart[N];
  const tasks = taskStart[N];
  const maxTasks = getMaxTasks(taskStart);
  // One memory, doubles first (8-byte aligned), then the task ends.
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
    taskEnd: take(tasks, 4),
  };
  const pages = Math.max(1, Math.ceil(bytes / 65536));
  const memory = new WebAssembly.Memory({ initial: pages, maximum: pages, shared: true });
  const buffer = memory.buffer;
  const f64 = (offset: number, length: number) => new Float64Array(buffer, offset, length);
  f64(at.table, 256).set(EXP_TABLE);
  const random = f64(at.random, rows * Kr);
  random.set(design.random);
  const fixed = f64(at.fixed, rows * Kf);
  fixed.set(design.fixed);
  const taskEnd = new Int32Array(buffer, at.taskEnd, tasks);
  for (let n = 0; n < N; n++)
    for (let t = taskStart[n]; t < taskStart[n + 1]; t++)
      taskEnd[t] = diffStart[t + 1] - rowStart[n];
  const v = f64(at.v, rows);
  const den = f64(at.den, maxTasks);
  const vFixedAt = Kf > 0 ? at.vFixed : at.v;
  const kernel = new WebAssembly.Instance(module, { env: { memory } })
    .exports as unknown as HbKernelExports;
  return {
    kind: 'simd',
    random,
    fixed,
    v,
    vFixed: Kf > 0 ? f64(at.vFixed, rows) : v,
    vNew: f64(at.vNew, maxRows),
    delta: f64(at.delta, Math.max(Kr, Kf)),
    exps: f64(at.ex, maxRows),
    denominators: den,
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
