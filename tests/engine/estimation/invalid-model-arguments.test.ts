import { describe, expect, it } from 'vitest';
import { fillUniformDraws } from '../../../server/engine/draws/uniform-draws';
import { checkMixedLogitOptions } from '../../../server/engine/estimation/check-mixed-logit-options';
import { computeWtp } from '../../../server/engine/estimation/compute-wtp';
import { EstimationOptionsError } from '../../../server/engine/estimation/estimation-errors';
import { uncorrelatedLayout } from './uncorrelated-layout';
import { computeTasteProfiles } from '../../../server/engine/estimation/taste-profiles';
import { computeGaussHermite } from '../../../server/engine/linalg/gauss-hermite';
import { estimationSpecSchema } from '../../../shared/schemas/estimation-spec';
import { good } from './invalid-arguments-data';

describe('checkMixedLogitOptions rejects invalid options before any numerics', () => {
  const base = {
    coefficients: [
      { name: 'x', distribution: 'normal' as const },
      { name: 'z', distribution: 'fixed' as const },
    ],
  };
  it.each<[string, object, RegExp]>([
    [
      'no random coefficient',
      { coefficients: [{ name: 'x', distribution: 'fixed' }] },
      /at least one random coefficient/,
    ],
    [
      'an unknown column',
      { coefficients: [{ name: 'time', distribution: 'normal' }] },
      /column time is not in the data/,
    ],
    [
      'a duplicate name',
      {
        coefficients: [
          { name: 'x', distribution: 'normal' },
          { name: 'x', column: 'z', distribution: 'fixed' },
        ],
      },
      /used twice/,
    ],
    [
      'an unknown distribution',
      { coefficients: [{ name: 'x', distribution: 'gamma' }] },
      /unknown distribution gamma/,
    ],
    [
      'correlation with one normal',
      { ...base, correlated: true },
      /at least two normal coefficients/,
    ],
    ['zero draws', { ...base, draws: { count: 0 } }, /draws.count/],
    ['a non-integer seed', { ...base, draws: { seed: 1.5 } }, /draws.seed/],
    ['an unknown draws type', { ...base, draws: { type: 'lattice' } }, /unknown draws type/],
    ['zero threads', { ...base, threads: 0 }, /threads/],
    ['zero starts', { ...base, starts: 0 }, /starts/],
    ['a start of the wrong length', { ...base, start: [1, 2] }, /start must have 3 values/],
    ['a negative gradient tolerance', { ...base, gradientTolerance: -1 }, /gradientTolerance/],
    ['no coefficient list', { coefficients: 'x' }, /coefficients must be a list/],
  ])('%s', (_label, options, message) => {
    expect(() => checkMixedLogitOptions(good, options as never)).toThrow(EstimationOptionsError);
    expect(() => checkMixedLogitOptions(good, options as never)).toThrow(message);
  });
});

describe('post-estimation guards', () => {
  const layout = uncorrelatedLayout(good, { x: 'normal', z: 'fixed' });
  const cov = Float64Array.from([0.1, 0, 0, 0, 0.1, 0, 0, 0, 0.1]);
  it.each<[string, object, RegExp]>([
    ['an unknown cost', { cost: 'price' }, /cost coefficient price/],
    ['a coverage level of 1', { cost: 'z', level: 1 }, /level/],
    ['too few Krinsky-Robb draws', { cost: 'z', draws: 10 }, /draws/],
  ])('computeWtp rejects %s', (_label, options, message) => {
    expect(() => computeWtp(layout, [1, -1, 0.5], cov, options as never)).toThrow(message);
  });

  it('computeTasteProfiles rejects zero draws, an unknown cost and a θ of the wrong length', () => {
    expect(() => computeTasteProfiles(good, layout, [1, -1, 0.5], { count: 0 })).toThrow(
      /profile draws/,
    );
    expect(() => computeTasteProfiles(good, layout, [1, -1, 0.5], { cost: 'price' })).toThrow(
      /cost coefficient price/,
    );
    expect(() => computeTasteProfiles(good, layout, [1, -1], {})).toThrow(
      /theta must have 3 values/,
    );
  });

  it('fillUniformDraws rejects a short buffer and computeGaussHermite a zero order', () => {
    expect(() =>
      fillUniformDraws(
        { type: 'halton', count: 10, dimensions: 2, seed: 1 },
        0,
        1,
        new Float64Array(5),
      ),
    ).toThrow(/too small/);
    expect(() => computeGaussHermite(0)).toThrow(RangeError);
  });
});

describe('estimationSpecSchema', () => {
  const issuePaths = (input: unknown) => {
    const parsed = estimationSpecSchema.safeParse(input);
    return parsed.success ? [] : parsed.error.issues.map((i) => i.path.join('.'));
  };
  it('fills the documented defaults', () => {
    const spec = estimationSpecSchema.parse({
      model: 'mixed',
      coefficients: [{ name: 'time', distribution: 'normal' }],
    });
    expect(spec).toMatchObject({
      correlated: false,
      draws: { type: 'halton', count: 500, seed: 1 },
      profileDraws: 2000,
      space: 'preference',
      settings: { tolerance: 1e-7, covariance: 'robust', simulationCheck: false },
    });
  });
  it.each<[string, unknown, string]>([
    [
      'an MNL with a random coefficient',
      { model: 'mnl', coefficients: [{ name: 'time', distribution: 'normal' }] },
      'coefficients.0.distribution',
    ],
    [
      'a mixed logit without random coefficients',
      { model: 'mixed', coefficients: [{ name: 'time' }] },
      'coefficients',
    ],
    [
      'a duplicate name',
      { model: 'mnl', coefficients: [{ name: 'a' }, { name: 'a' }] },
      'coefficients.1.name',
    ],
    [
      'correlation without two normals',
      { model: 'mixed', correlated: true, coefficients: [{ name: 'a', distribution: 'normal' }] },
      'correlated',
    ],
    [
      'too few draws',
      {
        model: 'mixed',
        coefficients: [{ name: 'a', distribution: 'normal' }],
        draws: { count: 2 },
      },
      'draws.count',
    ],
    ['an unknown model', { model: 'probit', coefficients: [{ name: 'a' }] }, 'model'],
  ])('rejects %s at the field', (_label, input, path) => {
    expect(issuePaths(input)).toContain(path);
  });
});
