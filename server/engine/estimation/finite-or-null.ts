/**
 * A value a run's JSON result can carry: the number when finite, otherwise null (JSON has no
 * NaN or ±Infinity, and a quantity that could not be computed is shown as missing).
 */
export const finiteOrNull = (x: number): number | null => (Number.isFinite(x) ? x : null);
