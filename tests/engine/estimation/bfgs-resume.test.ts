/**
 * BFGS stopped after iteration k and started again from the state it reported (bfgs.ts,
 * onState/resume) takes exactly the steps of one uninterrupted minimisation: the iterate,
 * gradient, inverse Hessian and counters are all it carries from one iteration to the next, and
 * the arithmetic is deterministic, so the resumed run must end bit for bit where the
 * uninterrupted one ends (no tolerance is needed for that comparison). Both must also meet
 * the optimiser's own guarantee on the test problems, whose minima are known in closed form.
 */
import { describe, expect, it } from 'vitest';
import {
  minimizeBfgs,
  type AsyncObjective,
  type BfgsOptions,
  type BfgsState,
} from '../../../server/engine/estimation/bfgs';
import { measureConvergence } from '../../../server/engine/estimation/convergence';
import { invertMatrix } from '../../../server/engine/linalg/invert-matrix';

/**
 * Extended Rosenbrock function of n (even) variables (Moré, Garbow & Hillstrom 1981, ACM TOMS
 * 7:17-41, problem 21): minimum f* = 0 at x* = (1, …, 1), standard start (−1.2, 1, −1.2, 1, …).
 */
const rosenbrock: AsyncObjective = async (x, g) => {
  let f = 0;
  for (let i = 0; i < x.length; i += 2) {
    const a = 10 * (x[i + 1] - x[i] * x[i]);
    const b = 1 - x[i];
    f += a * a + b * b;
    g[i] = -40 * x[i] * a - 2 * b;
    g[i + 1] = 20 * a;
  }
  return f;
};
const rosenbrockStart = (n: number) =>
  Float64Array.from({ length: n }, (_, i) => (i % 2 === 0 ? -1.2 : 1));

/**
 * A convex quadratic ½(x − c)′A(x − c) with A = tridiag(−1, 4, −1): minimum 0 at x = c (closed
 * form). Ill-scaled enough to need several BFGS updates.
 */
const center = Float64Array.from({ length: 8 }, (_, i) => (i - 3) / 2);
const quadratic: AsyncObjective = async (x, g) => {
  const n = x.length;
  let f = 0;
  for (let i = 0; i < n; i++) {
    const d = (j: number) => (j >= 0 && j < n ? x[j] - center[j] : 0);
    g[i] = 4 * d(i) - d(i - 1) - d(i + 1);
    f += 0.5 * d(i) * g[i];
  }
  return f;
};

const tolerances = { tolerance: 1e-7, gradientTolerance: 6e-6, maxIterations: 500 };

async function runRecording(
  f: AsyncObjective,
  x0: Float64Array,
  options: Partial<BfgsOptions> = {},
) {
  const states: BfgsState[] = [];
  let evaluations = 0;
  const counted: AsyncObjective = (x, g) => {
    evaluations++;
    return f(x, g);
  };
  const result = await minimizeBfgs(counted, x0, {
    ...tolerances,
    ...options,
    onState: (s) => states.push(s),
  });
  return { result, states, evaluations };
}

