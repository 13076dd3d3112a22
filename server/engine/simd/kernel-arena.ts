/**
 * Creates a kernel arena (see arena-plan.ts): one shared WebAssembly memory (its buffer is a
 * SharedArrayBuffer, so worker threads see it without copies) with the choice data, the
 * exponential's table, the model layout and a header per slice. When the runtime cannot
 * make a shared WebAssembly memory, a plain SharedArrayBuffer serves the TypeScript kernel.
 */
import { getMaxRespondentRows, type ChoiceData } from '../estimation/choice-data';
import type { MixedLogitLayout } from '../estimation/mixed-logit-layout';
import { EXP_TABLE } from '../linalg/exp-stream';
import * as H from './arena-header';
import { ARENA_MAX_BYTES, planArena, type ArenaPlan, type SliceRequest } from './arena-plan';

export interface KernelArena {
  /** Shared WebAssembly memory over `buffer`, or null when none could be made. */
  memory: WebAssembly.Memory | null;
  buffer: SharedArrayBuffer;
  plan: ArenaPlan;
}

/** The arena dimensions of a model on these data. */
export function getArenaDimensions(data: ChoiceData, layout: MixedLogitLayout, R: number) {
  return {
    respondents: data.taskStart.length - 1,
    tasks: data.diffStart.length - 1,
    rows: data.diffStart[data.diffStart.length - 1],
    columns: data.columns.length,
    K: layout.K,
    D: layout.D,
    P: layout.P,
    blockSize: layout.block.length,
    draws: R,
  };
}

function allocate(bytes: number): { memory: WebAssembly.Memory | null; buffer: SharedArrayBuffer } {
  const pages = Math.ceil(bytes / 65536);
  try {
    const memory = new WebAssembly.Memory({ initial: pages, maximum: pages, shared: true });
    return { memory, buffer: memory.buffer as unknown as SharedArrayBuffer };
  } catch {
    return { memory: null, buffer: new SharedArrayBuffer(pages * 65536) };
  }
}

/** Lays out and fills an arena for `slices` of `data` under `layout` with R draws. */
export function createKernelArena(
  data: ChoiceData,
  layout: MixedLogitLayout,
  R: number,
  slices: readonly Omit<SliceRequest, 'maxRows'>[],
): KernelArena {
  const plan = planArena(
    getArenaDimensions(data, layout, R),
    slices.map((s) => ({ ...s, maxRows: getMaxRespondentRows(data, s.first, s.count) })),
  );
  if (plan.bytes > ARENA_MAX_BYTES) {
    throw new RangeError(
      `the model needs ${Math.ceil(plan.bytes / 2 ** 20)} MiB of kernel memory, more than the 4096 MiB one kernel arena can address`,
    );
  }
  const { memory, buffer } = allocate(plan.bytes);
  const i32 = (at: number, values: ArrayLike<number>) =>
    new Int32Array(buffer, at, values.length).set(values);
  i32(plan.taskStart, data.taskStart);
  i32(plan.diffStart, data.diffStart);
  new Float64Array(buffer, plan.diffs, data.diffs.length).set(data.diffs);
  new Float64Array(buffer, plan.expTable, 256).set(EXP_TABLE);
  i32(plan.column, layout.column);
  i32(plan.dist, layout.dist);
  i32(plan.dimension, layout.dimension);
  i32(plan.meanIndex, layout.meanIndex);
  i32(plan.spreadIndex, layout.spreadIndex);
  i32(plan.block, layout.block);
  i32(plan.cholIndex, layout.cholIndex);
  for (const s of plan.slices) {
    const header = new Uint32Array(buffer, s.header, H.HEADER_WORDS);
    header[H.H_FIRST] = s.first;
    header[H.H_COUNT] = s.count;
    header[H.H_R] = R;
    header[H.H_STRIDE] = plan.stride;
    header[H.H_K] = layout.K;
    header[H.H_D] = layout.D;
    header[H.H_P] = layout.P;
    header[H.H_KD] = data.columns.length;
    header[H.H_BLOCK_SIZE] = layout.block.length;
    header[H.H_MAX_ROWS] = s.maxRows;
    header[H.H_TASK_START] = plan.taskStart;
    header[H.H_DIFF_START] = plan.diffStart;
    header[H.H_DIFFS] = plan.diffs;
    header[H.H_VARIATES] = s.variates;
    header[H.H_COLUMN] = plan.column;
    header[H.H_DIST] = plan.dist;
    header[H.H_DIMENSION] = plan.dimension;
    header[H.H_MEAN_INDEX] = plan.meanIndex;
    header[H.H_SPREAD_INDEX] = plan.spreadIndex;
    header[H.H_BLOCK] = plan.block;
    header[H.H_CHOL_INDEX] = plan.cholIndex;
    header[H.H_THETA] = s.theta;
    header[H.H_GRAD] = s.grad;
    header[H.H_SCORES] = s.scores;
    header[H.H_B] = s.B;
    header[H.H_G] = s.G;
    header[H.H_V] = s.V;
    header[H.H_LP] = s.lp;
    header[H.H_W] = s.w;
    header[H.H_GN] = s.gn;
    header[H.H_ROW_NNZ] = s.rowNnz;
    header[H.H_ROW_COEF] = s.rowCoef;
    header[H.H_ROW_OFF] = s.rowOff;
    header[H.H_COL_NNZ] = s.colNnz;
    header[H.H_COL_COEF] = s.colCoef;
    header[H.H_COL_OFF] = s.colOff;
    header[H.H_EXP_TABLE] = plan.expTable;
    header[H.H_WG] = s.wg;
  }
  return { memory, buffer, plan };
}

/** The arena's data as ChoiceData views (no copies), for the TypeScript kernel. */
export function getArenaChoiceData(
  buffer: SharedArrayBuffer,
  plan: ArenaPlan,
  columns: readonly string[],
): ChoiceData {
  const { respondents, tasks, rows } = plan.dims;
  return {
    columns,
    respondentIds: [],
    taskIds: [],
    taskStart: new Int32Array(buffer, plan.taskStart, respondents + 1),
    diffStart: new Int32Array(buffer, plan.diffStart, tasks + 1),
    diffs: new Float64Array(buffer, plan.diffs, rows * columns.length),
    altCount: new Int32Array(0),
  };
}
