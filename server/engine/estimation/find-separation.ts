/**
 * Separation test for logit models by linear programming (Albert & Anderson 1984, Biometrika
 * 71:1-10, for the existence of the maximum-likelihood estimate; the LP form follows Konis 2007,
 * "Linear programming algorithms for detecting separated data in binary logistic regression
 * models", DPhil thesis, Oxford, ch. 3). With d_j = x_j − x_chosen, the MLE fails to exist
 * exactly when some direction b ≠ 0 makes every chosen alternative at least as good as every
 * other one, b·d_j ≤ 0 for all rows, with at least one strict inequality: then the
 * log-likelihood keeps rising along b. The LP
 *   maximise Σ_j −b·d_j  subject to  b·d_j ≤ 0 for all j,  −1 ≤ b_k ≤ 1
 * has optimum 0 when no such direction exists, and otherwise returns one. Solved by HiGHS
 * (Huangfu & Hall 2018, Math. Prog. Comp. 10:119-142) through its WebAssembly build.
 */
import type { ChoiceData } from './choice-data';

export interface Separation {
  /** Separating direction b (one value per data column, max |b_k| = 1). */
  direction: Float64Array;
  /** Indexes of the tasks whose choice b predicts with certainty (b·d_j < 0 for some row). */
  tasks: number[];
}

type HighsSolver = { solve: (lp: string) => HighsSolution };
type HighsSolution = {
  Status: string;
  ObjectiveValue: number;
  Columns: Record<string, { Primal: number }>;
};

let solverPromise: Promise<HighsSolver> | null = null;

async function getSolver(): Promise<HighsSolver> {
  solverPromise ??= import('highs').then((m) =>
    (m.default as unknown as () => Promise<HighsSolver>)(),
  );
  return solverPromise;
}

/** Margin below which a row counts as strictly separated (data scaled to unit RMS). */
const STRICT = 1e-6;

function term(value: number, k: number): string {
  return `${value < 0 ? '-' : '+'} ${Math.abs(value).toPrecision(17)} b${k}`;
}

/** Returns a separating direction, or null when the maximum-likelihood estimate exists. */
export async function findSeparation(data: ChoiceData): Promise<Separation | null> {
  const K = data.columns.length;
  // A single column that separates on its own is the clearest report; check those first.
  for (let k = 0; k < K; k++)
    for (const sign of [1, -1]) {
      const direction = new Float64Array(K);
      direction[k] = sign;
      const found = checkDirection(data, direction);
      if (found) return found;
    }
  const rows = data.diffs.length / K;
  const total = new Float64Array(K);
  const constraints: string[] = [];
  for (let j = 0; j < rows; j++) {
    const terms: string[] = [];
    for (let k = 0; k < K; k++) {
      const d = data.diffs[j * K + k];
      if (d === 0) continue;
      total[k] -= d;
      terms.push(term(d, k));
    }
    if (terms.length > 0) constraints.push(` r${j}: ${terms.join(' ')} <= 0`);
  }
  if (constraints.length === 0) return null;
  const objective = [...total].map((v, k) => (v === 0 ? '' : term(v, k))).join(' ');
  const bounds = Array.from({ length: K }, (_, k) => ` -1 <= b${k} <= 1`);
  const lp = [
    'Maximize',
    ` obj: ${objective || '0 b0'}`,
    'Subject To',
    ...constraints,
    'Bounds',
    ...bounds,
    'End',
  ].join('\n');
  const solution = (await getSolver()).solve(lp);
  if (solution.Status !== 'Optimal') return null;
  const direction = Float64Array.from(
    { length: K },
    (_, k) => solution.Columns[`b${k}`]?.Primal ?? 0,
  );
  return checkDirection(data, direction);
}

/** The tasks `direction` predicts with certainty, or null when it is not separating. */
function checkDirection(data: ChoiceData, direction: Float64Array): Separation | null {
  const K = data.columns.length;
  const tasks: number[] = [];
  let worst = -Infinity;
  for (let t = 0; t + 1 < data.diffStart.length; t++) {
    let strict = false;
    for (let j = data.diffStart[t]; j < data.diffStart[t + 1]; j++) {
      let v = 0;
      for (let k = 0; k < K; k++) v += direction[k] * data.diffs[j * K + k];
      worst = Math.max(worst, v);
      if (v < -STRICT) strict = true;
    }
    if (strict) tasks.push(t);
  }
  // Optimum 0 (no strict row), or a direction that is not feasible after all: no separation.
  if (tasks.length === 0 || worst > STRICT) return null;
  return { direction, tasks };
}