describe('minimizeBfgs resumed from a reported state', () => {
  const problems = [
    { name: 'extended Rosenbrock, n = 6', f: rosenbrock, x0: rosenbrockStart(6) },
    { name: 'tridiagonal quadratic, n = 8', f: quadratic, x0: new Float64Array(8) },
  ];
  for (const problem of problems)
    it(`ends exactly where the uninterrupted run ends (${problem.name})`, async () => {
      const whole = await runRecording(problem.f, problem.x0);
      expect(whole.result.reason).toBe('converged');
      expect(whole.states.length).toBe(whole.result.iterations);
      // The optimiser's guarantee (convergence.ts): Newton decrement ≤ 1e-7 with its own H,
      // relative gradient ≤ 6e-6; the minimum value is 0 (closed form), and under the quadratic
      // model f − f* is half the decrement (Boyd & Vandenberghe 2004, §9.5.1).
      expect(whole.result.decrement).toBeLessThanOrEqual(tolerances.tolerance);
      expect(whole.result.f).toBeLessThanOrEqual(tolerances.tolerance / 2);
      const m = measureConvergence(whole.result.grad, null, whole.result.x, whole.result.f);
      expect(m.maxRelativeGradient).toBeLessThanOrEqual(tolerances.gradientTolerance);

      for (const k of [1, Math.floor(whole.states.length / 2), whole.states.length - 1]) {
        const state = whole.states[k - 1];
        expect(state.iterations).toBe(k);
        const resumed = await runRecording(problem.f, problem.x0, { resume: state });
        expect(Array.from(resumed.result.x)).toEqual(Array.from(whole.result.x));
        expect(resumed.result.f).toBe(whole.result.f);
        expect(Array.from(resumed.result.grad)).toEqual(Array.from(whole.result.grad));
        expect(resumed.result.iterations).toBe(whole.result.iterations);
        expect(resumed.result.evaluations).toBe(whole.result.evaluations);
        expect(resumed.result.decrement).toBe(whole.result.decrement);
        // Only the evaluations after iteration k are done again, none at x0.
        expect(resumed.evaluations).toBe(whole.evaluations - state.evaluations);
        // The states it reports are those the uninterrupted run reported after k.
        expect(resumed.states.map((s) => s.f)).toEqual(whole.states.slice(k).map((s) => s.f));
      }
    });

  it('returns a state that had already stopped without evaluating again', async () => {
    const whole = await runRecording(quadratic, new Float64Array(8));
    const last = whole.states[whole.states.length - 1];
    expect(last.stopped).toBe('converged');
    const resumed = await runRecording(quadratic, new Float64Array(8), { resume: last });
    expect(resumed.evaluations).toBe(0);
    expect(resumed.result).toMatchObject({
      reason: 'converged',
      iterations: whole.result.iterations,
      evaluations: whole.result.evaluations,
      f: whole.result.f,
    });
    expect(resumed.states).toEqual([]);
  });

  it('stops at the iteration limit counted from the first start, not from the resume', async () => {
    const whole = await runRecording(rosenbrock, rosenbrockStart(6), { maxIterations: 12 });
    expect(whole.result).toMatchObject({ reason: 'iteration_limit', iterations: 12 });
    const resumed = await runRecording(rosenbrock, rosenbrockStart(6), {
      maxIterations: 12,
      resume: whole.states[4],
    });
    expect(resumed.result).toMatchObject({ reason: 'iteration_limit', iterations: 12 });
    expect(Array.from(resumed.result.x)).toEqual(Array.from(whole.result.x));
  });

  it('reports copies: changing a reported state does not change the run', async () => {
    const states: BfgsState[] = [];
    const result = await minimizeBfgs(quadratic, new Float64Array(8), {
      ...tolerances,
      onState: (s) => {
        states.push(s);
        s.x.fill(NaN);
        s.inverseHessian.fill(NaN);
      },
    });
    expect(result.reason).toBe('converged');
    expect(Array.from(result.x).every(Number.isFinite)).toBe(true);
  });

  it('refuses a state of another problem size', async () => {
    const whole = await runRecording(quadratic, new Float64Array(8));
    await expect(
      minimizeBfgs(rosenbrock, rosenbrockStart(6), { ...tolerances, resume: whole.states[0] }),
    ).rejects.toThrow(/8 parameters cannot resume a problem of 6/);
  });
});

/** A = tridiag(−1, 4, −1) of `quadratic`, and its inverse (checked: A·A⁻¹ = I). */
function quadraticInverseHessian(n: number): Float64Array {
  const a = new Float64Array(n * n);
  for (let i = 0; i < n; i++) {
    a[i * n + i] = 4;
    if (i > 0) a[i * n + i - 1] = a[(i - 1) * n + i] = -1;
  }
  const inverse = invertMatrix(a, n)!;
  for (let i = 0; i < n; i++)
    for (let j = 0; j < n; j++) {
      let v = 0;
      for (let k = 0; k < n; k++) v += a[i * n + k] * inverse[k * n + j];
      expect(v).toBeCloseTo(i === j ? 1 : 0, 12);
    }
  // Symmetric to rounding; BFGS wants it exactly so.
  for (let i = 0; i < n; i++) for (let j = 0; j < i; j++) inverse[j * n + i] = inverse[i * n + j];
  return inverse;
}

