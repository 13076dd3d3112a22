/**
 * Numeric codes of the coefficient distributions (index into COEFFICIENT_DISTRIBUTIONS of
 * shared/schemas/estimation-spec.ts). Kept in a file of plain constants because the WebAssembly kernel
 * (server/engine/simd/assembly, AssemblyScript) compiles the same file.
 */
export const DIST_FIXED = 0;
export const DIST_NORMAL = 1;
export const DIST_LOGNORMAL = 2;
export const DIST_NEG_LOGNORMAL = 3;
export const DIST_TRIANGULAR = 4;
export const DIST_UNIFORM = 5;
