/**
 * Memory plan of a kernel arena: one shared memory holding the choice data once, the model
 * layout, and per slice (one worker thread's respondents) its header, standard variates,
 * inputs, outputs and workspaces. Both kernels read the same data and variates from it; the
 * WebAssembly kernel also keeps its workspaces there. The plan is plain arithmetic, so the
 * same function tells how much memory a specification needs before anything is allocated.
 */
import { DRAW_BLOCK, HEADER_WORDS } from './arena-header';

/** The first 64 KiB page is left to the WebAssembly module's own static data and stack. */
export const ARENA_BASE = 65536;
/** A WebAssembly 32-bit memory addresses at most 4 GiB. */
export const ARENA_MAX_BYTES = 65536 * 65536;

export interface ArenaDimensions {
  /** Respondents N, tasks T and difference rows in the whole data. */
  respondents: number;
  tasks: number;
  rows: number;
  /** Data columns of each difference row. */
  columns: number;
  K: number;
  D: number;
  P: number;
  blockSize: number;
  /** Draws per respondent R. */
  draws: number;
}

export interface SliceRequest {
  first: number;
  count: number;
  /** Most difference rows of one respondent of the slice. */
  maxRows: number;
  /** Respondents whose variates the slice holds at once (count, or a chunk for profiles). */
  variateRespondents: number;
}

export interface SlicePlan extends SliceRequest {
  /** Byte address of the slice's header; the other addresses are written into it. */
  header: number;
  theta: number;
  grad: number;
  scores: number;
  variates: number;
  B: number;
  G: number;
  V: number;
  lp: number;
  w: number;
  wg: number;
  gn: number;
  rowNnz: number;
  rowCoef: number;
  rowOff: number;
  colNnz: number;
  colCoef: number;
  colOff: number;
}

export interface ArenaPlan {
  dims: ArenaDimensions;
  stride: number;
  taskStart: number;
  diffStart: number;
  diffs: number;
  expTable: number;
  column: number;
  dist: number;
  dimension: number;
  meanIndex: number;
  spreadIndex: number;
  block: number;
  cholIndex: number;
  slices: SlicePlan[];
  /** Total bytes of the arena. */
  bytes: number;
}

/** Lays out the arena; addresses are 16-byte aligned (whole f64x2 loads). */
export function planArena(dims: ArenaDimensions, slices: readonly SliceRequest[]): ArenaPlan {
  let top = ARENA_BASE;
  const take = (bytes: number): number => {
    const at = top;
    top += Math.ceil(Math.max(bytes, 0) / 16) * 16;
    return at;
  };
  const { K, D, P, blockSize } = dims;
  const stride = Math.ceil(dims.draws / DRAW_BLOCK) * DRAW_BLOCK;
  const shared = {
    taskStart: take(4 * (dims.respondents + 1)),
    diffStart: take(4 * (dims.tasks + 1)),
    diffs: take(8 * dims.rows * dims.columns),
    expTable: take(8 * 256),
    column: take(4 * K),
    dist: take(4 * K),
    dimension: take(4 * K),
    meanIndex: take(4 * K),
    spreadIndex: take(4 * K),
    block: take(4 * blockSize),
    cholIndex: take(4 * blockSize * blockSize),
  };
  const planned = slices.map((s): SlicePlan => ({
    ...s,
    header: take(4 * HEADER_WORDS),
    theta: take(8 * P),
    grad: take(8 * P),
    gn: take(8 * P),
    scores: take(8 * s.count * P),
    variates: take(4 * s.variateRespondents * D * stride),
    B: take(8 * K * stride),
    G: take(8 * K * stride),
    V: take(8 * s.maxRows * DRAW_BLOCK),
    lp: take(8 * stride),
    w: take(8 * stride),
    wg: take(8 * stride),
    rowNnz: take(4 * s.maxRows),
    rowCoef: take(8 * s.maxRows * K),
    rowOff: take(4 * s.maxRows * K),
    colNnz: take(4 * K),
    colCoef: take(8 * K * s.maxRows),
    colOff: take(4 * K * s.maxRows),
  }));
  return { dims, stride, ...shared, slices: planned, bytes: top };
}