describe('minimizeBfgs from a given initial inverse Hessian', () => {
  it('takes the Newton step first: one iteration to the minimum of a quadratic given A⁻¹', async () => {
    // Closed form: from x0 with H0 = A⁻¹ the first direction is −A⁻¹∇f = c − x0, and the unit
    // step lands on the minimiser x* = c; the identity start needs several updates.
    const identity = await runRecording(quadratic, new Float64Array(8));
    const given = await runRecording(quadratic, new Float64Array(8), {
      initialInverseHessian: quadraticInverseHessian(8),
    });
    expect(given.result).toMatchObject({ reason: 'converged', iterations: 1, evaluations: 2 });
    expect(identity.result.iterations).toBeGreaterThan(1);
    // Within rounding of a 8 × 8 solve (relative error of order n·ε·cond(A), cond(A) < 3).
    given.result.x.forEach((v, i) => expect(Math.abs(v - center[i])).toBeLessThan(1e-13));
  });

  it('reaches the same minimum under the same convergence test (extended Rosenbrock, n = 6)', async () => {
    // Any symmetric positive-definite H0 will do for the guarantee; this one is ill-scaled on
    // purpose (diag 1, 10, 0.1, …) so the path differs from the identity start's.
    const n = 6;
    const h0 = new Float64Array(n * n);
    for (let i = 0; i < n; i++) h0[i * n + i] = [1, 10, 0.1][i % 3];
    const identity = await runRecording(rosenbrock, rosenbrockStart(n));
    const given = await runRecording(rosenbrock, rosenbrockStart(n), { initialInverseHessian: h0 });
    for (const run of [identity, given]) {
      expect(run.result.reason).toBe('converged');
      // The optimiser's guarantee (convergence.ts) and f* = 0 at x* = (1, …, 1) (closed form).
      expect(run.result.decrement).toBeLessThanOrEqual(tolerances.tolerance);
      expect(run.result.f).toBeLessThanOrEqual(tolerances.tolerance / 2);
    }
    // Under the quadratic model at x*, (x − x*)′∇²f(x*)(x − x*) = 2(f − f*) ≤ 1e-7; the smallest
    // eigenvalue of ∇²f(1, 1) = [[802, −400], [−400, 200]] is about 0.4, so |x − x*| ≤ 5e-4.
    for (const run of [identity, given])
      run.result.x.forEach((v) => expect(Math.abs(v - 1)).toBeLessThan(5e-4));
  });

  it('resumes bit for bit from a state of a run that started from H0', async () => {
    const rosenbrockH0 = new Float64Array(36);
    for (let i = 0; i < 6; i++) rosenbrockH0[i * 7] = 0.5;
    const whole = await runRecording(rosenbrock, rosenbrockStart(6), {
      initialInverseHessian: rosenbrockH0,
    });
    expect(whole.result.reason).toBe('converged');
    const k = Math.floor(whole.states.length / 2);
    // The given H0 is ignored on resume: the state carries its own inverse Hessian.
    const resumed = await runRecording(rosenbrock, rosenbrockStart(6), {
      initialInverseHessian: rosenbrockH0,
      resume: whole.states[k - 1],
    });
    expect(Array.from(resumed.result.x)).toEqual(Array.from(whole.result.x));
    expect(resumed.result.evaluations).toBe(whole.result.evaluations);
    expect(resumed.states.map((s) => s.f)).toEqual(whole.states.slice(k).map((s) => s.f));
  });

  it('refuses an initial inverse Hessian that is not symmetric positive definite', async () => {
    const indefinite = new Float64Array(64);
    for (let i = 0; i < 8; i++) indefinite[i * 9] = i === 3 ? -1 : 1;
    const asymmetric = new Float64Array(64);
    for (let i = 0; i < 8; i++) asymmetric[i * 9] = 1;
    asymmetric[1] = 0.1;
    for (const h of [indefinite, asymmetric, new Float64Array(36)])
      await expect(
        minimizeBfgs(quadratic, new Float64Array(8), { ...tolerances, initialInverseHessian: h }),
      ).rejects.toThrow(/symmetric positive definite/);
  });
});
