/**
 * Word offsets (4-byte words) of a kernel slice's header in the shared kernel arena. The
 * header tells the kernel where everything of its slice lives: sizes first, then byte
 * addresses into the one shared memory. This file is plain constants because the
 * WebAssembly kernel (assembly/, AssemblyScript) compiles the same file: the two sides
 * cannot drift apart.
 */
/** Global index of the slice's first respondent (of the current chunk, for taste profiles). */
export const H_FIRST = 0;
/** Respondents in the slice (or chunk). */
export const H_COUNT = 1;
/** Draws per respondent R. */
export const H_R = 2;
/** Distance in draws between two draw rows: R rounded up to a whole number of blocks. */
export const H_STRIDE = 3;
export const H_K = 4;
export const H_D = 5;
export const H_P = 6;
/** Columns of the difference rows (all data columns, of which the model uses K). */
export const H_KD = 7;
export const H_BLOCK_SIZE = 8;
/** Most difference rows of one respondent in the slice. */
export const H_MAX_ROWS = 9;
// Shared data (Int32 / Float64).
export const H_TASK_START = 10;
export const H_DIFF_START = 11;
export const H_DIFFS = 12;
/** Standard variates (Float32), [local respondent][dimension][stride]. */
export const H_VARIATES = 13;
// Layout of the model (Int32 arrays of K, blockSize and blockSize² entries).
export const H_COLUMN = 14;
export const H_DIST = 15;
export const H_DIMENSION = 16;
export const H_MEAN_INDEX = 17;
export const H_SPREAD_INDEX = 18;
export const H_BLOCK = 19;
export const H_CHOL_INDEX = 20;
// Per-call input and output (Float64).
export const H_THETA = 21;
export const H_GRAD = 22;
/** count × P per-respondent gradients. */
export const H_SCORES = 23;
// Workspaces of the slice's thread.
/** K × stride coefficients per draw. */
export const H_B = 24;
/** K × stride Σ_t ∂ln P_nt/∂β per draw. */
export const H_G = 25;
/** maxRows × BLOCK utilities, then probabilities, of one block of draws. */
export const H_V = 26;
/** stride: ln Π_t P_nt per draw. */
export const H_LP = 27;
/** stride: normalised weights. */
export const H_W = 28;
/** P: one respondent's gradient. */
export const H_GN = 29;
/** maxRows (Int32): non-zero coefficients of each row. */
export const H_ROW_NNZ = 30;
/** maxRows × K (Float64): their differences. */
export const H_ROW_COEF = 31;
/** maxRows × K (Int32): byte offset of their coefficient's row in B. */
export const H_ROW_OFF = 32;
/** K (Int32): rows with a non-zero difference in each coefficient. */
export const H_COL_NNZ = 33;
/** K × maxRows (Float64): minus those differences. */
export const H_COL_COEF = 34;
/** K × maxRows (Int32): byte offset of their row in V. */
export const H_COL_OFF = 35;
/** 256 (Float64): 2^(j/256), the table of the exponential. */
export const H_EXP_TABLE = 36;
/** stride (Float64): weight × G of one coefficient. */
export const H_WG = 37;
export const HEADER_WORDS = 40;

/** Draws per register block of the WebAssembly kernel; the stride is a multiple of it. */
export const DRAW_BLOCK = 8;
